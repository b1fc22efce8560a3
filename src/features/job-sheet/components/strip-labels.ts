import { polygonArea, polygonCentroid, polygonContainsPoint } from '../../../../shared/geometry/polygon';

type Pt = [number, number];

export type LabelStrip = { id: string; label: string; polygons: Pt[][]; labelAt: Pt };

/** A strip number placed on the plan: position and font size in plan millimetres, rotation in degrees (SVG, y down). */
export type PlacedLabel = { id: string; label: string; x: number; y: number; fontSize: number; rotateDeg: number };

/** On-screen font size of a strip number, CSS px: below MIN it is not readable on a phone, above MAX it crowds the plan. */
export const LABEL_MIN_PX = 11;
export const LABEL_MAX_PX = 15;
/** Width of one JetBrains Mono glyph as a share of the font size (its advance is 600/1000 em), with a little slack. */
const GLYPH_EM = 0.62;

/** Direction of a polygon's longest edge, degrees in [-90, 90): the way a strip runs. */
function runDeg(poly: Pt[]): number {
  let best = 0;
  let deg = 0;
  for (let i = 0; i < poly.length; i++) {
    const a = poly[i];
    const b = poly[(i + 1) % poly.length];
    const len = Math.hypot(b[0] - a[0], b[1] - a[1]);
    if (len > best) {
      best = len;
      deg = (Math.atan2(b[1] - a[1], b[0] - a[0]) * 180) / Math.PI;
    }
  }
  // Text should read left to right or bottom to top, never upside down.
  while (deg >= 90) deg -= 180;
  while (deg < -90) deg += 180;
  return deg;
}

/** Corners of a w × h box centred on c, turned by deg. */
function boxCorners(c: Pt, w: number, h: number, deg: number): Pt[] {
  const r = (deg * Math.PI) / 180;
  const [cos, sin] = [Math.cos(r), Math.sin(r)];
  return [
    [-w / 2, -h / 2],
    [w / 2, -h / 2],
    [w / 2, h / 2],
    [-w / 2, h / 2],
  ].map(([x, y]) => [c[0] + x * cos - y * sin, c[1] + x * sin + y * cos] as Pt);
}

type Box = { x0: number; y0: number; x1: number; y1: number };
const bounds = (pts: Pt[]): Box => ({
  x0: Math.min(...pts.map((p) => p[0])),
  y0: Math.min(...pts.map((p) => p[1])),
  x1: Math.max(...pts.map((p) => p[0])),
  y1: Math.max(...pts.map((p) => p[1])),
});
const overlaps = (a: Box, b: Box) => a.x0 < b.x1 && b.x0 < a.x1 && a.y0 < b.y1 && b.y0 < a.y1;

/**
 * Which strip numbers to draw at the current zoom, and how. `mmPerPx` is plan millimetres per CSS
 * pixel on screen. Each number gets a font of LABEL_MIN_PX..LABEL_MAX_PX on screen; it is drawn
 * level if its box fits inside its strip, else turned along the strip, else left out (zooming in
 * brings it back; the cut list always lists every strip). A number is also left out if its box
 * would touch one already placed, so numbers never run into each other.
 */
export function placeStripLabels(strips: LabelStrip[], mmPerPx: number): { placed: PlacedLabel[]; hidden: number } {
  if (!(mmPerPx > 0) || !Number.isFinite(mmPerPx)) throw new Error(`placeStripLabels: mmPerPx must be a positive number, got ${mmPerPx}`);
  const placed: PlacedLabel[] = [];
  const taken: Box[] = [];
  for (const s of strips) {
    const polys = s.polygons.filter((p) => p.length >= 3);
    if (!polys.length) continue;
    const byArea = polys.map((p, i) => ({ i, a: polygonArea(p) })).sort((x, y) => y.a - x.a);
    const main = polys[byArea[0].i];
    // Where to try: the strip's own label point, then the middle of each piece, largest first (a strip
    // cut in pieces by a hatch or a seam may have its label point on a cut, or even inside the hatch).
    const anchors: Pt[] = [s.labelAt, ...byArea.map(({ i }) => polygonCentroid(polys[i]) as Pt)];
    const inStrip = (c: Pt) => polys.some((g) => polygonContainsPoint(g, c));
    let done = false;
    // Largest readable size first, level before turned along the strip.
    for (let px = LABEL_MAX_PX; px >= LABEL_MIN_PX && !done; px -= 1) {
      const font = px * mmPerPx;
      const w = s.label.length * GLYPH_EM * font + 0.3 * font;
      const h = 1.1 * font;
      for (const at of anchors) {
        for (const deg of [0, runDeg(main)]) {
          const corners = boxCorners(at, w, h, deg);
          // Every corner and the centre on the strip (its pieces together), so the number sits on its own strip.
          if (!inStrip(at) || !corners.every(inStrip)) continue;
          const box = bounds(corners);
          if (taken.some((t) => overlaps(t, box))) continue;
          taken.push(box);
          placed.push({ id: s.id, label: s.label, x: at[0], y: at[1], fontSize: font, rotateDeg: Math.abs(deg) < 1e-9 ? 0 : deg });
          done = true;
          break;
        }
        if (done) break;
      }
    }
  }
  return { placed, hidden: strips.length - placed.length };
}
