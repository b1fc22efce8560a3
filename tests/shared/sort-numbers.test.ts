import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { orderByPositiveKeys, sortNumbersAscending } from '../../shared/geometry/sort-numbers';

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

describe('orderByPositiveKeys', () => {
  // The oracle is Array.prototype.sort, stable since ECMAScript 2019, on the keys' values.
  const positive = fc.oneof(fc.double({ min: 1e-300, max: 1e12, noNaN: true }), fc.constantFrom(1, 2, 2.5, 1e-9, 5e-324, 1e6));

  it('orders indices by key as a stable sort does, ties in index order', () => {
    fc.assert(
      fc.property(fc.array(positive, { maxLength: 500 }), (xs) => {
        const keys = Float64Array.from(xs);
        const expected = xs.map((_, i) => i).sort((i, j) => (xs[i] < xs[j] ? -1 : xs[i] > xs[j] ? 1 : 0));
        expect(Array.from(orderByPositiveKeys(keys)!)).toEqual(expected);
      }),
      { numRuns: 300 },
    );
  });

  it('declines keys that are not positive', () => {
    for (const bad of [0, -0, -1, Number.NaN]) expect(orderByPositiveKeys(Float64Array.from([3, bad, 1]))).toBeNull();
  });
});
