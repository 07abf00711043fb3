/**
 * Hand-made evaluations for the study's own logic (ranking, verdicts, summary), so that the expected
 * answers can be worked out by hand without the engine.
 */
import type { Objectives, Reason, TopologyId } from '../../src/engine/types.ts';
import { assembleStudy } from '../../src/study/assemble.ts';
import { candidateId, type StudyPlan } from '../../src/study/enumerate.ts';
import { type StudyOptionsInput, studyOptionsOrThrow } from '../../src/study/options.ts';
import type { CandidateEvaluation, Study } from '../../src/study/types.ts';
import { railSpec } from '../support/specs.ts';

export interface SyntheticCandidate {
  topology: TopologyId;
  fswHz: number;
  objectives: Partial<Objectives> & Pick<Objectives, 'parts' | 'lossW' | 'stress'>;
  efficiencyNom?: number;
  reasons?: Reason[];
}

export function syntheticStudy(list: SyntheticCandidate[], input: StudyOptionsInput = {}): Study {
  const spec = railSpec({ name: 'synthetic rail' });
  const options = studyOptionsOrThrow(spec, input);
  const plan: StudyPlan = {
    candidates: list.map((c) => ({
      id: candidateId(c.topology, `${c.fswHz / 1e3}k`, 0.3, 'sync'),
      topology: c.topology,
      fswHz: c.fswHz,
      ripple: 0.3,
      rect: 'sync',
    })),
    excluded: [],
  };
  const evaluations: CandidateEvaluation[] = list.map((c) => ({
    topology: c.topology,
    fswHz: c.fswHz,
    ripple: 0.3,
    rect: 'sync',
    feasible: (c.reasons ?? []).length === 0,
    reasons: c.reasons ?? [],
    cautions: [],
    objectives: { volumeMm3: 1000, ...c.objectives },
    partsByRole: {},
    efficiencyNom: c.efficiencyNom ?? 0.95,
  }));
  return assembleStudy(spec, options, plan, evaluations);
}

/**
 * The worked case (objectives parts, lossW, stress; minimised):
 *   A sepic@100k          10 parts, 2.0 W, stress 10   front (fewest parts)
 *   B sepic-coupled@200k  12 parts, 1.5 W, stress 10   front (lowest loss)
 *   F zeta@300k           11 parts, 1.6 W, stress 10   front (neither extreme)
 *   C sepic@400k          12 parts, 2.5 W, stress 11   dominated by A, B and F
 *   D zeta@500k           infeasible (duty above the maximum)
 * Front ranges: parts 10..12 (2), loss 1.5..2.0 (0.5 W), stress 10..10 (no spread: scale |10| = 10).
 */
export const WORKED: SyntheticCandidate[] = [
  { topology: 'sepic', fswHz: 100e3, objectives: { parts: 10, lossW: 2.0, stress: 10 } },
  { topology: 'sepic-coupled', fswHz: 200e3, objectives: { parts: 12, lossW: 1.5, stress: 10 } },
  { topology: 'zeta', fswHz: 300e3, objectives: { parts: 11, lossW: 1.6, stress: 10 } },
  { topology: 'sepic', fswHz: 400e3, objectives: { parts: 12, lossW: 2.5, stress: 11 } },
  {
    topology: 'zeta',
    fswHz: 500e3,
    objectives: { parts: 11, lossW: 1.2, stress: 9 },
    reasons: [
      {
        code: 'duty-above-max',
        corner: 'vin-min',
        value: 0.921,
        limit: 0.88,
        message: 'vin-min: duty 92.1 % above the 88.0 % allowed at 500 kHz',
      },
    ],
  },
];
