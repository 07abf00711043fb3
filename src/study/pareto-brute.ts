/**
 * The slow, obvious reference sorter: compare every pair, peel fronts, crowding by comparator sorts.
 * O(n² m) time. Exported for the tests (fast sorter vs this) and the benchmark; not for
 * production use. Same definitions and tie rules as the fast sorter (see pareto-crowding.ts).
 */
import { flattenPoints, type PointsInput } from './pareto-input.ts';

export interface BruteResult {
  rank: Int32Array;
  crowding: Float64Array;
  fronts: number[][];
}

export function sortNonDominatedBrute(points: PointsInput, m?: number): BruteResult {
  const { values, n, m: width } = flattenPoints(points, m);
  const row = (i: number) => Array.from(values.subarray(i * width, (i + 1) * width));
  const pts = Array.from({ length: n }, (_, i) => row(i));
  // Deb et al.'s fast non-dominated sort (NSGA-II paper, section III-A): count each point's dominators,
  // list whom it dominates, then peel fronts by decrementing the counts.
  const dominatedBy = new Int32Array(n);
  const beats: number[][] = pts.map(() => []);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (dominatesBrute(pts[i], pts[j])) {
        beats[i].push(j);
        dominatedBy[j]++;
      }
    }
  }
  const rank = new Int32Array(n);
  const fronts: number[][] = [];
  let current = pts.map((_, i) => i).filter((i) => dominatedBy[i] === 0);
  while (current.length > 0) {
    fronts.push(current);
    const next: number[] = [];
    for (const i of current) {
      rank[i] = fronts.length;
      for (const j of beats[i]) if (--dominatedBy[j] === 0) next.push(j);
    }
    current = next.sort((a, b) => a - b);
  }
  const crowding = new Float64Array(n);
  for (const front of fronts) {
    if (front.length <= 2) {
      for (const i of front) crowding[i] = Number.POSITIVE_INFINITY;
      continue;
    }
    for (let k = 0; k < width; k++) {
      const sorted = [...front].sort((a, b) => pts[a][k] - pts[b][k] || a - b);
      const lo = pts[sorted[0]][k];
      const hi = pts[sorted[sorted.length - 1]][k];
      if (hi === lo) continue;
      crowding[sorted[0]] = Number.POSITIVE_INFINITY;
      crowding[sorted[sorted.length - 1]] = Number.POSITIVE_INFINITY;
      for (let s = 1; s < sorted.length - 1; s++) {
        crowding[sorted[s]] += (pts[sorted[s + 1]][k] - pts[sorted[s - 1]][k]) / (hi - lo);
      }
    }
  }
  return { rank, crowding, fronts };
}

function dominatesBrute(a: number[], b: number[]): boolean {
  return a.every((v, k) => v <= b[k]) && a.some((v, k) => v < b[k]);
}
