/**
 * Rank kernel for three objectives: sort-and-sweep over fronts, each front holding a 2-D staircase.
 *
 * Contract: see pareto-sweep2.ts (distinct points in lexicographic order, 0-based ranks out).
 *
 * Method. Sweep the points in lexicographic order. For each front r keep the staircase of its members
 * projected on objectives (2, 3): the projections not weakly dominated by another member's projection,
 * sorted by objective 2 ascending, objective 3 then strictly descending. Front r dominates the next point
 * p iff some member q has q₂ ≤ p₂ and q₃ ≤ p₃, i.e. iff the staircase entry with the largest q₂ ≤ p₂ has
 * q₃ ≤ p₃. As in the 2-D sweep, "front r dominates p" holds for a prefix of the fronts, so p's front is
 * found by binary search over fronts; p then enters that staircase and evicts the entries it weakly
 * dominates (a contiguous run right after its position, since objective 3 descends along the staircase):
 * every later point that an evicted entry dominates, p dominates too, because p comes earlier in the sweep.
 * This is the "sweep with binary search over fronts" family of Jensen (IEEE TEVC 2003) and ENS-BS (Zhang,
 * Tian, Cheng & Jin, "An efficient approach to non-dominated sorting for evolutionary multiobjective
 * optimization", IEEE TEVC 2015), with ENS's linear scan of a front replaced by the staircase query, which
 * is exact for three objectives.
 *
 * Storage. Each staircase is a flat sorted array (binary search on contiguous memory is about three times
 * faster than a tree here, measured at 10⁶ points), all of them in one pool of 32-bit dense ranks (half
 * the memory of doubles: the staircases stay in the second-level cache); an insertion shifts the entries after it. On ordinary data the shifts
 * are short (10⁶ uniform points: ~30 per insertion). Adversarial orders can make them O(n) each, so the
 * total shifted is capped at SHIFT_BUDGET_PER_POINT · n; past the cap the sweep restarts on the treap of
 * pareto-treap.ts (introsort-style guard). Cost: O(n · log R · log S) plus at most the budget, where R is
 * the number of fronts and S the largest staircase; O(n · log R · log n) expected on the fallback.
 */
import { rankSorted3Treap } from './pareto-treap.ts';

/**
 * Entries shifted per point, on average, before giving up on flat arrays. Measured: ~30 on 10⁶ uniform
 * points, ~120 on 10⁶ points in a thin spherical shell (few, large fronts); an adversarial antichain
 * needs ~n/2. 256 keeps both realistic cases on the fast path and bounds the wasted work at 256 · n moves.
 */
export const SHIFT_BUDGET_PER_POINT = 256;

/** Entries moved above which copyWithin beats a plain loop (measured at 10⁶ points, uniform and shell). */
const LONG_MOVE = 32;

export function rankSorted3(
  cols: Int32Array[],
  u: number,
  shiftBudget = SHIFT_BUDGET_PER_POINT * u,
): Int32Array {
  return rankSorted3Flat(cols, u, shiftBudget) ?? rankSorted3Treap(cols, u);
}

/** The flat-array sweep; undefined when the shift budget runs out. */
export function rankSorted3Flat(cols: Int32Array[], u: number, shiftBudget: number): Int32Array | undefined {
  const f2 = cols[1];
  const f3 = cols[2];
  const rank = new Int32Array(u);
  // Every front's staircase lives in one pool, entries (objective 2, objective 3) interleaved so a probe
  // touches one cache line: front r holds entries off[r] .. off[r] + size[r] - 1 of its cap[r] slots, and
  // moves to the end of the pool when it outgrows them (capacity doubling: amortised O(1) per entry,
  // pool at most about 4 entries per point). One typed array instead of one per front saves a dependent
  // load per probe; measured 25 % faster at 10⁶ points together with the branch-free search below.
  let pool = new Int32Array(1024);
  let used = 0;
  // per-front offset, capacity and size; grown with the front count (often far below u)
  let off = new Int32Array(64);
  let cap = new Int32Array(64);
  let size = new Int32Array(64);
  let fronts = 0;
  let shifted = 0;
  for (let j = 0; j < u; j++) {
    const x = f2[j];
    const y = f3[j];
    let lo = 0;
    let hi = fronts;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      // the last entry with key ≤ x, then its objective 3 decides. Branch-free search: the loop count
      // depends only on the size, and `half & -(test)` compiles to a mask, not a mispredicted jump
      let base = off[mid];
      let len = size[mid];
      while (len > 1) {
        const half = len >>> 1;
        base += half & -(pool[2 * (base + half)] <= x);
        len -= half;
      }
      if (pool[2 * base] <= x && pool[2 * base + 1] <= y) lo = mid + 1;
      else hi = mid;
    }
    rank[j] = lo;
    if (lo === fronts) {
      if (fronts === off.length) {
        off = grown(off);
        cap = grown(cap);
        size = grown(size);
      }
      fronts++;
    }
    const n = size[lo];
    if (n === cap[lo]) {
      const newCap = Math.max(4, 2 * n);
      if (2 * (used + newCap) > pool.length) {
        const bigger = new Int32Array(Math.max(2 * pool.length, 2 * (used + newCap)));
        bigger.set(pool.subarray(0, 2 * used));
        pool = bigger;
      }
      pool.copyWithin(2 * used, 2 * off[lo], 2 * (off[lo] + n));
      off[lo] = used;
      cap[lo] = newCap;
      used += newCap;
    }
    // position: first entry with key ≥ x; evict the following run with objective 3 ≥ y
    const first = off[lo];
    const end = first + n;
    let a = first;
    if (n > 0) {
      let len = n;
      while (len > 1) {
        const half = len >>> 1;
        a += half & -(pool[2 * (a + half)] < x);
        len -= half;
      }
      if (pool[2 * a] < x) a++;
    }
    let e = a;
    while (e < end && pool[2 * e + 1] >= y) e++;
    // d = entries evicted − 1: the tail after e moves left by d entries (right by one when d = −1);
    // a plain loop for short moves (copyWithin's call overhead), copyWithin for long ones
    const d = e - a - 1;
    if (d !== 0 && end - e > LONG_MOVE) pool.copyWithin(2 * (e - d), 2 * e, 2 * end);
    else if (d > 0) {
      for (let t = 2 * e; t < 2 * end; t++) pool[t - 2 * d] = pool[t];
    } else if (d < 0) {
      for (let t = 2 * end - 1; t >= 2 * e; t--) pool[t + 2] = pool[t];
    }
    if (d !== 0) {
      shifted += end - e;
      if (shifted > shiftBudget) return undefined;
    }
    pool[2 * a] = x;
    pool[2 * a + 1] = y;
    size[lo] = n - d;
  }
  return rank;
}

function grown(a: Int32Array<ArrayBuffer>): Int32Array<ArrayBuffer> {
  const bigger = new Int32Array(2 * a.length);
  bigger.set(a);
  return bigger;
}
