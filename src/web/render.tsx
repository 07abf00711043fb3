/**
 * One handler, two answers: a plain request gets the full page, an htmx request the fragment it targets
 * (by the id in HX-Target, `tag#id`). History restores and `full` htmx requests get the page.
 */
import type { Context } from 'hono';
import { raw } from 'hono/html';
import type { Child } from 'hono/jsx';
import { Layout } from '../../views/layout.tsx';

/** Id of the element an htmx request will swap, or undefined for a page request. */
export function fragmentTarget(c: Context): string | undefined {
  if (c.req.header('HX-Request') !== 'true') return undefined;
  if (c.req.header('HX-History-Restore-Request') === 'true') return undefined;
  if (c.req.header('HX-Request-Type') === 'full') return undefined;
  const target = c.req.header('HX-Target') ?? '';
  const hash = target.indexOf('#');
  return hash >= 0 ? target.slice(hash + 1) : undefined;
}

export interface PageParts {
  title: string;
  status?: 200 | 202 | 404 | 413 | 403 | 400 | 422 | 429 | 500 | 503;
  /** Content of <main id="main">. */
  main: () => Child;
  /** Fragments an htmx request may target, by element id; each renders its element with that id. */
  fragments?: Record<string, () => Child>;
  wide?: boolean;
  /** Reload the page after this many seconds (a long sweep shown to a browser without htmx). */
  refreshSeconds?: number;
}

/** Full page, or the targeted fragment (the whole <main> for target `main`). */
export function renderPage(c: Context, parts: PageParts): Response | Promise<Response> {
  const status = parts.status ?? 200;
  const target = fragmentTarget(c);
  if (target !== undefined) {
    const fragment = parts.fragments?.[target];
    if (fragment) {
      // A fragment carries the page title too, so htmx updates the tab on swaps that change the view.
      return c.html(
        <>
          <title>{`${parts.title} · Straddle`}</title>
          {fragment()}
        </>,
        status,
      );
    }
    if (target === 'main') {
      return c.html(
        <>
          <title>{`${parts.title} · Straddle`}</title>
          <main id="main">{parts.main()}</main>
        </>,
        status,
      );
    }
  }
  return c.html(
    <>
      {raw('<!DOCTYPE html>')}
      <Layout title={parts.title} wide={parts.wide} refreshSeconds={parts.refreshSeconds}>
        <main id="main">{parts.main()}</main>
      </Layout>
    </>,
    status,
  );
}
