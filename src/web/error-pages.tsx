/**
 * The 404 page and the error page: status and a message safe to show, never a stack trace; the cause
 * goes to the log (5xx as errors, 4xx as warnings).
 */
import type { Context } from 'hono';
import { HTTPException } from 'hono/http-exception';
import type { Logger } from 'pino';
import { ErrorBody } from '../../views/error-page.tsx';
import { TechnologyError } from '../spec/errors.ts';
import { StudyInputError } from '../study/options.ts';
import { STATUS_TITLES, WebError } from './errors.ts';
import { renderPage } from './render.tsx';

export function notFoundPage(c: Context) {
  return renderPage(c, {
    title: STATUS_TITLES[404],
    status: 404,
    main: () => (
      <ErrorBody status={404} title={STATUS_TITLES[404]} message={`Nothing lives at ${c.req.path}.`} />
    ),
    fragments: {
      results: () => (
        <ErrorBody status={404} title={STATUS_TITLES[404]} message={`Nothing lives at ${c.req.path}.`} />
      ),
    },
  });
}

export function errorPage(err: unknown, c: Context, log?: Logger) {
  const known = toWebError(err);
  if (known.status >= 500) log?.error({ err, path: c.req.path }, 'internal error');
  else log?.warn({ path: c.req.path, status: known.status, message: known.message }, 'request refused');
  const title = STATUS_TITLES[known.status] ?? 'Error';
  const body = () => <ErrorBody status={known.status} title={title} message={known.publicMessage} />;
  return renderPage(c, { title, status: known.status, main: body, fragments: { results: body } });
}

/** Every thrown thing as a WebError: ours as is, hono's by status, anything else a 500 with its cause. */
export function toWebError(err: unknown): WebError {
  if (err instanceof WebError) return err;
  if (err instanceof HTTPException) {
    const status = err.status === 403 ? 403 : err.status === 413 ? 413 : err.status === 404 ? 404 : 400;
    const message =
      status === 403
        ? 'Cross-site form submission refused (the Origin header does not match this site).'
        : 'The request could not be read.';
    return new WebError(status, message, { cause: err });
  }
  if (err instanceof StudyInputError || err instanceof TechnologyError) {
    return new WebError(422, err.message.split('\n')[0], { cause: err });
  }
  return new WebError(500, 'Something went wrong on our side; the error has been logged.', { cause: err });
}
