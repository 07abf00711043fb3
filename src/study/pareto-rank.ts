/**
 * Non-dominated ranks of flat points: lexicographic order from the per-objective orders (pareto-order.ts),
 * merge exact duplicates, run the kernel for the objective count on the distinct points' dense ranks.
 *
 * Minimisation with weak dominance: a dominates b iff a ≤ b on every objective and a < b on at least one.
 * Points equal on every objective do not dominate each other and get the same rank, so they are merged
 * into one before ranking and share its result. After a lexicographic sort (objective 0 first, then 1, …)
 * a point can only be dominated by points before it, which every kernel relies on.
 *
 * Kernels: one objective O(n), two objectives O(n log n) (pareto-sweep2.ts), three objectives
 * O(n log R log S) with a guarded fallback (pareto-staircase.ts, pareto-treap.ts), four or more O(n log^m n) (pareto-divide.ts).
 */
import { rankSortedDivide } from './pareto-divide.ts';
import { lexicographicOrder, type ObjectiveOrders, objectiveOrders } from './pareto-order.ts';
import { rankSorted3 } from './pareto-staircase.ts';
import { rankSorted1, rankSorted2 } from './pareto-sweep2.ts';
import { rankSorted3Treap } from './pareto-treap.ts';

/**
 * Which kernel ranks the points: 'auto' picks by objective count; the others force a kernel so the tests
 * can check each against the reference: 'divide' (m ≥ 3) and 'treap' (m = 3, the staircase fallback).
 */
export type RankMethod = 'auto' | 'divide' | 'treap';

/**
 * 1-based rank of each of the n points held row-major in `values` (n × m, finite).
 * Rank 1 is the non-dominated front; rank r + 1 is the front once ranks 1..r are removed.
 */
export function rankPoints(
  values: Float64Array,
  n: number,
  m: number,
  method: RankMethod = 'auto',
): Int32Array {
  if (n === 0) return new Int32Array(0);
  return rankWithOrders(n, m, objectiveOrders(values, n, m), method);
}

/** rankPoints with the per-objective orders already computed (sortNonDominated shares them with crowding). */
export function rankWithOrders(
  n: number,
  m: number,
  orders: ObjectiveOrders,
  method: RankMethod = 'auto',
): Int32Array {
  const rank = new Int32Array(n);
  if (n === 0) return rank;
  const order = lexicographicOrder(orders, n);

  // merge runs of identical points (equal dense ranks on every objective): count the distinct points u,
  // and only when some repeat number them, group[i] being the distinct-point number of sorted position i.
  // An objective with n distinct values rules out duplicates, and the count is skipped.
  const { dense } = orders;
  let u = n;
  if (!orders.distinct.includes(n)) {
    u = 0;
    for (let i = 0; i < n; i++) if (i === 0 || !samePoint(dense, m, order[i], order[i - 1])) u++;
  }
  let group: Int32Array | undefined;
  if (u < n) {
    group = new Int32Array(n);
    let g = -1;
    for (let i = 0; i < n; i++) {
      if (i === 0 || !samePoint(dense, m, order[i], order[i - 1])) g++;
      group[i] = g;
    }
  }
  // the distinct points' dense ranks in sweep order: what the kernels compare. Objective 0 is settled by
  // the sweep order itself and no kernel reads it, so its column stays empty.
  const distinct: Int32Array[] = [new Int32Array(0)];
  for (let k = 1; k < m; k++) {
    const col = new Int32Array(u);
    const d = dense[k];
    if (group) for (let i = 0; i < n; i++) col[group[i]] = d[order[i]];
    else for (let i = 0; i < n; i++) col[i] = d[order[i]];
    distinct.push(col);
  }
  let kernelRank: Int32Array;
  if (method === 'divide') {
    if (m < 3) throw new RangeError(`rankPoints: the divide method needs m >= 3, got ${m}`);
    kernelRank = rankSortedDivide(distinct, u);
  } else if (method === 'treap') {
    if (m !== 3) throw new RangeError(`rankPoints: the treap method needs m = 3, got ${m}`);
    kernelRank = rankSorted3Treap(distinct, u);
  } else if (m === 1) kernelRank = rankSorted1(u);
  else if (m === 2) kernelRank = rankSorted2(distinct, u);
  else if (m === 3) kernelRank = rankSorted3(distinct, u);
  else kernelRank = rankSortedDivide(distinct, u);

  if (group) for (let i = 0; i < n; i++) rank[order[i]] = kernelRank[group[i]] + 1;
  else for (let i = 0; i < n; i++) rank[order[i]] = kernelRank[i] + 1;
  return rank;
}

function samePoint(dense: Int32Array[], m: number, p: number, q: number): boolean {
  for (let k = 0; k < m; k++) if (dense[k][p] !== dense[k][q]) return false;
  return true;
}

/**
 * Indices of each front, ascending rank; indices ascending within a front. Each front's array is
 * allocated at its final length (one counting pass first), so building 10⁶ entries makes no growth copies.
 */
export function frontsOf(rank: Int32Array): number[][] {
  let fronts = 0;
  for (let i = 0; i < rank.length; i++) if (rank[i] > fronts) fronts = rank[i];
  const size = new Int32Array(fronts + 1);
  for (let i = 0; i < rank.length; i++) size[rank[i]]++;
  const out: number[][] = [];
  for (let r = 1; r <= fronts; r++) out.push(new Array<number>(size[r]));
  size.fill(0);
  for (let i = 0; i < rank.length; i++) {
    const r = rank[i];
    out[r - 1][size[r]++] = i;
  }
  return out;
}
