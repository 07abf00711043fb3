/**
 * Non-dominated ranks of flat points: sort, merge exact duplicates, run the kernel for the objective count.
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
import { argsortColumns, column } from './pareto-radix.ts';
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
  const rank = new Int32Array(n);
  if (n === 0) return rank;
  const cols: Float64Array[] = [];
  for (let k = 0; k < m; k++) cols.push(column(values, n, m, k));
  const order = argsortColumns(cols, n);

  // merge runs of identical points in one pass: group[i] is the distinct-point number of sorted position i,
  // distinct[k][g] objective k of distinct point g
  const group = new Int32Array(n);
  const distinct: Float64Array[] = [];
  for (let k = 0; k < m; k++) distinct.push(new Float64Array(n));
  let u = 0;
  for (let i = 0; i < n; i++) {
    const row = order[i] * m;
    let fresh = i === 0;
    for (let k = 0; k < m && !fresh; k++) fresh = values[row + k] !== distinct[k][u - 1];
    if (fresh) {
      for (let k = 0; k < m; k++) distinct[k][u] = values[row + k];
      u++;
    }
    group[i] = u - 1;
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

  for (let i = 0; i < n; i++) rank[order[i]] = kernelRank[group[i]] + 1;
  return rank;
}

/** Indices of each front, ascending rank; indices ascending within a front. */
export function frontsOf(rank: Int32Array): number[][] {
  let fronts = 0;
  for (const r of rank) if (r > fronts) fronts = r;
  const out: number[][] = [];
  for (let r = 0; r < fronts; r++) out.push([]);
  for (let i = 0; i < rank.length; i++) out[rank[i] - 1].push(i);
  return out;
}
