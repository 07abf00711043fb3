/**
 * The study, serially: validate options, enumerate, evaluate every candidate at all its corners with the
 * engine, assemble. Pure and synchronous; the worker-thread path for large sweeps is parallel.ts.
 */
import { evaluateCandidateSummary } from '../engine/evaluate.ts';
import type { CandidateParams } from '../engine/types.ts';
import type { Technology } from '../parts/technology.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { assembleStudy } from './assemble.ts';
import { planStudy } from './enumerate.ts';
import { type StudyOptionsInput, studyOptionsOrThrow } from './options.ts';
import type { CandidateEvaluation, Study } from './types.ts';

export interface StudyHooks {
  /** Called after each evaluated candidate (done of total), e.g. for a progress bar. */
  onProgress?(done: number, total: number): void;
}

/**
 * Evaluate one candidate and keep what the study needs: evaluateCandidate without its corner records
 * and part list, which the summary path never builds.
 */
export function evaluateForStudy(
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
): CandidateEvaluation {
  return evaluateCandidateSummary(spec, params, tech);
}

/** Throws StudyInputError (with every problem) on bad options. */
export function runStudy(
  spec: RailSpec,
  tech: Technology,
  input: StudyOptionsInput = {},
  hooks: StudyHooks = {},
): Study {
  const options = studyOptionsOrThrow(spec, input);
  const plan = planStudy(spec, options);
  const total = plan.candidates.length;
  const evaluations = plan.candidates.map((c, i) => {
    const e = evaluateForStudy(spec, c, tech);
    hooks.onProgress?.(i + 1, total);
    return e;
  });
  return assembleStudy(spec, options, plan, evaluations);
}
