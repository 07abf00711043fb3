/**
 * Stable least-significant-digit radix argsorts of float64 keys and small integers, for the Pareto sorter.
 *
 * Why not `Array.prototype.sort` with a comparator: at 10⁶ points a comparator sort costs several
 * hundred milliseconds, more than the whole rank computation. An IEEE-754 double maps to an unsigned
 * 64-bit integer with the same order (flip every bit of a negative number, flip only the sign bit of a
 * positive one; the standard trick, common practice), held as two 32-bit words, each sorted in three
 * stable passes of 11-bit digits (11 + 11 + 10 bits). 11-bit digits keep the 2048 counters and the 2048
 * write positions of a pass in the first-level cache; measured at 10⁶ keys with full mantissas: 55 ms
 * against 160 ms for 16-bit digits. Keys travel with the indices (sequential reads, no random gather per
 * pass). Passes where every key has the same digit are skipped, so small integers (ranks, part counts)
 * cost one or two passes. Sorting by several columns = one stable sort per column, last column first.
 * Time O(n · passes), memory O(n). Below SMALL_N keys a comparator sort is cheaper than the counters.
 */

const BITS = 11;
const DIGITS = 1 << BITS;
const MASK = DIGITS - 1;
/** Passes per 32-bit word: shifts 0, 11, 22. */
const PASSES_PER_WORD = 3;
const HI_WORD = new Uint8Array(new Uint32Array([1]).buffer)[0] === 1 ? 1 : 0;

/**
 * Below this many keys the sorts use a comparator sort or a single counting pass: each radix call
 * allocates six buffers of n entries and 48 kB of digit counters, which inside a study costs more in
 * garbage collection than the comparator sort of a few thousand keys (measured with the study benchmark,
 * with the 16-bit digits of an earlier version; the study sorts about 1800 points, below it either way).
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
  const s = new RadixScratch(n);
  for (let i = 0; i < n; i++) s.order[i] = i;
  for (let c = columns.length - 1; c >= 0; c--) {
    const words = wordsOf(columns[c]);
    for (let i = 0; i < n; i++) loadKey(s, i, words, 2 * s.order[i]);
    s.sortLoaded(n, 2);
  }
  return s.order;
}

/** One objective's stable order and dense ranks. */
export interface ObjectiveSort {
  /** Point indices sorted by the objective ascending, ties by index. */
  order: Int32Array;
  /** dense[i]: number of distinct values below point i's (equal values equal ranks, -0 equal to +0). */
  dense: Int32Array;
  /** Number of distinct values. */
  distinct: number;
}

/**
 * Stable sort of objective k of the row-major n × m `values` (read in place, no column copy), with the
 * dense ranks. Comparator sort below SMALL_N keys, radix sort above, whose sorted keys give the dense ranks
 * without reading the values again; `scratch` (capacity ≥ n) is reused when given.
 */
export function sortObjective(
  values: Float64Array,
  n: number,
  m: number,
  k: number,
  scratch?: RadixScratch,
): ObjectiveSort {
  const dense = new Int32Array(n);
  let d = 0;
  if (n < SMALL_N) {
    const order = new Int32Array(n);
    for (let i = 0; i < n; i++) order[i] = i;
    // a - b of finite doubles is never NaN and is 0 exactly when a == b (-0 == +0 included)
    order.sort((a, b) => values[a * m + k] - values[b * m + k] || a - b);
    for (let i = 1; i < n; i++) {
      if (values[order[i] * m + k] !== values[order[i - 1] * m + k]) d++;
      dense[order[i]] = d;
    }
    return { order, dense, distinct: n > 0 ? d + 1 : 0 };
  }
  const s = scratch ?? new RadixScratch(n);
  const words = wordsOf(values);
  const { hi, lo } = s;
  for (let i = 0; i < n; i++) {
    s.order[i] = i;
    // the order-preserving unsigned image of the double (see loadKey), inlined: this loop reads n values
    const w = 2 * (i * m + k);
    const h = words[w + HI_WORD];
    const l = words[w + 1 - HI_WORD];
    if (h >= 0x80000000 && (h !== 0x80000000 || l !== 0)) {
      hi[i] = ~h >>> 0;
      lo[i] = ~l >>> 0;
    } else {
      hi[i] = (h | 0x80000000) >>> 0;
      lo[i] = l;
    }
  }
  s.sortLoaded(n, 2);
  const order = s.order.slice(0, n);
  const sh = s.hi;
  const sl = s.lo;
  for (let i = 1; i < n; i++) {
    if (sh[i] !== sh[i - 1] || sl[i] !== sl[i - 1]) d++;
    dense[order[i]] = d;
  }
  return { order, dense, distinct: d + 1 };
}

/**
 * Reorders `order` (n point indices) stably by the integer key[point] in 0..buckets-1: a counting sort,
 * one pass for up to 65 536 buckets, otherwise radix passes of 11 bits.
 */
export function sortByIntKey(
  order: Int32Array,
  key: Int32Array,
  buckets: number,
  n: number,
  scratch?: RadixScratch,
): Int32Array {
  if (buckets <= 65536) {
    const start = new Int32Array(buckets + 1);
    for (let i = 0; i < n; i++) start[key[order[i]] + 1]++;
    for (let b = 0; b < buckets; b++) start[b + 1] += start[b];
    const out = new Int32Array(n);
    for (let i = 0; i < n; i++) {
      const p = order[i];
      out[start[key[p]]++] = p;
    }
    return out;
  }
  const s = scratch ?? new RadixScratch(n);
  for (let i = 0; i < n; i++) {
    const p = order[i];
    s.order[i] = p;
    s.lo[i] = key[p];
  }
  s.sortLoaded(n, 1);
  return s.order.slice(0, n);
}

/** Buffers of one radix sort, allocated once per call and reused across columns and passes. */
export class RadixScratch {
  order: Int32Array;
  spare: Int32Array;
  hi: Uint32Array;
  lo: Uint32Array;
  hi2: Uint32Array;
  lo2: Uint32Array;
  readonly counts = new Int32Array(2 * PASSES_PER_WORD * DIGITS);

  constructor(capacity: number) {
    this.order = new Int32Array(capacity);
    this.spare = new Int32Array(capacity);
    this.hi = new Uint32Array(capacity);
    this.lo = new Uint32Array(capacity);
    this.hi2 = new Uint32Array(capacity);
    this.lo2 = new Uint32Array(capacity);
  }

  /**
   * Stably reorders order[0..n) by the keys loaded beside it: (hi, lo) for two words, lo alone for one.
   * The keys travel with the indices, so afterwards hi[i], lo[i] are the key of order[i].
   */
  sortLoaded(n: number, words: 1 | 2): void {
    const counts = this.counts;
    const passes = words * PASSES_PER_WORD;
    counts.fill(0, 0, passes * DIGITS);
    const lo = this.lo;
    const hi = this.hi;
    for (let i = 0; i < n; i++) {
      const l = lo[i];
      counts[l & MASK]++;
      counts[DIGITS + ((l >>> BITS) & MASK)]++;
      counts[2 * DIGITS + (l >>> (2 * BITS))]++;
    }
    if (words === 2) {
      for (let i = 0; i < n; i++) {
        const h = hi[i];
        counts[3 * DIGITS + (h & MASK)]++;
        counts[4 * DIGITS + ((h >>> BITS) & MASK)]++;
        counts[5 * DIGITS + (h >>> (2 * BITS))]++;
      }
    }
    for (let pass = 0; pass < passes; pass++) {
      const base = pass * DIGITS;
      if (!prefixSums(counts, base, n)) continue; // every key has this digit: nothing would move
      const shift = (pass % PASSES_PER_WORD) * BITS;
      if (pass < PASSES_PER_WORD) this.passOnLo(base, shift, n, words === 2);
      else this.passOnHi(base, shift, n);
    }
  }

  private passOnLo(base: number, shift: number, n: number, carryHi: boolean): void {
    const { counts, order, spare, lo, lo2, hi, hi2 } = this;
    if (carryHi) {
      for (let i = 0; i < n; i++) {
        const l = lo[i];
        const to = counts[base + ((l >>> shift) & MASK)]++;
        spare[to] = order[i];
        lo2[to] = l;
        hi2[to] = hi[i];
      }
      this.hi = hi2;
      this.hi2 = hi;
    } else {
      for (let i = 0; i < n; i++) {
        const l = lo[i];
        const to = counts[base + ((l >>> shift) & MASK)]++;
        spare[to] = order[i];
        lo2[to] = l;
      }
    }
    this.lo = lo2;
    this.lo2 = lo;
    this.order = spare;
    this.spare = order;
  }

  private passOnHi(base: number, shift: number, n: number): void {
    const { counts, order, spare, hi, hi2, lo, lo2 } = this;
    for (let i = 0; i < n; i++) {
      const h = hi[i];
      const to = counts[base + ((h >>> shift) & MASK)]++;
      spare[to] = order[i];
      hi2[to] = h;
      lo2[to] = lo[i];
    }
    this.hi = hi2;
    this.hi2 = hi;
    this.lo = lo2;
    this.lo2 = lo;
    this.order = spare;
    this.spare = order;
  }
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

/** The 32-bit words of a Float64Array (its byte offset is a multiple of 8, so the view is aligned). */
function wordsOf(a: Float64Array): Uint32Array {
  return new Uint32Array(a.buffer, a.byteOffset, 2 * a.length);
}

/**
 * Stores at slot i the order-preserving unsigned 64-bit image of the double whose low-address word is
 * words[w], as (hi, lo) halves. -0 is stored as +0: the two compare equal and must sort as equal.
 */
function loadKey(s: RadixScratch, i: number, words: Uint32Array, w: number): void {
  const h = words[w + HI_WORD];
  const l = words[w + 1 - HI_WORD];
  if (h >= 0x80000000 && (h !== 0x80000000 || l !== 0)) {
    s.hi[i] = ~h >>> 0;
    s.lo[i] = ~l >>> 0;
  } else {
    s.hi[i] = (h | 0x80000000) >>> 0;
    s.lo[i] = l;
  }
}

/** Column k of the row-major n × m values, as its own contiguous array. */
export function column(values: Float64Array, n: number, m: number, k: number): Float64Array {
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) out[i] = values[i * m + k];
  return out;
}
