import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { sortNumbersAscending } from '../../shared/geometry/sort-numbers';

// The oracle is the engine's own TypedArray.prototype.sort (ECMAScript: numeric order, −0 before +0).
const value = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 }),
  fc.constantFrom(0, -0, 1, -1, 1e-9),
  fc.integer({ min: -50, max: 50 }),
);

describe('sortNumbersAscending', () => {
  it('orders numbers as a typed array sorts them, duplicates and signed zeros included', () => {
    fc.assert(
      fc.property(fc.array(value, { maxLength: 400 }), (xs) => {
        const ours = Float64Array.from(xs);
        sortNumbersAscending(ours, 0, ours.length);
        const native = Float64Array.from(xs).sort();
        expect(Array.from(ours).map((x) => (Object.is(x, -0) ? '-0' : x))).toEqual(Array.from(native).map((x) => (Object.is(x, -0) ? '-0' : x)));
      }),
      { numRuns: 300 },
    );
  });

  it('sorts only the range asked for', () => {
    const a = Float64Array.from([9, 5, 3, 1, 0]);
    sortNumbersAscending(a, 1, 4);
    expect(Array.from(a)).toEqual([9, 1, 3, 5, 0]);
  });
});
