import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { exactMinLanes, packPieces, rollsByArea, type PieceToCut } from '../../shared/takeoff/roll-plan';

const pieces = (lengths: number[]): PieceToCut[] => lengths.map((lengthMm, i) => ({ stripNumber: i + 1, pieceIndex: 0, lengthMm }));

/** Independent oracle for tiny instances: try every assignment of items to bins. */
function bruteForceMinBins(items: number[], cap: number): number {
  let best = items.length;
  const bins: number[] = [];
  const rec = (i: number) => {
    if (bins.length >= best) return;
    if (i === items.length) {
      best = bins.length;
      return;
    }
    for (let b = 0; b < bins.length; b++) {
      if (bins[b] + items[i] <= cap) {
        bins[b] += items[i];
        rec(i + 1);
        bins[b] -= items[i];
      }
    }
    bins.push(items[i]);
    rec(i + 1);
    bins.pop();
  };
  rec(0);
  return best;
}

describe('rule-of-thumb roll count (common practice)', () => {
  it('48 m² with 10% waste and 7.0 m² per roll needs ceil(7.54) = 8 rolls', () => {
    expect(rollsByArea(48, 10, 7.0)).toBe(8);
  });

  it.each([
    [0, 10, 7, 0],
    [7, 0, 7, 1],
    [7.0001, 0, 7, 2],
    [42.42, 10, 5.7, 9],
  ])('area %s m², waste %s%%, %s m² per roll → %s rolls', (area, waste, cover, rolls) => {
    expect(rollsByArea(area, waste, cover)).toBe(rolls);
  });
});

describe('packing strips into roll lanes', () => {
  it('bay method (a retail how-to leaflet, found): 12 bays × 8 m with 8 m rolls → 12 rolls', () => {
    const p = packPieces(pieces(Array(12).fill(8000)), { rollLengthMm: 8000, lanesPerRoll: 1, minOffcutMm: 500 });
    expect(p.rolls).toBe(12);
    expect(p.wastePct).toBe(0);
  });

  it('bay method with 5.3 m rolls: the leaflet says 96 / 5.3 → 19 rolls, which is our lower bound; cutting whole pieces takes more', () => {
    // Each 8 m bay becomes a 5.3 m piece and a 2.7 m piece; two 2.7 m pieces do not fit one 5.3 m roll.
    const lengths = Array(12)
      .fill(0)
      .flatMap(() => [5300, 2700]);
    const p = packPieces(pieces(lengths), { rollLengthMm: 5300, lanesPerRoll: 1, minOffcutMm: 500 });
    expect(p.lanesLowerBound).toBe(19);
    expect(p.rolls).toBe(exactMinLanes(lengths, 5300));
    expect(p.rolls).toBe(24);
  });

  it('fills the lanes of split rolls before opening a new roll and lists offcuts', () => {
    const p = packPieces(pieces([4000, 4000, 4000, 3000]), { rollLengthMm: 8300, lanesPerRoll: 3, minOffcutMm: 500 });
    expect(p.lanesUsed).toBe(2);
    expect(p.rolls).toBe(1);
    expect(p.offcuts).toEqual([
      { roll: 1, lane: 1, lengthMm: 300, reusable: false },
      { roll: 1, lane: 2, lengthMm: 1300, reusable: true },
      { roll: 1, lane: 3, lengthMm: 8300, reusable: true },
    ]);
    expect(p.cutMm).toBe(15000);
    expect(p.boughtMm).toBe(24900);
  });

  it('does not reuse a lane end shorter than the minimum offcut', () => {
    const reuse = packPieces(pieces([7000, 500, 400]), { rollLengthMm: 8000, lanesPerRoll: 1, minOffcutMm: 0 });
    expect(reuse.lanesUsed).toBe(1);
    const strict = packPieces(pieces([7000, 500, 400]), { rollLengthMm: 8000, lanesPerRoll: 1, minOffcutMm: 1500 });
    expect(strict.lanesUsed).toBe(2);
  });

  it('refuses a piece longer than a roll', () => {
    expect(() => packPieces(pieces([9000]), { rollLengthMm: 8000, lanesPerRoll: 1, minOffcutMm: 0 })).toThrow(/longer than the 8000 mm roll/);
  });

  it('puts every piece in exactly one lane, never past the lane end', () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.integer({ min: 1, max: 160 }).map((x) => x * 50),
          { minLength: 1, maxLength: 60 },
        ),
        fc.integer({ min: 1, max: 3 }),
        (lengths, lanes) => {
          const p = packPieces(pieces(lengths), { rollLengthMm: 8000, lanesPerRoll: lanes, minOffcutMm: 500 });
          const placed = p.lanes.flatMap((l) => l.cuts.map((c) => c.stripNumber)).sort((a, b) => a - b);
          expect(placed).toEqual(lengths.map((_, i) => i + 1));
          for (const l of p.lanes) {
            expect(l.usedMm).toBeLessThanOrEqual(8000);
            let at = 0;
            for (const c of l.cuts) {
              expect(c.offsetMm).toBe(at);
              at += c.lengthMm;
            }
          }
          expect(p.lanesUsed).toBeGreaterThanOrEqual(p.lanesLowerBound);
          expect(p.rolls).toBe(Math.ceil(p.lanesUsed / lanes));
        },
      ),
      { numRuns: 200 },
    );
  });
});

describe('exact search on small instances (cutting stock, Gilmore and Gomory 1961 from memory)', () => {
  it('agrees with brute force on tiny instances', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: 100 }), { minLength: 1, maxLength: 7 }), (items) => {
        expect(exactMinLanes(items, 100)).toBe(bruteForceMinBins(items, 100));
      }),
      { numRuns: 300 },
    );
  });

  it('measures the gap of the heuristic packing against the optimum on small strip sets', () => {
    // Seeded random cut lists like a loft's: 6–14 strips of 0.3–8 m in 50 mm steps, 8.3 m rolls.
    let seed = 20261201;
    const rand = () => (seed = (seed * 1103515245 + 12345) % 2 ** 31) / 2 ** 31;
    let instances = 0;
    let extraLanes = 0;
    let worst = 0;
    let optimal = 0;
    for (let k = 0; k < 300; k++) {
      const n = 6 + Math.floor(rand() * 9);
      const lengths = Array.from({ length: n }, () => (6 + Math.floor(rand() * 155)) * 50);
      const exact = exactMinLanes(lengths, 8300);
      if (exact === null) continue;
      const heur = packPieces(pieces(lengths), { rollLengthMm: 8300, lanesPerRoll: 1, minOffcutMm: 0 }).lanesUsed;
      instances++;
      extraLanes += heur - exact;
      worst = Math.max(worst, heur - exact);
      if (heur === exact) optimal++;
      // FFD is never worse than 11/9·OPT + 6/9 (Dósa 2007; from memory).
      expect(heur).toBeLessThanOrEqual(Math.floor((11 / 9) * exact + 6 / 9));
      expect(heur).toBeGreaterThanOrEqual(exact);
    }
    console.info(`roll packing vs exact search: ${instances} instances, optimal in ${optimal}, ${extraLanes} extra lanes in all, worst gap ${worst} lane(s)`);
    expect(instances).toBeGreaterThan(250);
    expect(worst).toBeLessThanOrEqual(1);
  });
});
