import { randomUUID } from 'node:crypto';
import { fileTypeFromBuffer } from 'file-type';
import { can } from '../../../shared/auth/policies';
import { PLAN_FORMAT, type Plan } from '../../../shared/plan/plan-schema';
import { readStoredTakeoff, takeoffWithoutPrices } from '../../../shared/takeoff/takeoff-schema';
import { TAKEOFF_FORMAT } from '../../../shared/takeoff/takeoff-types';
import type { AppDeps } from '../../deps';
import { User } from '../../db/models';
import { AppError, ValidationError } from '../../lib/errors';
import { StorageNotFoundError } from '../../lib/storage';
import { assertImagePixels, MAX_IMAGE_PIXELS } from '../../lib/uploads';
import { checkPlanShapeOr422, runPlanTaskOr422 } from '../../lib/takeoff-pool/plan-checks';
import type { SessionUser } from '../../types';
import { companyTakeoffInputs, storePlanRevision, type TakeoffInputs } from '../plan-revisions/plan-takeoff';
import { getRevision, listRevisions } from '../plan-revisions/revisions.repository';
import { findSpaceForUser } from '../spaces/spaces.service';
import { readSpacePlan, type SpacePlanRow } from './plan-read';

export const BACKGROUND_MAX_BYTES = 8 * 1024 * 1024;
const IMAGE_TYPES: Record<string, string> = { 'image/png': 'png', 'image/jpeg': 'jpg', 'image/webp': 'webp', 'image/gif': 'gif' };

/** A new, empty plan for a space that has none yet. */
export function starterPlan(name: string): Plan {
  return {
    format: PLAN_FORMAT,
    name: name.slice(0, 120) || 'Loft',
    outline: [],
    eavesEdges: [],
    eavesGapMm: 50,
    joists: { angleDeg: 90, centresMm: 400, widthMm: 47, depthMm: 100, offsetMm: 0 },
    exclusions: [],
    existing: { depthMm: 0, condition: 'none' },
    target: { depthMm: 270 },
  };
}

export function createPlansService(deps: AppDeps) {
  const { sequelize, pool, storage, planPool } = deps;

  /**
   * Validates and computes the takeoff in the worker pool (422 with the engine's messages, or when
   * the plan passes the time limit), then stores both as the next revision.
   */
  async function save(actor: SessionUser, spaceId: string, input: unknown, opts: { baseRevision?: number; note?: string }) {
    checkPlanShapeOr422(input);
    const inputs = await companyTakeoffInputs(actor.organisationId);
    const { plan, takeoff } = await runPlanTaskOr422(planPool, { kind: 'takeoff', plan: input, ...inputs });
    const { revision: row } = await storePlanRevision(
      sequelize,
      { organisationId: actor.organisationId, spaceId, authorId: actor.id, plan, ...opts },
      { inputs, takeoff: takeoff! },
    );
    return { plan, revision: row.revision, createdAt: row.createdAt.toISOString(), netAreaM2: takeoff!.netAreaM2 };
  }

  return {
    async get(actor: SessionUser, spaceId: string) {
      return planAnswer(actor, await readSpacePlan(pool, actor, spaceId, { withTakeoff: !can(actor, 'plans:write') }));
    },

    async save(actor: SessionUser, spaceId: string, body: { plan: unknown; baseRevision: number; note?: string }) {
      await findSpaceForUser(actor, spaceId);
      return save(actor, spaceId, body.plan, { baseRevision: body.baseRevision, note: body.note });
    },

    async revisions(actor: SessionUser, spaceId: string) {
      await findSpaceForUser(actor, spaceId);
      const rows = await listRevisions(spaceId);
      const authorIds = [...new Set(rows.map((r) => r.authorId).filter((x): x is string => !!x))];
      const authors = new Map((await User.findAll({ where: { id: authorIds }, attributes: ['id', 'name'] })).map((u) => [u.id, u.name]));
      return rows.map((r) => ({
        revision: r.revision,
        author: r.authorId ? { id: r.authorId, name: authors.get(r.authorId) ?? 'former user' } : null,
        createdAt: r.createdAt.toISOString(),
        note: r.note || undefined,
      }));
    },

    async revision(actor: SessionUser, spaceId: string, revision: number) {
      await findSpaceForUser(actor, spaceId);
      const row = await getRevision(spaceId, revision);
      return { plan: row.plan as Plan, revision: row.revision, createdAt: row.createdAt.toISOString() };
    },

    /** Saves an old revision's plan as the newest one (history is never rewritten). */
    async restore(actor: SessionUser, spaceId: string, revision: number, baseRevision?: number) {
      await findSpaceForUser(actor, spaceId);
      const old = await getRevision(spaceId, revision);
      return save(actor, spaceId, old.plan, { baseRevision, note: `restored from revision ${revision}` });
    },

    /** Stores an underlay image (PNG, JPEG, WebP or GIF, checked by its bytes) and returns its URL. */
    /** Throws the space's 404 when this user may not see it (before an upload body is read). */
    async assertVisible(actor: SessionUser, spaceId: string): Promise<void> {
      await findSpaceForUser(actor, spaceId);
    },

    async uploadBackground(actor: SessionUser, spaceId: string, file: { buffer: Buffer; originalname: string } | undefined) {
      const space = await findSpaceForUser(actor, spaceId);
      if (!file) throw new ValidationError([{ path: 'image', message: 'choose an image file to upload (field "image")' }]);
      const type = await fileTypeFromBuffer(file.buffer);
      const ext = type ? IMAGE_TYPES[type.mime] : undefined;
      if (!ext) throw new AppError(415, 'unsupported_image', 'the underlay must be a PNG, JPEG, WebP or GIF image');
      // The browser decodes the underlay at full size: refuse decompression bombs by their header.
      await assertImagePixels(file.buffer, MAX_IMAGE_PIXELS.underlay, 'underlay image');
      const name = `${randomUUID()}.${ext}`;
      await storage.put(`${actor.organisationId}/plan-backgrounds/${space.id}/${name}`, file.buffer, { contentType: type!.mime });
      return { url: `/api/spaces/${space.id}/background/${name}`, bytes: file.buffer.length };
    },

    async background(actor: SessionUser, spaceId: string, name: string) {
      const space = await findSpaceForUser(actor, spaceId);
      if (!/^[0-9a-f-]{36}\.(png|jpg|webp|gif)$/.test(name)) throw new AppError(404, 'not_found', 'image not found');
      const key = `${actor.organisationId}/plan-backgrounds/${space.id}/${name}`;
      const ext = name.split('.').pop()!;
      try {
        return { stream: await storage.get(key), type: ext === 'jpg' ? 'image/jpeg' : `image/${ext}` };
      } catch (e) {
        if (e instanceof StorageNotFoundError) throw new AppError(404, 'not_found', 'image not found');
        throw e;
      }
    },
  };
}

export type PlansService = ReturnType<typeof createPlansService>;

/**
 * The answer to GET /:id/plan from the read (readSpacePlan, or the read that brings its session
 * along), read with its takeoff body exactly when the actor cannot write plans.
 */
export function planAnswer(actor: SessionUser, space: SpacePlanRow) {
  const canWrite = can(actor, 'plans:write');
  const { inputs } = space;
  const withPrices = can(actor, 'prices:read');
  // Writers are sent no takeoff, only whether one is stored: the server alone writes that column,
  // from computeTakeoff, whose output parses to itself under the schema of its format (a changed
  // shape bumps the format; tests/shared/takeoff-schema.test.ts), so the format string answers it.
  // Viewers are sent the body through the schema, which also puts its keys in the schema's order.
  const stored = canWrite ? null : readStoredTakeoff(space.takeoff);
  const takeoffStored = canWrite ? space.takeoffFormat === TAKEOFF_FORMAT : stored !== null;
  return {
    plan: (space.plan as Plan | null) ?? starterPlan(space.name),
    revision: space.revision ?? 0,
    savedAt: space.createdAt?.toISOString() ?? null,
    space: { id: space.id, name: space.name, jobId: space.jobId, jobReference: space.jobReference },
    canWrite,
    /** Whether this revision has its takeoff stored (the editor offers Save when it has not). */
    takeoffStored,
    // Read-only viewers are shown the stored artefact as it is (no recomputing, no pinning);
    // writers compute it live from the same inputs, so they are not sent a second copy.
    takeoff: canWrite || !stored ? null : withPrices ? stored : takeoffWithoutPrices(stored),
    takeoffInputs: withPrices ? inputs : withoutPrices(inputs),
  };
}

/** Inputs with every price zeroed, the fuel price included (installers never see prices). */
function withoutPrices(inputs: TakeoffInputs): TakeoffInputs {
  return { products: inputs.products.map((p) => ({ ...p, priceMinor: 0 })), settings: { ...inputs.settings, fuelPriceMinorPerKwh: 0 } };
}
