/**
 * `straddle simulate` and `straddle netlist`: the JSON and CSV contract other checks rely on, exit codes
 * (2 bad input, 1 "simulation could not settle: …"), and the exported netlist running as is in ngspice
 * (eecircuit-engine, npm; through test/support/ngspice.ts), landing on the waveform engine's steady state.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { main } from '../../src/cli/main.ts';
import { Ngspice, windowStats } from '../support/ngspice.ts';
import { streams } from '../support/streams.ts';
import { DEMO_SPEC_PATH } from './fixtures.ts';

async function run(argv: string[]) {
  const { out, err } = streams();
  const code = await main(argv, out, err);
  return { code, out: out.text, err: err.text };
}

const BASE = [DEMO_SPEC_PATH, '--topology', 'sepic', '--fsw', '400k'];

let ng: Ngspice;
beforeAll(async () => {
  ng = await Ngspice.start();
});
afterAll(async () => {
  await ng?.stop();
});

describe('straddle simulate', () => {
  it('--steady --json prints the result object with the named signals and their metrics', async () => {
    const r = await run(['simulate', ...BASE, '--steady', '--json']);
    expect(r.code, r.err).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.analysis).toBe('steady');
    expect(j.vinV).toBe(12.8);
    expect(Array.isArray(j.timeS)).toBe(true);
    for (const name of ['L1.i', 'L2.i', 'Q1.i', 'D1.i', 'Cs.v', 'Cout.v', 'out.v', 'sw.v', 'Rsense.i']) {
      expect(j.signals[name], name).toHaveLength(j.timeS.length);
      for (const key of ['avg', 'rms', 'min', 'max']) expect(typeof j.metrics[name][key]).toBe('number');
    }
    expect(j.metrics['out.v'].avg).toBeCloseTo(12, 0);
    expect(j.overshoot).toBeUndefined();
  });

  it('--step --json adds overshoot, peaks and settling time; --vin moves the start of the step', async () => {
    const r = await run(['simulate', ...BASE, '--rect', 'sync', '--step', '--json', '--vin', '11']);
    expect(r.code, r.err).toBe(0);
    const j = JSON.parse(r.out);
    expect(j.analysis).toBe('step');
    expect(j.step.fromV).toBe(11);
    expect(j.step.toV).toBeCloseTo(12.8, 9);
    expect(j.signals['Q2.i']).toBeDefined();
    expect(j.overshoot['Cs.v']).toBeGreaterThan(1);
    expect(typeof j.peaks['out.v']).toBe('number');
    expect(typeof j.settlingTimeS).toBe('number');
  });

  it('--startup --csv prints the header time_s,<signals> and one row per sample', async () => {
    const r = await run(['simulate', ...BASE, '--startup', '--csv']);
    expect(r.code, r.err).toBe(0);
    const lines = r.out.trim().split('\n');
    const header = lines[0].split(',');
    expect(header[0]).toBe('time_s');
    for (const name of ['L1.i', 'Cs.v', 'out.v']) expect(header).toContain(name);
    expect(lines.length).toBeGreaterThan(100);
    for (const line of lines.slice(1, 20)) expect(line.split(',')).toHaveLength(header.length);
    expect(Number(lines[1].split(',')[0])).toBe(0);
  });

  it('exits 2 with every problem for bad input', async () => {
    const r = await run([
      'simulate',
      DEMO_SPEC_PATH,
      '--topology',
      'nope',
      '--fsw',
      'fast',
      '--steady',
      '--step',
    ]);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--topology nope/);
    expect(r.err).toMatch(/--fsw fast/);
    expect(r.err).toMatch(/one analysis/);
    expect(r.err).toMatch(/--csv or --json/);
    const missing = await run([
      'simulate',
      'no-such-file.yaml',
      '--topology',
      'sepic',
      '--fsw',
      '400k',
      '--steady',
      '--json',
    ]);
    expect(missing.code).toBe(2);
    const vin = await run(['simulate', ...BASE, '--steady', '--json', '--vin', '-3']);
    expect(vin.code).toBe(2);
  });

  it('exits 1 with "simulation could not settle: …" and no stack when the engine cannot solve the circuit', async () => {
    // a 1 µA load on a diode SEPIC: no self-consistent diode sequence within the iteration cap
    const r = await run(['simulate', ...BASE, '--steady', '--json', '--iout', '1u']);
    expect(r.code).toBe(1);
    expect(r.err).toMatch(/^straddle simulate: simulation could not settle: /);
    expect(r.err).not.toMatch(/\n\s+at /);
    expect(r.out).toBe('');
  });
});

describe('straddle netlist', () => {
  it('prints a SPICE netlist that ngspice runs as is, starting on the waveform engine’s steady state', async () => {
    const r = await run(['netlist', ...BASE]);
    expect(r.code, r.err).toBe(0);
    expect(r.out).toMatch(/^\* Straddle sepic/);
    expect(r.out).toMatch(/\.tran .* uic\n\.end\n$/);
    const sim = await run(['simulate', ...BASE, '--steady', '--json']);
    const j = JSON.parse(sim.out);
    const tStop = 10 / 400e3;
    const spice = await ng.run(r.out, tStop);
    const t = spice.vectors.time;
    const out = windowStats(t, spice.vectors['v(n_out)'], tStop - 2 / 400e3, tStop);
    const il1 = windowStats(t, spice.vectors['i(l1)'], tStop - 2 / 400e3, tStop);
    // same circuit, started on its periodic state: averages agree to well under 1 %
    expect(Math.abs(out.avg / j.metrics['out.v'].avg - 1)).toBeLessThan(0.005);
    expect(Math.abs(il1.avg / j.metrics['L1.i'].avg - 1)).toBeLessThan(0.01);
  });

  it('exits 2 for bad input', async () => {
    const r = await run(['netlist', DEMO_SPEC_PATH, '--fsw', '400k']);
    expect(r.code).toBe(2);
    expect(r.err).toMatch(/--topology is required/);
  });
});
