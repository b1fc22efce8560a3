import type { Takeoff } from '../../../shared/takeoff/compute-takeoff';
import type { DrawnTakeoff } from '../canvas/draw-strips';

/** The parts of a takeoff the canvas draws: strips per layer and their lay direction. */
export function toDrawnTakeoff(t: Takeoff): DrawnTakeoff {
  return {
    layers: t.layers.map((l) => ({
      role: l.role,
      layAngleDeg: (Math.atan2(l.layDirection[1], l.layDirection[0]) * 180) / Math.PI,
      strips: l.strips.map((s) => ({ number: s.number, polygons: s.polygons, lengthMm: s.lengthMm, labelAt: s.labelAt })),
    })),
  };
}
