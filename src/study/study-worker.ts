/** Worker-thread task of a parallel study: evaluate one chunk of candidates (see parallel.ts). */
import type { CandidateParams } from '../engine/types.ts';
import type { Technology } from '../parts/technology.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { evaluateForStudy } from './run-study.ts';
import type { CandidateEvaluation } from './types.ts';

export interface StudyChunk {
  spec: RailSpec;
  tech: Technology;
  params: CandidateParams[];
}

export function evaluateChunk(chunk: StudyChunk): CandidateEvaluation[] {
  return chunk.params.map((p) => evaluateForStudy(chunk.spec, p, chunk.tech));
}
