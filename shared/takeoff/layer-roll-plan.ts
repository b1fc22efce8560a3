import { planRolls, type PieceDemand, type ProductRollPlan, type RollStock } from './roll-plan';
import type { TakeoffSettings } from './settings';
import type { TakeoffLayer, TakeoffRollPlan } from './takeoff-types';
import type { LayerWithDemand } from './build-layer';

const r1 = (x: number) => Math.round(x * 10) / 10 + 0;
const r4 = (x: number) => Math.round(x * 10000) / 10000 + 0;

/** The roll stock of a layer's product. */
export function stockOfLayer(l: Pick<TakeoffLayer, 'productId' | 'rollLengthMm' | 'lanesPerRoll' | 'laneWidthMm' | 'coverageM2PerRoll'>): RollStock {
  return {
    productId: l.productId,
    rollLengthMm: l.rollLengthMm,
    lanesPerRoll: l.lanesPerRoll,
    laneWidthMm: l.laneWidthMm,
    coverageM2PerRoll: l.coverageM2PerRoll,
  };
}

/**
 * Pieces of saved takeoff layers as the roll plan reads them, for pooling several spaces of a
 * job (`prefix` keeps keys apart, e.g. the space name). Strips become pieces at their cut length
 * and width, piece by piece; fills at their area. Cut-outs are not stored in the takeoff, so a pooled plan may
 * reuse a little less than the per-space one.
 */
export function piecesOfLayers(layers: TakeoffLayer[], prefix = ''): { stock: RollStock; pieces: PieceDemand[] }[] {
  const by = new Map<string, { stock: RollStock; pieces: PieceDemand[] }>();
  for (const l of layers) {
    const g = by.get(l.productId) ?? { stock: stockOfLayer(l), pieces: [] };
    const group = `${prefix}${l.role === 'base' ? 'base' : `cross${l.roleIndex + 1}`}`;
    // Each piece as cut (its own width), the strip's area shared by length × width.
    for (const s of l.strips) {
      const total = s.pieces.reduce((n, p) => n + p.lengthMm * p.widthMm, 0) || 1;
      s.pieces.forEach((p, i) =>
        g.pieces.push({
          key: `${prefix}${s.label}/${i + 1}`,
          group,
          lengthMm: p.lengthMm,
          widthMm: p.widthMm,
          areaMm2: (s.areaM2 * 1e6 * p.lengthMm * p.widthMm) / total,
          kind: 'strip',
        }),
      );
    }
    (l.fills ?? []).forEach((f, i) =>
      g.pieces.push({ key: `${prefix}${group}-fill${i + 1}`, group, lengthMm: f.lengthMm, widthMm: f.widthMm, areaMm2: f.areaM2 * 1e6, kind: 'fill' }),
    );
    by.set(l.productId, g);
  }
  return [...by.values()];
}

/**
 * Plans the rolls of a space, pooled per product over its layers, and writes each layer's
 * share: strip pieces (roll, lane, offset, width, source), rolls opened, its lanes and offcuts.
 * Returns the cut list per product.
 */
export function applyRollPlans(built: LayerWithDemand[], s: TakeoffSettings, priceOf: (productId: string) => number): TakeoffRollPlan[] {
  const by = new Map<string, { stock: RollStock; pieces: PieceDemand[]; layers: LayerWithDemand[] }>();
  for (const b of built) {
    const g = by.get(b.layer.productId) ?? { stock: stockOfLayer(b.layer), pieces: [], layers: [] };
    g.pieces.push(...b.demands);
    g.layers.push(b);
    by.set(b.layer.productId, g);
  }
  const groups = [...by.values()];
  const plans = planRolls(groups, { minOffcutMm: s.minOffcutMm, minStripWidthMm: s.minStripWidthMm });
  return groups.map((g, i) => {
    const plan = plans[i];
    for (const b of g.layers) writeLayer(b, plan, priceOf(b.layer.productId));
    return cutList(g.layers, plan, s.minOffcutMm);
  });
}

function writeLayer(b: LayerWithDemand, plan: ProductRollPlan, price: number): void {
  const l = b.layer;
  const byLabel = new Map(l.strips.map((st) => [st.label, st]));
  const lanes: TakeoffLayer['packing']['lanes'] = [];
  for (const lane of plan.lanes) {
    const cuts = lane.cuts.filter((c) => c.group === b.group && byLabel.has(c.key));
    if (!cuts.length) continue;
    lanes.push({
      roll: lane.roll,
      lane: lane.lane,
      usedMm: r1(lane.usedMm),
      leftoverMm: r1(lane.leftoverMm),
      cuts: cuts.map((c) => ({
        stripNumber: byLabel.get(c.key)!.number,
        pieceIndex: c.part - 1,
        lengthMm: r1(c.lengthMm),
        widthMm: r1(c.widthMm),
        offsetMm: r1(c.offsetMm),
      })),
    });
    for (const c of cuts) {
      byLabel.get(c.key)!.pieces.push({
        pieceIndex: c.part - 1,
        lengthMm: r1(c.lengthMm),
        widthMm: r1(c.widthMm),
        roll: lane.roll,
        lane: lane.lane,
        offsetMm: r1(c.offsetMm),
        source: c.widthMm < l.laneWidthMm - 0.5 ? 'lengthwise' : 'lane',
      });
    }
  }
  for (const c of plan.fromOffcuts) {
    const st = c.group === b.group ? byLabel.get(c.key) : undefined;
    if (st)
      st.pieces.push({
        pieceIndex: c.part - 1,
        lengthMm: r1(c.lengthMm),
        widthMm: r1(c.widthMm),
        roll: c.roll,
        lane: c.lane,
        offsetMm: 0,
        source: 'offcut',
        from: c.from,
      });
  }
  // Most strips are one piece: sorting those would only make the sort's scratch.
  for (const st of l.strips) if (st.pieces.length > 1) st.pieces.sort((a, c) => a.pieceIndex - c.pieceIndex);
  const layerCut = l.strips.reduce((t, st) => t + st.lengthMm * st.widthMm, 0);
  l.rollsByPacking = plan.rollsByGroup[b.group] ?? 0;
  l.wastePct = r1(plan.wastePct);
  l.priceMinor = l.rollsByPacking * price;
  l.packing = {
    method: 'continuous-lanes',
    lanesUsed: lanes.length,
    lanesLowerBound: Math.ceil(layerCut / (l.rollLengthMm * l.laneWidthMm) - 1e-9),
    lanes,
    offcuts: plan.offcuts.map((o) => ({ roll: o.roll, lane: o.lane, lengthMm: r1(o.lengthMm), widthMm: r1(o.widthMm), reusable: !!o.reusable })),
  };
}

function cutList(layers: LayerWithDemand[], plan: ProductRollPlan, minOffcutMm: number): TakeoffRollPlan {
  const l0 = layers[0].layer;
  const W = l0.laneWidthMm;
  return {
    productId: l0.productId,
    productName: l0.productName,
    laneWidthMm: W,
    rollLengthMm: l0.rollLengthMm,
    rolls: plan.rolls,
    rollsLowerBound: plan.rollsLowerBound,
    rollsByArea: layers.reduce((t, b) => t + b.layer.rollsByArea, 0),
    lanes: plan.lanes.map((lane) => ({
      roll: lane.roll,
      lane: lane.lane,
      cuts: lane.cuts.map((c) => ({
        label: c.key === 'fill' ? 'fill material' : c.key,
        part: c.part,
        parts: c.parts,
        lengthMm: r1(c.lengthMm),
        widthMm: r1(c.widthMm),
        lengthwise: c.widthMm < W - 0.5,
      })),
      leftoverMm: r1(lane.leftoverMm),
      leftover: lane.leftoverMm <= 0.5 ? 'none' : lane.leftoverMm + 1e-6 >= minOffcutMm ? 'keep' : 'waste',
    })),
    fromOffcuts: plan.fromOffcuts.map((c) => ({ label: c.key, part: c.part, parts: c.parts, lengthMm: r1(c.lengthMm), widthMm: r1(c.widthMm), from: c.from })),
    fills: plan.fills.map((f) => ({ layer: f.group, count: f.count, areaM2: r4(f.areaMm2 / 1e6) })),
    keep: plan.offcuts.filter((o) => o.reusable).map((o) => ({ lengthMm: r1(o.lengthMm), widthMm: r1(o.widthMm), from: o.from })),
    wastePct: r1(plan.wastePct),
  };
}
