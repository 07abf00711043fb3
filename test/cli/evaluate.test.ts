/** `straddle evaluate`: the JSON contract other checks rely on, and bad input → exit 2 with every message. */
import { execFileSync } from 'node:child_process';
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { streams } from '../support/streams.ts';

const DEMO = 'data/specs/marine-lifepo4-12v.yaml';

async function run(argv: string[]) {
  const { out, err } = streams();
  const code = await main(argv, out, err);
  return { code, out: out.text, err: err.text };
}

describe('straddle evaluate', () => {
  it('prints one JSON object in SI units with every corner and component', async () => {
    const r = await run(['evaluate', DEMO, '--topology', 'sepic', '--fsw', '400k', '--json']);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.topology).toBe('sepic');
    expect(j.fswHz).toBe(400e3);
    expect(typeof j.feasible).toBe('boolean');
    expect(Array.isArray(j.reasons)).toBe(true);
    expect(Object.keys(j.objectives).sort()).toEqual(['lossW', 'parts', 'stress', 'volumeMm3']);
    expect(j.corners.map((c: { label: string }) => c.label)).toEqual([
      'vin-min',
      'vin-nom',
      'vin-max',
      'light-load',
    ]);
    const c = j.corners[0];
    for (const key of ['vinV', 'ioutA', 'voutV', 'duty', 'mode', 'efficiency', 'lossW'])
      expect(c).toHaveProperty(key);
    for (const name of ['Q1', 'D1', 'L1', 'L2', 'Cs', 'Cin', 'Cout', 'Rsense']) {
      for (const key of ['value', 'iAvgA', 'iRmsA', 'iPeakA', 'iPpA', 'vPeakV', 'vPpV'])
        expect(c.components[name]).toHaveProperty(key);
    }
    // the demo rail at 400 kHz: a 12 V, 2 A SEPIC must land in the efficiency range an engineer expects
    expect(c.efficiency).toBeGreaterThan(0.85);
    expect(c.efficiency).toBeLessThan(0.97);
    expect(c.voutV).toBe(12);
    expect(j.caution).toMatch(/verify with a circuit simulator and on hardware/);
  });

  it('accepts pins and the ideal technology', async () => {
    const r = await run([
      'evaluate',
      DEMO,
      '--topology',
      'sepic',
      '--fsw',
      '250 kHz',
      '--tech',
      'ideal',
      '--set',
      'L1=22u',
      '--set',
      'L1.dcr=20m',
      '--json',
    ]);
    expect(r.code).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.corners[0].components.L1.value).toBe(22e-6);
    expect(j.corners[0].components.L1.lossW).toBeGreaterThan(0); // only the pinned DCR loses
    expect(j.corners[0].components.Q1.lossW).toBe(0);
  });

  it('rejects bad options with exit 2 and every message, never a stack trace', async () => {
    const r = await run([
      'evaluate',
      DEMO,
      '--topology',
      'flyback',
      '--fsw',
      '400 kV',
      '--ripple=-1',
      '--rect',
      'magic',
      '--set',
      'L1',
    ]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--topology flyback/);
    expect(r.err).toMatch(/--fsw 400 kV/);
    expect(r.err).toMatch(/--ripple -1/);
    expect(r.err).toMatch(/--rect magic/);
    expect(r.err).toMatch(/--set L1/);
    expect(r.err).not.toMatch(/at .*\.ts:\d+/);
  });

  it('rejects pins of components the topology does not have', async () => {
    const r = await run([
      'evaluate',
      DEMO,
      '--topology',
      'sepic',
      '--fsw',
      '400k',
      '--set',
      'L3=1u',
      '--set',
      'Cs.dcr=1m',
    ]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/no component L3/);
    expect(r.err).toMatch(/cannot pin that on Cs/);
  });

  it('rejects an invalid spec file with every problem, exit 2', async () => {
    const dir = mkdtempSync(join(tmpdir(), 'straddle-'));
    const file = join(dir, 'bad.yaml');
    writeFileSync(
      file,
      'name: bad\ninput: { min: 20, nom: 12, max: 14 }\noutput: { voltage: 1 MV }\nload: { max: 0 }\nripple: { output: 50m }\nswitching: { min: 5k, max: 1M }\n',
    );
    const r = await run(['evaluate', file, '--topology', 'sepic', '--fsw', '400k']);
    expect(r.code).toBe(2);
    for (const field of ['input.min', 'output.voltage', 'load.max', 'switching.min'])
      expect(r.err).toContain(field);
  });

  it('runs as `npx straddle` through the package bin', () => {
    const out = execFileSync(
      process.execPath,
      ['bin/straddle.js', 'evaluate', DEMO, '--topology', 'sepic-coupled', '--fsw', '300k', '--json'],
      { encoding: 'utf8' },
    );
    expect(JSON.parse(out).topology).toBe('sepic-coupled');
  });
});
