/**
 * Our own Pareto sorter: non-dominated ranks and crowding distance for minimisation of 1 to 4 (or more)
 * objectives, e.g. any subset of a candidate's `parts`, `lossW`, `stress`, `volumeMm3`.
 *
 * Definitions. Weak dominance: a dominates b iff a ≤ b on every objective and a < b on at least one.
 * Rank 1 is the set of points no point dominates; rank r + 1 is that set once ranks 1..r are removed.
 * Points equal on every objective never dominate each other and share a rank. Crowding distance as in
 * NSGA-II (Deb, Pratap, Agarwal & Meyarivan, IEEE Trans. Evolutionary Computation, 2002), within each rank;
 * tie rules in pareto-crowding.ts.
 *
 * Method and cost (n points, m objectives, R fronts). One stable radix sort per objective, O(n m), gives
 * each objective's order and dense ranks (pareto-order.ts); from those the lexicographic order is a pass
 * over small integers (none at all for continuous data), exact duplicates merge by comparing ranks, and
 * the same orders serve the crowding distance. After the lexicographic sort only earlier points can
 * dominate later ones, and each kernel sweeps once over the dense ranks:
 *  - m = 1: sorted order is the rank order, O(n).
 *  - m = 2: staircase sweep with binary search over the fronts' tails, O(n log R) (pareto-sweep2.ts; the
 *    two-objective sweep of Jensen, IEEE TEVC 2003).
 *  - m = 3: the same sweep with one 2-D staircase per front, O(n log R log S), S the largest staircase,
 *    on flat sorted arrays, guarded by a shift budget with a treap fallback of O(n log R log n) expected
 *    (pareto-staircase.ts, pareto-treap.ts).
 *  - m ≥ 4: divide and conquer over objectives, Jensen (IEEE TEVC 2003) with the tie handling of
 *    Buzdalov & Shalyto, "A provably asymptotically fast version of the generalized Jensen algorithm for
 *    non-dominated sorting", PPSN 2014: O(n log^(m-1) n) recursion, with a sort per step on top
 *    (pareto-divide.ts).
 * Crowding: the objective orders split by rank with a counting sort, O(n m). Recursion depth is O(log n)
 * everywhere. Measured (bench/pareto.bench.ts): 10⁶ uniform points × 3 objectives in 0.65–0.9 s on the
 * 2-core machine depending on its load; the 3-objective kernel is about 0.35 s of it, the m sorts 0.2 s.
 * The O(n² m) reference used by the tests is `sortNonDominatedBrute` (pareto-brute.ts).
 */
import { crowdingByGroups, crowdingFlat } from './pareto-crowding.ts';
import { epsilonGroupsFlat } from './pareto-epsilon.ts';
import { flattenPoints, ParetoInputError, type PointsInput } from './pareto-input.ts';
import { objectiveOrders } from './pareto-order.ts';
import { frontsOf, rankWithOrders } from './pareto-rank.ts';

export { sortNonDominatedBrute } from './pareto-brute.ts';
export { ParetoInputError, type PointsInput };

export interface SortResult {
  /** 1-based rank of each point (1 = non-dominated front). */
  rank: Int32Array;
  /** NSGA-II crowding distance of each point within its rank (Infinity at the boundaries). */
  crowding: Float64Array;
  /** Point indices per rank, ascending rank; indices ascending within a rank. */
  fronts: number[][];
}

/**
 * Ranks and crowding of the points (minimisation). Accepts an array of objective vectors, or a flat
 * row-major Float64Array of n × m values with m given. Throws ParetoInputError on a NaN or infinite
 * objective, RangeError on ragged or mis-sized input.
 */
export function sortNonDominated(points: PointsInput, m?: number): SortResult {
  const { values, n, m: width } = flattenPoints(points, m);
  // one sort per objective serves the lexicographic sweep order, the duplicate merge and the crowding
  const orders = objectiveOrders(values, n, width);
  const rank = rankWithOrders(n, width, orders);
  let fronts = 0;
  for (let i = 0; i < n; i++) if (rank[i] > fronts) fronts = rank[i];
  const crowding = crowdingByGroups(values, n, width, rank, fronts, orders, 1);
  return { rank, crowding, fronts: frontsOf(rank) };
}

/** True iff a dominates b (minimisation): a ≤ b on every objective and a < b on at least one. */
export function dominates(a: ArrayLike<number>, b: ArrayLike<number>): boolean {
  if (a.length !== b.length) throw new RangeError(`dominates: ${a.length} vs ${b.length} objectives`);
  let strict = false;
  for (let k = 0; k < a.length; k++) {
    // NaN and ±Infinity are rejected with the point (0 = a, 1 = b) and objective named
    if (a[k] - a[k] !== 0) throw new ParetoInputError(0, k, a[k]);
    if (b[k] - b[k] !== 0) throw new ParetoInputError(1, k, b[k]);
    if (a[k] > b[k]) return false;
    if (a[k] < b[k]) strict = true;
  }
  return strict;
}

/**
 * Crowding distance of each point within its group of equal `rank` (all points one group when rank is
 * omitted). Points as for sortNonDominated; m is needed for a flat Float64Array.
 */
export function crowdingDistance(points: PointsInput, rank?: ArrayLike<number>, m?: number): Float64Array {
  const flat = flattenPoints(points, m);
  const groups = rank ?? new Int32Array(flat.n).fill(1);
  if (groups.length !== flat.n)
    throw new RangeError(`crowdingDistance: ${groups.length} ranks for ${flat.n} points`);
  return crowdingFlat(flat.values, flat.n, flat.m, groups);
}

/**
 * Representative index of each point after ε-grouping (rule in pareto-epsilon.ts): points with the same key
 * (e.g. topology + rectifier + ripple) and every objective within relative tolerance eps of the group's
 * first member collapse onto that member.
 */
export function epsilonGroups(
  points: PointsInput,
  keys: ArrayLike<string>,
  eps: number,
  m?: number,
): number[] {
  return epsilonGroupsFlat(points, keys, eps, m);
}
