import { literal, type Transaction } from 'sequelize';
import type { Plan } from '../../../shared/plan/plan-schema';
import type { Takeoff } from '../../../shared/takeoff/takeoff-types';
import { PlanRevision, Space } from '../../db/models';
import { ConflictError, NotFoundError } from '../../lib/errors';

/*
 * The one place that reads and writes plan_revisions. Rows are only ever inserted (a save is the
 * next revision); the takeoff column is derived data and may be refreshed by the backfill.
 */

/** Whether to load the plan and takeoff bodies (large JSON) or only the revision's number, author and time. */
export type RevisionReadOptions = { bodies?: boolean; transaction?: Transaction };

const LATEST = literal('"PlanRevision"."revision" = (SELECT max(r2.revision) FROM plan_revisions r2 WHERE r2.space_id = "PlanRevision"."space_id")');

/**
 * The latest revision of each space, keyed by space id, in one query (spaces without a revision
 * are absent). Bodies are loaded unless `bodies: false`.
 */
export async function latestRevisions(spaceIds: readonly string[], opts: RevisionReadOptions = {}): Promise<Map<string, PlanRevision>> {
  if (spaceIds.length === 0) return new Map();
  const rows = await PlanRevision.findAll({
    where: { spaceId: [...new Set(spaceIds)], revision: LATEST } as never,
    ...(opts.bodies === false ? { attributes: { exclude: ['plan', 'takeoff'] } } : {}),
    transaction: opts.transaction,
  });
  return new Map(rows.map((r) => [r.spaceId, r]));
}

/** The latest revision of one space, or null when none was saved yet. */
export async function latestRevision(spaceId: string, opts: RevisionReadOptions = {}): Promise<PlanRevision | null> {
  return (await latestRevisions([spaceId], opts)).get(spaceId) ?? null;
}

/** The latest revisions of every space of these jobs (ordered by the job's space order), with their job id. */
export async function latestRevisionsOfJobs(
  jobIds: readonly string[],
  opts: RevisionReadOptions = {},
): Promise<{ space: Space; revision: PlanRevision | null }[]> {
  if (jobIds.length === 0) return [];
  const spaces = await Space.findAll({
    where: { jobId: [...jobIds] },
    order: [
      ['position', 'ASC'],
      ['createdAt', 'ASC'],
    ],
    transaction: opts.transaction,
  });
  const latest = await latestRevisions(
    spaces.map((s) => s.id),
    opts,
  );
  return spaces.map((space) => ({ space, revision: latest.get(space.id) ?? null }));
}

/** All revisions of a space, newest first, without the bodies (use getRevision for one). */
export async function listRevisions(spaceId: string): Promise<PlanRevision[]> {
  return PlanRevision.findAll({ where: { spaceId }, order: [['revision', 'DESC']], attributes: { exclude: ['plan', 'takeoff'] } });
}

/** One revision with its bodies; NotFound when the space has no such revision. */
export async function getRevision(spaceId: string, revision: number): Promise<PlanRevision> {
  const row = await PlanRevision.findOne({ where: { spaceId, revision } });
  if (!row) throw new NotFoundError('revision');
  return row;
}

/**
 * Inserts a plan and its takeoff as the next revision of a space. The space row is locked so two
 * saves cannot take the same number; with `baseRevision`, refuses (409 revision_conflict) when
 * another save came in between.
 */
export async function insertRevision(
  transaction: Transaction,
  row: { organisationId: string; spaceId: string; authorId: string | null; plan: Plan; takeoff: Takeoff | null; note?: string; baseRevision?: number },
): Promise<PlanRevision> {
  await Space.findOne({ where: { id: row.spaceId }, lock: transaction.LOCK.UPDATE, transaction });
  const current = (await latestRevision(row.spaceId, { bodies: false, transaction }))?.revision ?? 0;
  if (row.baseRevision !== undefined && row.baseRevision !== current) {
    throw new ConflictError(`this plan was saved by someone else meanwhile (revision ${current}); reload before saving`, 'revision_conflict');
  }
  const created = await PlanRevision.create(
    {
      organisationId: row.organisationId,
      spaceId: row.spaceId,
      revision: current + 1,
      plan: row.plan,
      takeoff: row.takeoff as unknown as Record<string, unknown> | null,
      authorId: row.authorId,
      note: row.note ?? '',
    },
    { transaction },
  );
  await Space.update({ updatedAt: new Date() } as never, { where: { id: row.spaceId }, transaction });
  return created;
}
