import type { Sequelize, Transaction } from 'sequelize';
import { mayEditActuals, type Actuals, type StoredActuals } from '../../../shared/api/actuals';
import type { ActualsPart } from '../../../shared/api/settings';
import { readStoredTakeoff } from '../../../shared/takeoff/takeoff-schema';
import { Invoice, Job, JobActual, JobEvent, Space, User } from '../../db/models';
import { ConflictError, ValidationError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import { findJobFor } from '../jobs/job-access';
import { latestRevisions } from '../plan-revisions/revisions.repository';
import { loadCompanySettings } from '../settings/settings.service';
import { actualsApply, checkActualsRefs, missingActuals, storedActualsOf } from './record-actuals';

const PARTS: ActualsPart[] = ['rolls', 'hours', 'extras'];

// JSONB gives keys back in its own order: compare entries with their keys sorted.
const canonical = (list: readonly object[]) => JSON.stringify(list.map((x) => Object.entries(x).sort(([a], [b]) => a.localeCompare(b))));

/** Whether the job has an invoice (a credit note alone does not count: it follows an invoice). */
export async function isInvoiced(jobId: string, transaction?: Transaction): Promise<boolean> {
  return (await Invoice.count({ where: { jobId, kind: 'invoice' }, transaction })) > 0;
}

/**
 * Corrects what was used on a finished job (mayEditActuals says who, when). Guarded: the job row
 * is locked, then the stored version must be the one the editor read (`expectedVersion`, 0 when
 * nothing was recorded), else 409 `actuals_changed` and nothing is written, so of two corrections
 * made from the same reading the second is refused rather than silently overwriting the first.
 * The company's required parts and the product and person checks of the finish apply. Each
 * correction bumps the version, records who and when, and goes in the job's history with its
 * before and after.
 */
export async function editActuals(
  sequelize: Sequelize,
  user: SessionUser,
  jobId: string,
  body: { actuals: Actuals; expectedVersion: number },
): Promise<StoredActuals> {
  await sequelize.transaction(async (t) => {
    // Lock first, then judge: a finish, a stage move or another correction at once wait their turn.
    await Job.findOne({ where: { id: jobId, organisationId: user.organisationId }, transaction: t, lock: t.LOCK.UPDATE });
    const job = await findJobFor(user, jobId, {
      action: 'sitework:record',
      forbidden: "only the office or the job's installer corrects what was used",
      transaction: t,
    });
    if (job.stage !== 'installed' && job.stage !== 'closed')
      throw new ConflictError('what was used can be corrected once the job is marked installed', 'job_not_installed');
    if (!mayEditActuals(user.role, { stage: job.stage, invoiced: await isInvoiced(job.id, t) }))
      throw new ConflictError('this job is invoiced or closed: the office corrects what was used now', 'actuals_locked');

    const row = await JobActual.findByPk(job.id, { transaction: t, lock: t.LOCK.UPDATE });
    const current = row?.version ?? 0;
    if (current !== body.expectedVersion)
      throw new ConflictError('someone changed what was used since you opened it: look at the new figures and make your change again', 'actuals_changed', [
        { path: 'expectedVersion', message: `the stored version is now ${current}` },
      ]);

    const spaces = await Space.findAll({ where: { jobId: job.id }, transaction: t });
    const revisions = await latestRevisions(
      spaces.map((s) => s.id),
      { transaction: t },
    );
    const takeoffs = [...revisions.values()].flatMap((r) => readStoredTakeoff(r.takeoff) ?? []);
    const company = await loadCompanySettings(job.organisationId, t);
    const missing = missingActuals(body.actuals, company.actualsRequired ?? [], actualsApply(takeoffs, company.extraRules));
    if (missing.length) throw new ValidationError(missing);
    await checkActualsRefs(user, body.actuals, new Set(takeoffs.flatMap((x) => x.layers.map((l) => l.productId))), t);

    const now = new Date();
    const { rolls, hours, extras } = body.actuals;
    const before = row ? { rolls: row.rolls, hours: row.hours, extras: row.extras } : null;
    if (row) await row.update({ rolls, hours, extras, version: current + 1, editedById: user.id, editedAt: now }, { transaction: t });
    else
      await JobActual.create(
        { jobId: job.id, organisationId: job.organisationId, rolls, hours, extras, recordedById: user.id, recordedAt: now, version: 1 },
        { transaction: t },
      );
    const changed = PARTS.filter((p) => canonical(before?.[p] ?? []) !== canonical(body.actuals[p]));
    await JobEvent.create(
      {
        organisationId: job.organisationId,
        jobId: job.id,
        userId: user.id,
        kind: 'actuals_edited',
        data: {
          text: `What was used ${before ? 'corrected' : 'recorded after finishing'}${changed.length ? `: ${changed.join(', ')}` : ''}`,
          version: current + 1,
          before,
          after: { rolls, hours, extras },
        },
      },
      { transaction: t },
    );
  });
  const stored = await JobActual.findByPk(jobId, {
    include: [
      { model: User, as: 'recordedBy' },
      { model: User, as: 'editedBy' },
    ],
  });
  return storedActualsOf(stored)!;
}
