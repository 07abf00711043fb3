/**
 * The edge of the study that uses threads: above a size threshold the candidates are evaluated in chunks
 * on a tinypool of worker threads, then assembled by the same pure code as the serial path, so the result
 * is identical (the engine is deterministic and the chunks come back in order). Below the threshold, or
 * on one core, it runs serially: starting workers costs more than a small sweep.
 */
import { availableParallelism } from 'node:os';
import Tinypool from 'tinypool';
import type { Technology } from '../parts/technology.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { assembleStudy } from './assemble.ts';
import { type PlannedCandidate, planStudy } from './enumerate.ts';
import { type StudyOptionsInput, studyOptionsOrThrow } from './options.ts';
import { evaluateForStudy, type StudyHooks } from './run-study.ts';
import type { StudyChunk } from './study-worker.ts';
import type { CandidateEvaluation, Study } from './types.ts';

/**
 * Candidates above which a study goes to worker threads. Measured on the 2-core development machine: a
 * worker needs a few hundred ms to start and load the engine, the engine takes about 0.5–2 ms per
 * candidate, so two threads pay off only from a few thousand candidates.
 */
export const PARALLEL_THRESHOLD = 3000;
/** Chunks per thread: enough to balance uneven topologies and move the progress bar. */
const CHUNKS_PER_THREAD = 8;

const WORKER_ENTRY = new URL('./study-worker-entry.mjs', import.meta.url);

export interface ParallelOptions extends StudyHooks {
  /** Override PARALLEL_THRESHOLD (tests use a small one). */
  threshold?: number;
  /** Worker threads (default: available parallelism). */
  threads?: number;
}

export async function runStudyParallel(
  spec: RailSpec,
  tech: Technology,
  input: StudyOptionsInput = {},
  parallel: ParallelOptions = {},
): Promise<Study> {
  const options = studyOptionsOrThrow(spec, input);
  const plan = planStudy(spec, options);
  const total = plan.candidates.length;
  const threads = parallel.threads ?? availableParallelism();
  let evaluations: CandidateEvaluation[];
  if (total < (parallel.threshold ?? PARALLEL_THRESHOLD) || threads < 2) {
    evaluations = plan.candidates.map((c, i) => {
      const e = evaluateForStudy(spec, c, tech);
      parallel.onProgress?.(i + 1, total);
      return e;
    });
  } else {
    evaluations = await evaluateOnPool(spec, tech, plan.candidates, threads, parallel);
  }
  return assembleStudy(spec, options, plan, evaluations);
}

async function evaluateOnPool(
  spec: RailSpec,
  tech: Technology,
  candidates: readonly PlannedCandidate[],
  threads: number,
  hooks: StudyHooks,
): Promise<CandidateEvaluation[]> {
  const size = Math.max(1, Math.ceil(candidates.length / (threads * CHUNKS_PER_THREAD)));
  const chunks: StudyChunk[] = [];
  for (let i = 0; i < candidates.length; i += size) {
    const params = candidates
      .slice(i, i + size)
      .map(({ topology, fswHz, ripple, rect }) => ({ topology, fswHz, ripple, rect }));
    chunks.push({ spec, tech, params });
  }
  const pool = new Tinypool({ filename: WORKER_ENTRY.href, minThreads: threads, maxThreads: threads });
  let done = 0;
  try {
    const results = await Promise.all(
      chunks.map(async (chunk) => {
        const r = (await pool.run(chunk)) as CandidateEvaluation[];
        done += chunk.params.length;
        hooks.onProgress?.(done, candidates.length);
        return r;
      }),
    );
    return results.flat();
  } finally {
    await pool.destroy();
  }
}
