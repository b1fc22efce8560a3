import type { Plan } from '../../../shared/plan/plan-schema';

/**
 * What differs between two versions of a plan, in words an estimator checks against the loft:
 * counts of corners, exclusions and eaves edges, the joists, the depths, the name. Empty when the
 * two agree on all of these (they may still differ in a corner's position: then one line says so).
 */
export function describePlanDifferences(mine: Plan, theirs: Plan): string[] {
  const out: string[] = [];
  const count = (what: string, a: number, b: number) => {
    if (a !== b) out.push(`${what}: yours ${a}, theirs ${b}`);
  };
  count('corners', mine.outline.length, theirs.outline.length);
  count('exclusions', mine.exclusions.length, theirs.exclusions.length);
  count('eaves edges', mine.eavesEdges.length, theirs.eavesEdges.length);
  if (mine.joists.centresMm !== theirs.joists.centresMm) out.push(`joist centres: yours ${mine.joists.centresMm} mm, theirs ${theirs.joists.centresMm} mm`);
  if (mine.joists.angleDeg !== theirs.joists.angleDeg) out.push(`joist angle: yours ${mine.joists.angleDeg}°, theirs ${theirs.joists.angleDeg}°`);
  if (mine.existing.depthMm !== theirs.existing.depthMm) out.push(`existing depth: yours ${mine.existing.depthMm} mm, theirs ${theirs.existing.depthMm} mm`);
  const target = (p: Plan) => ('depthMm' in p.target ? `${p.target.depthMm} mm` : `U ${p.target.uValue}`);
  if (target(mine) !== target(theirs)) out.push(`target: yours ${target(mine)}, theirs ${target(theirs)}`);
  if (mine.name !== theirs.name) out.push(`name: yours “${mine.name}”, theirs “${theirs.name}”`);
  if (out.length === 0 && JSON.stringify(mine) !== JSON.stringify(theirs)) {
    out.push(
      mine.outline.length === theirs.outline.length && JSON.stringify(mine.outline) !== JSON.stringify(theirs.outline)
        ? 'corner positions differ'
        : 'other details differ',
    );
  }
  return out;
}
