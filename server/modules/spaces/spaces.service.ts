import { Op, type Transaction, type WhereOptions } from 'sequelize';
import type { Space as SpaceDto, SpaceCreateBody, SpacePatch } from '../../../shared/api/spaces';
import { can } from '../../../shared/auth/policies';
import type { Plan } from '../../../shared/plan/plan-schema';
import { validatePlan } from '../../../shared/plan/validate-plan';
import type { AppDeps } from '../../deps';
import { Job, PlanRevision, Space } from '../../db/models';
import { ConflictError, NotFoundError, ValidationError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import { findJobForUser, recordJobEvent } from '../jobs/jobs.service';

/**
 * The space if this user may see it (same company; installers only on their assigned jobs),
 * else NotFound. The plans module calls this before reading or saving a plan.
 */
export async function findSpaceForUser(actor: SessionUser, spaceId: string, transaction?: Transaction): Promise<Space & { job: Job }> {
  const jobWhere: Record<string, unknown> = { organisationId: actor.organisationId };
  if (!can(actor, 'jobs:read-all')) jobWhere.assignedInstallerId = actor.id;
  const space = await Space.findOne({
    where: { id: spaceId, organisationId: actor.organisationId },
    include: [{ model: Job, as: 'job', where: jobWhere as WhereOptions<Job>, required: true }],
    transaction,
  });
  if (!space) throw new NotFoundError('space');
  return space as Space & { job: Job };
}

/** The newest revision of a space's plan, or null when none was saved yet. */
export async function getLatestRevision(spaceId: string, transaction?: Transaction): Promise<PlanRevision | null> {
  return PlanRevision.findOne({ where: { spaceId }, order: [['revision', 'DESC']], transaction });
}

/** All revisions, newest first, without the plan bodies (use getRevision for one). */
export async function listRevisions(spaceId: string): Promise<PlanRevision[]> {
  return PlanRevision.findAll({ where: { spaceId }, order: [['revision', 'DESC']], attributes: { exclude: ['plan', 'takeoff'] } });
}

export async function getRevision(spaceId: string, revision: number): Promise<PlanRevision> {
  const row = await PlanRevision.findOne({ where: { spaceId, revision } });
  if (!row) throw new NotFoundError('revision');
  return row;
}

/**
 * Validates a plan with the shared validatePlan (schema, then geometry: self-intersection,
 * zero-length edges...); 422 naming the place (`plan.outline.0`, `plan.format`) when it is not valid.
 */
export function parsePlanOr422(input: unknown): Plan {
  const r = validatePlan(input);
  if (!r.ok) throw new ValidationError(r.errors.map((e) => ({ path: e.path ? `plan.${e.path}` : 'plan', message: e.message })));
  return r.plan;
}

/**
 * Saves a plan as the next revision of a space (never overwriting an older one). With
 * `baseRevision`, refuses (409 revision_conflict) when someone saved in between.
 */
export async function addPlanRevision(
  sequelize: NonNullable<typeof Space.sequelize>,
  actor: SessionUser,
  spaceId: string,
  plan: Plan,
  opts: { baseRevision?: number; note?: string; takeoff?: Record<string, unknown> | null; transaction?: Transaction } = {},
): Promise<PlanRevision> {
  const run = async (transaction: Transaction) => {
    // Locks the space row so two saves cannot take the same revision number.
    await Space.findOne({ where: { id: spaceId }, lock: transaction.LOCK.UPDATE, transaction });
    const latest = await getLatestRevision(spaceId, transaction);
    const current = latest?.revision ?? 0;
    if (opts.baseRevision !== undefined && opts.baseRevision !== current) {
      throw new ConflictError(`this plan was saved by someone else meanwhile (revision ${current}); reload before saving`, 'revision_conflict');
    }
    const row = await PlanRevision.create(
      { organisationId: actor.organisationId, spaceId, revision: current + 1, plan, takeoff: opts.takeoff ?? null, authorId: actor.id, note: opts.note ?? '' },
      { transaction },
    );
    await Space.update({ updatedAt: new Date() } as never, { where: { id: spaceId }, transaction });
    return row;
  };
  return opts.transaction ? run(opts.transaction) : sequelize.transaction(run);
}

async function toDto(space: Space & { job: Job }): Promise<SpaceDto> {
  const latest = await getLatestRevision(space.id);
  return {
    id: space.id,
    jobId: space.jobId,
    jobReference: space.job.reference,
    name: space.name,
    position: space.position,
    latestRevision: latest?.revision ?? null,
    createdAt: space.createdAt.toISOString(),
    updatedAt: space.updatedAt.toISOString(),
  };
}

export function createSpacesService(deps: AppDeps) {
  const { sequelize } = deps;
  return {
    async create(actor: SessionUser, jobId: string, body: SpaceCreateBody): Promise<SpaceDto> {
      const job = await findJobForUser(actor, jobId);
      const plan = body.plan === undefined ? null : parsePlanOr422(body.plan);
      const spaceId = await sequelize.transaction(async (transaction) => {
        const position = await Space.count({ where: { jobId: job.id }, transaction });
        const space = await Space.create({ organisationId: actor.organisationId, jobId: job.id, name: body.name.trim(), position }, { transaction });
        if (plan) await addPlanRevision(sequelize, actor, space.id, plan, { note: 'first plan', transaction });
        return space.id;
      });
      await recordJobEvent(job, actor, 'space_added', { spaceId, name: body.name });
      return toDto(await findSpaceForUser(actor, spaceId));
    },

    async get(actor: SessionUser, id: string): Promise<SpaceDto> {
      return toDto(await findSpaceForUser(actor, id));
    },

    async update(actor: SessionUser, id: string, patch: SpacePatch): Promise<SpaceDto> {
      const space = await findSpaceForUser(actor, id);
      await space.update({ ...(patch.name !== undefined ? { name: patch.name } : {}), ...(patch.position !== undefined ? { position: patch.position } : {}) });
      return toDto(space);
    },

    async remove(actor: SessionUser, id: string): Promise<void> {
      const space = await findSpaceForUser(actor, id);
      const others = await Space.count({ where: { jobId: space.jobId, id: { [Op.ne]: space.id } } });
      await space.destroy();
      await recordJobEvent(space.job, actor, 'space_removed', { spaceId: space.id, name: space.name, remaining: others });
    },
  };
}
