import type { PlanMessage } from './plan-messages';

/**
 * Bounds on the size of a plan, so that the work a takeoff does stays bounded whatever a file or
 * a request holds. Each is far above any real loft (a detailed outline has tens of corners, a
 * house a few dozen downlights) and far below what stalls the engine (100,000 corners, 5,000
 * downlights or a 0.4 mm joist spacing over 99 m did). Measured: a plan at every limit at once
 * computes in well under the server's time limit (scripts/bench-takeoff.ts, tests/shared/plan-limits.test.ts).
 */
export const PLAN_LIMITS = {
  /** Corners of the outline. */
  outlineCorners: 500,
  /** Exclusions (hatches, tanks, downlights…). */
  exclusions: 300,
  /** Corners of one exclusion's polygon. */
  exclusionCorners: 100,
  /** Corners of every exclusion polygon together. */
  allExclusionCorners: 2_000,
  /**
   * Bays between joists across the outline (its extent across the joists divided by the joist
   * centres): each bay is at least one strip of the base layer. 100 m at 100 mm centres is 1,000.
   */
  bays: 1_000,
  /** Largest coordinate or offset, mm (10 km from the origin; float precision stays far below 1 mm). */
  coordinateMm: 10_000_000,
} as const;

const n = (x: number) => x.toLocaleString('en-GB');

/**
 * Counts the arrays of a raw (not yet parsed) plan against `PLAN_LIMITS`, without reading their
 * contents, so an oversized plan is refused before any parsing or geometry. Anything that is not an
 * array where one is expected is left to the schema. Returns one message per field over its limit,
 * each with the field's `path`.
 */
export function checkPlanCounts(input: unknown): PlanMessage[] {
  if (!input || typeof input !== 'object') return [];
  const plan = input as { outline?: unknown; exclusions?: unknown; eavesEdges?: unknown };
  const out: PlanMessage[] = [];
  const over = (path: string, what: string, count: number, limit: number) =>
    out.push({ code: 'limits.too-many', path, message: `${path}: ${n(count)} ${what}; a plan may have at most ${n(limit)}` });
  if (Array.isArray(plan.outline) && plan.outline.length > PLAN_LIMITS.outlineCorners)
    over('outline', 'corners in the outline', plan.outline.length, PLAN_LIMITS.outlineCorners);
  if (Array.isArray(plan.eavesEdges) && plan.eavesEdges.length > PLAN_LIMITS.outlineCorners)
    over('eavesEdges', 'eaves edges', plan.eavesEdges.length, PLAN_LIMITS.outlineCorners);
  if (Array.isArray(plan.exclusions)) {
    if (plan.exclusions.length > PLAN_LIMITS.exclusions) {
      over('exclusions', 'exclusions', plan.exclusions.length, PLAN_LIMITS.exclusions);
      return out;
    }
    let total = 0;
    plan.exclusions.forEach((e, i) => {
      const poly = e && typeof e === 'object' ? (e as { polygon?: unknown }).polygon : undefined;
      if (!Array.isArray(poly)) return;
      total += poly.length;
      if (poly.length > PLAN_LIMITS.exclusionCorners)
        over(`exclusions.${i}.polygon`, `corners in exclusion ${i}'s shape`, poly.length, PLAN_LIMITS.exclusionCorners);
    });
    if (total > PLAN_LIMITS.allExclusionCorners) over('exclusions', 'corners in all exclusion shapes together', total, PLAN_LIMITS.allExclusionCorners);
  }
  return out;
}

/**
 * Bays implied by the joists over the outline: the outline's extent across the joists (mm)
 * divided by the joist centres (mm), rounded up. 0 for fewer than 3 corners or no spacing.
 */
export function impliedBays(outline: ReadonlyArray<readonly number[]>, joists: { angleDeg: number; centresMm: number }): number {
  if (outline.length < 3 || !(joists.centresMm > 0)) return 0;
  const a = (joists.angleDeg * Math.PI) / 180;
  // Unit vector at right angles to the joists: bays follow one another along it.
  const ax = -Math.sin(a);
  const ay = Math.cos(a);
  let lo = Infinity;
  let hi = -Infinity;
  for (const p of outline) {
    const t = p[0] * ax + p[1] * ay;
    if (t < lo) lo = t;
    if (t > hi) hi = t;
  }
  return Math.ceil((hi - lo) / joists.centresMm);
}

/** The message for a plan whose joists imply more than `PLAN_LIMITS.bays` bays, else null. */
export function checkImpliedBays(outline: ReadonlyArray<readonly number[]>, joists: { angleDeg: number; centresMm: number }): PlanMessage | null {
  const bays = impliedBays(outline, joists);
  if (bays <= PLAN_LIMITS.bays) return null;
  return {
    code: 'limits.too-many-bays',
    path: 'joists.centresMm',
    message: `joists.centresMm: joist centres of ${joists.centresMm} mm across this outline make ${n(bays)} bays to fill; a plan may have at most ${n(PLAN_LIMITS.bays)} (centres are in millimetres, usually 400 or 600)`,
  };
}
