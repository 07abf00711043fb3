/**
 * Per-objective orders of the points, computed once per sort and shared by ranking and crowding.
 *
 * For each objective k: the stable argsort of objective k (ties by point index), which is exactly the
 * order the crowding distance walks, and the dense rank of each point on objective k (0 for the smallest
 * value, equal values equal ranks, -0 equal to +0). The lexicographic order the rank kernels sweep is then
 * a stable sort of small integers, last objective first (LSD), instead of a second sort of doubles; and
 * when one objective has n distinct values its argsort already is the lexicographic order on the objectives
 * from it on, so the objectives after it need no pass (continuous data: no pass at all).
 */
import { RadixScratch, SMALL_N, sortByIntKey, sortObjective } from './pareto-radix.ts';

export interface ObjectiveOrders {
  /** orders[k]: point indices sorted by objective k ascending, ties by index. */
  orders: Int32Array[];
  /** dense[k][i]: number of distinct objective-k values below point i's. */
  dense: Int32Array[];
  /** distinct[k]: number of distinct objective-k values. */
  distinct: number[];
}

/** The orders and dense ranks of every objective of the row-major n × m finite `values`. */
export function objectiveOrders(values: Float64Array, n: number, m: number): ObjectiveOrders {
  const scratch = n < SMALL_N ? undefined : new RadixScratch(n);
  const out: ObjectiveOrders = { orders: [], dense: [], distinct: [] };
  for (let k = 0; k < m; k++) {
    const sorted = sortObjective(values, n, m, k, scratch);
    out.orders.push(sorted.order);
    out.dense.push(sorted.dense);
    out.distinct.push(sorted.distinct);
  }
  return out;
}

/**
 * Point indices in lexicographic order of the objectives (objective 0 first), ties by index. Three ways,
 * cheapest first:
 *  - an objective with n distinct values: its order breaks every tie of the objectives after it, so the
 *    LSD below starts there (continuous data: objective 0, and nothing is left to do);
 *  - few ties on objective 0 (at most n / FEW_TIES positions share a value with their predecessor):
 *    objective 0's order with each run of equal values sorted by the remaining dense ranks;
 *  - otherwise LSD over the dense ranks, last objective first, one stable counting sort each.
 */
export function lexicographicOrder(o: ObjectiveOrders, n: number): Int32Array {
  const m = o.orders.length;
  let start = m - 1;
  for (let k = 0; k < m; k++) {
    if (o.distinct[k] === n) {
      start = k;
      break;
    }
  }
  if (start > 0 && m > 1 && (n - o.distinct[0]) * FEW_TIES <= n) return sortTieRuns(o, n);
  let order = o.orders[start];
  const scratch = n < SMALL_N || start === 0 ? undefined : new RadixScratch(n);
  for (let k = start - 1; k >= 0; k--) order = sortByIntKey(order, o.dense[k], o.distinct[k], n, scratch);
  return order;
}

/** Ties on objective 0 in at most 1 / FEW_TIES of the positions: sort the tie runs one by one. */
const FEW_TIES = 64;

function sortTieRuns(o: ObjectiveOrders, n: number): Int32Array {
  const order = o.orders[0].slice();
  const d0 = o.dense[0];
  const rest = o.dense.slice(1);
  const byRest = (a: number, b: number): number => {
    for (const d of rest) if (d[a] !== d[b]) return d[a] - d[b];
    return a - b;
  };
  let runStart = 0;
  let previous = n > 0 ? d0[order[0]] : 0;
  for (let i = 1; i <= n; i++) {
    const current = i < n ? d0[order[i]] : -1;
    if (current !== previous) {
      if (i - runStart > 1) order.subarray(runStart, i).sort(byRest);
      runStart = i;
      previous = current;
    }
  }
  return order;
}
