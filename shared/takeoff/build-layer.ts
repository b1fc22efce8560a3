import type { Plan } from '../plan/plan-schema';
import type { MultiPolygon } from '../geometry/polygon';
import { SNAP_MM } from '../geometry/bands';
import { vecDot, type Vec2 } from '../geometry/vector';
import type { LayerChoice } from './layers';
import { cutStrips, layerBands, layingOrder, roundUpToStep, type RawStrip } from './strips';
import { rollsByArea, type PieceDemand } from './roll-plan';
import type { TakeoffSettings } from './settings';
import { productLaneWidthMm } from './products';
import type { PlanPointMm, TakeoffLayer, TakeoffStrip } from './takeoff-types';

// `+ 0` turns -0 into 0, which JSON cannot tell apart anyway.
const r1 = (x: number) => Math.round(x * 10) / 10 + 0;
const r3 = (x: number) => Math.round(x * 1000) / 1000 + 0;
const r4 = (x: number) => Math.round(x * 10000) / 10000 + 0;
const pt = (p: readonly number[]): PlanPointMm => [r1(p[0]), r1(p[1])];
const m2 = (mm2: number) => mm2 / 1e6;

/** A layer with its strips numbered and what the roll plan must cut for it (rolls not yet counted). */
export interface LayerWithDemand {
  layer: TakeoffLayer;
  /** Key of the layer in the roll plan (`base`, `cross1`…). */
  group: string;
  demands: PieceDemand[];
}

/**
 * One layer: its bands, its strips in laying order with the width actually covered, the slivers
 * to fill from offcuts, and the pieces the roll plan must cut (`demands`, keyed by strip label).
 * Rolls, pieces and packing are filled in later by `applyRollPlans` (rolls are pooled per product).
 * A narrow strip is cut at the width it covers plus the friction-fit allowance of a full bay
 * (lane width − bay width, where the lane is the wider), rounded up to 10 mm.
 */
export function buildLayer(
  plan: Plan,
  choice: LayerChoice,
  region: MultiPolygon,
  regionAreaMm2: number,
  reference: Vec2,
  outlineCentre: Vec2,
  s: TakeoffSettings,
): LayerWithDemand {
  const p = choice.product;
  const laneWidthMm = productLaneWidthMm(p);
  const stagger = choice.role === 'cross' ? (choice.roleIndex * laneWidthMm) / 2 : 0;
  const lb = layerBands(plan, choice.role, laneWidthMm, region, stagger);
  const all = cutStrips(region, lb, s.cuttingAllowanceMm, s.minOffcutMm);
  const friction = Math.max(0, laneWidthMm - lb.bandWidthMm);
  const widthOf = (covered: number, full: boolean) => (full ? laneWidthMm : Math.min(laneWidthMm, roundUpToStep(covered + friction, 10)));
  // Thresholds give float dust the benefit of the doubt (a piece exactly at the minimum is a
  // strip however the plan is turned): SNAP_MM on widths, 10 mm² on areas (a µm along a metre).
  const minArea = s.minStripAreaM2 * 1e6 - 10;
  const minWidth = s.minStripWidthMm - SNAP_MM;
  // A piece too small or too narrow everywhere is a sliver: filled from offcuts, not numbered.
  const isSliver = (r: RawStrip) => r.areaMm2 < minArea || r.coveredWidthMm < minWidth;
  const raw = all.filter((r) => !isSliver(r));
  const order = layingOrder(raw, lb.frame, reference);
  const prefix = choice.role === 'base' ? 'B' : `C${choice.roleIndex + 1}.`;
  const group = choice.role === 'base' ? 'base' : `cross${choice.roleIndex + 1}`;

  const demands: PieceDemand[] = [];
  const fills: TakeoffLayer['fills'] = [];
  const addFill = (areaMm2: number, widthMm: number, lengthMm: number, at: Vec2) => {
    demands.push({ key: `${prefix}fill${fills.length + 1}`, group, lengthMm, widthMm: Math.min(laneWidthMm, widthMm), areaMm2, kind: 'fill' });
    fills.push({ areaM2: r4(m2(areaMm2)), widthMm: r1(widthMm), lengthMm: r1(lengthMm), at: pt(at) });
  };
  for (const r of all) if (isSliver(r)) addFill(r.areaMm2, r.coveredWidthMm, r.lengthMm, r.insideAt);
  const strips: TakeoffStrip[] = order.map((rawIndex, k) => {
    const r = raw[rawIndex];
    const number = k + 1;
    const key = `${prefix}${number}`;
    // The piece's area shared over its lengths by length × width covered.
    const nominal = r.segments.reduce((t, g) => t + g.lengthMm * g.coveredWidthMm, 0) || 1;
    let widthMm = 0;
    let cutLength = 0;
    let fillArea = 0;
    let first = true;
    for (const g of r.segments) {
      const areaMm2 = (r.areaMm2 * g.lengthMm * g.coveredWidthMm) / nominal;
      if (g.coveredWidthMm < minWidth) {
        addFill(areaMm2, g.coveredWidthMm, g.lengthMm, r.insideAt);
        fillArea += areaMm2;
        continue;
      }
      const w = widthOf(g.coveredWidthMm, g.fullWidth);
      if (w > widthMm) widthMm = w;
      cutLength += g.lengthMm;
      const scale = w / Math.max(g.coveredWidthMm, 1e-9);
      demands.push({
        key,
        group,
        lengthMm: g.lengthMm,
        widthMm: w,
        areaMm2,
        kind: 'strip',
        cutOuts: first ? r.cutOuts.map((c) => ({ lengthMm: c.lengthMm, widthMm: Math.min(w, c.acrossMm * scale) })) : undefined,
      });
      first = false;
    }
    return {
      number,
      label: key,
      bandIndex: r.bandIndex,
      lengthMm: r1(cutLength),
      widthMm: r1(widthMm),
      fullWidth: r.fullWidth,
      bandWidthMm: r1(lb.bandWidthMm),
      extentMm: r1(r.extentMm),
      areaM2: r4(m2(r.areaMm2 - fillArea)),
      cutOutM2: r4(m2(r.cutOuts.reduce((t, c) => t + c.lengthMm * c.acrossMm, 0))),
      polygons: r.polygons,
      labelAt: pt(r.insideAt),
      pieces: [],
    };
  });

  let dir: Vec2 = [lb.frame.along[0], lb.frame.along[1]];
  const toRef: Vec2 = [reference[0] - outlineCentre[0], reference[1] - outlineCentre[1]];
  const d = vecDot(dir, toRef);
  if (d < -1e-6 || (Math.abs(d) <= 1e-6 && (dir[0] < -1e-12 || (Math.abs(dir[0]) <= 1e-12 && dir[1] < 0)))) dir = [-dir[0], -dir[1]];

  const areaM2 = m2(regionAreaMm2);
  const coveredMm2 = all.reduce((t, x) => t + x.areaMm2, 0);
  const layer: TakeoffLayer = {
    role: choice.role,
    roleIndex: choice.roleIndex,
    productId: p.id,
    productName: p.name,
    thicknessMm: p.thicknessMm,
    lambda: p.lambda,
    areaM2: r3(areaM2),
    rollLengthMm: p.rollLengthMm,
    laneWidthMm: r1(laneWidthMm),
    lanesPerRoll: p.lanesPerRoll,
    coverageM2PerRoll: p.coverageM2PerRoll,
    bandWidthMm: r1(lb.bandWidthMm),
    layDirection: [r4(dir[0]), r4(dir[1])],
    strips,
    fills,
    totalStripLengthMm: r1(strips.reduce((t, x) => t + x.lengthMm, 0)),
    coveredAreaM2: r3(m2(coveredMm2)),
    rollsByPacking: 0,
    rollsByArea: rollsByArea(areaM2, s.wasteAllowancePct, p.coverageM2PerRoll),
    rollsLowerBound: Math.ceil(m2(coveredMm2) / p.coverageM2PerRoll - 1e-9),
    wastePct: 0,
    packing: { method: 'continuous-lanes', lanesUsed: 0, lanesLowerBound: 0, lanes: [], offcuts: [] },
    priceMinor: 0,
  };
  return { layer, group, demands };
}
