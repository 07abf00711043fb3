/**
 * The exact periodic steady state of a candidate's netlist against the slow obvious reference: fine fixed
 * time steps (exact per step, diodes flipped at step boundaries, test/waveform/brute-force.ts) repeated
 * period after period until the state stops moving. Candidate: the sized inverting buck-boost with its
 * diode rectifier (default technology, nominal input, full load). Tolerances: 0.5 % on averages and
 * extremes (the fixed 1/2000-period steps place the diode's turn-on and turn-off up to half a step late).
 */
import { describe, expect, it } from 'vitest';
import { simulateCandidate } from '../../src/simulate/candidate.ts';
import { candidateCircuit } from '../../src/simulate/operating-point.ts';
import { loadTechnology } from '../../src/spec/load.ts';
import { seedInitialState } from '../../src/topologies/netlists/index.ts';
import { expectClose } from '../support/expect-close.ts';
import { bruteForcePeriodic } from '../waveform/brute-force.ts';
import { marineSpec } from './fixtures.ts';

const RTOL = 0.005;

describe('exact steady state against brute-force time stepping of the same candidate netlist', () => {
  it('inverting buck-boost, diode rectifier: every average and extreme agrees', () => {
    const spec = marineSpec();
    const tech = loadTechnology('default');
    const params = {
      topology: 'inverting-buck-boost' as const,
      fswHz: 400e3,
      ripple: 0.3,
      rect: 'diode' as const,
    };
    const cc = candidateCircuit(spec, params, tech, {});
    const seeded = seedInitialState(cc.netlist, cc.topology, cc.design, cc.vinV, cc.ioutA);
    const x0: Record<string, number> = {};
    for (const e of seeded.elements) {
      if (e.kind === 'L') x0[e.name] = e.i0 ?? 0;
      if (e.kind === 'C') x0[e.name] = e.v0 ?? 0;
    }
    const slow = bruteForcePeriodic(cc.netlist, {
      stepsPerPeriod: 2000,
      maxPeriods: 3000,
      settleRtol: 1e-9,
      integrator: 'exact',
      x0,
    });
    const fast = simulateCandidate(spec, params, tech, {}, { analysis: 'steady' });
    expect(slow.periods).toBeGreaterThan(2);
    for (const name of ['L1', 'Q1', 'D1', 'Cout']) {
      const what = name === 'Cout' ? 'v' : 'i';
      const key = `${what}(${name})`;
      const m = fast.metrics[`${name}.${what}`];
      const scale = Math.max(Math.abs(slow.max[key]), Math.abs(slow.min[key]));
      expectClose(m.avg, slow.avg[key], { rtol: RTOL, atol: RTOL * scale, what: `${key} average` });
      expectClose(m.max, slow.max[key], { rtol: RTOL, atol: RTOL * scale, what: `${key} max` });
      expectClose(m.min, slow.min[key], { rtol: RTOL, atol: RTOL * scale, what: `${key} min` });
    }
  });
});
