/**
 * World (plan millimetres) and screen (CSS pixels) coordinates are different types, and this
 * module is the only place that converts between them. Snap tolerances are given in screen
 * pixels and turned into millimetres by dividing by the zoom, so snapping feels the same at
 * every zoom level.
 */

declare const worldBrand: unique symbol;
declare const screenBrand: unique symbol;

/** A point in plan space, millimetres, y down. */
export type WorldPt = { readonly x: number; readonly y: number; readonly [worldBrand]: true };
/** A point on the canvas element, CSS pixels from its top-left corner. */
export type ScreenPt = { readonly x: number; readonly y: number; readonly [screenBrand]: true };

/** Screen = world × zoom + pan. `zoom` is pixels per millimetre. */
export type Camera = { readonly panX: number; readonly panY: number; readonly zoom: number };

export const MIN_ZOOM = 0.005; // 1 px ≈ 200 mm
export const MAX_ZOOM = 2; // 1 px = 0.5 mm

export const world = (x: number, y: number): WorldPt => ({ x, y }) as WorldPt;
export const screen = (x: number, y: number): ScreenPt => ({ x, y }) as ScreenPt;

export function worldToScreen(cam: Camera, p: WorldPt): ScreenPt {
  return screen(p.x * cam.zoom + cam.panX, p.y * cam.zoom + cam.panY);
}

export function screenToWorld(cam: Camera, s: ScreenPt): WorldPt {
  return world((s.x - cam.panX) / cam.zoom, (s.y - cam.panY) / cam.zoom);
}

/** A length on screen (px) as a world length (mm) at this zoom. */
export function pxToMm(cam: Camera, px: number): number {
  return px / cam.zoom;
}

export function clampZoom(z: number): number {
  return Math.min(MAX_ZOOM, Math.max(MIN_ZOOM, z));
}

/** Zoom by `factor` keeping the world point under `anchor` where it is on screen. */
export function zoomAt(cam: Camera, anchor: ScreenPt, factor: number): Camera {
  const zoom = clampZoom(cam.zoom * factor);
  const w = screenToWorld(cam, anchor);
  return { zoom, panX: anchor.x - w.x * zoom, panY: anchor.y - w.y * zoom };
}

export function panBy(cam: Camera, dxPx: number, dyPx: number): Camera {
  return { ...cam, panX: cam.panX + dxPx, panY: cam.panY + dyPx };
}

/** The camera that shows `points` (mm) inside a viewport of `width`×`height` px with `marginPx` around. */
export function fitCamera(points: ReadonlyArray<readonly [number, number]>, width: number, height: number, marginPx = 60): Camera {
  if (points.length === 0) return { zoom: 0.1, panX: marginPx, panY: marginPx };
  let minX = Infinity,
    minY = Infinity,
    maxX = -Infinity,
    maxY = -Infinity;
  for (const [x, y] of points) {
    minX = Math.min(minX, x);
    minY = Math.min(minY, y);
    maxX = Math.max(maxX, x);
    maxY = Math.max(maxY, y);
  }
  const w = Math.max(maxX - minX, 500);
  const h = Math.max(maxY - minY, 500);
  const zoom = clampZoom(Math.min((width - 2 * marginPx) / w, (height - 2 * marginPx) / h));
  const cx = (minX + maxX) / 2;
  const cy = (minY + maxY) / 2;
  return { zoom, panX: width / 2 - cx * zoom, panY: height / 2 - cy * zoom };
}

/** Rounds to the nearest multiple of `gridMm`. */
export function snapToGrid(p: WorldPt, gridMm: number): WorldPt {
  return world(Math.round(p.x / gridMm) * gridMm, Math.round(p.y / gridMm) * gridMm);
}

/**
 * Snaps the direction from `from` to `p` to the nearest multiple of `stepDeg` (90 or 45),
 * keeping the distance; the length is then rounded to `lengthStepMm` when given.
 */
export function snapAngle(from: WorldPt, p: WorldPt, stepDeg = 45, lengthStepMm = 0): WorldPt {
  const dx = p.x - from.x;
  const dy = p.y - from.y;
  let len = Math.hypot(dx, dy);
  if (len === 0) return p;
  const step = (stepDeg * Math.PI) / 180;
  const a = Math.round(Math.atan2(dy, dx) / step) * step;
  if (lengthStepMm > 0) len = Math.max(lengthStepMm, Math.round(len / lengthStepMm) * lengthStepMm);
  return world(round3(from.x + Math.cos(a) * len), round3(from.y + Math.sin(a) * len));
}

/** A grid step (mm) that stays at least `minPx` apart on screen: 10, 100, 1000 mm … */
export function gridStepMm(cam: Camera, minPx = 8): number {
  let step = 100;
  while (step * cam.zoom < minPx) step *= 10;
  return step;
}

/** Distance (mm) from `p` to the segment a–b, and the parameter t ∈ [0,1] of the nearest point. */
export function distanceToSegmentMm(p: WorldPt, a: WorldPt, b: WorldPt): { distMm: number; t: number } {
  const dx = b.x - a.x;
  const dy = b.y - a.y;
  const len2 = dx * dx + dy * dy;
  const t = len2 === 0 ? 0 : Math.max(0, Math.min(1, ((p.x - a.x) * dx + (p.y - a.y) * dy) / len2));
  return { distMm: Math.hypot(p.x - (a.x + t * dx), p.y - (a.y + t * dy)), t };
}

/** Avoids 4199.999999 from cos/sin round-trips in stored coordinates. */
export function round3(n: number): number {
  return Math.round(n * 1000) / 1000;
}
