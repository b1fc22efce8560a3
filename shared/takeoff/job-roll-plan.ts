import { planRolls } from './roll-plan';
import { piecesOfLayers } from './layer-roll-plan';
import type { Takeoff } from './takeoff-types';

/**
 * Rolls per product for a whole job: the strips of every space's takeoff planned together, so
 * one space's offcuts and roll ends serve the next (rolls pooled per job per product). Each
 * product gets the smaller of the pooled plan and the sum of the spaces' own plans (both are
 * plans an installer can follow; the stored strips do not record the cut-outs a space's own plan
 * reuses). Settings (minimum usable offcut, minimum strip width) are the first takeoff's.
 * Returns productId → rolls; empty for no takeoffs.
 */
export function jobRollsByProduct(takeoffs: readonly Takeoff[]): Map<string, number> {
  const out = new Map<string, number>();
  if (takeoffs.length === 0) return out;
  const bySpace = new Map<string, number>();
  for (const t of takeoffs) for (const l of t.layers) bySpace.set(l.productId, (bySpace.get(l.productId) ?? 0) + l.rollsByPacking);
  const merged = new Map<string, ReturnType<typeof piecesOfLayers>[number]>();
  takeoffs.forEach((t, i) => {
    for (const g of piecesOfLayers(t.layers, `${i + 1}:`)) {
      const m = merged.get(g.stock.productId);
      if (m) m.pieces.push(...g.pieces);
      else merged.set(g.stock.productId, { stock: g.stock, pieces: [...g.pieces] });
    }
  });
  const s = takeoffs[0].settings;
  const plans = planRolls([...merged.values()], { minOffcutMm: s.minOffcutMm, minStripWidthMm: s.minStripWidthMm });
  for (const p of plans) out.set(p.productId, Math.min(p.rolls, bySpace.get(p.productId) ?? p.rolls));
  return out;
}
