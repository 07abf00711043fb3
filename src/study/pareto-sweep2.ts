/**
 * Rank kernels for one and two objectives.
 *
 * Kernel contract (shared with pareto-staircase.ts and pareto-divide.ts): `cols[k][j]` is objective k
 * of the j-th distinct point as its dense rank (0 for the smallest value; integers compare like the values
 * and take half the memory), the points sorted lexicographically ascending and pairwise distinct
 * (exact duplicates were merged beforehand). Kernels never read cols[0]: the order settles objective 0.
 * Under that order a point can only be dominated by points
 * before it, and an earlier point q dominates a later p exactly when q ≤ p on objectives 1..m-1
 * (q ≤ p on objective 0 comes with the order, and q ≠ p with distinctness). Kernels return the
 * 0-based rank of every distinct point: 1 + the largest rank among its dominators, 0 if none.
 */

/** One objective: distinct sorted values, so each value is its own front. O(n). */
export function rankSorted1(u: number): Int32Array {
  const rank = new Int32Array(u);
  for (let j = 0; j < u; j++) rank[j] = j;
  return rank;
}

/**
 * Two objectives: the classic staircase sweep for 2-D non-dominated sorting with ranks.
 * Scanning in lexicographic order, keep for each front r the objective-2 value of its last member
 * (its "tail", the smallest objective-2 value in the front so far). Front r dominates the next point p
 * iff tail[r] ≤ p₂. That predicate holds for a prefix of the fronts (whatever dominates p's dominator
 * dominates p), so p's front is found by binary search, and p becomes that front's new tail.
 * O(n log R) after sorting, R = number of fronts. Method: the standard sort-and-sweep for 2-D layers
 * of maxima, as in Jensen, "Reducing the run-time complexity of multiobjective EAs: the NSGA-II and
 * other algorithms", IEEE Trans. Evolutionary Computation, 2003 (its two-objective sweep).
 */
export function rankSorted2(cols: Int32Array[], u: number): Int32Array {
  const f2 = cols[1];
  const rank = new Int32Array(u);
  const tail = new Int32Array(u);
  let fronts = 0;
  for (let j = 0; j < u; j++) {
    const y = f2[j];
    // smallest r with tail[r] > y (not dominating p); r == fronts opens a new front
    let lo = 0;
    let hi = fronts;
    while (lo < hi) {
      const mid = (lo + hi) >>> 1;
      if (tail[mid] <= y) lo = mid + 1;
      else hi = mid;
    }
    rank[j] = lo;
    tail[lo] = y;
    if (lo === fronts) fronts++;
  }
  return rank;
}
