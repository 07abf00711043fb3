/**
 * Studies for the web app: evaluations cached by what defines them (spec, band, grid, ripples), the Study
 * assembled from them per objective choice and weights (cheap), and long sweeps run as in-memory jobs
 * that evaluate in short slices between event-loop turns, so progress can be polled and a job cancelled.
 */
import { randomUUID } from 'node:crypto';
import type { Technology } from '../parts/technology.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { assembleStudy } from '../study/assemble.ts';
import { planStudy, type StudyPlan } from '../study/enumerate.ts';
import { evaluateForStudy } from '../study/run-study.ts';
import type { CandidateEvaluation, Study, StudyOptions } from '../study/types.ts';

export interface ServiceLimits {
  /** Sweeps up to this many candidates are evaluated within the request; larger ones become jobs. */
  inlineCandidates: number;
  /** Running jobs at once; starting one more cancels the oldest (most likely a superseded edit). */
  maxRunningJobs: number;
  /** Evaluation sets kept in memory. */
  cacheEntries: number;
  /** Evaluation time per slice before yielding to the event loop (ms). */
  sliceMs: number;
  /** Finished or cancelled jobs are forgotten after this long (ms). */
  jobTtlMs: number;
}

export const DEFAULT_LIMITS: ServiceLimits = {
  inlineCandidates: 240,
  maxRunningJobs: 3,
  cacheEntries: 24,
  sliceMs: 40,
  jobTtlMs: 10 * 60_000,
};

export type JobState = 'running' | 'done' | 'cancelled' | 'failed';

export interface Job {
  id: string;
  key: string;
  done: number;
  total: number;
  state: JobState;
  startedAt: number;
  finishedAt?: number;
  error?: unknown;
}

interface Evaluated {
  plan: StudyPlan;
  evaluations: CandidateEvaluation[];
}

export type StudyAnswer = { kind: 'ready'; study: Study } | { kind: 'job'; job: Job };

/** Cache key of the evaluations: everything that changes a candidate's figures. */
function evaluationKey(spec: RailSpec, o: StudyOptions): string {
  return JSON.stringify([spec, o.band, o.frequencyPoints, o.ripples]);
}

export class StudyService {
  readonly limits: ServiceLimits;
  private readonly evaluated = new Map<string, Evaluated>();
  private readonly studies = new Map<string, Study>();
  private readonly jobs = new Map<string, Job>();
  private readonly jobByKey = new Map<string, string>();

  constructor(limits: Partial<ServiceLimits> = {}) {
    this.limits = { ...DEFAULT_LIMITS, ...limits };
  }

  /** The study if it is cached or small; otherwise the job computing it (started if needed). */
  study(spec: RailSpec, tech: Technology, options: StudyOptions, restart = false): StudyAnswer {
    this.expireJobs();
    const key = evaluationKey(spec, options);
    const ready = this.assembled(key, spec, options);
    if (ready) return { kind: 'ready', study: ready };
    const existing = this.jobFor(key);
    if (existing && (existing.state === 'running' || (!restart && existing.state !== 'done'))) {
      return { kind: 'job', job: existing };
    }
    const plan = planStudy(spec, options);
    if (plan.candidates.length <= this.limits.inlineCandidates) {
      const evaluations = plan.candidates.map((c) => evaluateForStudy(spec, c, tech));
      this.remember(key, { plan, evaluations });
      return { kind: 'ready', study: this.assembled(key, spec, options)! };
    }
    return { kind: 'job', job: this.startJob(key, spec, tech, plan) };
  }

  /** The study if its evaluations are cached; never starts work. */
  cached(spec: RailSpec, options: StudyOptions): Study | undefined {
    return this.assembled(evaluationKey(spec, options), spec, options);
  }

  job(id: string): Job | undefined {
    this.expireJobs();
    return this.jobs.get(id);
  }

  /** Ask a running job to stop at its next slice. Returns the job, or undefined if unknown. */
  cancel(id: string): Job | undefined {
    const job = this.jobs.get(id);
    if (job && job.state === 'running') {
      job.state = 'cancelled';
      job.finishedAt = Date.now();
    }
    return job;
  }

  /** Wait for a job to leave the running state (tests, shutdown). */
  async settle(job: Job): Promise<Job> {
    while (job.state === 'running') await new Promise((resolve) => setTimeout(resolve, 5));
    return job;
  }

  runningJobs(): Job[] {
    return [...this.jobs.values()].filter((j) => j.state === 'running');
  }

  private jobFor(key: string): Job | undefined {
    const id = this.jobByKey.get(key);
    return id === undefined ? undefined : this.jobs.get(id);
  }

  private assembled(key: string, spec: RailSpec, options: StudyOptions): Study | undefined {
    const evaluated = this.evaluated.get(key);
    if (!evaluated) return undefined;
    const fullKey = JSON.stringify([key, options.objectives, options.weights, options.epsilon]);
    let study = this.studies.get(fullKey);
    if (!study) {
      study = assembleStudy(spec, options, evaluated.plan, evaluated.evaluations);
      this.studies.set(fullKey, study);
      trim(this.studies, this.limits.cacheEntries * 4);
    }
    return study;
  }

  private remember(key: string, value: Evaluated): void {
    this.evaluated.delete(key);
    this.evaluated.set(key, value);
    trim(this.evaluated, this.limits.cacheEntries);
  }

  private startJob(key: string, spec: RailSpec, tech: Technology, plan: StudyPlan): Job {
    const running = this.runningJobs().sort((a, b) => a.startedAt - b.startedAt);
    for (let k = 0; k <= running.length - this.limits.maxRunningJobs; k++) this.cancel(running[k].id);
    const job: Job = {
      id: randomUUID(),
      key,
      done: 0,
      total: plan.candidates.length,
      state: 'running',
      startedAt: Date.now(),
    };
    this.jobs.set(job.id, job);
    this.jobByKey.set(key, job.id);
    void this.runJob(job, spec, tech, plan);
    return job;
  }

  private async runJob(job: Job, spec: RailSpec, tech: Technology, plan: StudyPlan): Promise<void> {
    const evaluations: CandidateEvaluation[] = [];
    try {
      while (job.done < job.total) {
        await new Promise((resolve) => setImmediate(resolve));
        if (job.state !== 'running') return;
        const until = performance.now() + this.limits.sliceMs;
        do {
          evaluations.push(evaluateForStudy(spec, plan.candidates[job.done], tech));
          job.done++;
        } while (job.done < job.total && performance.now() < until);
      }
      this.remember(job.key, { plan, evaluations });
      job.state = 'done';
    } catch (error) {
      job.state = 'failed';
      job.error = error;
    }
    job.finishedAt = Date.now();
  }

  private expireJobs(): void {
    const now = Date.now();
    for (const [id, job] of this.jobs) {
      if (job.finishedAt !== undefined && now - job.finishedAt > this.limits.jobTtlMs) {
        this.jobs.delete(id);
        if (this.jobByKey.get(job.key) === id) this.jobByKey.delete(job.key);
      }
    }
  }
}

/** Drop the oldest entries of an insertion-ordered map beyond `max`. */
function trim<K, V>(map: Map<K, V>, max: number): void {
  while (map.size > max) map.delete(map.keys().next().value as K);
}
