/**
 * The study page: GET / and GET /study (spec in the query string), POST /study (the form). A plain POST
 * that validates is redirected to its GET URL (bookmarkable, Back works); an invalid one is a 422 page
 * with every message beside its field. htmx edits get the results block plus the message slots.
 */
import type { Context } from 'hono';
import { Hono } from 'hono';
import type { Child } from 'hono/jsx';
import { CandidateTable } from '../../../views/candidate-table.tsx';
import { FixInputPanel, ProgressPanel } from '../../../views/progress.tsx';
import { AllFieldMessages } from '../../../views/rail-form.tsx';
import { Workspace } from '../../../views/study-page.tsx';
import { FrontPlot, Recommendation, StudyResults } from '../../../views/study-results.tsx';
import type { SpecIssue } from '../../spec/errors.ts';
import { listTechnologies } from '../../spec/load.ts';
import { fragmentTarget, renderPage } from '../render.tsx';
import { formValuesFromQuery } from '../spec-codec.ts';
import { cleanFormValues, type FormValues } from '../spec-fields.ts';
import { resolveStudy, type StudyOutcome, topologyTitles } from '../study-request.ts';
import type { StudyService } from '../study-service.ts';
import { type ViewState, viewFromQuery, viewUrl } from '../view-state.ts';

type Query = Record<string, string | string[] | undefined>;

/** Query parameters with repeated keys kept as lists (`obj`). */
export function queryOf(c: Context): Query {
  const all = c.req.queries();
  const out: Query = {};
  for (const [k, v] of Object.entries(all)) out[k] = v.length > 1 ? v : v[0];
  return out;
}

function firstValues(q: Query): Record<string, string> {
  return Object.fromEntries(Object.entries(q).map(([k, v]) => [k, (Array.isArray(v) ? v[0] : v) ?? '']));
}

function renderStudy(c: Context, view: ViewState, outcome: StudyOutcome, issues: SpecIssue[]) {
  const titles = topologyTitles();
  const pageUrl = viewUrl('/study', view);
  const results = () => {
    if (outcome.kind === 'invalid') return <FixInputPanel count={issues.length} />;
    if (outcome.kind === 'job')
      return <ProgressPanel job={outcome.job} pollUrl={pageUrl} restartUrl={`${pageUrl}&run=1`} />;
    return <StudyResults study={outcome.study} view={view} titles={titles} />;
  };
  const ready = outcome.kind === 'ready' ? outcome.study : undefined;
  const only = (block: (study: NonNullable<typeof ready>) => Child) => (ready ? () => block(ready) : results);
  return renderPage(c, {
    title: outcome.kind === 'ready' ? `Study: ${outcome.spec.name}` : 'Rail spec',
    status: outcome.kind === 'invalid' ? 422 : 200,
    wide: true,
    main: () => (
      <Workspace
        values={view.spec}
        sweep={view.sweep}
        issues={issues}
        technologies={listTechnologies()}
        results={results()}
      />
    ),
    fragments: {
      results: () => (
        <>
          {results()}
          <AllFieldMessages issues={issues} />
        </>
      ),
      candidates: only((study) => <CandidateTable study={study} view={view} titles={titles} />),
      'front-plot': only((study) => <FrontPlot study={study} view={view} titles={titles} />),
      recommendation: only((study) => <Recommendation study={study} view={view} titles={titles} />),
    },
  });
}

export function studyRoutes(service: StudyService): Hono {
  const app = new Hono();

  const show = (c: Context) => {
    const q = queryOf(c);
    const values = formValuesFromQuery(firstValues(q));
    const view = viewFromQuery(values, q);
    const outcome = resolveStudy(service, values, view.sweep, q.run === '1');
    const issues = outcome.kind === 'invalid' ? outcome.issues : [];
    return renderStudy(c, view, outcome, issues);
  };
  app.get('/', show);
  app.get('/study', show);

  app.post('/study', async (c) => {
    const body = await c.req.parseBody({ all: true });
    const q: Query = {};
    for (const [k, v] of Object.entries(body)) {
      const list = (Array.isArray(v) ? v : [v]).filter((x): x is string => typeof x === 'string');
      q[k] = list.length > 1 ? list : list[0];
    }
    const values: FormValues = cleanFormValues(firstValues(q));
    const view = viewFromQuery(values, q);
    const outcome = resolveStudy(service, values, view.sweep);
    const issues = outcome.kind === 'invalid' ? outcome.issues : [];
    if (fragmentTarget(c) === undefined && outcome.kind !== 'invalid')
      return c.redirect(viewUrl('/study', view), 303);
    if (outcome.kind !== 'invalid') c.header('HX-Replace-Url', viewUrl('/study', view));
    return renderStudy(c, view, outcome, issues);
  });

  app.post('/jobs/:id/cancel', (c) => {
    const job = service.cancel(c.req.param('id'));
    if (!job) return c.notFound();
    const back = c.req.header('HX-Current-URL') ?? c.req.header('Referer') ?? '/study';
    let restart = '/study';
    try {
      const url = new URL(back, 'http://x');
      url.searchParams.set('run', '1');
      restart = url.pathname + url.search;
    } catch {
      /* keep the default */
    }
    return renderPage(c, {
      title: 'Sweep cancelled',
      main: () => <ProgressPanel job={job} pollUrl={restart} restartUrl={restart} />,
      fragments: { results: () => <ProgressPanel job={job} pollUrl={restart} restartUrl={restart} /> },
    });
  });

  return app;
}
