import { type Includeable, type WhereOptions } from 'sequelize';
import type { Job as JobDto, JobBody, JobEvent as JobEventDto, JobListPage, JobListQuery, JobPatch, InstallerOption, JobStage } from '../../../shared/api/jobs';
import { allowedStageMoves, canMoveStage } from '../../../shared/api/job-stages';
import { can } from '../../../shared/auth/policies';
import type { AppDeps } from '../../deps';
import { Customer, Job, JobEvent, Space, User } from '../../db/models';
import { ConflictError, ForbiddenError, NotFoundError, fieldError } from '../../lib/errors';
import { redactPrices } from '../../lib/redact';
import type { SessionUser } from '../../types';
import { latestRevisions } from '../plan-revisions/revisions.repository';
import { findJobFor, jobScope } from './job-access';
import { readJobListPage } from './job-list-query';
import { nextJobReference } from './job-reference';

const INCLUDE: Includeable[] = [
  { model: Customer, as: 'customer' },
  { model: User, as: 'assignedInstaller', attributes: ['id', 'name'] },
  // separate: spaces load in their own query, so LIMIT and `$customer.name$` search apply to jobs only.
  { model: Space, as: 'spaces', separate: true },
];

/** Appends to a job's timeline. Other modules call it too (quote sent, installed, ...). */
export async function recordJobEvent(
  job: Pick<Job, 'id' | 'organisationId'>,
  actor: Pick<SessionUser, 'id'> | null,
  kind: string,
  data: Record<string, unknown> = {},
) {
  await JobEvent.create({ organisationId: job.organisationId, jobId: job.id, userId: actor?.id ?? null, kind, data });
}

async function toDtos(jobs: Job[], actor: SessionUser): Promise<JobDto[]> {
  const latest = await latestRevisions(
    jobs.flatMap((j) => (j.spaces ?? []).map((s) => s.id)),
    { bodies: false },
  );
  const dtos = jobs.map<JobDto>((j) => ({
    id: j.id,
    reference: j.reference,
    customer: { id: j.customer!.id, name: j.customer!.name, email: j.customer!.email, phone: j.customer!.phone },
    propertyAddress: { line1: j.addressLine1, line2: j.addressLine2, town: j.town, postcode: j.postcode },
    stage: j.stage,
    assignedInstaller: j.assignedInstaller ? { id: j.assignedInstaller.id, name: j.assignedInstaller.name } : null,
    installDate: j.installDate,
    accessNotes: j.accessNotes,
    notes: j.notes,
    spaces: [...(j.spaces ?? [])]
      .sort((a, b) => a.position - b.position || a.createdAt.getTime() - b.createdAt.getTime())
      .map((s) => {
        const rev = latest.get(s.id);
        return {
          id: s.id,
          name: s.name,
          latestRevision: rev?.revision ?? null,
          latestRevisionAt: rev?.createdAt.toISOString() ?? null,
          updatedAt: s.updatedAt.toISOString(),
        };
      }),
    createdAt: j.createdAt.toISOString(),
    updatedAt: j.updatedAt.toISOString(),
  }));
  return can(actor, 'prices:read') ? dtos : dtos.map((d) => redactPrices(d));
}

export function createJobsService(deps: AppDeps) {
  const { sequelize } = deps;

  async function checkCustomer(actor: SessionUser, customerId: string) {
    const c = await Customer.findOne({ where: { id: customerId, organisationId: actor.organisationId } });
    if (!c) throw fieldError('customerId', 'choose one of your customers');
  }

  async function checkInstaller(actor: SessionUser, installerId: string | null | undefined) {
    if (!installerId) return;
    const u = await User.findOne({ where: { id: installerId, organisationId: actor.organisationId, role: 'installer', active: true } });
    if (!u) throw fieldError('assignedInstallerId', 'choose an active installer of your company');
  }

  function checkSchedulingRights(actor: SessionUser, body: { assignedInstallerId?: unknown; installDate?: unknown }) {
    if ((body.assignedInstallerId !== undefined || body.installDate !== undefined) && !can(actor, 'jobs:assign')) {
      throw new ForbiddenError('only the office assigns installers and install dates');
    }
  }

  async function load(actor: SessionUser, id: string) {
    const job = await Job.findOne({ where: { ...jobScope(actor), id } as WhereOptions<Job>, include: INCLUDE });
    if (!job) throw new NotFoundError('job');
    return job;
  }

  return {
    /** One page of the company's jobs (installers: their own), searched, filtered and sorted; see readJobListPage. */
    async list(actor: SessionUser, query: JobListQuery): Promise<JobListPage> {
      return readJobListPage(deps.pool, actor, query);
    },

    async get(actor: SessionUser, id: string): Promise<JobDto> {
      return (await toDtos([await load(actor, id)], actor))[0];
    },

    async create(actor: SessionUser, body: JobBody & { stage: JobStage }): Promise<JobDto> {
      checkSchedulingRights(actor, body);
      await checkCustomer(actor, body.customerId);
      await checkInstaller(actor, body.assignedInstallerId);
      const job = await sequelize.transaction(async (transaction) => {
        const reference = await nextJobReference(sequelize, actor.organisationId, transaction);
        const created = await Job.create(
          {
            organisationId: actor.organisationId,
            reference,
            customerId: body.customerId,
            addressLine1: body.propertyAddress.line1,
            addressLine2: body.propertyAddress.line2 ?? '',
            town: body.propertyAddress.town,
            postcode: body.propertyAddress.postcode,
            stage: body.stage,
            assignedInstallerId: body.assignedInstallerId ?? null,
            installDate: body.installDate ?? null,
            accessNotes: body.accessNotes ?? '',
            notes: body.notes ?? '',
            createdById: actor.id,
          },
          { transaction },
        );
        await JobEvent.create(
          { organisationId: actor.organisationId, jobId: created.id, userId: actor.id, kind: 'created', data: { reference, stage: body.stage } },
          { transaction },
        );
        return created;
      });
      return this.get(actor, job.id);
    },

    async update(actor: SessionUser, id: string, patch: JobPatch): Promise<JobDto> {
      const job = await load(actor, id);
      checkSchedulingRights(actor, patch);
      if (patch.customerId && patch.customerId !== job.customerId) await checkCustomer(actor, patch.customerId);
      if (patch.assignedInstallerId && patch.assignedInstallerId !== job.assignedInstallerId) await checkInstaller(actor, patch.assignedInstallerId);
      const changes: Partial<Job> = {};
      if (patch.customerId !== undefined) changes.customerId = patch.customerId;
      if (patch.propertyAddress) {
        Object.assign(changes, {
          addressLine1: patch.propertyAddress.line1,
          addressLine2: patch.propertyAddress.line2 ?? '',
          town: patch.propertyAddress.town,
          postcode: patch.propertyAddress.postcode,
        });
      }
      for (const k of ['stage', 'assignedInstallerId', 'installDate', 'accessNotes', 'notes'] as const) {
        if (patch[k] !== undefined) (changes as Record<string, unknown>)[k] = patch[k];
      }
      const before = { stage: job.stage, assignedInstallerId: job.assignedInstallerId, installDate: job.installDate };
      if (changes.stage && !canMoveStage(before.stage, changes.stage, actor.role)) {
        throw new ConflictError(`a job cannot be moved from ${before.stage} to ${changes.stage}`, 'stage_not_allowed', [
          { path: 'stage', message: `from ${before.stage} the job may move to: ${allowedStageMoves(before.stage, actor.role).join(', ') || 'nothing'}` },
        ]);
      }
      await sequelize.transaction(async (transaction) => {
        // A stage move applies only from the stage it was checked against: of two moves at once, one wins.
        const where = changes.stage ? { id: job.id, stage: before.stage } : { id: job.id };
        const [count] = await Job.update(changes, { where, transaction });
        if (count !== 1) {
          throw new ConflictError(`the job moved on from ${before.stage} meanwhile; reload it`, 'stage_changed', [
            { path: 'stage', message: `expected the job at ${before.stage}` },
          ]);
        }
        const ev = (kind: string, data: Record<string, unknown>) =>
          JobEvent.create({ organisationId: job.organisationId, jobId: job.id, userId: actor.id, kind, data }, { transaction });
        if (changes.stage && changes.stage !== before.stage) await ev('stage_changed', { from: before.stage, to: changes.stage });
        if (changes.assignedInstallerId !== undefined && changes.assignedInstallerId !== before.assignedInstallerId) {
          await ev('assigned', { from: before.assignedInstallerId, to: changes.assignedInstallerId });
        }
        if (changes.installDate !== undefined && changes.installDate !== before.installDate)
          await ev('scheduled', { from: before.installDate, to: changes.installDate });
        const other = Object.keys(changes).filter((k) => !['stage', 'assignedInstallerId', 'installDate'].includes(k));
        if (other.length) await ev('updated', { fields: other });
      });
      return this.get(actor, id);
    },

    async events(actor: SessionUser, id: string): Promise<JobEventDto[]> {
      const job = await findJobFor(actor, id);
      const rows = await JobEvent.findAll({
        where: { jobId: job.id },
        include: [{ model: User, as: 'user', attributes: ['id', 'name'] }],
        order: [
          ['createdAt', 'ASC'],
          ['seq', 'ASC'],
        ],
      });
      const dtos = rows.map((e) => ({
        id: e.id,
        kind: e.kind,
        data: e.data,
        user: e.user ? { id: e.user.id, name: e.user.name } : null,
        createdAt: e.createdAt.toISOString(),
      }));
      return can(actor, 'prices:read') ? dtos : redactPrices(dtos);
    },

    async installers(actor: SessionUser): Promise<InstallerOption[]> {
      const rows = await User.findAll({ where: { organisationId: actor.organisationId, role: 'installer', active: true }, order: [['name', 'ASC']] });
      return rows.map((u) => ({ id: u.id, name: u.name }));
    },
  };
}
