/**
 * The study summary: the recommended candidate and why it beats the best of each other topology.
 *
 * Recommendation rule (ours). Normalise each chosen objective over the front's range,
 *   n_k = (x_k − min_front_k) / range_front_k        (src/study/normalise.ts; 0 … 1 on the front)
 * and score a candidate by the weighted mean  S = Σ w_k n_k / Σ w_k  with the user's weights (default
 * equal). The recommended candidate is the front member with the smallest S (ties: first in candidate
 * order). Because S never decreases when an objective gets worse, a front member always scores at least
 * as well as anything it dominates, so the minimum over the front is the minimum over all feasible
 * candidates. Each other topology is represented by its own lowest-S feasible candidate.
 */
import type { Objectives, Reason, TopologyId } from '../engine/types.ts';
import { type FrontScale, normalised } from './normalise.ts';
import { describeDelta, formatObjective, OBJECTIVE_WORDS, objectiveDelta } from './objectives.ts';
import type {
  InfeasibleTopology,
  StudyCandidate,
  StudyOptions,
  StudySummary,
  TopologyComparison,
} from './types.ts';

export function recommendationScore(o: Objectives, scale: FrontScale, weights: readonly number[]): number {
  const n = normalised(o, scale);
  const total = weights.reduce((a, b) => a + b, 0);
  return n.reduce((sum, v, j) => sum + weights[j] * v, 0) / total;
}

function fmtScore(s: number): string {
  return s.toFixed(3);
}

export function summarizeStudy(
  candidates: readonly StudyCandidate[],
  front: readonly number[],
  scale: FrontScale | undefined,
  options: StudyOptions,
  topologies: readonly TopologyId[],
): StudySummary {
  const infeasibleTopologies = topologies
    .map((t) =>
      infeasibleTopology(
        t,
        candidates.filter((c) => c.topology === t),
      ),
    )
    .filter((x): x is InfeasibleTopology => x !== undefined);
  if (front.length === 0 || !scale) {
    const headline =
      candidates.length === 0
        ? 'No candidate to evaluate: no topology applies to this spec.'
        : 'No candidate is feasible.';
    const details = infeasibleTopologies.map((x) => x.text);
    const text = [headline, ...details].join(' ');
    return {
      recommended: null,
      score: null,
      runnerUp: null,
      comparisons: [],
      infeasibleTopologies,
      headline,
      details,
      text,
    };
  }
  const keys = options.objectives;
  const score = (c: StudyCandidate) => recommendationScore(c.objectives, scale, options.weights);
  let rec = front[0];
  for (const i of front) if (score(candidates[i]) < score(candidates[rec])) rec = i;
  const best = candidates[rec];
  const bestScore = score(best);

  let runnerUp: StudyCandidate | undefined;
  for (const c of candidates) {
    if (!c.feasible || c === best) continue;
    if (!runnerUp || score(c) < score(runnerUp)) runnerUp = c;
  }

  const comparisons: TopologyComparison[] = [];
  for (const t of topologies) {
    if (t === best.topology) continue;
    let top: StudyCandidate | undefined;
    for (const c of candidates)
      if (c.topology === t && c.feasible && (!top || score(c) < score(top))) top = c;
    if (!top) continue;
    const deltas = keys.map((k) => objectiveDelta(k, best.objectives, top.objectives));
    const s = score(top);
    const wins = deltas.filter((d) => d.delta < 0).map(describeDelta);
    const losses = deltas.filter((d) => d.delta > 0).map(describeDelta);
    const text =
      `Against the best ${t} candidate, ${top.id} (score ${fmtScore(s)} vs ${fmtScore(bestScore)}), ${best.id} has ` +
      `${wins.length > 0 ? wins.join(', ') : 'no objective better'}` +
      `${losses.length > 0 ? `, at the cost of ${losses.join(', ')}` : ''}.`;
    comparisons.push({ topology: t, id: top.id, score: s, deltas, text });
  }

  const figures = keys
    .map((k) => `${OBJECTIVE_WORDS[k].noun} ${formatObjective(k, best.objectives[k])}`)
    .join(', ');
  const weights = keys.map((k, j) => `${k} ${options.weights[j]}`).join(', ');
  const headline = `Recommended: ${best.id} (${figures}; ${(best.efficiencyNom * 100).toFixed(1)} % efficient at nominal input), the front member with the lowest weighted score ${fmtScore(bestScore)} (weights ${weights}; each objective normalised over the front's range).`;
  const details: string[] = comparisons.map((c) => c.text);
  if (comparisons.length === 0 && runnerUp) {
    const d = keys.map((k) => describeDelta(objectiveDelta(k, best.objectives, runnerUp.objectives)));
    details.push(
      `No other topology has a feasible candidate; against the runner-up ${runnerUp.id} (score ${fmtScore(score(runnerUp))}) it has ${d.join(', ')}.`,
    );
  } else if (comparisons.length === 0) details.push('It is the only feasible candidate.');
  return {
    recommended: best.id,
    score: bestScore,
    runnerUp: runnerUp?.id ?? null,
    comparisons,
    infeasibleTopologies,
    headline,
    details,
    text: [headline, ...details].join(' '),
  };
}

/** Why a topology has no feasible candidate, or undefined when it has one (or none were enumerated). */
export function infeasibleTopology(
  topology: TopologyId,
  candidates: readonly StudyCandidate[],
): InfeasibleTopology | undefined {
  if (candidates.length === 0 || candidates.some((c) => c.feasible)) return undefined;
  const byCode = new Map<string, { candidates: number; example: Reason }>();
  for (const c of candidates) {
    for (const code of new Set(c.reasons.map((r) => r.code))) {
      const entry = byCode.get(code);
      if (entry) entry.candidates++;
      else byCode.set(code, { candidates: 1, example: c.reasons.find((r) => r.code === code)! });
    }
  }
  const reasons = [...byCode.entries()]
    .map(([code, e]) => ({ code, candidates: e.candidates, example: e.example.message }))
    .sort((a, b) => b.candidates - a.candidates);
  const list = reasons.map((r) => `${r.code} in ${r.candidates} (e.g. ${r.example})`).join('; ');
  return {
    topology,
    candidates: candidates.length,
    reasons,
    text: `${topology}: none of ${candidates.length} candidates is feasible: ${list}.`,
  };
}
