import { describe, expect, it } from 'vitest';
import { parseRun } from '../../src/editor/commands';

describe('typed runs of walls', () => {
  it('reads an L-shaped loft from words and closes it exactly', () => {
    const r = parseRun('6000 right, 3000 down, 2500 left, 2000 down, 3500 left, 5000 up');
    expect(r.points).toEqual([
      [0, 0],
      [6000, 0],
      [6000, 3000],
      [3500, 3000],
      [3500, 5000],
      [0, 5000],
    ]);
    expect(r.closure).toEqual({ kind: 'closed', errorMm: 0 });
  });

  it('reads letters and units, and adds the closing wall when one is left out', () => {
    const r = parseRun('4.2m R 360cm D 4200 L');
    expect(r.points).toEqual([
      [0, 0],
      [4200, 0],
      [4200, 3600],
      [0, 3600],
    ]);
    expect(r.closure).toEqual({ kind: 'implied', lengthMm: 3600, angleDeg: 270 });
  });

  it('absorbs a small tape error and reports it', () => {
    const r = parseRun('4200 r 3600 d 4180 l 3600 u');
    expect(r.points).toHaveLength(4);
    expect(r.closure).toEqual({ kind: 'closed', errorMm: 20 });
  });

  it('takes angles for splayed walls', () => {
    const r = parseRun('3000 r, 1000 @45, 3000 d');
    expect(r.points[2][0]).toBeCloseTo(3000 + 1000 * Math.SQRT1_2, 2);
    expect(r.points[2][1]).toBeCloseTo(1000 * Math.SQRT1_2, 2);
  });

  it.each([
    ['', /at least three walls/],
    ['4200 sideways', /"sideways" is not a direction/],
    ['4200', /needs a direction/],
    ['right 4200', /should be a length/],
    ['4200 r', /at least three corners/],
  ])('explains what is wrong with %j', (text, msg) => {
    expect(() => parseRun(text)).toThrow(msg);
  });
});
