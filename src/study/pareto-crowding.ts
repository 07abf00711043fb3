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
 * Cost: one radix sort per objective, O(n · m).
 */
import { argsortColumns, column } from './pareto-radix.ts';

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
  const crowd = new Float64Array(n);
  if (n === 0) return crowd;
  // rank groups: label order by one radix sort, then each objective sorted once and split by a stable
  // counting sort into its rank group (objective order, ties by index, survive the stable scatter)
  const labels = Float64Array.from(rank);
  const byLabel = argsortColumns([labels], n);
  const groupOf = new Int32Array(n);
  const groupStart: number[] = [0];
  for (let i = 1; i < n; i++) {
    if (labels[byLabel[i]] !== labels[byLabel[i - 1]]) groupStart.push(i);
    groupOf[byLabel[i]] = groupStart.length - 1;
  }
  groupStart.push(n);
  const fill = new Int32Array(groupStart.length);
  const order = new Int32Array(n);
  for (let k = 0; k < m; k++) {
    const f = column(values, n, m, k);
    const byValue = argsortColumns([f], n);
    for (let g = 0; g < fill.length; g++) fill[g] = groupStart[g];
    for (let i = 0; i < n; i++) {
      const idx = byValue[i];
      order[fill[groupOf[idx]]++] = idx;
    }
    for (let g = 0; g + 1 < groupStart.length; g++)
      addObjective(crowd, f, order, groupStart[g], groupStart[g + 1]);
  }
  return crowd;
}

/** Adds objective k's share for the rank occupying sorted positions [start, end). */
function addObjective(
  crowd: Float64Array,
  f: Float64Array,
  order: Int32Array,
  start: number,
  end: number,
): void {
  if (end - start <= 2) {
    for (let i = start; i < end; i++) crowd[order[i]] = Number.POSITIVE_INFINITY;
    return;
  }
  const range = f[order[end - 1]] - f[order[start]];
  if (range === 0) return;
  crowd[order[start]] = Number.POSITIVE_INFINITY;
  crowd[order[end - 1]] = Number.POSITIVE_INFINITY;
  for (let i = start + 1; i < end - 1; i++) {
    crowd[order[i]] += (f[order[i + 1]] - f[order[i - 1]]) / range;
  }
}
