/**
 * The one error type of the web layer: an HTTP status, a message safe to show, and the cause for the
 * log (hono's HTTPException style). Bad input never throws: it is a 422 page built from the issues.
 */
export class WebError extends Error {
  readonly status: 400 | 403 | 404 | 413 | 422 | 429 | 500 | 503;
  /** What the page says; never the cause's message or stack. */
  readonly publicMessage: string;

  constructor(
    status: WebError['status'],
    publicMessage: string,
    options?: { cause?: unknown; detail?: string },
  ) {
    super(options?.detail ?? publicMessage, { cause: options?.cause });
    this.name = 'WebError';
    this.status = status;
    this.publicMessage = publicMessage;
  }
}

/** Titles of the error pages, by status. */
export const STATUS_TITLES: Readonly<Record<number, string>> = {
  400: 'Bad request',
  403: 'Request refused',
  404: 'Page not found',
  413: 'Request too large',
  422: 'Input needs fixing',
  429: 'Too many running sweeps',
  500: 'Internal error',
  503: 'Busy',
};
