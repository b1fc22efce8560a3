import type pg from 'pg';
import { can } from '../../../shared/auth/policies';
import { parseProductCatalogue, type TakeoffProduct } from '../../../shared/takeoff/products';
import { NotFoundError } from '../../lib/errors';
import type { SessionUser } from '../../types';
import { takeoffSettingsOf, type SettingsForTakeoff, type TakeoffInputs } from '../plan-revisions/plan-takeoff';
import { defaultCompanySettings } from '../settings/settings.defaults';

/** A space with its job's facts, its latest revision and its company's takeoff inputs, read in one query. */
export interface SpacePlanRow {
  id: string;
  name: string;
  jobId: string;
  jobReference: string;
  revision: number | null;
  plan: unknown;
  /** The stored takeoff's format string (null without one); the body itself only when asked for. */
  takeoffFormat: string | null;
  takeoff: unknown;
  createdAt: Date | null;
  inputs: TakeoffInputs;
}

/** A row of planReadSql. */
export interface PlanReadRow extends Omit<SpacePlanRow, 'inputs'> {
  jobOrganisationId: string;
  assignedInstallerId: string | null;
  settings: SettingsForTakeoff | null;
  /** The catalogue as JSON text (the key of `parsedCatalogues`). */
  products: string;
  hatchKit: boolean;
}

// The editor's read is the hottest authenticated GET: one round trip for the space, the job that
// decides access, the newest revision (the (space_id, revision) index serves the LIMIT 1) and the
// company's takeoff inputs (settings, active products in name order, whether a hatch kit is
// offered), read afresh every time so a change made through any instance shows on the next read.
// The takeoff body is sent only to viewers who cannot write (withTakeoff): writers compute it live, and for them
// the stored format column (migration 0508) answers whether one is stored without unpacking it. A named
// statement: each connection parses and plans it once, not on every read.
// Its parameters are SQL expressions, so the plan read that brings its session along
// (plan-read-session.ts) runs the same text with the company taken from the session's user.
export const planReadSql = (q: { spaceId: string; organisationId: string; withTakeoff: string }) => `
  SELECT s.id, s.name, s.job_id AS "jobId", j.reference AS "jobReference", j.organisation_id AS "jobOrganisationId",
         j.assigned_installer_id AS "assignedInstallerId", r.revision, r.plan, r.takeoff_format AS "takeoffFormat",
         CASE WHEN ${q.withTakeoff} THEN r.takeoff END AS takeoff, r.created_at AS "createdAt",
         (SELECT json_build_object('wasteAllowance', c.waste_allowance, 'minOffcutMm', c.min_offcut_mm, 'degreeDays', c.degree_days,
                   'fuelPriceMinorPerKwh', c.fuel_price_minor_per_kwh, 'heatingEfficiency', c.heating_efficiency,
                   'eavesMode', c.eaves_mode, 'hatchKitInsulationMm', c.hatch_kit_insulation_mm)
            FROM company_settings c WHERE c.organisation_id = ${q.organisationId}) AS settings,
         (SELECT coalesce(json_agg(json_build_object('id', p.id, 'name', p.name, 'thicknessMm', p.thickness_mm, 'rollWidthMm', p.roll_width_mm,
                   'lanes', p.lanes, 'rollLengthMm', p.roll_length_mm, 'coverageM2', p.coverage_m2, 'lambdaWmK', p.lambda_w_mk,
                   'unitPriceMinor', p.unit_price_minor, 'roles', p.roles) ORDER BY p.name, p.id), '[]')::text
            FROM products p WHERE p.organisation_id = ${q.organisationId} AND p.active) AS products,
         EXISTS (SELECT 1 FROM extras e WHERE e.organisation_id = ${q.organisationId} AND e.kind = 'hatch_kit' AND e.active) AS "hatchKit"
  FROM spaces s
  JOIN jobs j ON j.id = s.job_id
  LEFT JOIN LATERAL (
    SELECT revision, plan, takeoff_format, takeoff, created_at FROM plan_revisions WHERE space_id = s.id ORDER BY revision DESC LIMIT 1
  ) r ON true
  WHERE s.id = ${q.spaceId} AND s.organisation_id = ${q.organisationId} AND s.deleted_at IS NULL`;
const SQL = planReadSql({ spaceId: '$1', organisationId: '$2', withTakeoff: '$3::boolean' });

/**
 * The space, its latest revision and the company's takeoff inputs when the actor may see its job;
 * a 404 like a missing id otherwise. `withTakeoff` loads the stored takeoff's body.
 */
export async function readSpacePlan(pool: pg.Pool, actor: SessionUser, spaceId: string, opts: { withTakeoff: boolean }): Promise<SpacePlanRow> {
  const {
    rows: [row],
  } = await pool.query<PlanReadRow>({ name: 'plan-read', text: SQL, values: [spaceId, actor.organisationId, opts.withTakeoff] });
  const space = row ? visibleSpacePlan(actor, row) : null;
  if (!space) throw new NotFoundError('space');
  return space;
}

/** The row as the service uses it, or null when the actor may not see its job. */
export function visibleSpacePlan(actor: SessionUser, row: PlanReadRow): SpacePlanRow | null {
  if (!can(actor, 'jobs:read', { organisationId: row.jobOrganisationId, assignedInstallerId: row.assignedInstallerId })) return null;
  const { jobOrganisationId: _o, assignedInstallerId: _a, settings, products, hatchKit, ...plan } = row;
  // A company that never saved its settings reads the defaults (GETs write nothing).
  const inputs = { products: parsedCatalogue(products), settings: takeoffSettingsOf(settings ?? defaultCompanySettings(''), { hatchKitActive: hatchKit }) };
  return { ...plan, inputs };
}

// Catalogues as read, parsed and checked once per distinct content. The key is the catalogue's JSON
// text from the same query as the plan, so an edit through any instance is a new key at once (no
// invalidation to get wrong); entries are frozen because every read shares them.
const parsedCatalogues = new Map<string, readonly TakeoffProduct[]>();
const CATALOGUES_KEPT = 200;

function parsedCatalogue(json: string): TakeoffProduct[] {
  let parsed = parsedCatalogues.get(json);
  if (!parsed) {
    parsed = Object.freeze(parseProductCatalogue(JSON.parse(json) as unknown[]).map((p) => Object.freeze(p)));
    // Simplest bound: start afresh when full (a company's catalogue changes rarely).
    if (parsedCatalogues.size >= CATALOGUES_KEPT) parsedCatalogues.clear();
    parsedCatalogues.set(json, parsed);
  }
  return parsed as TakeoffProduct[];
}
