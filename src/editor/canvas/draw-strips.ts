import { traceRing, type DrawContext } from './draw-context';
import { placeStripNumbers } from './place-strip-numbers';
import { MONO, PALETTE } from './palette';

/** What the canvas needs of a takeoff: each layer's strips in laying order, and its lay direction. */
export type DrawnTakeoff = {
  layers: {
    role: 'base' | 'cross';
    /** Direction the strips run, degrees from the x axis. */
    layAngleDeg: number;
    strips: { number: number; polygons: ReadonlyArray<ReadonlyArray<readonly [number, number]>>; lengthMm: number; labelAt: readonly [number, number] }[];
  }[];
};

/**
 * Strips in their layer's colour (base straw, cross teal), numbered in laying order. Numbers of
 * both layers are placed so none overlaps another (placeStripNumbers); in the review step only
 * the top layer is numbered.
 */
export function drawStrips(d: DrawContext, t: DrawnTakeoff, review: boolean) {
  const { ctx, cam } = d;
  t.layers.forEach((layer) => {
    const base = layer.role === 'base';
    ctx.beginPath();
    for (const s of layer.strips) for (const p of s.polygons) traceRing(d, p);
    ctx.fillStyle = base ? PALETTE.strawLight : PALETTE.tealLight;
    ctx.globalAlpha = base ? 0.75 : 0.35;
    ctx.fill();
    ctx.globalAlpha = 1;
    ctx.strokeStyle = base ? PALETTE.straw : PALETTE.teal;
    ctx.lineWidth = 1;
    ctx.stroke();
  });
  ctx.font = `500 10px ${MONO}`;
  const numbered = review ? t.layers.slice(-1) : t.layers;
  const placed = placeStripNumbers(numbered, cam, (text) => ctx.measureText(text).width);
  ctx.textAlign = 'center';
  ctx.textBaseline = 'middle';
  for (const n of placed) {
    ctx.strokeStyle = 'rgba(250,247,240,0.95)';
    ctx.lineWidth = 3;
    ctx.strokeText(n.text, n.x, n.y);
    ctx.fillStyle = n.role === 'base' ? PALETTE.strawDark : PALETTE.tealDark;
    ctx.fillText(n.text, n.x, n.y);
  }
}

/** Lay-direction arrows, one per layer, in a key at the bottom-left corner of the view. */
export function drawLayArrows(d: DrawContext, t: DrawnTakeoff) {
  const { ctx } = d;
  if (!t.layers.length) return;
  ctx.font = `600 11px ${MONO}`;
  const labels = t.layers.map((layer, i) => {
    const n = t.layers.filter((l, k) => k < i && l.role === layer.role).length + 1;
    return layer.role === 'base' ? 'base: lay this way' : `cross ${n}: lay this way`;
  });
  const w = 60 + Math.max(...labels.map((l) => ctx.measureText(l).width));
  ctx.fillStyle = 'rgba(250,247,240,0.92)';
  ctx.strokeStyle = PALETTE.paperLineStrong;
  ctx.lineWidth = 1;
  const h = 12 + t.layers.length * 30;
  const top = d.height - 8 - h;
  ctx.fillRect(8, top, w, h);
  ctx.strokeRect(8.5, top + 0.5, w, h);
  t.layers.forEach((layer, i) => {
    const x = 30,
      y = top + 21 + i * 30;
    const a = (layer.layAngleDeg * Math.PI) / 180;
    const ux = Math.cos(a),
      uy = Math.sin(a);
    const colour = layer.role === 'base' ? PALETTE.strawDark : PALETTE.teal;
    ctx.beginPath();
    ctx.moveTo(x - ux * 11, y - uy * 11);
    ctx.lineTo(x + ux * 11, y + uy * 11);
    ctx.moveTo(x + ux * 11, y + uy * 11);
    ctx.lineTo(x + ux * 5 - uy * 5, y + uy * 5 + ux * 5);
    ctx.moveTo(x + ux * 11, y + uy * 11);
    ctx.lineTo(x + ux * 5 + uy * 5, y + uy * 5 - ux * 5);
    ctx.strokeStyle = colour;
    ctx.lineWidth = 2.5;
    ctx.stroke();
    ctx.font = `600 11px ${MONO}`;
    ctx.fillStyle = colour;
    ctx.textAlign = 'left';
    ctx.textBaseline = 'middle';
    ctx.fillText(labels[i], x + 20, y);
  });
}
