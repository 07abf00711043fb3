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
 * faster than a tree here, measured at 10⁶ points); an insertion shifts the entries after it. On ordinary data the shifts
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

export function rankSorted3(
  cols: Float64Array[],
  u: number,
  shiftBudget = SHIFT_BUDGET_PER_POINT * u,
): Int32Array {
  return rankSorted3Flat(cols, u, shiftBudget) ?? rankSorted3Treap(cols, u);
}

/** The flat-array sweep; undefined when the shift budget runs out. */
export function rankSorted3Flat(
  cols: Float64Array[],
  u: number,
  shiftBudget: number,
): Int32Array | undefined {
  const f2 = cols[1];
  const f3 = cols[2];
  const rank = new Int32Array(u);
  // front r's staircase: stairs[r] = [key₀, val₀, key₁, val₁, …] (objectives 2 and 3 interleaved, so a
  // probe touches one cache line), size[r] entries in use
  const stairs: Float64Array[] = [];
  const size = new Int32Array(u);
  let shifted = 0;
  for (let j = 0; j < u; j++) {
    const x = f2[j];
    const y = f3[j];
    let lo = 0;
    let hi = stairs.length;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      const st = stairs[mid];
      // last entry with key ≤ x, then its objective 3 decides
      let a = 0;
      let b = size[mid];
      while (a < b) {
        const c = (a + b) >>> 1;
        if (st[2 * c] <= x) a = c + 1;
        else b = c;
      }
      if (a > 0 && st[2 * a - 1] <= y) lo = mid + 1;
      else hi = mid;
    }
    rank[j] = lo;
    if (lo === stairs.length) stairs.push(new Float64Array(4));
    let st = stairs[lo];
    const n = size[lo];
    // position: first entry with key ≥ x; evict the following run with objective 3 ≥ y
    let a = 0;
    let b = n;
    while (a < b) {
      const c = (a + b) >>> 1;
      if (st[2 * c] < x) a = c + 1;
      else b = c;
    }
    let e = a;
    while (e < n && st[2 * e + 1] >= y) e++;
    const newSize = n - (e - a) + 1;
    if (2 * newSize > st.length) {
      const bigger = new Float64Array(2 * st.length);
      bigger.set(st);
      stairs[lo] = st = bigger;
    }
    if (e !== a + 1) {
      st.copyWithin(2 * a + 2, 2 * e, 2 * n);
      shifted += n - e;
      if (shifted > shiftBudget) return undefined;
    }
    st[2 * a] = x;
    st[2 * a + 1] = y;
    size[lo] = newSize;
  }
  return rank;
}
