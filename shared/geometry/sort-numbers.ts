/** Whether `x` sorts after `y` as in a typed array's own sort: by value, −0 before 0. */
function after(x: number, y: number): boolean {
  return x > y || (x === 0 && y === 0 && 1 / x > 1 / y);
}

/**
 * Sorts `a[lo..hi)` ascending in place, in the order a typed array's own sort gives (−0 before
 * 0; no NaN expected). Quicksort (median of three) down to runs of 24, then insertion sort: the
 * arrays here are short (a band's edge ends, a strip's ribbon ends) and called for by the
 * thousand, where the native sort's set-up per call costs more than the sorting.
 */
export function sortNumbersAscending(a: Float64Array, lo: number, hi: number): void {
  while (hi - lo > 24) {
    const m = (lo + hi) >> 1;
    if (after(a[lo], a[m])) swap(a, lo, m);
    if (after(a[m], a[hi - 1])) {
      swap(a, m, hi - 1);
      if (after(a[lo], a[m])) swap(a, lo, m);
    }
    const p = a[m];
    let i = lo;
    let j = hi - 1;
    for (;;) {
      while (after(p, a[i])) i++;
      while (after(a[j], p)) j--;
      if (i >= j) break;
      swap(a, i, j);
      i++;
      j--;
    }
    // Now a[lo..j] ≤ p ≤ a[j + 1..hi): recurse into the smaller side, loop on the larger.
    if (j + 1 - lo < hi - j - 1) {
      sortNumbersAscending(a, lo, j + 1);
      lo = j + 1;
    } else {
      sortNumbersAscending(a, j + 1, hi);
      hi = j + 1;
    }
  }
  for (let i = lo + 1; i < hi; i++) {
    const v = a[i];
    let j = i - 1;
    while (j >= lo && after(a[j], v)) {
      a[j + 1] = a[j];
      j--;
    }
    a[j + 1] = v;
  }
}

function swap(a: Float64Array, i: number, j: number): void {
  const t = a[i];
  a[i] = a[j];
  a[j] = t;
}
