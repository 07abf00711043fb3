/**
 * The study's exports, all at GET URLs with the study parameters: /note (printable design note, HTML
 * with inline SVG), /note.md (Markdown download), /study.csv, /study.json. Each carries the caution.
 * A study still being computed answers 202 with its progress and reloads itself.
 */
import type { Context } from 'hono';
import { Hono } from 'hono';
import { candidateHref } from '../../../views/links.ts';
import { ProgressPanel } from '../../../views/progress.tsx';
import { DesignNote } from '../../report/design-note-html.tsx';
import { renderStudyCsv } from '../../report/study-csv.ts';
import { studyToJson } from '../../report/study-json.ts';
import { renderStudyMarkdown } from '../../report/study-markdown.ts';
import type { Study } from '../../study/types.ts';
import { WebError } from '../errors.ts';
import { renderPage } from '../render.tsx';
import { SAFETY_CAUTION } from '../safety.ts';
import { formValuesFromQuery } from '../spec-codec.ts';
import { resolveStudy, topologyTitles } from '../study-request.ts';
import type { StudyService } from '../study-service.ts';
import { studyParams, viewFromQuery } from '../view-state.ts';
import { queryOf } from './study.tsx';

type Answer = { study: Study; query: string } | Response | Promise<Response>;

function fileStem(study: Study): string {
  return (
    study.spec.name
      .replace(/[^a-zA-Z0-9]+/g, '-')
      .replace(/^-|-$/g, '')
      .toLowerCase() || 'study'
  );
}

function studyFor(c: Context, service: StudyService): Answer {
  const q = queryOf(c);
  const first = Object.fromEntries(
    Object.entries(q).map(([k, v]) => [k, (Array.isArray(v) ? v[0] : v) ?? '']),
  );
  const values = formValuesFromQuery(first);
  const view = viewFromQuery(values, q);
  const outcome = resolveStudy(service, values, view.sweep);
  const query = studyParams(view);
  if (outcome.kind === 'invalid') {
    throw new WebError(
      422,
      `The spec in this link has problems: ${outcome.issues.map((i) => i.message).join('; ')}`,
    );
  }
  if (outcome.kind === 'job') {
    return renderPage(c, {
      title: 'Study running',
      status: 202,
      refreshSeconds: outcome.job.state === 'running' ? 1 : undefined,
      main: () => (
        <ProgressPanel job={outcome.job} pollUrl={`/study?${query}`} restartUrl={`/study?${query}&run=1`} />
      ),
    });
  }
  return { study: outcome.study, query };
}

export function exportRoutes(service: StudyService): Hono {
  const app = new Hono();

  app.get('/note', (c) => {
    const r = studyFor(c, service);
    if (r instanceof Response || r instanceof Promise) return r;
    return renderPage(c, {
      title: `Design note: ${r.study.spec.name}`,
      main: () => (
        <>
          <p class="no-print crumbs">
            <a href={`/study?${r.query}`}>← Back to the study</a> ·{' '}
            <a href={`/note.md?${r.query}`} download>
              Markdown
            </a>{' '}
            · Print this page for a paper copy.
          </p>
          <DesignNote study={r.study} titles={topologyTitles()} href={(id) => candidateHref(id, r.query)} />
        </>
      ),
    });
  });

  app.get('/note.md', (c) => {
    const r = studyFor(c, service);
    if (r instanceof Response || r instanceof Promise) return r;
    c.header('Content-Type', 'text/markdown; charset=utf-8');
    c.header('Content-Disposition', `attachment; filename="${fileStem(r.study)}-design-note.md"`);
    return c.body(renderStudyMarkdown(r.study));
  });

  app.get('/study.csv', (c) => {
    const r = studyFor(c, service);
    if (r instanceof Response || r instanceof Promise) return r;
    c.header('Content-Type', 'text/csv; charset=utf-8');
    c.header('Content-Disposition', `attachment; filename="${fileStem(r.study)}-candidates.csv"`);
    return c.body(renderStudyCsv(r.study));
  });

  app.get('/study.json', (c) => {
    const r = studyFor(c, service);
    if (r instanceof Response || r instanceof Promise) return r;
    c.header('Content-Disposition', `attachment; filename="${fileStem(r.study)}-study.json"`);
    return c.json({ caution: SAFETY_CAUTION, ...studyToJson(r.study) });
  });

  return app;
}
