import { describe, expect, it } from 'vitest';
import { SimulationError } from '../../src/waveform/errors.ts';
import type { Netlist } from '../../src/waveform/netlist.ts';
import { solvePeriodicSteadyState } from '../../src/waveform/steady-state.ts';
import { bruteForcePeriodic } from './brute-force.ts';
import { expectClose } from './close.ts';
import { boostNetlist, sepicNetlist } from './netlists.ts';

// Brute force with RK4 at T/1000 in CCM (no events to quantise): states agree to ~1e-7, and the
// trapezoid period averages of the reference carry an O(step²) error, well inside 2e-5 of the ripple span.
const RTOL_STATES_CCM = 1e-6;
const RTOL_AVG_CCM = 2e-5;

function compareWithBruteForce(
  net: Netlist,
  opts: Parameters<typeof bruteForcePeriodic>[1],
  tol: { states: number; avg: number },
  signals: string[],
) {
  const ss = solvePeriodicSteadyState(net);
  const ref = bruteForcePeriodic(net, opts);
  const scale = Math.max(...ref.x0.map(Math.abs));
  ss.stateNames.forEach((name, i) => {
    expectClose(ss.x0[i], ref.x0[i], { atol: tol.states * scale }, `x0 ${name}`);
  });
  for (const s of signals) {
    const span = ref.max[s] - ref.min[s];
    expectClose(ss.metrics[s].avg, ref.avg[s], { rtol: tol.avg, atol: tol.avg * span }, `avg ${s}`);
    expectClose(ss.metrics[s].max, ref.max[s], { rtol: tol.avg, atol: 10 * tol.avg * span }, `max ${s}`);
    expectClose(ss.metrics[s].min, ref.min[s], { rtol: tol.avg, atol: 10 * tol.avg * span }, `min ${s}`);
  }
  return ss;
}

describe('periodic steady state against brute-force time stepping', () => {
  it('agrees on a lossy boost in CCM', () => {
    const net = boostNetlist({
      ...{ vinV: 12, duty: 0.4, fswHz: 100e3, lH: 22e-6, cF: 22e-6, rOhm: 8 },
      ...{ dcrOhm: 0.05, esrOhm: 0.02, ronOhm: 0.02, rdOhm: 0.02, vfV: 0.4, roffOhm: 1e6 },
    });
    const ss = compareWithBruteForce(
      net,
      // Start at the ideal operating point V = Vin/(1 − D), I_L = V/(R(1 − D)) (Erickson & Maksimović, ch. 2).
      {
        stepsPerPeriod: 1000,
        maxPeriods: 5000,
        settleRtol: 1e-11,
        integrator: 'rk4',
        x0: { Cout: 20, L1: 4.2 },
      },
      { states: RTOL_STATES_CCM, avg: RTOL_AVG_CCM },
      ['node(out)', 'i(L1)', 'i(D1)', 'i(S1)', 'i(Cout)'],
    );
    expect(ss.hasDiodeEvents).toBe(false);
  });

  it('agrees on a separate-inductor SEPIC in CCM', () => {
    const net = sepicNetlist({
      ...{ vinV: 12, duty: 0.5, fswHz: 200e3, l1H: 22e-6, l2H: 22e-6, csF: 4.7e-6, coutF: 22e-6, rOhm: 6 },
      ...{ dcrOhm: 0.1, esrOhm: 0.01 },
    });
    compareWithBruteForce(
      net,
      // Start at the ideal operating point V = Vin·D/(1 − D) = 12 V, I_L1 = V²/(R·Vin), I_L2 = −V/R (L2's
      // node a is the diode side), V_Cs = Vin
      // (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., 2001, ch. 2 problems / ch. 6).
      {
        ...{ stepsPerPeriod: 1000, maxPeriods: 10000, settleRtol: 1e-11, integrator: 'rk4' },
        x0: { Cout: 12, Cs: 12, L1: 2, L2: -2 },
      },
      { states: RTOL_STATES_CCM, avg: RTOL_AVG_CCM },
      ['node(out)', 'i(L1)', 'i(L2)', 'v(Cs)', 'i(D1)'],
    );
  });

  it('agrees on a boost in DCM, where the diode turns off inside the period', () => {
    // Exact steps of T/2000 with the diode flipped only at step boundaries: the turn-off instant is
    // quantised to T/2000, so the reference carries ~0.1 % error in the delivered charge.
    const net = boostNetlist({
      vinV: 12,
      duty: 0.4,
      fswHz: 100e3,
      lH: 10e-6,
      cF: 10e-6,
      rOhm: 50,
      vfV: 0.5,
      rdOhm: 0.01,
    });
    const ss = compareWithBruteForce(
      net,
      { stepsPerPeriod: 2000, maxPeriods: 5000, settleRtol: 1e-10, integrator: 'exact' },
      { states: 1e-3, avg: 1e-3 },
      ['node(out)', 'i(D1)'],
    );
    expect(ss.hasDiodeEvents).toBe(true);
    expect(ss.diodeSequence.map((s) => s.conducting)).toEqual([[], ['D1'], []]);
  });
});

describe('boost against the textbook ideal relations', () => {
  // Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001.
  it('gives Vout = Vin/(1 − D) and ΔI = Vin·D·T/L in CCM (ch. 2)', () => {
    const [vin, d, fsw, l] = [12, 0.6, 100e3, 47e-6];
    const ss = solvePeriodicSteadyState(
      boostNetlist({ vinV: vin, duty: d, fswHz: fsw, lH: l, cF: 1e-3, rOhm: 20 }),
    );
    // Near-ideal parts (1 µΩ on, 10 MΩ off) and 0.02 % output ripple: the small-ripple relations hold to 1e-3.
    expectClose(ss.metrics['node(out)'].avg, vin / (1 - d), { rtol: 1e-3 }, 'Vout');
    const ripple = ss.metrics['i(L1)'].max - ss.metrics['i(L1)'].min;
    expectClose(ripple, (vin * d) / (fsw * l), { rtol: 1e-3 }, 'ΔI');
    expect(ss.hasDiodeEvents).toBe(false);
  });

  it('gives M = 1/2 + √(1/4 + D²/K), K = 2L/(R·T), and D2 = D/(M − 1) in DCM (ch. 5)', () => {
    const [vin, d, fsw, l, r] = [12, 0.4, 100e3, 10e-6, 400];
    const k = (2 * l * fsw) / r;
    expect(k).toBeLessThan(d * (1 - d) ** 2); // DCM: K < K_crit(D) = D(1 − D)² (ch. 5)
    const m = 0.5 + Math.sqrt(0.25 + (d * d) / k);
    const ss = solvePeriodicSteadyState(
      boostNetlist({ vinV: vin, duty: d, fswHz: fsw, lH: l, cF: 100e-6, rOhm: r }),
    );
    expectClose(ss.metrics['node(out)'].avg, m * vin, { rtol: 1e-3 }, 'M·Vin');
    const conducting = ss.diodeSequence.find((s) => s.conducting.includes('D1'))!;
    expectClose((conducting.endS - conducting.startS) * fsw, d / (m - 1), { rtol: 1e-3 }, 'D2');
    expect(ss.segments[2].startsAt).toEqual({ diode: 'D1', turns: 'off' });
  });
});

describe('steady-state output', () => {
  const ss = solvePeriodicSteadyState(
    boostNetlist({ vinV: 5, duty: 0.5, fswHz: 1e5, lH: 10e-6, cF: 10e-6, rOhm: 10 }),
    {
      Vin: 6,
    },
  );
  it('samples one closed period with both sides of each configuration change', () => {
    expect(ss.timeS[0]).toBe(0);
    expectClose(ss.timeS[ss.timeS.length - 1], ss.periodS, { rtol: 1e-12 }, 'end');
    expect(ss.timeS.length).toBeGreaterThanOrEqual(200);
    for (let i = 1; i < ss.timeS.length; i++) expect(ss.timeS[i]).toBeGreaterThanOrEqual(ss.timeS[i - 1]);
    const iL = ss.states.L1;
    expectClose(iL[iL.length - 1], iL[0], { rtol: 1e-9 }, 'periodic');
  });

  it('applies source overrides by name', () => {
    expectClose(ss.signals['v(Vin)'][0], 6, { rtol: 0 }, 'Vin');
  });

  it('keeps Kirchhoff current law at the switch node in every sample', () => {
    const { 'i(L1)': iL, 'i(S1)': iS, 'i(D1)': iD } = ss.signals;
    for (let i = 0; i < iL.length; i++) expectClose(iL[i], iS[i] + iD[i], { atol: 1e-9 }, `KCL ${i}`);
  });
});

describe('steady-state failures', () => {
  it('reports an integrator (capacitor charged by a current source) as having no periodic solution', () => {
    const net: Netlist = {
      fswHz: 1e5,
      pwm: {},
      elements: [
        { kind: 'I', name: 'I1', a: '0', b: 'x', amp: 1 },
        { kind: 'C', name: 'C1', a: 'x', b: '0', farad: 1e-6, esrOhm: 0.01 },
      ],
    };
    expect(() => solvePeriodicSteadyState(net)).toThrow(SimulationError);
    try {
      solvePeriodicSteadyState(net);
    } catch (e) {
      expect((e as SimulationError).code).toBe('no-periodic-solution');
    }
  });
});
