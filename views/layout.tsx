/**
 * The page shell. Every page is a full document (doctype, header, footer with the safety caution);
 * htmx requests get only the part they target, rendered by the same components.
 */
import type { Child, FC } from 'hono/jsx';
import { SAFETY_CAUTION } from '../src/web/safety.ts';

/** htmx 4 config: no injected indicator CSS (our stylesheet has it; the CSP allows no inline style). */
const HTMX_CONFIG = '{"includeIndicatorCSS": false, "defaultSwap": "outerHTML"}';

export const Layout: FC<{ title: string; children?: Child; wide?: boolean; refreshSeconds?: number }> = ({
  title,
  children,
  wide,
  refreshSeconds,
}) => (
  <html lang="en">
    <head>
      <meta charset="utf-8" />
      <meta name="viewport" content="width=device-width, initial-scale=1" />
      <meta name="htmx-config" content={HTMX_CONFIG} />
      {refreshSeconds !== undefined ? <meta http-equiv="refresh" content={String(refreshSeconds)} /> : null}
      <title>{`${title} · Straddle`}</title>
      <link rel="stylesheet" href="/static/app.css" />
      <link rel="icon" href="/static/icon.svg" type="image/svg+xml" />
      <script src="/static/htmx.min.js" defer></script>
    </head>
    <body class={wide ? 'wide' : undefined}>
      <header class="site-header">
        <a class="brand" href="/">
          Straddle
        </a>
        <span class="tagline">topology selection for rails whose input straddles the output</span>
      </header>
      {children}
      <footer class="site-footer">
        <p class="safety">{SAFETY_CAUTION}</p>
      </footer>
    </body>
  </html>
);

/** The caution as a block inside result fragments, so it travels with every swapped result. */
export const SafetyNote: FC = () => (
  <p class="safety-note" role="note">
    <strong>Caution.</strong> {SAFETY_CAUTION}
  </p>
);
