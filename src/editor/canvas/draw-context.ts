import type { Camera } from '../geometry/coords';

/** What every draw function needs: the 2D context, the camera and the viewport size (px). */
export type DrawContext = {
  ctx: CanvasRenderingContext2D;
  cam: Camera;
  width: number;
  height: number;
};

/** World mm → screen px, inlined for speed in the draw loops. */
export function sx(cam: Camera, x: number): number {
  return x * cam.zoom + cam.panX;
}
export function sy(cam: Camera, y: number): number {
  return y * cam.zoom + cam.panY;
}

/** Traces a closed ring (mm) as a path on screen. */
export function traceRing(d: DrawContext, ring: ReadonlyArray<readonly [number, number]>) {
  const { ctx, cam } = d;
  ring.forEach(([x, y], i) => (i === 0 ? ctx.moveTo(sx(cam, x), sy(cam, y)) : ctx.lineTo(sx(cam, x), sy(cam, y))));
  ctx.closePath();
}

/** Parallel lines at `angleDeg`, `spacingPx` apart, covering the current clip's bounding box. */
export function hatch(d: DrawContext, box: { minX: number; minY: number; maxX: number; maxY: number }, angleDeg: number, spacingPx: number) {
  const { ctx } = d;
  const a = (angleDeg * Math.PI) / 180;
  const ux = Math.cos(a),
    uy = Math.sin(a);
  const nx = -uy,
    ny = ux;
  const corners = [
    [box.minX, box.minY],
    [box.maxX, box.minY],
    [box.maxX, box.maxY],
    [box.minX, box.maxY],
  ];
  let lo = Infinity,
    hi = -Infinity,
    lo2 = Infinity,
    hi2 = -Infinity;
  for (const [x, y] of corners) {
    const dn = x * nx + y * ny,
      du = x * ux + y * uy;
    lo = Math.min(lo, dn);
    hi = Math.max(hi, dn);
    lo2 = Math.min(lo2, du);
    hi2 = Math.max(hi2, du);
  }
  const start = Math.floor(lo / spacingPx) * spacingPx;
  for (let t = start; t <= hi; t += spacingPx) {
    ctx.moveTo(nx * t + ux * lo2, ny * t + uy * lo2);
    ctx.lineTo(nx * t + ux * hi2, ny * t + uy * hi2);
  }
}
