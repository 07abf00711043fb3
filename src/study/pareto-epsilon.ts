/**
 * ε-grouping: collapse near-identical candidates before (or after) sorting, so that a sweep over a fine
 * grid of, say, ripple ratios does not fill the front with copies of one design.
 *
 * Rule (greedy, in index order): point i joins the first existing representative r with the same group
 * key whose every objective is within a relative tolerance eps of r's:
 *   |p_k − r_k| ≤ eps · max(|p_k|, |r_k|)   for every objective k
 * (symmetric; a zero objective matches only zero). Otherwise i becomes a new representative. The result is
 * the representative's index for every point (a representative maps to itself). Because it is greedy, a
 * point within eps of a non-representative member but not of its representative starts its own group:
 * groups never chain. Cost O(n · g · m) with g representatives per key.
 */
import { flattenPoints, type PointsInput } from './pareto-input.ts';

export function epsilonGroupsFlat(
  points: PointsInput,
  keys: ArrayLike<string>,
  eps: number,
  m?: number,
): number[] {
  const { values, n, m: width } = flattenPoints(points, m);
  if (keys.length !== n) throw new RangeError(`epsilonGroups: ${keys.length} keys for ${n} points`);
  if (!(eps >= 0 && Number.isFinite(eps))) {
    throw new RangeError(`epsilonGroups: eps must be a finite number >= 0, got ${eps}`);
  }
  const repsByKey = new Map<string, number[]>();
  const out = new Array<number>(n);
  for (let i = 0; i < n; i++) {
    let reps = repsByKey.get(keys[i]);
    if (reps === undefined) {
      reps = [];
      repsByKey.set(keys[i], reps);
    }
    let found = -1;
    for (const r of reps) {
      if (withinEps(values, width, i, r, eps)) {
        found = r;
        break;
      }
    }
    if (found < 0) {
      reps.push(i);
      found = i;
    }
    out[i] = found;
  }
  return out;
}

function withinEps(values: Float64Array, m: number, i: number, r: number, eps: number): boolean {
  for (let k = 0; k < m; k++) {
    const p = values[i * m + k];
    const q = values[r * m + k];
    if (Math.abs(p - q) > eps * Math.max(Math.abs(p), Math.abs(q))) return false;
  }
  return true;
}
