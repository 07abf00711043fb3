/**
 * The candidate sheet at /candidate/<id>?<study params>, where the id reads `topology@freq/r<ripple>/<rect>`
 * and the study parameters say which grid it came from (so its exact frequency is known), and its
 * evaluation as JSON at /candidate/<id>/evaluation.json.
 */
import type { Context } from 'hono';
import { Hono } from 'hono';
import { CandidateSheet } from '../../../views/candidate-sheet.tsx';
import { ErrorBody } from '../../../views/error-page.tsx';
import { candidateHref } from '../../../views/links.ts';
import { evaluateCandidate } from '../../engine/evaluate.ts';
import type { Evaluation } from '../../engine/types.ts';
import type { Technology } from '../../parts/technology.ts';
import { loadTechnology } from '../../spec/load.ts';
import type { RailSpec } from '../../spec/rail-spec.ts';
import { planStudy } from '../../study/enumerate.ts';
import type { StudyOptions } from '../../study/types.ts';
import { getTopology } from '../../topologies/registry.ts';
import { WebError } from '../errors.ts';
import { renderPage } from '../render.tsx';
import { SAFETY_CAUTION } from '../safety.ts';
import { formValuesFromQuery } from '../spec-codec.ts';
import { checkStudyInput } from '../study-request.ts';
import type { StudyService } from '../study-service.ts';
import { studyParams, viewFromQuery } from '../view-state.ts';
import { queryOf } from './study.tsx';

export interface Resolved {
  id: string;
  spec: RailSpec;
  options: StudyOptions;
  tech: Technology;
  evaluation: Evaluation;
  query: string;
}

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
  const tech = loadTechnology(checked.spec.technology);
  const evaluation = evaluateCandidate(checked.spec, planned, tech);
  return { id, spec: checked.spec, options: checked.options, tech, evaluation, query: studyParams(view) };
}

/** Route pattern of a candidate id; exports hang below it (`${CANDIDATE_ROUTE}/netlist.cir`). */
export const CANDIDATE_ROUTE = '/candidate/:tf{[a-z-]+@[0-9.]+[kMG]?}/:r{r[0-9.]+}/:rect{diode|sync}';

export function candidateRoutes(service: StudyService): Hono {
  const app = new Hono();
  const base = CANDIDATE_ROUTE;

  app.get(base, (c) => {
    const r = resolveCandidate(c);
    if (r instanceof Response || r instanceof Promise) return r;
    const topology = getTopology(r.evaluation.topology)!;
    const studied = service.cached(r.spec, r.options)?.candidates.find((x) => x.id === r.id);
    return renderPage(c, {
      title: `Candidate ${r.id}`,
      main: () => (
        <CandidateSheet
          id={r.id}
          spec={r.spec}
          topology={topology}
          evaluation={r.evaluation}
          tech={r.tech}
          studied={studied}
          studyHref={`/study?${r.query}`}
          jsonHref={candidateHref(r.id, r.query, '/evaluation.json')}
        />
      ),
    });
  });

  app.get(`${base}/evaluation.json`, (c) => {
    const r = resolveCandidate(c);
    if (r instanceof Response || r instanceof Promise) return r;
    c.header('Content-Disposition', `attachment; filename="${r.id.replace(/[^a-zA-Z0-9.-]+/g, '_')}.json"`);
    return c.json({ caution: SAFETY_CAUTION, id: r.id, spec: r.spec, evaluation: r.evaluation });
  });

  return app;
}
