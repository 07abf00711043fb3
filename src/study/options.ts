/**
 * Study options: defaults and validation. Every problem is collected, each naming the option; the CLI turns
 * them into a UsageError (exit 2), the web into form errors. Pure: no I/O.
 */
import type { RailSpec } from '../spec/rail-spec.ts';
import { formatSiShort } from '../units/format.ts';
import { countCandidates } from './enumerate.ts';
import type { ObjectiveKey, StudyOptions } from './types.ts';

export const OBJECTIVE_KEYS: readonly ObjectiveKey[] = ['parts', 'lossW', 'stress', 'volumeMm3'];
export const DEFAULT_OBJECTIVES: readonly ObjectiveKey[] = ['parts', 'lossW', 'stress'];
export const DEFAULT_FREQUENCY_POINTS = 32;
export const DEFAULT_RIPPLES: readonly number[] = [0.2, 0.3, 0.4, 0.6];
export const DEFAULT_MAX_CANDIDATES = 20_000;
/** Ripple ratios allowed: (0, 2]; above 2 the inductor current reverses every cycle at full load. */
export const MAX_RIPPLE = 2;

/** Options as a caller gives them; anything omitted takes its default. */
export interface StudyOptionsInput {
  objectives?: readonly string[];
  frequencyPoints?: number;
  band?: { minHz: number; maxHz: number };
  ripples?: readonly number[];
  weights?: readonly number[];
  epsilon?: number;
  maxCandidates?: number;
}

export interface OptionIssue {
  option: keyof StudyOptions;
  message: string;
}

/** Bad study options, with every problem. */
export class StudyInputError extends Error {
  constructor(readonly issues: OptionIssue[]) {
    super(issues.map((i) => `${i.option}: ${i.message}`).join('\n'));
    this.name = 'StudyInputError';
  }
}

export type ResolvedOptions = { ok: true; options: StudyOptions } | { ok: false; issues: OptionIssue[] };

export function resolveStudyOptions(spec: RailSpec, input: StudyOptionsInput = {}): ResolvedOptions {
  const issues: OptionIssue[] = [];
  const objectives = [...(input.objectives ?? DEFAULT_OBJECTIVES)] as ObjectiveKey[];
  for (const o of objectives) {
    if (!OBJECTIVE_KEYS.includes(o)) {
      issues.push({
        option: 'objectives',
        message: `unknown objective "${o}" (one of ${OBJECTIVE_KEYS.join(', ')})`,
      });
    }
  }
  if (objectives.length === 0)
    issues.push({ option: 'objectives', message: `choose at least one of ${OBJECTIVE_KEYS.join(', ')}` });
  if (new Set(objectives).size !== objectives.length)
    issues.push({ option: 'objectives', message: `an objective is listed twice (${objectives.join(', ')})` });

  const frequencyPoints = input.frequencyPoints ?? DEFAULT_FREQUENCY_POINTS;
  if (!Number.isInteger(frequencyPoints) || frequencyPoints < 2) {
    issues.push({
      option: 'frequencyPoints',
      message: `${frequencyPoints}: need an integer of at least 2 frequency points`,
    });
  }

  const band = input.band ?? { minHz: spec.switching.minHz, maxHz: spec.switching.maxHz };
  const bandText = `${formatSiShort(band.minHz, 'Hz')} to ${formatSiShort(band.maxHz, 'Hz')}`;
  if (!(Number.isFinite(band.minHz) && Number.isFinite(band.maxHz) && band.minHz > 0)) {
    issues.push({ option: 'band', message: `${bandText}: frequencies must be finite and positive` });
  } else if (band.maxHz < band.minHz) {
    issues.push({ option: 'band', message: `${bandText} is inverted (minimum above maximum)` });
  } else if (band.maxHz === band.minHz) {
    issues.push({
      option: 'band',
      message: `${bandText} is empty: a sweep needs a minimum below the maximum`,
    });
  }

  const ripples = [...(input.ripples ?? DEFAULT_RIPPLES)];
  if (ripples.length === 0) issues.push({ option: 'ripples', message: 'give at least one ripple ratio' });
  for (const r of ripples) {
    if (!(r > 0 && r <= MAX_RIPPLE))
      issues.push({ option: 'ripples', message: `${r}: a ripple ratio in (0, ${MAX_RIPPLE}]` });
  }
  if (new Set(ripples).size !== ripples.length)
    issues.push({ option: 'ripples', message: `a ripple ratio is listed twice (${ripples.join(', ')})` });

  const weights = [...(input.weights ?? objectives.map(() => 1))];
  if (weights.length !== objectives.length) {
    issues.push({
      option: 'weights',
      message: `${weights.length} weights for ${objectives.length} objectives (${objectives.join(', ')})`,
    });
  }
  if (weights.some((w) => !(w >= 0 && Number.isFinite(w))))
    issues.push({ option: 'weights', message: `${weights.join(', ')}: weights must be finite and ≥ 0` });
  else if (weights.length > 0 && weights.every((w) => w === 0))
    issues.push({ option: 'weights', message: 'at least one weight must be above 0' });

  const epsilon = input.epsilon ?? 0;
  if (!(epsilon >= 0 && epsilon < 1))
    issues.push({ option: 'epsilon', message: `${epsilon}: a relative tolerance in [0, 1)` });

  const maxCandidates = input.maxCandidates ?? DEFAULT_MAX_CANDIDATES;
  if (!(Number.isInteger(maxCandidates) && maxCandidates >= 1))
    issues.push({ option: 'maxCandidates', message: `${maxCandidates}: a positive integer` });

  if (issues.length > 0) return { ok: false, issues };
  const options: StudyOptions = {
    objectives,
    frequencyPoints,
    band,
    ripples,
    weights,
    epsilon,
    maxCandidates,
  };
  const count = countCandidates(spec, options);
  if (count > maxCandidates) {
    issues.push({
      option: 'maxCandidates',
      message: `${frequencyPoints} frequencies × ${ripples.length} ripple ratios give ${count} candidates, above the cap of ${maxCandidates}; use fewer frequency points or ripple ratios, or raise the cap`,
    });
    return { ok: false, issues };
  }
  return { ok: true, options };
}

/** resolveStudyOptions, throwing StudyInputError on any problem. */
export function studyOptionsOrThrow(spec: RailSpec, input: StudyOptionsInput = {}): StudyOptions {
  const r = resolveStudyOptions(spec, input);
  if (!r.ok) throw new StudyInputError(r.issues);
  return r.options;
}
