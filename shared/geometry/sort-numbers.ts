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

const LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/**
 * The indices of `keys` in ascending order of key, equal keys in index order (a stable sort),
 * by an LSD radix sort on the keys' bits: for positive doubles the bit pattern read as an
 * unsigned integer orders as the value does (IEEE 754), so eight passes of one byte sort them
 * without a comparison. Returns null when a key is not positive (0, −0, negative, NaN) or the
 * platform is not little-endian; the caller then sorts another way.
 */
export function orderByPositiveKeys(keys: Float64Array): Int32Array | null {
  const n = keys.length;
  if (!LITTLE_ENDIAN) return null;
  for (let i = 0; i < n; i++) if (!(keys[i] > 0)) return null;
  const words = new Uint32Array(keys.buffer, keys.byteOffset, 2 * n);
  let order = new Int32Array(n);
  let next = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  const count = new Int32Array(257);
  for (let pass = 0; pass < 8; pass++) {
    // Little-endian: word 2i holds the low 32 bits of key i, word 2i + 1 the high ones.
    const w = pass >> 2;
    const shift = (pass & 3) * 8;
    count.fill(0);
    for (let k = 0; k < n; k++) count[((words[2 * order[k] + w] >>> shift) & 255) + 1]++;
    if (count[1] === n) continue;
    for (let b = 0; b < 256; b++) count[b + 1] += count[b];
    for (let k = 0; k < n; k++) {
      const i = order[k];
      next[count[(words[2 * i + w] >>> shift) & 255]++] = i;
    }
    const t = order;
    order = next;
    next = t;
  }
  return order;
}
