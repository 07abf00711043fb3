/**
 * The candidate a URL names: /candidate/<topology@freq>/<r ripple>/<rect>?<study params>. The study
 * parameters say which grid it came from (so its exact frequency is known); the candidate is evaluated
 * in full. Shared by the sheet, its exports and its simulation sections.
 */
import type { Context } from 'hono';
import { ErrorBody } from '../../../views/error-page.tsx';
import { evaluateCandidate } from '../../engine/evaluate.ts';
import type { CandidateParams, Evaluation } from '../../engine/types.ts';
import type { Technology } from '../../parts/technology.ts';
import { loadTechnology } from '../../spec/load.ts';
import type { RailSpec } from '../../spec/rail-spec.ts';
import { planStudy } from '../../study/enumerate.ts';
import type { StudyOptions } from '../../study/types.ts';
import { WebError } from '../errors.ts';
import { renderPage } from '../render.tsx';
import { formValuesFromQuery } from '../spec-codec.ts';
import { checkStudyInput } from '../study-request.ts';
import { studyParams, viewFromQuery } from '../view-state.ts';
import { queryOf } from './study.tsx';

export interface Resolved {
  id: string;
  params: CandidateParams;
  spec: RailSpec;
  options: StudyOptions;
  tech: Technology;
  evaluation: Evaluation;
  query: string;
}

/** Route pattern of a candidate id; exports hang below it (`${CANDIDATE_ROUTE}/netlist.cir`). */
export const CANDIDATE_ROUTE = '/candidate/:tf{[a-z-]+@[0-9.]+[kMG]?}/:r{r[0-9.]+}/:rect{diode|sync}';

function firstValues(c: Context): Record<string, string> {
  return Object.fromEntries(Object.entries(c.req.query()).map(([k, v]) => [k, v ?? '']));
}

/** The candidate named by the path, evaluated in full; 422 for a bad spec, 404 for an unknown id. */
export function resolveCandidate(c: Context): Resolved | Response | Promise<Response> {
  const id = `${c.req.param('tf')}/${c.req.param('r')}/${c.req.param('rect')}`;
  const values = formValuesFromQuery(firstValues(c));
  const view = viewFromQuery(values, queryOf(c));
  const checked = checkStudyInput(values, view.sweep);
  if (!checked.ok) {
    const message = `The spec in this link has ${checked.issues.length} problem(s): ${checked.issues.map((i) => i.message).join('; ')}`;
    return renderPage(c, {
      title: 'Input needs fixing',
      status: 422,
      main: () => <ErrorBody status={422} title="Input needs fixing" message={message} />,
    });
  }
  const planned = planStudy(checked.spec, checked.options).candidates.find((p) => p.id === id);
  if (!planned) throw new WebError(404, `No candidate "${id}" in this study's sweep.`);
  const params: CandidateParams = {
    topology: planned.topology,
    fswHz: planned.fswHz,
    ripple: planned.ripple,
    rect: planned.rect,
  };
  const tech = loadTechnology(checked.spec.technology);
  const evaluation = evaluateCandidate(checked.spec, planned, tech);
  return {
    id,
    params,
    spec: checked.spec,
    options: checked.options,
    tech,
    evaluation,
    query: studyParams(view),
  };
}
