/**
 * The slow, obvious reference for the periodic steady state: start from a given state, integrate with a tiny fixed
 * step for as many periods as it takes to settle, and read the last period. Gates are sampled at each
 * step's midpoint (steps are aligned with the gate edges); a diode flips at a step boundary when its
 * present state is inconsistent (on with i < 0, off with v > vf). No root finding, no periodic solve.
 * Integrator: classic fourth-order Runge–Kutta, or the exact step x⁺ = Φ(h)x + Γ(h)u for stiff circuits
 * (RK4 is unstable in a configuration with both semiconductors off: the inductor then sees roff, a mode
 * near −roff/L; start CCM runs near the operating point so start-up never visits it).
 */
import { stepMaps } from '../../src/waveform/expm.ts';
import type { Netlist } from '../../src/waveform/netlist.ts';
import { isGateOn } from '../../src/waveform/pwm.ts';
import { compileCircuit, type StateSpace } from '../../src/waveform/state-space.ts';

export interface BruteForceResult {
  x0: Float64Array;
  periods: number;
  /** Output averages (trapezoid per step), minima and maxima over the last period. */
  avg: Record<string, number>;
  min: Record<string, number>;
  max: Record<string, number>;
}

function out(ss: StateSpace, k: number, x: Float64Array, u: Float64Array): number {
  let s = 0;
  for (let j = 0; j < ss.n; j++) s += ss.c[k * ss.n + j] * x[j];
  for (let j = 0; j < ss.m; j++) s += ss.d[k * ss.m + j] * u[j];
  return s;
}

function deriv(ss: StateSpace, x: Float64Array, u: Float64Array): Float64Array {
  const dx = new Float64Array(ss.n);
  for (let i = 0; i < ss.n; i++) {
    let s = 0;
    for (let j = 0; j < ss.n; j++) s += ss.a[i * ss.n + j] * x[j];
    for (let j = 0; j < ss.m; j++) s += ss.b[i * ss.m + j] * u[j];
    dx[i] = s;
  }
  return dx;
}

export function bruteForcePeriodic(
  netlist: Netlist,
  opts: {
    stepsPerPeriod: number;
    maxPeriods: number;
    settleRtol: number;
    integrator: 'rk4' | 'exact';
    /** Starting state by element name (default rest). */
    x0?: Record<string, number>;
  },
): BruteForceResult {
  const circuit = compileCircuit(netlist);
  const u = circuit.inputVector();
  const T = 1 / netlist.fswHz;
  const N = opts.stepsPerPeriod;
  const h = T / N;
  const diodes = circuit.twoState.flatMap((e, j) => (e.kind === 'D' ? [{ e, bit: 1 << j }] : []));
  const gateBits = Array.from({ length: N }, (_, k) => {
    let mask = 0;
    circuit.twoState.forEach((e, j) => {
      if (e.kind === 'S' && isGateOn(netlist.pwm[e.gate], (k + 0.5) / N)) mask |= 1 << j;
    });
    return mask;
  });
  const exactMaps = new Map<number, ReturnType<typeof stepMaps>>();
  let x = new Float64Array(circuit.n);
  for (const [name, v] of Object.entries(opts.x0 ?? {})) x[circuit.stateIndex(name)] = v;
  let dMask = 0;
  const consistentMask = (gates: number): number => {
    for (let pass = 0; pass < 2 * diodes.length + 2; pass++) {
      const ss = circuit.configuration(gates | dMask);
      const wrong = diodes.find(({ e, bit }) => {
        if (e.kind !== 'D') return false;
        if (dMask & bit) return out(ss, circuit.outputIndex(`i(${e.name})`), x, u) < 0;
        return out(ss, circuit.outputIndex(`v(${e.name})`), x, u) > e.vfV;
      });
      if (!wrong) break;
      dMask ^= wrong.bit;
    }
    return gates | dMask;
  };
  const names = circuit.outputNames;
  const sum = new Float64Array(names.length);
  const min = new Float64Array(names.length);
  const max = new Float64Array(names.length);
  const runPeriod = (record: boolean) => {
    sum.fill(0);
    min.fill(Infinity);
    max.fill(-Infinity);
    for (let k = 0; k < N; k++) {
      const ss = circuit.configuration(consistentMask(gateBits[k]));
      const y0 = record ? names.map((_, o) => out(ss, o, x, u)) : [];
      if (opts.integrator === 'rk4') {
        const k1 = deriv(ss, x, u);
        const k2 = deriv(
          ss,
          x.map((v, i) => v + 0.5 * h * k1[i]),
          u,
        );
        const k3 = deriv(
          ss,
          x.map((v, i) => v + 0.5 * h * k2[i]),
          u,
        );
        const k4 = deriv(
          ss,
          x.map((v, i) => v + h * k3[i]),
          u,
        );
        x = x.map((v, i) => v + (h / 6) * (k1[i] + 2 * k2[i] + 2 * k3[i] + k4[i]));
      } else {
        let maps = exactMaps.get(ss.mask);
        if (!maps) {
          maps = stepMaps(ss.a, ss.b, ss.n, ss.m, h);
          exactMaps.set(ss.mask, maps);
        }
        const xn = new Float64Array(ss.n);
        for (let i = 0; i < ss.n; i++) {
          let s = 0;
          for (let j = 0; j < ss.n; j++) s += maps.phi[i * ss.n + j] * x[j];
          for (let j = 0; j < ss.m; j++) s += maps.gamma[i * ss.m + j] * u[j];
          xn[i] = s;
        }
        x = xn;
      }
      if (!record) continue;
      // Trapezoid over the step, both ends in the step's configuration (jumps fall on step boundaries).
      for (let o = 0; o < names.length; o++) {
        const y1 = out(ss, o, x, u);
        sum[o] += (y0[o] + y1) / (2 * N);
        min[o] = Math.min(min[o], y0[o], y1);
        max[o] = Math.max(max[o], y0[o], y1);
      }
    }
  };
  for (let period = 1; period <= opts.maxPeriods; period++) {
    const start = x.slice();
    runPeriod(false);
    const scale = Math.max(...x.map(Math.abs));
    const change = Math.max(...x.map((v, i) => Math.abs(v - start[i])));
    if (change > opts.settleRtol * scale) continue;
    const x0 = x.slice();
    runPeriod(true);
    const rec = (arr: Float64Array) => Object.fromEntries(names.map((nm, o) => [nm, arr[o]]));
    return { x0, periods: period + 1, avg: rec(sum), min: rec(min), max: rec(max) };
  }
  throw new Error(`brute force did not settle in ${opts.maxPeriods} periods`);
}
