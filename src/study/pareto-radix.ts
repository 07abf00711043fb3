/**
 * Stable least-significant-digit radix argsort of float64 keys, for the Pareto sorter.
 *
 * Why not `Array.prototype.sort` with a comparator: at 10⁶ points a comparator sort costs several
 * hundred milliseconds, more than the whole rank computation. An IEEE-754 double maps to an unsigned
 * 64-bit integer with the same order (flip every bit of a negative number, flip only the sign bit of a
 * positive one; the standard trick, common practice), which sorts in four stable passes of 16-bit
 * digits. Passes where every key has the same digit are skipped, so small integers (ranks, part counts)
 * cost one or two passes. Sorting by several columns = one stable sort per column, last column first.
 * Time O(n · passes), memory O(n). Below SMALL_N points a comparator sort is cheaper than clearing the
 * 65 536-entry digit counters, so argsortColumns switches to it.
 */

const DIGITS = 65536;
const LITTLE_ENDIAN = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1;

/**
 * Below this many points argsortColumns uses a comparator sort: each radix call allocates and clears
 * 1 MB of counters, which inside a study (a sort per objective per front) costs more in garbage
 * collection than the comparator sort of a few thousand keys (measured with the study benchmark).
 */
export const SMALL_N = 4096;

/**
 * The permutation that sorts indices 0..n-1 by the columns lexicographically (columns[0] primary);
 * equal keys keep ascending index order. Each column holds n finite values.
 */
export function argsortColumns(columns: Float64Array[], n: number): Int32Array {
  return n < SMALL_N ? comparatorArgsort(columns, n) : radixArgsort(columns, n);
}

/** The same permutation by a comparator sort: the obvious version, also the reference for the tests. */
export function comparatorArgsort(columns: Float64Array[], n: number): Int32Array {
  const order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  return order.sort((a, b) => {
    for (const c of columns) {
      // written as two comparisons: -0 and +0 compare equal, as they must
      if (c[a] < c[b]) return -1;
      if (c[a] > c[b]) return 1;
    }
    return a - b;
  });
}

/** The same permutation by stable LSD radix sort. */
export function radixArgsort(columns: Float64Array[], n: number): Int32Array {
  let order = new Int32Array(n);
  for (let i = 0; i < n; i++) order[i] = i;
  if (n < 2) return order;
  let spare = new Int32Array(n);
  const counts = new Int32Array(4 * DIGITS);
  const hi = new Uint32Array(n);
  const lo = new Uint32Array(n);
  for (let c = columns.length - 1; c >= 0; c--) {
    toSortableBits(columns[c], n, hi, lo);
    counts.fill(0);
    for (let i = 0; i < n; i++) {
      counts[lo[i] & 0xffff]++;
      counts[DIGITS + (lo[i] >>> 16)]++;
      counts[2 * DIGITS + (hi[i] & 0xffff)]++;
      counts[3 * DIGITS + (hi[i] >>> 16)]++;
    }
    for (let pass = 0; pass < 4; pass++) {
      const base = pass * DIGITS;
      if (!prefixSums(counts, base, n)) continue; // every key has this digit: the pass would not move anything
      const key = pass < 2 ? lo : hi;
      const shift = pass % 2 === 0 ? 0 : 16;
      for (let i = 0; i < n; i++) {
        const idx = order[i];
        const d = base + ((key[idx] >>> shift) & 0xffff);
        spare[counts[d]++] = idx;
      }
      const t = order;
      order = spare;
      spare = t;
    }
  }
  return order;
}

/**
 * Turns counts[base .. base+DIGITS) into starting offsets. Returns false when one digit holds all n keys.
 */
function prefixSums(counts: Int32Array, base: number, n: number): boolean {
  let sum = 0;
  for (let d = base; d < base + DIGITS; d++) {
    const c = counts[d];
    if (c === n) return false;
    counts[d] = sum;
    sum += c;
  }
  return true;
}

/** Writes the order-preserving unsigned 64-bit image of each double as (hi, lo) 32-bit halves. */
function toSortableBits(column: Float64Array, n: number, hi: Uint32Array, lo: Uint32Array): void {
  const scratch = new Float64Array(n);
  // + 0 turns -0 into +0: the two compare equal and must sort as equal.
  for (let i = 0; i < n; i++) scratch[i] = column[i] + 0;
  const words = new Uint32Array(scratch.buffer);
  const hiWord = LITTLE_ENDIAN ? 1 : 0;
  const loWord = 1 - hiWord;
  for (let i = 0; i < n; i++) {
    const h = words[2 * i + hiWord];
    const l = words[2 * i + loWord];
    if (h & 0x80000000) {
      hi[i] = ~h >>> 0;
      lo[i] = ~l >>> 0;
    } else {
      hi[i] = (h | 0x80000000) >>> 0;
      lo[i] = l;
    }
  }
}

/** Column k of the row-major n × m values, as its own contiguous array. */
export function column(values: Float64Array, n: number, m: number, k: number): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = values[i * m + k];
  return out;
}
