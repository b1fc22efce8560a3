import type { Transaction } from 'sequelize';
import { Customer, Job, User } from '../../db/models';
import { ConflictError, ForbiddenError, NotFoundError } from '../../lib/errors';
import type { SessionUser } from '../../types';

/**
 * A job the user may open as a job sheet: in their company, and for an installer only when it is
 * assigned to them. Anything else is a 404 that looks exactly like an id that does not exist.
 */
export async function findSheetJob(user: SessionUser, jobId: string, transaction?: Transaction): Promise<Job> {
  const job = await Job.findOne({
    where: { id: jobId, organisationId: user.organisationId },
    include: [
      { model: Customer, as: 'customer' },
      { model: User, as: 'assignedInstaller' },
    ],
    transaction,
  });
  if (!job) throw new NotFoundError('job');
  if (user.role === 'installer' && job.assignedInstallerId !== user.id) throw new NotFoundError('job');
  if (user.role === 'installer' && !['scheduled', 'installed', 'closed'].includes(job.stage)) throw new NotFoundError('job');
  return job;
}

/** The same job, checked as one the user may record site work on (ticks, notes, photos, finishing). */
export async function findWorkableJob(user: SessionUser, jobId: string, transaction?: Transaction): Promise<Job> {
  if (user.role === 'estimator') throw new ForbiddenError('only the installer or the office records site work');
  const job = await findSheetJob(user, jobId, transaction);
  if (job.stage === 'installed' || job.stage === 'closed') {
    throw new ConflictError('this job is already marked installed; site records are closed', 'job_installed');
  }
  if (job.stage !== 'scheduled') throw new ConflictError('site work can be recorded once the job is scheduled', 'job_not_scheduled');
  return job;
}
