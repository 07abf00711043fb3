/**
 * Per-topology frequency sweeps over the feasible candidates: at each switching frequency the best nominal
 * efficiency and the smallest volume over the ripple ratios and rectifiers (each picked on its own, so
 * the two series may come from different variants; the ids say which), then the frequency with the best
 * efficiency, the one with the smallest volume, and the knee between them.
 *
 * Knee (our definition). Take the sweep points whose frequency lies between the best-efficiency frequency
 * fA and the smallest-volume frequency fB, inclusive. Normalise over those points so both axes read
 * "lower is better" on [0, 1]:
 *   x = (V − Vmin) / (Vmax − Vmin),   y = (ηmax − η) / (ηmax − ηmin)     (0 when a range is zero)
 * so A = (xA, 0), B = (0, yB) and the ideal corner is (0, 0). The knee is the point with the largest
 * signed distance from the chord AB towards the ideal corner,
 *   d(P) = ±((B − A) × (P − A)) / |B − A|,  sign chosen so the ideal corner is positive,
 * i.e. the frequency that gives the most of both at once. A and B have d = 0, so when no point bulges
 * towards the ideal corner the knee is an endpoint; ties go to the lower frequency. When A = B (one
 * frequency is best at both) the knee is that frequency.
 */
import type { TopologyId } from '../engine/types.ts';
import type { StudyCandidate, SweepHighlights, SweepPoint } from './types.ts';

export function topologySweep(candidates: readonly StudyCandidate[]): SweepPoint[] {
  const byFreq = new Map<number, SweepPoint>();
  for (const c of candidates) {
    if (!c.feasible) continue;
    const p = byFreq.get(c.fswHz);
    if (!p) {
      byFreq.set(c.fswHz, {
        fswHz: c.fswHz,
        efficiency: c.efficiencyNom,
        volumeMm3: c.objectives.volumeMm3,
        efficiencyId: c.id,
        volumeId: c.id,
      });
      continue;
    }
    if (c.efficiencyNom > p.efficiency) {
      p.efficiency = c.efficiencyNom;
      p.efficiencyId = c.id;
    }
    if (c.objectives.volumeMm3 < p.volumeMm3) {
      p.volumeMm3 = c.objectives.volumeMm3;
      p.volumeId = c.id;
    }
  }
  return [...byFreq.values()].sort((a, b) => a.fswHz - b.fswHz);
}

export function sweepHighlights(points: readonly SweepPoint[]): SweepHighlights | undefined {
  if (points.length === 0) return undefined;
  let a = 0;
  let b = 0;
  points.forEach((p, i) => {
    if (p.efficiency > points[a].efficiency) a = i;
    if (p.volumeMm3 < points[b].volumeMm3) b = i;
  });
  const knee = kneeIndex(points, a, b);
  return {
    bestEfficiency: { fswHz: points[a].fswHz, efficiency: points[a].efficiency, id: points[a].efficiencyId },
    smallestVolume: { fswHz: points[b].fswHz, volumeMm3: points[b].volumeMm3, id: points[b].volumeId },
    knee: {
      fswHz: points[knee.i].fswHz,
      efficiency: points[knee.i].efficiency,
      volumeMm3: points[knee.i].volumeMm3,
      distance: knee.d,
    },
  };
}

/** Index of the knee between indices a (best efficiency) and b (smallest volume), and its distance. */
export function kneeIndex(points: readonly SweepPoint[], a: number, b: number): { i: number; d: number } {
  const lo = Math.min(a, b);
  const hi = Math.max(a, b);
  const span = points.slice(lo, hi + 1);
  const vMin = Math.min(...span.map((p) => p.volumeMm3));
  const vMax = Math.max(...span.map((p) => p.volumeMm3));
  const eMin = Math.min(...span.map((p) => p.efficiency));
  const eMax = Math.max(...span.map((p) => p.efficiency));
  const x = (p: SweepPoint) => (vMax > vMin ? (p.volumeMm3 - vMin) / (vMax - vMin) : 0);
  const y = (p: SweepPoint) => (eMax > eMin ? (eMax - p.efficiency) / (eMax - eMin) : 0);
  const ax = x(points[a]);
  const ay = y(points[a]);
  const dx = x(points[b]) - ax;
  const dy = y(points[b]) - ay;
  const length = Math.hypot(dx, dy);
  if (length === 0) return { i: a, d: 0 };
  // Cross product (B − A) × (P − A); the ideal corner (0, 0) fixes which side counts as positive.
  const cross = (px: number, py: number) => (dx * (py - ay) - dy * (px - ax)) / length;
  const side = Math.sign(cross(0, 0)) || 1;
  let best = { i: lo, d: -Infinity };
  for (let i = lo; i <= hi; i++) {
    const d = side * cross(x(points[i]), y(points[i]));
    if (d > best.d + 1e-12) best = { i, d };
  }
  return best;
}

export function studySweeps(topologies: readonly TopologyId[], candidates: readonly StudyCandidate[]) {
  const sweeps: Partial<Record<TopologyId, SweepPoint[]>> = {};
  const highlights: Partial<Record<TopologyId, SweepHighlights>> = {};
  for (const t of topologies) {
    const points = topologySweep(candidates.filter((c) => c.topology === t));
    sweeps[t] = points;
    const h = sweepHighlights(points);
    if (h) highlights[t] = h;
  }
  return { sweeps, highlights };
}
