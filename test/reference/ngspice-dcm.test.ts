/**
 * Reference: ngspice, via the eecircuit-engine WebAssembly build, npm. The waveform engine's exact
 * periodic steady state in discontinuous conduction against ngspice on the same circuit: the sized
 * candidate's netlist (default technology, marine demo rail, 400 kHz, diode rectifier) at maximum input
 * and light load (14.6 V, 0.2 A), at the analytic engine's DCM duty, exported by src/report/spice.ts.
 * ngspice's periodic steady state comes from shooting (test/support/ngspice.ts), started from the waveform
 * engine's state: a wrong start would show as a shooting correction and as differences below.
 * Diodes are written with CJO = 0 so ngspice has no junction-capacitance ringing the PWL model lacks; its
 * exponential diode drops a few mV less than vf + rd·i at the small DCM currents (src/report/spice.ts).
 * Tolerances (relative): averages 2 %, ripple and peaks 5 %, diode conduction time 5 % of the period.
 */
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { TopologyId } from '../../src/engine/types.ts';
import { toSpice } from '../../src/report/spice.ts';
import { candidateCircuit } from '../../src/simulate/operating-point.ts';
import { withInitialState } from '../../src/simulate/spice-export.ts';
import { loadTechnology } from '../../src/spec/load.ts';
import { compileCircuit } from '../../src/waveform/state-space.ts';
import { solvePeriodicSteadyState } from '../../src/waveform/steady-state.ts';
import { marineSpec } from '../simulate/fixtures.ts';
import { expectClose } from '../support/expect-close.ts';
import { Ngspice, periodicSteadyState } from '../support/ngspice.ts';

const RTOL_AVG = 0.02;
const RTOL_RIPPLE = 0.05;
const RTOL_PEAK = 0.05;
const CONDUCTION_ATOL = 0.05;

let ng: Ngspice;
beforeAll(async () => {
  ng = await Ngspice.start();
});
afterAll(async () => {
  await ng?.stop();
});

/** Fraction of the period the diode conducts more than 1 % of its peak current, from samples (t, i). */
function conductionFraction(t: ArrayLike<number>, i: ArrayLike<number>, t0: number, t1: number): number {
  let peak = 0;
  for (let k = 0; k < t.length; k++) if (t[k] >= t0 && t[k] <= t1) peak = Math.max(peak, i[k]);
  let on = 0;
  for (let k = 1; k < t.length; k++) {
    if (t[k] <= t0 || t[k - 1] >= t1) continue;
    if (0.5 * (i[k] + i[k - 1]) > 0.01 * peak) on += Math.min(t[k], t1) - Math.max(t[k - 1], t0);
  }
  return on / (t1 - t0);
}

describe('DCM steady state against ngspice (light load, diode rectifier)', () => {
  const spec = marineSpec();
  const tech = loadTechnology('default');
  for (const id of ['sepic', 'boost-then-buck'] as TopologyId[]) {
    it(`${id} at 14.6 V, 0.2 A`, async () => {
      const cc = candidateCircuit(
        spec,
        { topology: id, fswHz: 400e3, ripple: 0.3, rect: 'diode' },
        tech,
        {},
        {
          vinV: 14.6,
          ioutA: 0.2,
        },
      );
      expect(cc.mode).toBe('dcm');
      const circuit = compileCircuit(cc.netlist);
      const ss = solvePeriodicSteadyState(cc.netlist, {}, { circuit, samples: 2000 });
      expect(ss.hasDiodeEvents, 'the waveform engine finds diode events (DCM)').toBe(true);
      const ref = await periodicSteadyState(ng, withInitialState(cc.netlist, circuit, ss.x0), {
        title: `${id} DCM`,
        stepsPerPeriod: 1000,
        spice: { diodeCjoF: 0 },
      });
      expect(ref.residual, 'shooting converged').toBeLessThan(1e-4);
      const m = ss.metrics;
      expectClose(m['node(out)'].avg, ref.nodes.out.avg, { rtol: RTOL_AVG, what: 'output average' });
      for (const l of cc.netlist.elements.filter((e) => e.kind === 'L')) {
        const mine = m[`i(${l.name})`];
        const theirs = ref.currents[l.name];
        const scale = Math.max(Math.abs(mine.max), Math.abs(mine.min));
        expectClose(mine.avg, theirs.avg, { rtol: RTOL_AVG, atol: 0.01 * scale, what: `${l.name} average` });
        expectClose(mine.max - mine.min, theirs.pp, { rtol: RTOL_RIPPLE, what: `${l.name} ripple` });
      }
      const diodes = cc.netlist.elements.filter((e) => e.kind === 'D').map((e) => e.name);
      for (const d of diodes) {
        expectClose(m[`i(${d})`].max, ref.currents[d].max, { rtol: RTOL_PEAK, what: `${d} peak current` });
        expectClose(m[`i(${d})`].avg, ref.currents[d].avg, { rtol: RTOL_AVG, what: `${d} average current` });
      }
      // the DCM signature: the output diode stops conducting before the period ends, as long in both
      const d = diodes[diodes.length - 1];
      const mine = conductionFraction(ss.timeS, ss.signals[`i(${d})`], 0, ss.periodS);
      expect(mine, `${d} conducts ${(100 * mine).toFixed(1)} % of the period`).toBeLessThan(0.95);
      const spiceRun = await ng.run(
        toSpice(withInitialState(cc.netlist, circuit, ss.x0), {
          title: `${id} DCM one period`,
          tStopS: ss.periodS,
          tStepS: ss.periodS / 1000,
          initialConditions: true,
          diodeCjoF: 0,
        }),
        ss.periodS,
      );
      const theirs = conductionFraction(
        spiceRun.vectors.time,
        spiceRun.vectors[`i(v_${d.toLowerCase()}_vf)`],
        0,
        ss.periodS,
      );
      expectClose(mine, theirs, { atol: CONDUCTION_ATOL, rtol: 0, what: `${d} conduction fraction` });
    });
  }
});
