// The one access rule, can() in shared/auth/policies.ts, as a matrix of who may do what on which
// job. The expectations are the product's rules: installers see only the jobs assigned to them and
// no prices; estimators price and draft but do not send, assign or record site work; nobody sees
// another company's job.
import { describe, expect, it } from 'vitest';
import { can, type Action } from '../../shared/auth/policies';
import type { Role } from '../../shared/auth/roles';

const ORG = 'org-a';
const user = (role: Role, id = `${role}-1`, organisationId = ORG) => ({ role, id, organisationId });
const job = (assignedInstallerId: string | null, organisationId = ORG) => ({ organisationId, assignedInstallerId });

describe('can(): actions by role', () => {
  const rows: Array<[Action, boolean, boolean, boolean]> = [
    // action               office estimator installer
    ['jobs:read', true, true, true],
    ['jobs:read-all', true, true, false],
    ['jobs:write', true, true, false],
    ['jobs:assign', true, false, false],
    ['plans:write', true, true, false],
    ['prices:read', true, true, false],
    ['quotes:draft', true, true, false],
    ['quotes:manage', true, false, false],
    ['settings:manage', true, false, false],
    ['users:manage', true, false, false],
    ['jobsheet:work', false, false, true],
    ['sitework:record', true, false, true],
  ];
  it.each(rows)('%s: office %s, estimator %s, installer %s', (action, office, estimator, installer) => {
    expect([can(user('office'), action), can(user('estimator'), action), can(user('installer'), action)]).toEqual([office, estimator, installer]);
  });

  it('refuses everything to nobody', () => {
    expect(can(null, 'jobs:read')).toBe(false);
    expect(can(undefined, 'jobs:read', job(null))).toBe(false);
  });
});

describe('can(): on one job', () => {
  const mine = job('installer-1');
  const colleagues = job('installer-2');
  const unassigned = job(null);
  const foreign = job('installer-1', 'org-b');

  it('lets the office and estimators see every job of their company, and no other', () => {
    for (const role of ['office', 'estimator'] as const) {
      expect([mine, colleagues, unassigned].map((j) => can(user(role), 'jobs:read', j))).toEqual([true, true, true]);
      expect(can(user(role), 'jobs:read', foreign)).toBe(false);
    }
  });

  it('lets an installer see and record on their own jobs only', () => {
    const me = user('installer');
    expect([mine, colleagues, unassigned, foreign].map((j) => can(me, 'jobs:read', j))).toEqual([true, false, false, false]);
    expect([mine, colleagues].map((j) => can(me, 'sitework:record', j))).toEqual([true, false]);
    // Seeing a job never grants an action the role lacks.
    expect(can(me, 'prices:read', mine)).toBe(false);
    expect(can(me, 'jobs:write', mine)).toBe(false);
  });

  it('lets an estimator see a job but not record site work on it', () => {
    expect(can(user('estimator'), 'jobs:read', mine)).toBe(true);
    expect(can(user('estimator'), 'sitework:record', mine)).toBe(false);
    expect(can(user('office'), 'sitework:record', mine)).toBe(true);
  });

  it('needs the user id and company to answer for a job', () => {
    expect(can({ role: 'office' }, 'jobs:read', mine)).toBe(false);
    expect(can({ role: 'installer', organisationId: ORG }, 'jobs:read', mine)).toBe(false);
  });
});
