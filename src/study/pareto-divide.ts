/**
 * Rank kernel for any number of objectives (used for four): divide and conquer.
 *
 * Contract: see pareto-sweep2.ts (distinct points in lexicographic order, 0-based ranks out).
 *
 * Method: the divide-and-conquer non-dominated sort of Jensen ("Reducing the run-time complexity of
 * multiobjective EAs: the NSGA-II and other algorithms", IEEE TEVC 2003) in the form made correct for
 * ties by Buzdalov & Shalyto ("A provably asymptotically fast version of the generalized Jensen algorithm
 * for non-dominated sorting", PPSN XIII, 2014). Two routines:
 *
 *  - solve(points): split the sweep order into a first half F and second half S; solve(F) fixes F's ranks;
 *    contribute(F → S) raises every rank in S to 1 + the rank of each F point dominating it; solve(S).
 *    Only points before p can dominate p, so every rank is final when it is read.
 *  - contribute(L → H, objectives d..m-1): L's ranks are final and each l ∈ L already beats each h ∈ H on
 *    objectives before d, so l dominates h iff l ≤ h on d..m-1. Split L ∪ H at the median of objective d,
 *    L before H on ties; the lower half X and upper half Y recurse on the same objectives, and X's L
 *    points reach Y's H points with objective d settled (recurse on d+1..m-1). With two objectives left,
 *    sweep objective d with a Fenwick tree (prefix maximum) over the L points' ranks indexed by objective
 *    d+1.
 *
 * Cost O(n log^(m-1) n) for the recursion as in the cited papers, times a log factor here because each
 * step sorts its sublist (O(n log³ n) for three objectives, O(n log⁴ n) for four) rather than keeping
 * presorted lists. The sorts are native sorts of packed integer keys (see INDEX_SPAN), about 15 % faster
 * overall than comparator sorts at 10⁵ points × 4 objectives; keeping the lists presorted by objective
 * m-2 (split by median selection and stable partition, a Fenwick tree over the global dense ranks of
 * objective m-1) would remove the log factor and is the next step if four objectives need to be faster.
 * Memory O(n log n) in transient sublists. Small subproblems are finished by direct
 * comparison.
 */

interface Ctx {
  cols: Int32Array[];
  m: number;
  rank: Int32Array;
  fenwick: Int32Array;
}

/**
 * Sort keys pack (dense rank, tag, point index) into one double, key = (rank · 2 + tag) · INDEX_SPAN + index,
 * exact while below 2⁵³: ranks and indices below 2²⁶ (67 million points). A native numeric sort of such
 * keys needs no comparator callback (measured: several times faster than sorting indices with one).
 */
const INDEX_SPAN = 2 ** 26;

/** Subproblems with at most this many points (solve) or pairs (contribute) are compared directly. */
const DIRECT_POINTS = 24;
const DIRECT_PAIRS = 128;

export function rankSortedDivide(cols: Int32Array[], u: number): Int32Array {
  if (u >= INDEX_SPAN) throw new RangeError(`rankSortedDivide: ${u} points, at most ${INDEX_SPAN - 1}`);
  const ctx: Ctx = { cols, m: cols.length, rank: new Int32Array(u), fenwick: new Int32Array(u + 1) };
  solve(ctx, 0, u);
  return ctx.rank;
}

function solve(ctx: Ctx, lo: number, hi: number): void {
  if (hi - lo <= DIRECT_POINTS) {
    solveDirect(ctx, lo, hi);
    return;
  }
  const mid = (lo + hi) >>> 1;
  solve(ctx, lo, mid);
  contribute(ctx, span(lo, mid), span(mid, hi), 1);
  solve(ctx, mid, hi);
}

function solveDirect(ctx: Ctx, lo: number, hi: number): void {
  const { rank } = ctx;
  for (let h = lo + 1; h < hi; h++) {
    for (let l = lo; l < h; l++) {
      if (rank[l] >= rank[h] && weaklyBelow(ctx, l, h, 1)) rank[h] = rank[l] + 1;
    }
  }
}

function contribute(ctx: Ctx, L: Int32Array, H: Int32Array, d: number): void {
  if (L.length === 0 || H.length === 0) return;
  if (L.length * H.length <= DIRECT_PAIRS) {
    contributeDirect(ctx, L, H, d);
    return;
  }
  if (ctx.m - d === 2) {
    contributeSweep(ctx, L, H, d);
    return;
  }
  const a = ctx.cols[d];
  const maxL = maxOf(a, L);
  const minH = minOf(a, H);
  if (maxL <= minH) {
    contribute(ctx, L, H, d + 1); // objective d already settled for every pair
    return;
  }
  if (minOf(a, L) > maxOf(a, H)) return; // no l can be ≤ any h on objective d
  // merged list sorted by (objective d, tag 0 for L and 1 for H): L first on ties. Any order within equal
  // (objective d, tag) serves the split, so the point index rides in the low bits of one packed key
  const merged = new Float64Array(L.length + H.length);
  for (let i = 0; i < L.length; i++) merged[i] = 2 * a[L[i]] * INDEX_SPAN + L[i];
  for (let i = 0; i < H.length; i++) merged[L.length + i] = (2 * a[H[i]] + 1) * INDEX_SPAN + H[i];
  merged.sort();
  const half = merged.length >>> 1;
  const lowL = untag(merged, 0, half, 0);
  const lowH = untag(merged, 0, half, 1);
  const highL = untag(merged, half, merged.length, 0);
  const highH = untag(merged, half, merged.length, 1);
  contribute(ctx, lowL, lowH, d);
  contribute(ctx, highL, highH, d);
  // an L point in the upper half never reaches an H point in the lower half: on a tie it would sort first
  contribute(ctx, lowL, highH, d + 1);
}

function contributeDirect(ctx: Ctx, L: Int32Array, H: Int32Array, d: number): void {
  const { rank } = ctx;
  for (const h of H) {
    for (const l of L) {
      if (rank[l] >= rank[h] && weaklyBelow(ctx, l, h, d)) rank[h] = rank[l] + 1;
    }
  }
}

/** Last two objectives: sweep objective d ascending, Fenwick prefix maximum over objective d+1. */
function contributeSweep(ctx: Ctx, L: Int32Array, H: Int32Array, d: number): void {
  const a = ctx.cols[d];
  const b = ctx.cols[d + 1];
  const { rank, fenwick } = ctx;
  const ls = sortedBy(a, L);
  const hs = sortedBy(a, H);
  const bs = new Int32Array(L.length);
  for (let i = 0; i < L.length; i++) bs[i] = b[L[i]];
  bs.sort();
  const size = L.length;
  fenwick.fill(0, 0, size + 1);
  let i = 0;
  for (const h of hs) {
    while (i < size && a[ls[i]] <= a[h]) {
      const l = ls[i++];
      const value = rank[l] + 1;
      for (let pos = lowerBound(bs, b[l]) + 1; pos <= size; pos += pos & -pos) {
        if (fenwick[pos] < value) fenwick[pos] = value;
      }
    }
    let best = 0;
    for (let pos = upperBound(bs, b[h]); pos > 0; pos -= pos & -pos) {
      if (fenwick[pos] > best) best = fenwick[pos];
    }
    if (best > rank[h]) rank[h] = best;
  }
}

function weaklyBelow(ctx: Ctx, l: number, h: number, d: number): boolean {
  for (let k = d; k < ctx.m; k++) {
    const c = ctx.cols[k];
    if (c[l] > c[h]) return false;
  }
  return true;
}

function span(lo: number, hi: number): Int32Array {
  const out = new Int32Array(hi - lo);
  for (let i = 0; i < out.length; i++) out[i] = lo + i;
  return out;
}

/** The point indices of merged[from, to) carrying the tag (0 = L, 1 = H), in merged order. */
function untag(merged: Float64Array, from: number, to: number, tag: number): Int32Array {
  let count = 0;
  for (let i = from; i < to; i++) if ((Math.floor(merged[i] / INDEX_SPAN) & 1) === tag) count++;
  const out = new Int32Array(count);
  let k = 0;
  for (let i = from; i < to; i++) {
    const key = merged[i];
    if ((Math.floor(key / INDEX_SPAN) & 1) === tag) out[k++] = key % INDEX_SPAN;
  }
  return out;
}

/** The indices sorted by a[index] ascending (ties by index), by a native sort of packed keys. */
function sortedBy(a: Int32Array, idx: Int32Array): Int32Array {
  const keys = new Float64Array(idx.length);
  for (let i = 0; i < idx.length; i++) keys[i] = a[idx[i]] * INDEX_SPAN + idx[i];
  keys.sort();
  const out = new Int32Array(idx.length);
  for (let i = 0; i < idx.length; i++) out[i] = keys[i] % INDEX_SPAN;
  return out;
}

function maxOf(a: Int32Array, idx: Int32Array): number {
  let v = Number.NEGATIVE_INFINITY;
  for (const i of idx) if (a[i] > v) v = a[i];
  return v;
}

function minOf(a: Int32Array, idx: Int32Array): number {
  let v = Number.POSITIVE_INFINITY;
  for (const i of idx) if (a[i] < v) v = a[i];
  return v;
}

/** First position whose value is ≥ x. */
function lowerBound(sorted: Int32Array, x: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid] < x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}

/** First position whose value is > x (= number of values ≤ x). */
function upperBound(sorted: Int32Array, x: number): number {
  let lo = 0;
  let hi = sorted.length;
  while (lo < hi) {
    const mid = (lo + hi) >>> 1;
    if (sorted[mid] <= x) lo = mid + 1;
    else hi = mid;
  }
  return lo;
}
