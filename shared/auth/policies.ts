import type { Role } from './roles';

/** The actions the API and the UI gate on. */
export type Action =
  | 'users:manage'
  | 'customers:read'
  | 'customers:write'
  | 'jobs:read'
  | 'jobs:read-all'
  | 'jobs:write'
  | 'jobs:assign'
  | 'plans:write'
  | 'prices:read'
  | 'settings:manage'
  | 'quotes:draft'
  | 'quotes:manage'
  | 'jobsheet:work'
  | 'sitework:record'
  | 'outbox:read'
  | 'reports:read';

const GRANTS: Record<Role, ReadonlySet<Action>> = {
  office: new Set<Action>([
    'users:manage',
    'customers:read',
    'customers:write',
    'jobs:read',
    'jobs:read-all',
    'jobs:write',
    'jobs:assign',
    'plans:write',
    'prices:read',
    'settings:manage',
    'quotes:draft',
    'quotes:manage',
    'sitework:record',
    'outbox:read',
    // Estimate against actual shows costs and margins: office only.
    'reports:read',
  ]),
  estimator: new Set<Action>(['customers:read', 'customers:write', 'jobs:read', 'jobs:read-all', 'jobs:write', 'plans:write', 'prices:read', 'quotes:draft']),
  // Installers see only jobs assigned to them and never prices.
  installer: new Set<Action>(['jobs:read', 'jobsheet:work', 'sitework:record']),
};

/** The facts of a job that decide who may see it. */
export interface JobAccessFacts {
  organisationId: string;
  assignedInstallerId: string | null;
}

/** The signed-in user as the rule needs them; `id` and `organisationId` only when a job is named. */
export interface Actor {
  role: Role;
  id?: string;
  organisationId?: string;
}

/**
 * Whether a user may perform the action, and, when a job is named, on that job. The one access rule
 * of the app: the server's guards, every module's job lookups and the UI all ask it.
 *
 * Who may see a job: anyone of the job's company who may read all jobs (office, estimator); an
 * installer only a job assigned to them. Another company's job is never visible. An action on a
 * job needs both the action and the job; `can(user, 'jobs:read', job)` asks visibility alone.
 */
export function can(user: Actor | null | undefined, action: Action, job?: JobAccessFacts): boolean {
  if (!user || !GRANTS[user.role].has(action)) return false;
  if (!job) return true;
  if (!user.organisationId || user.organisationId !== job.organisationId) return false;
  return GRANTS[user.role].has('jobs:read-all') || (!!user.id && job.assignedInstallerId === user.id);
}
