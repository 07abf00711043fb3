/**
 * Crowding distance within each rank, as defined for NSGA-II by Deb, Pratap, Agarwal & Meyarivan,
 * "A fast and elitist multiobjective genetic algorithm: NSGA-II", IEEE Trans. Evolutionary Computation,
 * 2002 (section III-B, crowding-distance assignment).
 *
 * In words: for each objective k, sort the rank's points by objective k; the first and last get Infinity;
 * every other point adds (value of its next neighbour − value of its previous neighbour) / (max − min of
 * objective k within the rank). The distance is the sum over objectives (dimensionless).
 *
 * Our choices where the paper is silent:
 *  - ties in objective k are ordered by point index, so the result is deterministic;
 *  - an objective with zero range within the rank (every point equal on it, e.g. the same part count)
 *    adds nothing to any point, boundary Infinity included: it tells nothing about spread;
 *  - a rank of one or two points is all boundary: every point gets Infinity.
 * Cost: one radix sort per objective, O(n · m), shared with the rank computation in sortNonDominated.
 */
import { type ObjectiveOrders, objectiveOrders } from './pareto-order.ts';
import { sortObjective } from './pareto-radix.ts';

/**
 * Crowding distance of the n points (row-major n × m in `values`) within the groups given by `rank`
 * (any numeric labels; points with equal labels form one group).
 */
export function crowdingFlat(
  values: Float64Array,
  n: number,
  m: number,
  rank: ArrayLike<number>,
): Float64Array {
  if (n === 0) return new Float64Array(0);
  // groups numbered in label order: the dense rank of the label
  const labels = sortObjective(Float64Array.from(rank), n, 1, 0);
  return crowdingByGroups(values, n, m, labels.dense, labels.distinct, objectiveOrders(values, n, m));
}

/**
 * Crowding distance within groups numbered first..first+groups-1 (`groupOf[i]` for point i; first = 1
 * takes 1-based ranks as they are), given each objective's
 * sorted order (shared with the rank computation). Each objective's order is split by a stable counting
 * sort into its groups (objective order, ties by index, survive the stable scatter), then walked once.
 */
export function crowdingByGroups(
  values: Float64Array,
  n: number,
  m: number,
  groupOf: Int32Array,
  groups: number,
  orders: ObjectiveOrders,
  first = 0,
): Float64Array {
  const crowd = new Float64Array(n);
  const groupStart = new Int32Array(groups + 1);
  for (let i = 0; i < n; i++) groupStart[groupOf[i] - first + 1]++;
  for (let g = 0; g < groups; g++) groupStart[g + 1] += groupStart[g];
  const fill = new Int32Array(groups);
  const order = new Int32Array(n);
  for (let k = 0; k < m; k++) {
    const byValue = orders.orders[k];
    fill.set(groupStart.subarray(0, groups));
    for (let i = 0; i < n; i++) {
      const idx = byValue[i];
      order[fill[groupOf[idx] - first]++] = idx;
    }
    for (let g = 0; g < groups; g++)
      addObjective(crowd, values, m, k, order, groupStart[g], groupStart[g + 1]);
  }
  return crowd;
}

/**
 * Adds objective k's share for the group occupying sorted positions [start, end). The walk keeps the
 * previous, current and next values in locals, so each point's row is read once.
 */
function addObjective(
  crowd: Float64Array,
  values: Float64Array,
  m: number,
  k: number,
  order: Int32Array,
  start: number,
  end: number,
): void {
  if (end - start <= 2) {
    for (let i = start; i < end; i++) crowd[order[i]] = Number.POSITIVE_INFINITY;
    return;
  }
  const range = values[order[end - 1] * m + k] - values[order[start] * m + k];
  if (range === 0) return;
  crowd[order[start]] = Number.POSITIVE_INFINITY;
  crowd[order[end - 1]] = Number.POSITIVE_INFINITY;
  let previous = values[order[start] * m + k];
  let current = values[order[start + 1] * m + k];
  for (let i = start + 1; i < end - 1; i++) {
    const next = values[order[i + 1] * m + k];
    crowd[order[i]] += (next - previous) / range;
    previous = current;
    current = next;
  }
}
