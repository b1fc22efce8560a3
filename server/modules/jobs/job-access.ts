import type { Includeable, Transaction, WhereOptions } from 'sequelize';
import { can, type Action } from '../../../shared/auth/policies';
import { Customer, Job, User } from '../../db/models';
import { ConflictError, ForbiddenError, NotFoundError } from '../../lib/errors';
import type { SessionUser } from '../../types';

/**
 * Who may see a job, for every module: `can(user, action, job)` in shared/auth/policies.ts, the
 * rule the UI asks too. `jobScope` is the same rule as a where-clause for lists; a test checks
 * that the two agree.
 */

/** Where-clause every list of jobs starts from: the actor's company, and for installers only their own jobs. */
export function jobScope(actor: SessionUser): WhereOptions<Job> {
  const where: Record<string, unknown> = { organisationId: actor.organisationId };
  if (!can(actor, 'jobs:read-all')) where.assignedInstallerId = actor.id;
  return where;
}

/**
 * The job if the actor may see it and perform `action` on it (default: read it). A job they may
 * not see is a 404 that looks exactly like an id that does not exist (another company's job, an
 * installer's colleague's job); a job they see but may not act on is a 403 with `forbidden`.
 */
export async function findJobFor(
  actor: SessionUser,
  jobId: string,
  opts: { action?: Action; forbidden?: string; include?: Includeable[]; transaction?: Transaction } = {},
): Promise<Job> {
  const job = await Job.findOne({
    where: { id: jobId, organisationId: actor.organisationId },
    include: opts.include,
    transaction: opts.transaction,
  });
  if (!job || !can(actor, 'jobs:read', job)) throw new NotFoundError('job');
  if (opts.action && !can(actor, opts.action, job)) throw new ForbiddenError(opts.forbidden);
  return job;
}

const SHEET_INCLUDE = [
  { model: Customer, as: 'customer' },
  { model: User, as: 'assignedInstaller' },
];

/** A job the user may open as a job sheet (the one job-access rule, `can`), with its customer and installer. */
export async function findSheetJob(user: SessionUser, jobId: string, transaction?: Transaction): Promise<Job> {
  return findJobFor(user, jobId, { include: SHEET_INCLUDE, transaction });
}

/** The same job, checked as one the user may record site work on now (ticks, notes, photos, finishing). */
export async function findWorkableJob(user: SessionUser, jobId: string, transaction?: Transaction): Promise<Job> {
  const job = await findJobFor(user, jobId, {
    action: 'sitework:record',
    forbidden: 'only the installer or the office records site work',
    include: SHEET_INCLUDE,
    transaction,
  });
  if (job.stage === 'installed' || job.stage === 'closed') {
    throw new ConflictError('this job is already marked installed; site records are closed', 'job_installed');
  }
  if (job.stage !== 'scheduled') throw new ConflictError('site work can be recorded once the job is scheduled', 'job_not_scheduled');
  return job;
}
