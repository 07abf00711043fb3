/**
 * The app in a real browser (Debian's Chromium driven by playwright-core): the demo study loads, editing
 * the input range re-runs it, a bad value gets its message beside its field, a candidate sheet opens,
 * the design note downloads, a candidate sheet loads its waveform, transient and Bode plots as htmx
 * fragments. The app runs in-process on a free port. Chromium missing is a failure.
 */
import { existsSync, mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import type { AddressInfo } from 'node:net';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { type ServerType, serve } from '@hono/node-server';
import { type BrowserContext, chromium, type Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { createApp } from '../../src/web/app.ts';
import { demoFormValues, encodeSpec } from '../../src/web/spec-codec.ts';

const CHROMIUM = '/usr/bin/chromium';
const ARTIFACTS = 'test-artifacts';

let server: ServerType;
let base = '';
let ctx: BrowserContext;
let page: Page;
let profile = '';

beforeAll(async () => {
  if (!existsSync(CHROMIUM)) {
    throw new Error(
      `Chromium not found at ${CHROMIUM}: install it with "apt-get install -y chromium" (see .ci/run)`,
    );
  }
  const app = createApp();
  server = await new Promise<ServerType>((resolve) => {
    const s = serve({ fetch: app.fetch, hostname: '127.0.0.1', port: 0 }, () => resolve(s));
  });
  base = `http://127.0.0.1:${(server.address() as AddressInfo).port}`;
  profile = mkdtempSync(join(tmpdir(), 'pw-'));
  ctx = await chromium.launchPersistentContext(profile, {
    executablePath: CHROMIUM,
    headless: true,
    acceptDownloads: true,
    viewport: { width: 1400, height: 1000 },
    args: [
      '--headless',
      '--no-sandbox',
      '--disable-gpu',
      '--disable-quic',
      '--no-first-run',
      '--disable-background-networking',
      '--disable-component-update',
      '--disable-sync',
    ],
  });
  page = ctx.pages()[0] ?? (await ctx.newPage());
});

afterAll(async () => {
  await ctx?.close();
  await new Promise<void>((resolve) => (server ? server.close(() => resolve()) : resolve()));
  if (profile) rmSync(profile, { recursive: true, force: true });
});

/** Wait until the results block holds a finished study (the sweep may first show its progress). */
async function waitForStudy(p: Page): Promise<void> {
  await p.locator('#results svg.scatter').waitFor({ state: 'visible', timeout: 60_000 });
}

describe('the study in a browser', () => {
  it('opens on the demo study with the front plotted, and no CSP violation', async () => {
    const violations: string[] = [];
    page.on('console', (m) => {
      if (/Content Security Policy|Refused to/.test(m.text())) violations.push(m.text());
    });
    await page.goto(`${base}/`);
    await waitForStudy(page);
    expect(await page.locator('#results h2').textContent()).toContain('Marine instrument 12 V rail');
    const frontCount = Number(await page.locator('g.front').getAttribute('data-front-count'));
    expect(frontCount).toBeGreaterThan(0);
    await expect
      .poll(() => page.evaluate(() => typeof (window as unknown as { htmx?: unknown }).htmx))
      .toBe('object');
    mkdirSync(ARTIFACTS, { recursive: true });
    await page.screenshot({ path: join(ARTIFACTS, 'study.png'), fullPage: false });
    expect(violations).toEqual([]);
  });

  it('re-runs the study when the input range changes, and puts the new spec in the URL', async () => {
    const before = await page.locator('#results').getAttribute('data-study-key');
    const urlBefore = page.url();
    await page.locator('input[name="input.min"]').fill('6 V');
    await expect
      .poll(async () => page.locator('#results').getAttribute('data-study-key'), { timeout: 60_000 })
      .not.toBe(before);
    await waitForStudy(page);
    expect(await page.locator('#results h2').textContent()).toContain('6 V–14.6 V');
    await expect.poll(() => page.url()).not.toBe(urlBefore);
    expect(page.url()).toContain('/study?s=');
  });

  it('shows the message beside a bad field and keeps what was typed', async () => {
    await page.locator('input[name="input.max"]').fill('14.6 Q');
    await expect
      .poll(() => page.locator('#err-input-max').textContent(), { timeout: 30_000 })
      .toContain("'Q'");
    expect(await page.locator('input[name="input.max"]').inputValue()).toBe('14.6 Q');
    expect(await page.locator('#results').getAttribute('data-state')).toBe('invalid');
    await page.locator('input[name="input.max"]').fill('14.6 V');
    await expect.poll(() => page.locator('#err-input-max').textContent(), { timeout: 30_000 }).toBe('');
    await waitForStudy(page);
  });

  it('opens a candidate sheet from a front marker', async () => {
    const first = page.locator('g.front a').first();
    const id = await first.getAttribute('data-id');
    await first.locator('path').click();
    await page.waitForURL(/\/candidate\//);
    expect(await page.locator('h1').textContent()).toBe(id);
    expect(await page.locator('table.parts tbody tr').count()).toBeGreaterThan(3);
    expect(await page.locator('body').textContent()).toContain('Estimates for topology selection only');
    await page.goBack();
    await waitForStudy(page);
  });

  it('downloads the design note as Markdown with the study in it', async () => {
    const [download] = await Promise.all([
      page.waitForEvent('download'),
      page.locator('a', { hasText: 'Markdown' }).first().click(),
    ]);
    const file = await download.path();
    const text = readFileSync(file, 'utf8');
    expect(text).toContain('## Topology study: Marine instrument 12 V rail');
    expect(text).toContain('### Recommendation');
    expect(text).toContain('Estimates for topology selection only');
  });

  it('loads the waveform, transient and Bode plots on a candidate sheet', async () => {
    const violations: string[] = [];
    const onConsole = (m: { text(): string }) => {
      if (/Content Security Policy|Refused to/.test(m.text())) violations.push(m.text());
    };
    page.on('console', onConsole);
    const query = `s=${encodeSpec(demoFormValues('marine-lifepo4-12v'))}&fp=3&rp=0.3`;
    await page.goto(`${base}/candidate/sepic@316k/r0.3/diode?${query}`);
    for (const id of ['waveforms', 'transients', 'bode']) {
      await page.locator(`section#${id}[data-state="ready"]`).waitFor({ state: 'attached', timeout: 60_000 });
    }
    expect(await page.locator('#waveforms svg.waveform').count()).toBeGreaterThanOrEqual(4);
    expect(await page.locator('#transients svg.waveform').count()).toBeGreaterThanOrEqual(4);
    expect(await page.locator('#bode g.magnitude g.freq-mark.rhp-zero').count()).toBe(1);
    expect(await page.locator('#transients .transient-words').first().textContent()).toContain('Start-up');
    expect(await page.locator('#transients').textContent()).toContain('Visible ringing');
    expect(await page.locator('body').textContent()).toContain('Estimates for topology selection only');
    const netlist = page.locator('.exports a', { hasText: 'SPICE netlist' });
    expect(await netlist.getAttribute('href')).toContain('/netlist.cir?');
    mkdirSync(ARTIFACTS, { recursive: true });
    await page.locator('#waveforms').scrollIntoViewIfNeeded();
    await page.screenshot({ path: join(ARTIFACTS, 'candidate.png'), fullPage: true });
    page.off('console', onConsole);
    expect(violations).toEqual([]);
  });
});
