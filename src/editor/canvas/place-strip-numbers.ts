import { polygonContainsPoint } from '../../../shared/geometry/polygon';
import type { Camera } from '../geometry/coords';
import type { DrawnTakeoff } from './draw-strips';

/** A strip number placed on screen: its centre (px), text and layer. */
export type PlacedNumber = { x: number; y: number; w: number; h: number; text: string; role: 'base' | 'cross' };

/** Height of a number's box on screen (px), and the steps it may slide along its strip. */
const BOX_H = 13;
const SLIDES_PX = [0, 16, -16, 32, -32, 48, -48, 64, -64, 96, -96];

/**
 * Where each strip number goes so that none overlaps another, base or cross: at the strip's label
 * point if that is free, else slid along the strip (its lay direction) by up to 96 px while it
 * stays inside the strip; a number with no free spot is left out (it appears when zooming in).
 * Layers are placed in the order given (base first), so the base numbers keep their spots.
 * `measure` gives a text's width in px. Pure: no canvas, testable headless.
 */
export function placeStripNumbers(layers: DrawnTakeoff['layers'], cam: Camera, measure: (text: string) => number): PlacedNumber[] {
  const placed: PlacedNumber[] = [];
  const overlaps = (b: PlacedNumber) => placed.some((o) => Math.abs(o.x - b.x) * 2 < o.w + b.w && Math.abs(o.y - b.y) * 2 < o.h + b.h);
  for (const layer of layers) {
    const a = (layer.layAngleDeg * Math.PI) / 180;
    const ux = Math.cos(a),
      uy = Math.sin(a);
    for (const s of layer.strips) {
      const text = String(s.number);
      const w = measure(text) + 4;
      const x0 = s.labelAt[0] * cam.zoom + cam.panX,
        y0 = s.labelAt[1] * cam.zoom + cam.panY;
      for (const t of SLIDES_PX) {
        const b: PlacedNumber = { x: x0 + ux * t, y: y0 + uy * t, w, h: BOX_H, text, role: layer.role };
        if (t !== 0) {
          const wp = [(b.x - cam.panX) / cam.zoom, (b.y - cam.panY) / cam.zoom];
          if (!s.polygons.some((p) => polygonContainsPoint(p, wp))) continue;
        }
        if (overlaps(b)) continue;
        placed.push(b);
        break;
      }
    }
  }
  return placed;
}
