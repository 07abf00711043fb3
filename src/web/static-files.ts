/**
 * The few static files the pages use, read once at start-up: htmx from its installed package (never a
 * CDN), our stylesheet and tab icon. Served with a long cache lifetime and nosniff.
 */
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { Hono } from 'hono';

const require = createRequire(import.meta.url);

interface StaticFile {
  body: string;
  type: string;
}

function load(): Map<string, StaticFile> {
  const here = (name: string) => fileURLToPath(new URL(`./static/${name}`, import.meta.url));
  const htmx = require.resolve('htmx.org/dist/htmx.min.js');
  return new Map([
    ['htmx.min.js', { body: readFileSync(htmx, 'utf8'), type: 'text/javascript; charset=utf-8' }],
    ['app.css', { body: readFileSync(here('app.css'), 'utf8'), type: 'text/css; charset=utf-8' }],
    // the tab icon: an input swinging across the output rail (our own drawing)
    ['icon.svg', { body: readFileSync(here('icon.svg'), 'utf8'), type: 'image/svg+xml' }],
  ]);
}

export function staticRoutes(): Hono {
  const files = load();
  const app = new Hono();
  app.get('/static/:name', (c) => {
    const file = files.get(c.req.param('name'));
    if (!file) return c.notFound();
    c.header('Content-Type', file.type);
    c.header('Cache-Control', 'public, max-age=3600');
    return c.body(file.body);
  });
  // browsers ask for this path whatever the page links; answer with the icon rather than a 404
  app.get('/favicon.ico', (c) => c.redirect('/static/icon.svg', 301));
  return app;
}
