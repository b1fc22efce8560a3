import { round3 } from '../geometry/coords';

/** One typed wall: its length in mm and its direction in degrees from the plan's x axis (y down). */
export type RunStep = { lengthMm: number; angleDeg: number; text: string };

export type RunResult = {
  /** Corners in order, starting at the start point. */
  points: [number, number][];
  steps: RunStep[];
  /**
   * How the shape closed: `closed` when the run came back to its start within the tolerance
   * (errorMm is the miss that was absorbed), or `implied` when a last wall was added to close it.
   */
  closure: { kind: 'closed'; errorMm: number } | { kind: 'implied'; lengthMm: number; angleDeg: number };
};

export class RunParseError extends Error {
  constructor(message: string) {
    super(message);
    this.name = 'RunParseError';
  }
}

// Screen-like axes (y down): right = 0°, down = 90°, left = 180°, up = 270°.
const DIRECTIONS: Record<string, number> = {
  r: 0,
  right: 0,
  e: 0,
  east: 0,
  d: 90,
  down: 90,
  s: 90,
  south: 90,
  l: 180,
  left: 180,
  w: 180,
  west: 180,
  u: 270,
  up: 270,
  n: 270,
  north: 270,
  ur: 315,
  'up-right': 315,
  ne: 315,
  dr: 45,
  'down-right': 45,
  se: 45,
  dl: 135,
  'down-left': 135,
  sw: 135,
  ul: 225,
  'up-left': 225,
  nw: 225,
};

const UNIT_MM: Record<string, number> = { mm: 1, cm: 10, m: 1000, in: 25.4, ft: 304.8 };

/** Misses up to this much (or 0.5% of the run) count as tape error and are absorbed. */
export const CLOSE_TOLERANCE_MM = 50;

/**
 * Parses a typed run of walls, e.g. "4200 right, 3600 down, 4200 left" or "4200 R 3600 D 4200 L"
 * or "4.2m r; 3600 d; 2000 @135". Each wall is a length (mm unless a unit is given: mm, cm, m,
 * in, ft) and a direction word, a letter, or `@degrees` (clockwise from right, as on screen).
 */
export function parseRun(text: string, start: [number, number] = [0, 0]): RunResult {
  const tokens = text
    .toLowerCase()
    .replace(/[,;\n]+/g, ' ')
    .replace(/@\s+/g, '@')
    .trim()
    .split(/\s+/)
    .filter(Boolean);
  if (tokens.length === 0) throw new RunParseError('type at least three walls, e.g. "4200 right, 3600 down, 4200 left"');
  const steps: RunStep[] = [];
  for (let i = 0; i < tokens.length;) {
    const m = /^(\d+(?:\.\d+)?)(mm|cm|m|in|ft)?$/.exec(tokens[i]);
    if (!m) throw new RunParseError(`"${tokens[i]}" should be a length, e.g. 4200 or 4.2m (wall ${steps.length + 1})`);
    let unit = m[2];
    i++;
    if (!unit && tokens[i] && tokens[i] in UNIT_MM) unit = tokens[i++];
    const lengthMm = round3(Number(m[1]) * UNIT_MM[unit ?? 'mm']);
    if (lengthMm <= 0) throw new RunParseError(`wall ${steps.length + 1} has no length`);
    const dirTok = tokens[i];
    if (dirTok === undefined) throw new RunParseError(`wall ${steps.length + 1} (${m[0]}) needs a direction: right, down, left, up (or R D L U, or @degrees)`);
    let angleDeg: number;
    if (dirTok.startsWith('@')) {
      angleDeg = Number(dirTok.slice(1));
      if (!Number.isFinite(angleDeg)) throw new RunParseError(`"${dirTok}" should be an angle such as @45`);
    } else if (dirTok in DIRECTIONS) {
      angleDeg = DIRECTIONS[dirTok];
    } else {
      throw new RunParseError(`"${dirTok}" is not a direction: use right, down, left, up (R D L U) or @degrees (wall ${steps.length + 1})`);
    }
    i++;
    steps.push({ lengthMm, angleDeg: ((angleDeg % 360) + 360) % 360, text: `${m[0]} ${dirTok}` });
  }
  const points: [number, number][] = [[start[0], start[1]]];
  let perimeter = 0;
  for (const s of steps) {
    const [x, y] = points[points.length - 1];
    const a = (s.angleDeg * Math.PI) / 180;
    points.push([round3(x + Math.cos(a) * s.lengthMm), round3(y + Math.sin(a) * s.lengthMm)]);
    perimeter += s.lengthMm;
  }
  const last = points[points.length - 1];
  const missMm = Math.hypot(last[0] - start[0], last[1] - start[1]);
  let closure: RunResult['closure'];
  if (missMm <= Math.max(CLOSE_TOLERANCE_MM, perimeter * 0.005)) {
    points.pop();
    closure = { kind: 'closed', errorMm: round3(missMm) };
  } else {
    const ang = (Math.atan2(start[1] - last[1], start[0] - last[0]) * 180) / Math.PI;
    closure = { kind: 'implied', lengthMm: round3(missMm), angleDeg: round3(((ang % 360) + 360) % 360) };
  }
  if (points.length < 3) throw new RunParseError('an outline needs at least three corners: type more walls');
  return { points, steps, closure };
}

/** "3000 mm up" style description of a direction in degrees, for messages. */
export function describeDirection(angleDeg: number): string {
  const names: Record<number, string> = { 0: 'right', 90: 'down', 180: 'left', 270: 'up', 45: 'down-right', 135: 'down-left', 225: 'up-left', 315: 'up-right' };
  const r = Math.round(angleDeg * 1000) / 1000;
  return names[r] ?? `at ${r}°`;
}
