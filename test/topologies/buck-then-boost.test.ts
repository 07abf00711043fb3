/**
 * Buck then boost: a buck stage to a bus below every rail, then a boost stage to the output.
 * Textbook relations: Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001
 * (E&M below): CCM conversion ratios and ripples ch. 2, DCM ch. 5, RHP zero Table 8.2.
 */
import { describe, expect, it } from 'vitest';
import { evaluateCandidate } from '../../src/engine/evaluate.ts';
import type { CandidateParams, Evaluation, RectifierKind } from '../../src/engine/types.ts';
import { loadTechnology } from '../../src/spec/load.ts';
import { buckThenBoost } from '../../src/topologies/buck-then-boost.ts';
import {
  BUS_EDGE,
  RECT_DROP_ALLOWANCE_V,
  RESISTIVE_DROP_ALLOWANCE,
} from '../../src/topologies/cascade-bus.ts';
import { CBUS, COUT, L1, L2 } from '../../src/topologies/cascade-core.ts';
import { WORKED_EXAMPLES } from '../reference/worked-examples.ts';
import { expectClose } from '../support/expect-close.ts';
import { railSpec } from '../support/specs.ts';
import { bisect, demoSpec, operateAt, pinnedDesign, sampledStats, sampleWave } from './cascade-kit.ts';

const ideal = loadTechnology('ideal');
const tech = loadTechnology('default');
const marine = demoSpec('marine-lifepo4-12v');
const usbPd = demoSpec('usb-pd-bench-tool-12v');

/** Closed forms vs closed forms: only rounding separates them. */
const EXACT = 1e-9;
/** Sampled references (200 000 points) against the exact piecewise-linear summaries. */
const SAMPLED = 1e-3;
/**
 * Both stages discontinuous: the bus current has five segments and is stored in four (wave-sum.ts);
 * its RMS and charge swing are then an estimate within this fraction of the sampled truth.
 */
const MERGED = 0.05;

type Corner = Evaluation['corners'][number] & { duty2: number; iinA: number };
const params = (fswHz: number, rect: RectifierKind, ripple = 0.3): CandidateParams => ({
  topology: 'buck-then-boost',
  fswHz,
  ripple,
  rect,
});
const full = (ev: Evaluation) => (ev.corners as Corner[]).filter((c) => c.label !== 'light-load');
const light = (ev: Evaluation) => (ev.corners as Corner[]).find((c) => c.label === 'light-load')!;

describe('buck-then-boost: bus voltage', () => {
  it('puts the bus 15 % below the lowest rail on the marine and USB-PD demo specs', () => {
    // 15 % margin: common practice (the technology presets record the same busMargin)
    const a = evaluateCandidate(marine, params(400e3, 'diode'), tech);
    expectClose(a.busV!, 10 * 0.85, { rtol: EXACT, what: 'marine bus (V)' });
    expect(a.feasible, JSON.stringify(a.reasons)).toBe(true);
    const b = evaluateCandidate(usbPd, params(500e3, 'sync'), tech);
    expectClose(b.busV!, 5 * 0.85, { rtol: EXACT, what: 'USB-PD bus (V)' });
    expect(b.feasible, JSON.stringify(b.reasons)).toBe(true);
    const caution = b.cautions.find((c) => c.code === 'bus-voltage')!;
    expect(caution.value).toBe(b.busV);
    expect(caution.message).toMatch(/15 % below the lowest rail/);
  });

  it('lowers the bus until the buck duty at the lowest input, with the drop allowance, stays under the maximum', () => {
    // USB-PD at 1 MHz: Dmax = 0.85; the buck at 5 V needs Vbus ≤ Dmax·(5 + Vd)/(1 + r) − Vd < 4.25 V
    const fsw = 1e6;
    const dMax = Math.min(tech.controller.maxDuty, 1 - tech.controller.minOffS * fsw);
    for (const rect of ['diode', 'sync'] as const) {
      const vd = RECT_DROP_ALLOWANCE_V[rect];
      const ev = evaluateCandidate(usbPd, params(fsw, rect), tech);
      expectClose(ev.busV!, (dMax * (5 + vd)) / (1 + RESISTIVE_DROP_ALLOWANCE) - vd, {
        rtol: EXACT,
        what: `${rect} lowered bus (V)`,
      });
      expect(ev.feasible, JSON.stringify(ev.reasons)).toBe(true);
      expect(full(ev).find((c) => c.label === 'vin-min')!.duty).toBeLessThanOrEqual(dMax);
    }
  });

  it('is infeasible when the minimum on- and off-times leave no bus for both stages', () => {
    // USB-PD 5–20 V at 2 MHz: Dmin = 0.2, Dmax = 0.7. The buck at 20 V needs Vbus ≥ 0.2·20, the buck at
    // 5 V needs Vbus ≤ 0.7·(5 + Vd)/(1 + r) − Vd.
    for (const rect of ['diode', 'sync'] as const) {
      const vd = RECT_DROP_ALLOWANCE_V[rect];
      const ev = evaluateCandidate(usbPd, params(2e6, rect), tech);
      expect(ev.feasible).toBe(false);
      const bus = ev.reasons.find((r) => r.code === 'bus-voltage-unreachable')!;
      expectClose(bus.value!, 0.2 * 20 * (1 + BUS_EDGE), { rtol: EXACT, what: `${rect} lowest bus (V)` });
      expectClose(bus.limit!, (0.7 * (5 + vd)) / (1 + RESISTIVE_DROP_ALLOWANCE) - vd, {
        rtol: EXACT,
        what: `${rect} highest bus (V)`,
      });
      const codes = ev.reasons.map((r) => r.code);
      expect(codes).toContain('duty-above-max');
      expect(codes).toContain('duty-below-min-on-time');
    }
  });
});

describe('buck-then-boost: lossless CCM against the textbook', () => {
  for (const rect of ['diode', 'sync'] as const) {
    it(`matches the buck and boost relations at every full-load corner (${rect})`, () => {
      const fsw = 400e3;
      const ev = evaluateCandidate(marine, params(fsw, rect), ideal);
      const vbus = ev.busV!;
      const [vout, iout] = [12, 2];
      for (const c of full(ev)) {
        const at = (what: string) => ({ rtol: EXACT, what: `${c.label} ${what}` });
        const k = c.components;
        const D = vbus / c.vinV; // E&M ch. 2: buck M = D
        const D2 = 1 - vbus / vout; // E&M ch. 2: boost M = 1/(1 − D)
        expect(c.mode).toBe('ccm');
        expectClose(c.duty, D, at('buck duty'));
        expectClose(c.duty2, D2, at('boost duty'));
        const il2 = iout / (1 - D2); // E&M ch. 2: boost IL = Io/(1 − D)
        const dI1 = ((c.vinV - vbus) * D) / (k.L1.value * fsw); // E&M ch. 2: buck ΔI = (Vin − Vout)·D/(L·fsw)
        const dI2 = (vbus * D2) / (k.L2.value * fsw); // E&M ch. 2: boost ΔI = Vin·D/(L·fsw)
        expectClose(k.L1.iAvgA, il2, at('L1 average = bus current'));
        expectClose(k.L2.iAvgA, il2, at('L2 average'));
        expectClose(c.iinA, D * il2, at('input current = buck switch average'));
        expectClose(k.L1.iPpA, dI1, at('L1 ripple'));
        expectClose(k.L2.iPpA, dI2, at('L2 ripple'));
        expectClose(k.Q1.iPeakA, il2 + dI1 / 2, at('Q1 peak'));
        expectClose(k.Q3.iPeakA, il2 + dI2 / 2, at('Q3 peak'));
        expectClose(k[rect === 'diode' ? 'D2' : 'Q4'].iPeakA, il2 + dI2 / 2, at('rectifier 2 peak'));
        // the buck stage blocks the input, the boost stage the output
        expectClose(k.Q1.vPeakV, c.vinV, at('Q1 peak voltage'));
        expectClose(k[rect === 'diode' ? 'D1' : 'Q2'].vPeakV, c.vinV, at('rectifier 1 peak voltage'));
        expectClose(k.Q3.vPeakV, vout, at('Q3 peak voltage'));
        expectClose(k[rect === 'diode' ? 'D2' : 'Q4'].vPeakV, vout, at('rectifier 2 peak voltage'));
        // boost output ripple ΔV = Io·D/(fsw·C) (E&M ch. 2; Rashid, Power Electronics, 4th ed., 2014, Ex. 5.6)
        expectClose(k.Cout.vPpV, (iout * D2) / (fsw * k.Cout.value), at('Cout ripple'));
        expectClose(c.efficiency, 1, at('efficiency'));
      }
    });
  }

  it('reproduces Rashid Ex. 5.6 (boost regulator) in the boost stage', () => {
    const ex = WORKED_EXAMPLES.find((e) => e.id === 'rashid4-ex5.6-boost')!;
    const { vinV, voutV, ioutA, fswHz, l1H, coutF } = ex.inputs;
    const spec = railSpec({ vin: [6, 8, 10], vout: voutV, iout: ioutA });
    const pins = { L1: 100e-6, L2: l1H, Cin: 10e-6, Cbus: 10e-6, Cout: coutF };
    for (const rect of ['diode', 'sync'] as const) {
      const d = pinnedDesign(buckThenBoost, spec, params(fswHz, rect), ideal, pins, vinV);
      const { w, s } = operateAt(buckThenBoost, d, 8, ioutA);
      const what = (x: string) => `${rect}: ${x}`;
      expect(s.mode).toBe('ccm');
      expectClose(s.duty2, ex.expected.duty, { rtol: ex.precision.duty, what: what('boost duty') });
      expectClose(w.max(L2) - w.min(L2), ex.expected.il1PpA, {
        rtol: ex.precision.il1PpA,
        what: what('boost inductor ripple'),
      });
      expectClose(w.max(L2), ex.expected.il1PeakA, {
        rtol: ex.precision.il1PeakA,
        what: what('boost inductor peak'),
      });
      expectClose(w.chargeSwing(COUT) / fswHz / coutF, ex.expected.coutVPpV, {
        rtol: ex.precision.coutVPpV,
        what: what('output ripple'),
      });
    }
  });

  it('keeps charge balance at the bus and sums the bus current on the common switching grid', () => {
    const d = pinnedDesign(
      buckThenBoost,
      marine,
      params(400e3, 'diode'),
      ideal,
      { L1: 6.8e-6, L2: 4.7e-6 },
      8.5,
    );
    const { w } = operateAt(buckThenBoost, d, 12.8, 2);
    expectClose(w.average(L1), w.average(L2), { rtol: EXACT, what: 'bus charge balance' });
    const ref = sampledStats((t) => sampleWave(w, L1, t) - sampleWave(w, L2, t));
    expect(Math.abs(w.average(CBUS))).toBeLessThan(1e-12);
    expectClose(w.rms(CBUS), ref.rms, { rtol: SAMPLED, what: 'Cbus RMS' });
    expectClose(w.chargeSwing(CBUS), ref.swing, { rtol: SAMPLED, what: 'Cbus charge swing' });
  });
});

describe('buck-then-boost: drops, light load, cautions', () => {
  it('solves the loss-inclusive duties of both stages like a bisection on volt-second balance', () => {
    const drops = {
      'Q1.ron': 0.02,
      'Q2.ron': 0.015,
      'L1.dcr': 0.02,
      'Q3.ron': 0.025,
      'Q4.ron': 0.02,
      'L2.dcr': 0.03,
    };
    const ev = evaluateCandidate(marine, params(400e3, 'sync'), ideal, drops);
    const vbus = ev.busV!;
    const [vo, io] = [12, 2];
    // stage 2 (boost): average voltage across L2 is zero with IL = Io/(1 − D) (derived in stage-boost.ts)
    const vl2 = (D: number) => {
      const il = io / (1 - D);
      return D * (vbus - il * (0.03 + 0.025)) + (1 - D) * (vbus - il * 0.03 - vo - 0.02 * il);
    };
    const D2 = bisect(vl2, 0, 1 - vbus / vo + 0.2);
    const iBus = io / (1 - D2) / 1; // the boost draws its inductor current
    for (const c of full(ev)) {
      // stage 1 (buck): average voltage across L1 is zero with IL = iBus
      const vl1 = (D: number) =>
        D * (c.vinV - iBus * (0.02 + 0.02) - vbus) - (1 - D) * (0.015 * iBus + iBus * 0.02 + vbus);
      const D1 = bisect(vl1, 0, 1);
      expectClose(c.duty2, D2, { rtol: 1e-9, what: `${c.label} boost duty with drops` });
      expectClose(c.duty, D1, { rtol: 1e-9, what: `${c.label} buck duty with drops` });
      expectClose(c.iinA, D1 * iBus, { rtol: 1e-9, what: `${c.label} input current` });
    }
  });

  it('runs discontinuous at light load with diodes, at the DCM ratios of both stages', () => {
    const fsw = 400e3;
    const ev = evaluateCandidate(marine, params(fsw, 'diode'), ideal);
    const c = light(ev);
    const vbus = ev.busV!;
    expect(c.mode).toBe('dcm');
    // E&M ch. 5: K = 2L·fsw/R; boost M = ½ + √(¼ + D²/K) ⇒ D = √(K·M·(M − 1))
    const m2 = 12 / vbus;
    const k2 = (2 * c.components.L2.value * fsw) / (12 / c.ioutA);
    expectClose(c.duty2, Math.sqrt(k2 * m2 * (m2 - 1)), { rtol: EXACT, what: 'boost DCM duty' });
    // buck M = 2/(1 + √(1 + 4K/D²)) ⇒ D = √(K·M²/(1 − M)), its load R = Vbus/iBus = Vbus²/Pout (lossless)
    const m1 = vbus / c.vinV;
    const k1 = (2 * c.components.L1.value * fsw) / ((vbus * vbus) / (12 * c.ioutA));
    expectClose(c.duty, Math.sqrt((k1 * m1 * m1) / (1 - m1)), { rtol: EXACT, what: 'buck DCM duty' });
  });

  it('estimates the bus current closely when both stages are discontinuous', () => {
    const d = pinnedDesign(
      buckThenBoost,
      marine,
      params(400e3, 'diode'),
      ideal,
      { L1: 6.8e-6, L2: 4.7e-6 },
      8.5,
    );
    const { w, s } = operateAt(buckThenBoost, d, 14.6, 0.05);
    expect(s.mode).toBe('dcm');
    const ref = sampledStats((t) => sampleWave(w, L1, t) - sampleWave(w, L2, t));
    expect(Math.abs(w.average(CBUS))).toBeLessThan(1e-12);
    expectClose(w.rms(CBUS), ref.rms, { rtol: MERGED, what: 'Cbus RMS' });
    expectClose(w.chargeSwing(CBUS), ref.swing, { rtol: MERGED, what: 'Cbus charge swing' });
  });

  it('stays in forced CCM at light load with synchronous rectifiers', () => {
    const ev = evaluateCandidate(marine, params(400e3, 'sync'), ideal);
    const c = light(ev);
    expect(c.mode).toBe('ccm');
    expectClose(c.duty, ev.busV! / c.vinV, { rtol: EXACT, what: 'buck duty' });
    expectClose(c.duty2, 1 - ev.busV! / 12, { rtol: EXACT, what: 'boost duty' });
    expect(c.components.L1.iAvgA - c.components.L1.iPpA / 2).toBeLessThan(0);
  });

  it('warns about the RHP zero of the boost stage at the output and about both pulsating rails', () => {
    const ev = evaluateCandidate(marine, params(400e3, 'sync'), ideal);
    const nom = full(ev).find((c) => c.label === 'vin-nom')!;
    // E&M Table 8.2: boost ωz = D′²·R/L, R = Vout/Iout
    const fz = ((1 - nom.duty2) ** 2 * (12 / 2)) / nom.components.L2.value / (2 * Math.PI);
    expectClose(ev.cautions.find((c) => c.code === 'rhp-zero')!.value!, fz, {
      rtol: EXACT,
      what: 'RHP zero (Hz)',
    });
    const codes = ev.cautions.map((c) => c.code);
    expect(codes).toContain('pulsating-input');
    expect(codes).toContain('cascade-two-loops');
  });
});
