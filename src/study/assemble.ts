/**
 * From the evaluations of a planned study to the Study: ranks and crowding over the feasible candidates
 * (our sorter, pareto.ts), ε-groups, verdicts, sweeps and the summary. Pure; shared by the serial path
 * (run-study.ts) and the worker-thread path (parallel.ts), which differ only in who evaluates.
 */
import type { Reason } from '../engine/types.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import type { StudyPlan } from './enumerate.ts';
import { frontScale } from './normalise.ts';
import { objectiveVector } from './objectives.ts';
import { epsilonGroups, sortNonDominated } from './pareto.ts';
import { summarizeStudy } from './summary.ts';
import { studySweeps } from './sweeps.ts';
import type { CandidateEvaluation, Study, StudyCandidate, StudyOptions } from './types.ts';
import { dominatedVerdict, frontVerdict, infeasibleVerdict, type VerdictInput } from './verdicts.ts';

export function assembleStudy(
  spec: RailSpec,
  options: StudyOptions,
  plan: StudyPlan,
  evaluations: readonly CandidateEvaluation[],
): Study {
  if (evaluations.length !== plan.candidates.length) {
    throw new RangeError(
      `assembleStudy: ${evaluations.length} evaluations for ${plan.candidates.length} candidates`,
    );
  }
  const keys = options.objectives;
  const candidates: StudyCandidate[] = plan.candidates.map((p, i) => {
    const e = evaluations[i];
    const reasons: Reason[] = [...e.reasons];
    for (const k of keys) {
      if (e.feasible && !Number.isFinite(e.objectives[k])) {
        reasons.push({
          code: 'not-converged',
          message: `objective ${k} came out as ${e.objectives[k]}`,
          value: e.objectives[k],
        });
      }
    }
    return {
      id: p.id,
      topology: p.topology,
      fswHz: p.fswHz,
      ripple: p.ripple,
      rect: p.rect,
      feasible: reasons.length === 0 && e.feasible,
      objectives: { ...e.objectives },
      efficiencyNom: e.efficiencyNom,
      rank: null,
      crowding: null,
      representative: null,
      verdict: infeasibleVerdict(reasons),
      reasons,
      cautions: [...e.cautions],
    };
  });

  const feasible = candidates.map((c, i) => (c.feasible ? i : -1)).filter((i) => i >= 0);
  const vectors = feasible.map((i) => objectiveVector(candidates[i].objectives, keys));
  let front: number[] = [];
  if (feasible.length > 0) {
    const sorted = sortNonDominated(vectors, keys.length);
    feasible.forEach((ci, j) => {
      candidates[ci].rank = sorted.rank[j];
      candidates[ci].crowding = sorted.crowding[j];
    });
    front = sorted.fronts[0].map((j) => feasible[j]);
  }
  const scale =
    front.length > 0
      ? frontScale(
          front.map((i) => candidates[i].objectives),
          keys,
        )
      : undefined;
  if (scale) {
    const flat = new Float64Array(candidates.length * keys.length);
    candidates.forEach((c, i) => {
      keys.forEach((k, j) => {
        flat[i * keys.length + j] = c.objectives[k];
      });
    });
    const input: VerdictInput = {
      ids: candidates.map((c) => c.id),
      objectives: candidates.map((c) => c.objectives),
      keys,
      front,
      scale,
      flat,
    };
    for (const i of feasible) {
      const rank = candidates[i].rank!;
      candidates[i].verdict = rank === 1 ? frontVerdict(i, input) : dominatedVerdict(i, rank, input);
    }
  }
  if (options.epsilon > 0 && feasible.length > 0) assignRepresentatives(candidates, feasible, options);

  const topologies = [...new Set(plan.candidates.map((c) => c.topology))];
  const { sweeps, highlights } = studySweeps(topologies, candidates);
  return {
    spec,
    options,
    candidates,
    front: front.map((i) => candidates[i].id),
    summary: summarizeStudy(candidates, front, scale, options, topologies),
    sweeps,
    highlights,
    excluded: plan.excluded,
  };
}

/**
 * ε-grouping for the plot (rule in pareto-epsilon.ts), keyed by topology. Candidates are offered best
 * first (rank ascending, crowding descending, then candidate order), so a group's representative is its
 * best-ranked member and every front member is represented by a front member.
 */
function assignRepresentatives(
  candidates: StudyCandidate[],
  feasible: readonly number[],
  options: StudyOptions,
): void {
  const order = [...feasible].sort((a, b) => {
    const ca = candidates[a];
    const cb = candidates[b];
    return ca.rank! - cb.rank! || cb.crowding! - ca.crowding! || a - b;
  });
  const points = order.map((i) => objectiveVector(candidates[i].objectives, options.objectives));
  const reps = epsilonGroups(
    points,
    order.map((i) => candidates[i].topology),
    options.epsilon,
    options.objectives.length,
  );
  order.forEach((ci, j) => {
    candidates[ci].representative = candidates[order[reps[j]]].id;
  });
}
