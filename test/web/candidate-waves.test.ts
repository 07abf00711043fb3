/**
 * The candidate sheet's simulation sections through app.request() (no server): each section as an htmx
 * fragment and as its own full page from the same URL, the SPICE netlist and data downloads, a failing
 * simulation shown inside its section, and the SVG structure engineers read (axis units, the RHP zero).
 */
import { Hono } from 'hono';
import { describe, expect, it } from 'vitest';
import { getTopology } from '../../src/topologies/registry.ts';
import { SimulationError } from '../../src/waveform/errors.ts';
import { createApp } from '../../src/web/app.ts';
import { errorPage } from '../../src/web/error-pages.tsx';
import { candidateRoutes } from '../../src/web/routes/candidate.tsx';
import { ENGINE_SIMULATOR } from '../../src/web/routes/simulation-input.ts';
import { demoFormValues, encodeSpec } from '../../src/web/spec-codec.ts';
import { StudyService } from '../../src/web/study-service.ts';

const app = createApp({ limits: { inlineCandidates: 10_000 } });
// The marine demo (12.8 V nominal into 12 V at 2 A) on a 3-frequency grid: sepic@316k is in its sweep.
const QUERY = `s=${encodeSpec(demoFormValues('marine-lifepo4-12v'))}&fp=3&rp=0.3`;
const SEPIC = '/candidate/sepic@316k/r0.3/diode';
const DAMPED = '/candidate/sepic-damped@316k/r0.3/diode';
const url = (path: string, suffix = '') => `${path}${suffix}?${QUERY}`;
const htmx = (target: string) => ({
  'HX-Request': 'true',
  'HX-Target': target,
  'HX-Request-Type': 'partial',
});
const SAFETY = 'Estimates for topology selection only';

async function text(
  path: string,
  init?: RequestInit,
): Promise<{ status: number; body: string; res: Response }> {
  const res = await app.request(path, init);
  return { status: res.status, body: await res.text(), res };
}

describe('the candidate sheet', () => {
  it('paints three placeholders that htmx loads on page load, each with a plain link to its page', async () => {
    const { status, body } = await text(url(SEPIC));
    expect(status).toBe(200);
    for (const id of ['waveforms', 'transients', 'bode']) {
      const section = body.match(new RegExp(`<section id="${id}"[^>]*>[\\s\\S]*?</section>`))?.[0];
      expect(section, id).toBeDefined();
      expect(section).toContain(`hx-get="/candidate/sepic@316k/r0.3/diode/${id}?`);
      expect(section).toContain('hx-trigger="load"');
      expect(section).toContain('data-state="pending"');
      expect(section).toMatch(new RegExp(`<a href="/candidate/sepic@316k/r0.3/diode/${id}\\?`));
    }
    // No simulation runs for the first paint: no plots yet, just the placeholders.
    expect(body).not.toContain('<svg class="waveform"');
    expect(body).toContain(SAFETY);
  });

  it('lists the SPICE netlist and the simulated data under its exports', async () => {
    const { body } = await text(url(SEPIC));
    const exports = body.match(/<section class="exports">[\s\S]*?<\/section>/)![0];
    expect(exports).toMatch(/href="\/candidate\/sepic@316k\/r0.3\/diode\/netlist.cir\?[^"]+" download/);
    expect(exports).toContain('/waveforms.csv?');
    expect(exports).toContain('/simulation.json?');
  });
});

describe('one-period waveforms', () => {
  it('answers htmx with the section alone, plotted with engineering-unit axes and named traces', async () => {
    const { status, body } = await text(url(SEPIC, '/waveforms'), { headers: htmx('section#waveforms') });
    expect(status).toBe(200);
    expect(body).not.toContain('<!DOCTYPE html>');
    expect(body).toMatch(
      /^<title>[^<]+<\/title><section id="waveforms" class="sim-section" data-state="ready">/,
    );
    expect(body.match(/<svg class="waveform"/g)?.length).toBe(4);
    // One period at 316 kHz is 3.16 µs.
    expect(body).toContain('Time (µs)');
    expect(body).toContain('Current (A)');
    expect(body).toContain('Voltage (V)');
    expect(body).toContain('Ripple (mV)');
    for (const signal of ['L1.i', 'L2.i', 'sw.v', 'Cs.v', 'Q1.i', 'D1.i', 'out.v']) {
      expect(body, signal).toContain(`data-signal="${signal}"`);
    }
    for (const tag of ['i L1', 'i L2', 'v sw', 'v Cs', 'i Q1', 'i D1', 'ṽ out']) {
      expect(body, tag).toMatch(new RegExp(`<text class="trace-label"[^>]*>${tag}</text>`));
    }
    expect(body).toMatch(/Output ripple over one period: [\d.]+ mV peak to peak \(spec limit 50 mV\)/);
  });

  it('serves the same section as a full page to a plain request, with the caution and a way back', async () => {
    const { status, body } = await text(url(SEPIC, '/waveforms'));
    expect(status).toBe(200);
    expect(body.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(body).toContain('<section id="waveforms" class="sim-section" data-state="ready">');
    expect(body).toContain('← Candidate sheet of sepic@316k/r0.3/diode');
    expect(body).toContain(SAFETY);
  });
});

describe('transients', () => {
  it('reports start-up and step in words, and the undamped SEPIC ringing with its remedy', async () => {
    const { status, body } = await text(url(SEPIC, '/transients'), { headers: htmx('section#transients') });
    expect(status).toBe(200);
    expect(body).not.toContain('<!DOCTYPE html>');
    expect(body).toContain('data-analysis="startup" data-state="ready"');
    expect(body).toContain('data-analysis="step" data-state="ready"');
    expect(body.match(/<svg class="waveform"/g)?.length).toBe(4);
    expect(body).toContain('Time (ms)');
    // The marine spec names its step: 12.8 V → 14.6 V.
    expect(body).toContain('Input step from 12.8 V to 14.6 V');
    expect(body).toMatch(/Output: peaks at [\d.]+ V, that is [\d.]+ × the final change/);
    expect(body).toMatch(/settles within 2 % of its final change in [\d.]+ ms/);
    expect(body).toMatch(/Coupling capacitor Cs: peaks at [\d.]+ V/);
    // An undamped series L–C network answers a step by swinging to twice it (common practice).
    const swing = Number(body.match(/Visible ringing:[^<]*Cs swings to ([\d.]+) ×/)?.[1]);
    expect(swing).toBeGreaterThan(1.7);
    expect(swing).toBeLessThan(2.3);
    expect(body).toContain('coupled inductor');
    expect(body).toContain('damping leg');
  });

  it('calls the damped SEPIC well damped, with its number', async () => {
    const { body } = await text(url(DAMPED, '/transients'), { headers: htmx('section#transients') });
    const swing = Number(
      body.match(/Well damped: the Rd–Cd leg across Cs holds its swing to ([\d.]+) ×/)?.[1],
    );
    expect(swing).toBeGreaterThan(1);
    expect(swing).toBeLessThanOrEqual(1.4);
  });
});

describe('Bode plot', () => {
  it('plots magnitude and phase on a log frequency axis with the RHP zero and crossover marked', async () => {
    const { status, body } = await text(url(SEPIC, '/bode'), { headers: htmx('section#bode') });
    expect(status).toBe(200);
    expect(body).toContain('<svg class="bode"');
    expect(body).toContain('Magnitude (dB)');
    expect(body).toContain('Phase (°)');
    expect(body).toContain('Frequency (Hz)');
    expect(body).toMatch(/>\d+ kHz</);
    const rhp = body.match(/<g class="freq-mark rhp-zero" data-freq-hz="([\d.e+]+)">/);
    expect(rhp).not.toBeNull();
    const rhpHz = Number(rhp![1]);
    expect(body).toMatch(/RHP zero [\d.]+ kHz/);
    expect(body).toContain('class="freq-mark crossover"');
    const crossover = Number(body.match(/<g class="freq-mark crossover" data-freq-hz="([\d.e+]+)">/)![1]);
    // At most a fifth of the RHP zero (common practice).
    expect(crossover).toBeLessThanOrEqual(rhpHz / 5 + 1e-9);
    expect(body).toContain('Right-half-plane zero at');
  });

  it('is a bookmarkable full page too', async () => {
    const { status, body } = await text(url(SEPIC, '/bode'));
    expect(status).toBe(200);
    expect(body.startsWith('<!DOCTYPE html>')).toBe(true);
    expect(body).toContain('<svg class="bode"');
  });
});

describe('downloads', () => {
  it('gives the SPICE netlist as a plain-text attachment with .tran and every power-stage part', async () => {
    const { status, body, res } = await text(url(SEPIC, '/netlist.cir'));
    expect(status).toBe(200);
    expect(res.headers.get('content-type')).toMatch(/^text\/plain/);
    expect(res.headers.get('content-disposition')).toBe('attachment; filename="sepic_316k_r0.3_diode.cir"');
    expect(body).toMatch(/^\.tran\s/m);
    expect(body).toMatch(/^\.end\s*$/m);
    const topology = getTopology('sepic')!;
    const parts = topology.components('diode').filter((c) => c.role !== 'controller');
    expect(parts.length).toBeGreaterThan(5);
    for (const p of parts) expect(body, p.name).toMatch(new RegExp(`\\b\\w*${p.name}\\b`));
  });

  it('gives one simulated period as CSV and the whole simulation as JSON, with the caution', async () => {
    const csv = await text(url(SEPIC, '/waveforms.csv'));
    expect(csv.res.headers.get('content-type')).toContain('text/csv');
    const rows = csv.body.trim().split('\r\n');
    expect(rows[0]).toMatch(/^time_s,/);
    expect(rows[0]).toContain('L1.i_A');
    expect(rows[0]).toContain('sw.v_V');
    expect(rows.length).toBeGreaterThan(100);
    const json = (await (await app.request(url(SEPIC, '/simulation.json'))).json()) as Record<
      string,
      unknown
    > & {
      caution: string;
      steady: { timeS: number[] };
      bode: { freqHz: number[] };
    };
    expect(json.caution).toContain(SAFETY);
    expect(json.steady.timeS.length).toBeGreaterThan(100);
    expect(json.bode.freqHz.length).toBeGreaterThan(10);
    expect(Object.keys(json)).toEqual(expect.arrayContaining(['startup', 'step']));
  });
});

describe('a simulation that fails', () => {
  const failing = new Hono().route(
    '/',
    candidateRoutes(new StudyService(), {
      ...ENGINE_SIMULATOR,
      simulate: () => {
        throw new SimulationError('event-chatter', 'diodes keep flipping at one instant');
      },
      bode: () => {
        throw new SimulationError('averaging-requires-ccm', 'the averaged model needs continuous conduction');
      },
    }),
  );

  it('shows its message inside the section, as a fragment and as a page, never a 500', async () => {
    for (const [id, message] of [
      ['waveforms', 'Simulation could not settle: diodes keep flipping at one instant'],
      ['transients', 'Simulation could not settle: diodes keep flipping at one instant'],
      ['bode', 'Simulation could not settle: the averaged model needs continuous conduction'],
    ]) {
      const fragment = await failing.request(url(SEPIC, `/${id}`), { headers: htmx(`section#${id}`) });
      expect(fragment.status, id).toBe(200);
      const body = await fragment.text();
      expect(body, id).toContain(`<section id="${id}" class="sim-section" data-state="error">`);
      expect(body, id).toContain(`<p class="sim-error" role="alert">${message}</p>`);
      const page = await failing.request(url(SEPIC, `/${id}`));
      expect(page.status, id).toBe(200);
      expect(await page.text(), id).toContain(message);
    }
  });

  it('lets an unexpected error through to the error page (a bug, logged)', async () => {
    const buggy = new Hono();
    buggy.onError((err, c) => errorPage(err, c));
    buggy.route(
      '/',
      candidateRoutes(new StudyService(), {
        ...ENGINE_SIMULATOR,
        bode: () => {
          throw new TypeError('x is undefined');
        },
      }),
    );
    const res = await buggy.request(url(SEPIC, '/bode'));
    expect(res.status).toBe(500);
    expect(await res.text()).not.toContain('x is undefined');
  });
});
