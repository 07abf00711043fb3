import { describe, expect, it } from 'vitest';
import { SimulationError } from '../../src/waveform/errors.ts';
import type { Netlist } from '../../src/waveform/netlist.ts';
import { solvePeriodicSteadyState } from '../../src/waveform/steady-state.ts';
import { simulateTransient } from '../../src/waveform/transient.ts';
import { expectClose } from './close.ts';
import { boostNetlist } from './netlists.ts';

/** Vs —L— out —C— 0, no resistance: ω0 = 1/√(LC), f0 ≈ 50.3 kHz. fswHz only paces the samples. */
const lc: Netlist = {
  fswHz: 1e6,
  pwm: {},
  elements: [
    { kind: 'V', name: 'Vs', a: 'in', b: '0', volt: 0 },
    { kind: 'L', name: 'L1', a: 'in', b: 'out', henry: 10e-6 },
    { kind: 'C', name: 'C1', a: 'out', b: '0', farad: 1e-6 },
  ],
};

function expectSimulationError(run: () => unknown, code: string): SimulationError {
  try {
    run();
  } catch (e) {
    expect(e).toBeInstanceOf(SimulationError);
    expect((e as SimulationError).code).toBe(code);
    return e as SimulationError;
  }
  return expect.unreachable(`expected a SimulationError '${code}'`);
}

describe('transient', () => {
  it('rings an undamped LC network to twice an input step (common practice), with no numerical damping', () => {
    const tr = simulateTransient(lc, { tStopS: 220e-6, sourceSteps: [{ source: 'Vs', atS: 1e-6, toV: 1 }] });
    const v = tr.signals['node(out)'];
    // Samples every 20 ns may miss the crest by up to (ω0·10 ns)²/2 ≈ 5e-6 of the swing.
    const SAMPLING_RTOL = 1e-5;
    expectClose(Math.max(...v), 2, { rtol: SAMPLING_RTOL }, 'peak');
    expectClose(Math.min(...v), 0, { atol: SAMPLING_RTOL }, 'trough');
    // Exact steps: the 11th cycle's crest is still 2 V (an integrator with numerical damping would decay it).
    const late = v.filter((_, i) => tr.timeS[i] > 200e-6);
    expectClose(Math.max(...late), 2, { rtol: SAMPLING_RTOL }, 'late peak');
  });

  it('applies a rise time as a staircase: a rise of 1 % of the ring period still overshoots to ≈ 2×', () => {
    // Ramp of duration τ into an undamped LC: peak = 1 + |sin(ω0τ/2)/(ω0τ/2)| (common practice), ≈ 1.9998 here.
    const riseS = 0.2e-6;
    const w0 = 1 / Math.sqrt(10e-6 * 1e-6);
    const tr = simulateTransient(lc, {
      tStopS: 40e-6,
      sourceSteps: [{ source: 'Vs', atS: 1e-6, toV: 1, riseS }],
    });
    const x = (w0 * riseS) / 2;
    expectClose(Math.max(...tr.signals['node(out)']), 1 + Math.sin(x) / x, { rtol: 1e-4 }, 'peak');
    const vs = tr.signals['v(Vs)'];
    expect(vs[0]).toBe(0);
    expect(vs[vs.length - 1]).toBe(1);
  });

  it('starts from given states and the elements’ initial values', () => {
    const tr = simulateTransient(lc, { tStopS: 1e-6, x0: { C1: 3 } });
    expect(tr.states.C1[0]).toBe(3);
    expect(() => simulateTransient(lc, { tStopS: 1e-6, x0: { nope: 1 } })).toThrow(SimulationError);
  });

  it('settles a boost start-up onto the periodic steady state, through diode events', () => {
    const net = boostNetlist({
      ...{ vinV: 12, duty: 0.4, fswHz: 100e3, lH: 22e-6, cF: 22e-6, rOhm: 8 },
      ...{ dcrOhm: 0.05, esrOhm: 0.02, ronOhm: 0.02, rdOhm: 0.02, vfV: 0.4, roffOhm: 1e6 },
    });
    const periods = 800;
    const tr = simulateTransient(net, { tStopS: periods / net.fswHz, outputs: ['node(out)'] });
    const ss = solvePeriodicSteadyState(net);
    expect(tr.events).toBeGreaterThan(0); // start-up passes through discontinuous conduction
    // After 800 periods the slowest mode (≈ e^−0.03 per period) has decayed by e^−24.
    ss.stateNames.forEach((name, i) => {
      expectClose(tr.xEnd[i], ss.x0[i], { rtol: 1e-6, atol: 1e-6 }, name);
    });
  });

  it('follows an input step to the new steady state', () => {
    const net = boostNetlist({
      vinV: 12,
      duty: 0.5,
      fswHz: 100e3,
      lH: 22e-6,
      cF: 22e-6,
      rOhm: 8,
      dcrOhm: 0.1,
      esrOhm: 0.02,
    });
    const ss15 = solvePeriodicSteadyState(net, { Vin: 15 });
    const x0 = Object.fromEntries(ss15.stateNames.map((n) => [n, 0]));
    const ss12 = solvePeriodicSteadyState(net);
    ss12.stateNames.forEach((n, i) => {
      x0[n] = ss12.x0[i];
    });
    const tr = simulateTransient(net, {
      tStopS: 8e-3,
      x0,
      sourceSteps: [{ source: 'Vin', atS: 1e-4, toV: 15, riseS: 2e-6 }],
      outputs: ['node(out)'],
    });
    ss15.stateNames.forEach((name, i) => {
      expectClose(tr.xEnd[i], ss15.x0[i], { rtol: 1e-5, atol: 1e-5 }, name);
    });
  });
});

describe('transient limits are typed errors, never hangs', () => {
  const dcm = boostNetlist({ vinV: 12, duty: 0.4, fswHz: 100e3, lH: 10e-6, cF: 100e-6, rOhm: 400 });

  it('stops at the diode-event cap', () => {
    const e = expectSimulationError(
      () => simulateTransient(dcm, { tStopS: 1e-3, maxEvents: 5 }),
      'event-cap',
    );
    expect(e.message).toMatch(/^simulation could not settle: /);
  });

  it('stops at the step cap', () => {
    expectSimulationError(() => simulateTransient(dcm, { tStopS: 1, maxSteps: 1000 }), 'step-cap');
  });

  it('rejects a step on an unknown source and a non-positive stop time', () => {
    expectSimulationError(
      () => simulateTransient(dcm, { tStopS: 1e-4, sourceSteps: [{ source: 'Vx', atS: 0, toV: 1 }] }),
      'invalid-netlist',
    );
    expectSimulationError(() => simulateTransient(dcm, { tStopS: 0 }), 'invalid-netlist');
  });
});
