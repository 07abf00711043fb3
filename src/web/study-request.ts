/**
 * From a request's spec and sweep text to what the study page shows: the input problems, the study, or
 * the job computing it. Shared by the study page, the design note and the exports.
 */
import type { SpecIssue } from '../spec/errors.ts';
import { loadTechnology } from '../spec/load.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import type { Study, StudyOptions } from '../study/types.ts';
import { getTopology, topologyIds } from '../topologies/registry.ts';
import { checkFormValues } from './spec-codec.ts';
import type { FormValues } from './spec-fields.ts';
import type { Job, StudyService } from './study-service.ts';
import { checkSweep } from './sweep-options.ts';
import type { SweepText } from './view-state.ts';

export type StudyOutcome =
  | { kind: 'invalid'; issues: SpecIssue[] }
  | { kind: 'ready'; study: Study; spec: RailSpec; options: StudyOptions }
  | { kind: 'job'; job: Job; spec: RailSpec; options: StudyOptions };

/** Spec and sweep checked together, so the form shows every problem of both at once. */
export function checkStudyInput(
  values: FormValues,
  sweep: SweepText,
): { ok: true; spec: RailSpec; options: StudyOptions } | { ok: false; issues: SpecIssue[] } {
  const spec = checkFormValues(values);
  if (!spec.ok) return { ok: false, issues: spec.issues };
  const options = checkSweep(spec.spec, sweep);
  if (!options.ok) return { ok: false, issues: options.issues };
  return { ok: true, spec: spec.spec, options: options.options };
}

export function resolveStudy(
  service: StudyService,
  values: FormValues,
  sweep: SweepText,
  restart = false,
): StudyOutcome {
  const checked = checkStudyInput(values, sweep);
  if (!checked.ok) return { kind: 'invalid', issues: checked.issues };
  const { spec, options } = checked;
  const answer = service.study(spec, loadTechnology(spec.technology), options, restart);
  return answer.kind === 'ready'
    ? { kind: 'ready', study: answer.study, spec, options }
    : { kind: 'job', job: answer.job, spec, options };
}

/** Topology titles by id, for legends and tables. */
export function topologyTitles(): Record<string, string> {
  return Object.fromEntries(topologyIds().map((id) => [id, getTopology(id)!.title]));
}
