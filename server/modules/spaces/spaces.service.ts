import { Op, type Transaction } from 'sequelize';
import type { Space as SpaceDto, SpaceCreateBody, SpacePatch } from '../../../shared/api/spaces';
import { can } from '../../../shared/auth/policies';
import type { Plan } from '../../../shared/plan/plan-schema';
import { validatePlan } from '../../../shared/plan/validate-plan';
import type { AppDeps } from '../../deps';
import { Job, Space } from '../../db/models';
import { NotFoundError } from '../../lib/errors';
import { checkPlanShapeOr422, invalidPlan, runPlanTaskOr422 } from '../../lib/takeoff-pool/plan-checks';
import type { SessionUser } from '../../types';
import { findJobFor } from '../jobs/job-access';
import { recordJobEvent } from '../jobs/jobs.service';
import { companyTakeoffInputs, storePlanRevision } from '../plan-revisions/plan-takeoff';
import { latestRevision } from '../plan-revisions/revisions.repository';

/**
 * The space if this user may see it (same company; installers only on their assigned jobs),
 * else NotFound. The plans module calls this before reading or saving a plan.
 */
export async function findSpaceForUser(
  actor: SessionUser,
  spaceId: string,
  transaction?: Transaction,
  opts: { removed?: boolean } = {},
): Promise<Space & { job: Job }> {
  const space = (await Space.findOne({
    where: { id: spaceId, organisationId: actor.organisationId },
    include: [{ model: Job, as: 'job', required: true }],
    transaction,
    paranoid: !opts.removed,
  })) as (Space & { job?: Job }) | null;
  if (!space?.job || !can(actor, 'jobs:read', space.job)) throw new NotFoundError('space');
  return space as Space & { job: Job };
}

/**
 * Validates a plan on this thread with the shared validatePlan (sizes, schema, geometry); 422 naming
 * the place (`plan.outline.0`, `plan.format`). For scripts and tests: request paths use the pool.
 */
export function parsePlanOr422(input: unknown): Plan {
  const r = validatePlan(input);
  if (!r.ok) throw invalidPlan(r.errors);
  return r.plan;
}

async function toDto(space: Space & { job: Job }): Promise<SpaceDto> {
  const latest = await latestRevision(space.id, { bodies: false });
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
  const { sequelize, planPool } = deps;
  return {
    async create(actor: SessionUser, jobId: string, body: SpaceCreateBody): Promise<SpaceDto> {
      const job = await findJobFor(actor, jobId);
      if (body.plan !== undefined) checkPlanShapeOr422(body.plan);
      // Checked and worked out exactly as a saved plan is: in the worker pool, same limits and messages.
      const inputs = body.plan === undefined ? null : await companyTakeoffInputs(actor.organisationId);
      const first = inputs ? await runPlanTaskOr422(planPool, { kind: 'takeoff', plan: body.plan, ...inputs }) : null;
      const spaceId = await sequelize.transaction(async (transaction) => {
        const position = await Space.count({ where: { jobId: job.id }, transaction });
        const space = await Space.create({ organisationId: actor.organisationId, jobId: job.id, name: body.name.trim(), position }, { transaction });
        // Stored with its takeoff, like every other revision.
        if (first)
          await storePlanRevision(
            sequelize,
            { organisationId: actor.organisationId, spaceId: space.id, authorId: actor.id, plan: first.plan, note: 'first plan' },
            { transaction, takeoff: first.takeoff },
          );
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
      // Soft: the row and every revision stay (deleted_at), so "Undo" brings the space back whole.
      await space.destroy();
      await recordJobEvent(space.job, actor, 'space_removed', { spaceId: space.id, name: space.name, remaining: others });
    },

    /** Brings a removed space back with its revisions; a space that was not removed is answered as it is. */
    async restore(actor: SessionUser, id: string): Promise<SpaceDto> {
      const space = await findSpaceForUser(actor, id, undefined, { removed: true });
      if (space.deletedAt) {
        // Guarded: only the request that finds it still removed restores it and records the event.
        const [restored] = await Space.update({ deletedAt: null }, { where: { id: space.id, deletedAt: { [Op.ne]: null } }, paranoid: false });
        if (restored === 1) await recordJobEvent(space.job, actor, 'space_restored', { spaceId: space.id, name: space.name });
      }
      return toDto(await findSpaceForUser(actor, id));
    },
  };
}
