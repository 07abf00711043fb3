/**
 * The web app, without listening (serve.ts listens; tests call app.request()). Middleware in order:
 * request log, response compression (gzip or deflate when the client accepts it: a full study page is
 * about half a megabyte of markup and inline SVG), security headers with a strict content security
 * policy, body-size limit, CSRF check on every POST; then the routes; then the 404 page and the error
 * page (status and safe message only).
 */
import { Hono } from 'hono';
import { bodyLimit } from 'hono/body-limit';
import { compress } from 'hono/compress';
import { csrf } from 'hono/csrf';
import { secureHeaders } from 'hono/secure-headers';
import type { Logger } from 'pino';
import { errorPage, notFoundPage } from './error-pages.tsx';
import { WebError } from './errors.ts';
import { candidateRoutes } from './routes/candidate.tsx';
import { exportRoutes } from './routes/exports.tsx';
import { studyRoutes } from './routes/study.tsx';
import { staticRoutes } from './static-files.ts';
import { type ServiceLimits, StudyService } from './study-service.ts';

export interface AppOptions {
  logger?: Logger;
  /** Largest accepted request body (bytes). */
  maxBodyBytes?: number;
  limits?: Partial<ServiceLimits>;
  service?: StudyService;
}

export const DEFAULT_MAX_BODY_BYTES = 16 * 1024;

/** Only our own scripts and styles; SVG is inline markup, which needs no policy exception. */
const CSP = {
  defaultSrc: ["'self'"],
  scriptSrc: ["'self'"],
  styleSrc: ["'self'"],
  imgSrc: ["'self'", 'data:'],
  connectSrc: ["'self'"],
  formAction: ["'self'"],
  frameAncestors: ["'none'"],
  baseUri: ["'none'"],
  objectSrc: ["'none'"],
};

export function createApp(options: AppOptions = {}): Hono {
  const service = options.service ?? new StudyService(options.limits);
  const log = options.logger;
  const app = new Hono();

  app.use('*', async (c, next) => {
    const start = performance.now();
    await next();
    log?.info(
      {
        method: c.req.method,
        path: c.req.path,
        status: c.res.status,
        ms: Math.round(performance.now() - start),
        htmx: c.req.header('HX-Request') === 'true',
      },
      'request',
    );
  });
  app.use('*', compress());
  app.use('*', secureHeaders({ contentSecurityPolicy: CSP, referrerPolicy: 'same-origin' }));
  app.use(
    '*',
    bodyLimit({
      maxSize: options.maxBodyBytes ?? DEFAULT_MAX_BODY_BYTES,
      onError: () => {
        throw new WebError(
          413,
          `The request body is larger than ${options.maxBodyBytes ?? DEFAULT_MAX_BODY_BYTES} bytes.`,
        );
      },
    }),
  );
  app.use('*', csrf());

  app.route('/', staticRoutes());
  app.route('/', studyRoutes(service));
  app.route('/', candidateRoutes(service));
  app.route('/', exportRoutes(service));

  app.notFound(notFoundPage);
  app.onError((err, c) => errorPage(err, c, log));

  return app;
}
