/**
 * Every page through app.request() (no server): full page for a plain request, the targeted fragment for
 * an htmx request, and every error path (422 with messages beside fields, 404, 500 without a stack,
 * CSRF refusal, body limit, security headers).
 */
import { gunzipSync } from 'node:zlib';
import { describe, expect, it } from 'vitest';
import { createApp } from '../../src/web/app.ts';
import { demoFormValues, encodeSpec } from '../../src/web/spec-codec.ts';

// A small sweep (3 frequencies × 1 ripple) keeps every request fast; large sweeps are tested in jobs.test.ts.
const SMALL = 'fp=3&rp=0.3';
const app = createApp({ limits: { inlineCandidates: 10_000 } });
const demo = demoFormValues('marine-lifepo4-12v');
const s = encodeSpec(demo);
const studyUrl = `/study?s=${s}&${SMALL}`;
const htmx = (target: string) => ({
  'HX-Request': 'true',
  'HX-Target': target,
  'HX-Request-Type': 'partial',
});
const ORIGIN = 'http://localhost';
const form = (fields: Record<string, string>, origin: string | null = ORIGIN) => {
  const headers: Record<string, string> = { 'content-type': 'application/x-www-form-urlencoded' };
  if (origin) headers.origin = origin;
  return { method: 'POST', body: new URLSearchParams(fields).toString(), headers };
};
const SAFETY = 'Estimates for topology selection only';

async function firstCandidateHref(): Promise<string> {
  const html = await (await app.request(studyUrl)).text();
  const href = html.match(/href="(\/candidate\/[^"]+)"/)?.[1];
  expect(href).toBeDefined();
  return href!.replace(/&amp;/g, '&');
}

describe('study page', () => {
  it('serves the demo study as a full page at /, with doctype, caution and the front plot', async () => {
    const res = await app.request(`/?${SMALL}`);
    expect(res.status).toBe(200);
    const html = await res.text();
    expect(html.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(html).toContain('Marine instrument 12 V rail');
    expect(html).toContain('<svg class="scatter"');
    expect(html).toContain(SAFETY);
    expect(html).toContain('/static/htmx.min.js');
  });

  it('gives an htmx request only the fragment it targets', async () => {
    for (const [target, marker] of [
      ['section#results', 'id="results"'],
      ['section#candidates', 'id="candidates"'],
      ['section#front-plot', 'id="front-plot"'],
      ['section#recommendation', 'id="recommendation"'],
      ['main#main', 'id="main"'],
    ]) {
      const html = await (await app.request(studyUrl, { headers: htmx(target) })).text();
      expect(html, target).toContain(marker);
      expect(html, target).not.toContain('<!DOCTYPE html>');
      expect(html, target).not.toContain('class="site-footer"');
    }
  });

  it('answers a history restore with the full page', async () => {
    const res = await app.request(studyUrl, {
      headers: { ...htmx('main#main'), 'HX-History-Restore-Request': 'true' },
    });
    expect((await res.text()).startsWith('<!DOCTYPE html>')).toBe(true);
  });

  it('takes the spec as plain query fields and as a demo name', async () => {
    const fields = new URLSearchParams({
      'input.min': '9',
      'input.nom': '12',
      'input.max': '15',
      'output.voltage': '12',
      'load.max': '1',
      'ripple.output': '50m',
      'switching.min': '200k',
      'switching.max': '400k',
    });
    const plain = await app.request(`/study?${fields}&${SMALL}`);
    expect(plain.status).toBe(200);
    expect(await plain.text()).toContain('9 V–15 V in');
    const usb = await app.request(`/study?demo=usb-pd-bench-tool-12v&${SMALL}`);
    expect(await usb.text()).toContain('USB-PD bench tool');
  });

  it('sorts and filters the table from the query', async () => {
    const html = await (
      await app.request(`${studyUrl}&sort=lossW&dir=desc&verdict=front`, {
        headers: htmx('section#candidates'),
      })
    ).text();
    const losses = [...html.matchAll(/<td class="num">([\d.]+) (m?)W<\/td>/g)].map(
      (m) => Number(m[1]) * (m[2] === 'm' ? 1e-3 : 1),
    );
    expect(losses.length).toBeGreaterThan(1);
    expect([...losses].sort((a, b) => b - a)).toEqual(losses);
    expect(html).not.toContain('verdict-dominated');
    expect(html).toContain('aria-sort="descending"');
  });

  it('redirects a valid plain form POST to its bookmarkable GET URL', async () => {
    const res = await app.request('/study', form({ ...demo, fp: '3', rp: '0.3' }));
    expect(res.status).toBe(303);
    const location = res.headers.get('location')!;
    expect(location).toMatch(/^\/study\?s=/);
    expect((await app.request(location)).status).toBe(200);
  });

  it('answers an htmx edit with the results, cleared message slots and the new URL', async () => {
    const res = await app.request('/study', {
      ...form({ ...demo, 'input.min': '8 V', fp: '3', rp: '0.3' }),
      headers: { ...form({}).headers, ...htmx('section#results') },
    });
    expect(res.status).toBe(200);
    expect(res.headers.get('HX-Replace-Url')).toMatch(/^\/study\?s=/);
    const html = await res.text();
    expect(html).toContain('8 V–14.6 V in');
    expect(html).toContain('id="err-input-min" aria-live="polite" hx-swap-oob="true"></div>');
  });
});

describe('bad input', () => {
  it('re-renders the form with 422, every message beside its field and the typed text kept', async () => {
    const res = await app.request(
      '/study',
      form({ ...demo, 'input.min': '15 V', 'load.max': 'two amps', 'switching.max': '5 kHz', fp: '1' }),
    );
    expect(res.status).toBe(422);
    const html = await res.text();
    expect(html).toMatch(/id="err-input-min"[^>]*><p>15 V is above input.max \(14.6 V\)<\/p>/);
    expect(html).toMatch(/id="err-load-max"[^>]*><p>&quot;two amps&quot;/);
    expect(html).toMatch(/id="err-switching-max"[^>]*><p>5 kHz is outside the allowed band/);
    expect(html).toContain('value="two amps"');
    expect(html).toContain('value="15 V"');
  });

  it('reports sweep options beside their fields once the spec is valid', async () => {
    const res = await app.request(`/study?s=${s}&fp=1&rp=0.3,abc`);
    expect(res.status).toBe(422);
    const html = await res.text();
    expect(html).toMatch(/id="err-fp"[^>]*><p>&quot;1&quot; is not a whole number/);
    expect(html).toMatch(/id="err-rp"[^>]*><p>&quot;abc&quot; not a number/);
  });

  it('gives htmx the notice and the messages as out-of-band swaps, with 422', async () => {
    const res = await app.request('/study', {
      ...form({ ...demo, 'input.max': 'abc' }),
      headers: { ...form({}).headers, ...htmx('section#results') },
    });
    expect(res.status).toBe(422);
    const html = await res.text();
    expect(html).toContain('data-state="invalid"');
    expect(html).toMatch(
      /id="err-input-max" aria-live="polite" hx-swap-oob="true"><p>&quot;abc&quot; does not start with a number/,
    );
  });

  it('escapes user text everywhere', async () => {
    const evil = encodeSpec({ ...demo, name: '<script>alert(1)</script>' });
    const html = await (await app.request(`/study?s=${evil}&${SMALL}`)).text();
    expect(html).not.toContain('<script>alert(1)</script>');
    expect(html).toContain('&lt;script&gt;alert(1)&lt;/script&gt;');
  });

  it('answers a damaged spec link with 400 and an unknown technology with a message beside the field', async () => {
    expect((await app.request('/study?s=%%%')).status).toBe(400);
    expect((await app.request('/study?s=AAAA')).status).toBe(400);
    const html = await (
      await app.request(`/study?s=${encodeSpec({ ...demo, technology: 'unobtainium' })}`)
    ).text();
    expect(html).toMatch(/id="err-technology"[^>]*><p>no preset named &quot;unobtainium&quot;/);
  });
});

describe('candidate sheet and exports', () => {
  it('shows a candidate sheet with parts, ratings, losses per corner and the caution; fragment for htmx', async () => {
    const href = await firstCandidateHref();
    const res = await app.request(href);
    expect(res.status).toBe(200);
    const html = await res.text();
    for (const text of [
      'Parts, stresses and suggested minimum ratings',
      'Min. V rating',
      'Efficiency and loss per corner',
      'vin-min',
      'Loss breakdown per corner',
      SAFETY,
      '/evaluation.json',
    ]) {
      expect(html).toContain(text);
    }
    const fragment = await (await app.request(href, { headers: htmx('main#main') })).text();
    expect(fragment).not.toContain('<!DOCTYPE html>');
    expect(fragment).toContain('Parts, stresses');
  });

  it('exports the evaluation as JSON with the caution', async () => {
    const href = await firstCandidateHref();
    const [path, query] = href.split('?');
    const res = await app.request(`${path}/evaluation.json?${query}`);
    expect(res.status).toBe(200);
    const body = (await res.json()) as {
      caution: string;
      evaluation: { corners: unknown[]; parts: unknown[] };
    };
    expect(body.caution).toContain(SAFETY);
    expect(body.evaluation.corners.length).toBeGreaterThan(2);
  });

  it('answers an id outside the sweep with 404', async () => {
    expect((await app.request(`/candidate/sepic@123k/r0.3/diode?s=${s}&${SMALL}`)).status).toBe(404);
  });

  it('serves the design note as printable HTML with inline SVG, and as Markdown, CSV and JSON', async () => {
    const note = await app.request(`/note?s=${s}&${SMALL}`);
    expect(note.status).toBe(200);
    const html = await note.text();
    expect(html).toContain('Topology study: Marine instrument 12 V rail');
    expect(html).toContain('<svg');
    expect(html).toContain(SAFETY);
    const md = await app.request(`/note.md?s=${s}&${SMALL}`);
    expect(md.headers.get('content-disposition')).toContain('attachment');
    expect(await md.text()).toContain('## Topology study: Marine instrument 12 V rail');
    const csv = await app.request(`/study.csv?s=${s}&${SMALL}`);
    expect(csv.headers.get('content-type')).toContain('text/csv');
    expect((await csv.text()).split('\r\n')[0]).toMatch(/^id,topology,fswHz/);
    const json = (await (await app.request(`/study.json?s=${s}&${SMALL}`)).json()) as {
      caution: string;
      candidates: unknown[];
    };
    expect(json.caution).toContain(SAFETY);
    expect(json.candidates.length).toBeGreaterThan(0);
  });
});

describe('errors and safety', () => {
  it('renders unknown routes as a 404 page', async () => {
    const res = await app.request('/no/such/page');
    expect(res.status).toBe(404);
    expect(await res.text()).toContain('Page not found');
  });

  it('renders an internal error as a 500 page without the message or stack', async () => {
    const broken = createApp();
    broken.get('/boom', () => {
      throw new Error('secret detail at /srv/app/engine.ts:42');
    });
    const res = await broken.request('/boom');
    expect(res.status).toBe(500);
    const html = await res.text();
    expect(html).toContain('Internal error');
    expect(html).not.toContain('secret detail');
    expect(html).not.toMatch(/at .*\.ts:\d+/);
  });

  it('refuses a cross-site form POST (CSRF) and one with no Origin', async () => {
    expect((await app.request('/study', form(demo, 'https://evil.example'))).status).toBe(403);
    expect((await app.request('/study', form(demo, null))).status).toBe(403);
  });

  it('refuses a body above the limit with 413', async () => {
    const res = await app.request('/study', form({ ...demo, name: 'x'.repeat(20_000) }));
    expect(res.status).toBe(413);
  });

  it('compresses a page for a client that accepts gzip, to the same markup', async () => {
    const plain = await app.request(studyUrl);
    const zipped = await app.request(studyUrl, { headers: { 'Accept-Encoding': 'gzip' } });
    expect(plain.headers.get('content-encoding')).toBeNull();
    expect(zipped.headers.get('content-encoding')).toBe('gzip');
    const raw = new Uint8Array(await zipped.arrayBuffer());
    const text = gunzipSync(raw).toString('utf8');
    expect(text).toBe(await plain.text());
    // markup and inline SVG compress well: a fifth of the size at most
    expect(raw.byteLength).toBeLessThan(text.length / 5);
  });

  it('sends a content security policy allowing only our own scripts and styles, and the usual headers', async () => {
    const res = await app.request(`/?${SMALL}`);
    const csp = res.headers.get('content-security-policy')!;
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("style-src 'self'");
    expect(csp).not.toContain('unsafe-inline');
    expect(res.headers.get('x-content-type-options')).toBe('nosniff');
    expect(res.headers.get('x-frame-options')).toBe('SAMEORIGIN');
  });

  it('serves htmx and the stylesheet from our own origin', async () => {
    const js = await app.request('/static/htmx.min.js');
    expect(js.status).toBe(200);
    expect(js.headers.get('content-type')).toContain('javascript');
    expect(await js.text()).toContain('4.0');
    expect((await app.request('/static/app.css')).status).toBe(200);
    expect((await app.request('/static/../package.json')).status).toBe(404);
  });

  it('gives the tab an icon of its own and answers /favicon.ico with it', async () => {
    const icon = await app.request('/static/icon.svg');
    expect(icon.status).toBe(200);
    expect(icon.headers.get('content-type')).toBe('image/svg+xml');
    const legacy = await app.request('/favicon.ico');
    expect(legacy.status).toBe(301);
    expect(legacy.headers.get('location')).toBe('/static/icon.svg');
    expect(await (await app.request('/')).text()).toContain('href="/static/icon.svg"');
  });
});
