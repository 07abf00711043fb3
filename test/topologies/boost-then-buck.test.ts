/**
 * Boost then buck: a boost stage to a bus above every rail, then a buck stage to the output.
 * Textbook relations: Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001
 * (E&M below): CCM conversion ratios and ripples ch. 2, DCM ch. 5, RHP zero Table 8.2.
 */
import { describe, expect, it } from 'vitest';
import { evaluateCandidate } from '../../src/engine/evaluate.ts';
import type { CandidateParams, Evaluation, RectifierKind } from '../../src/engine/types.ts';
import { loadTechnology } from '../../src/spec/load.ts';
import { boostThenBuck } from '../../src/topologies/boost-then-buck.ts';
import {
  BUS_EDGE,
  RECT_DROP_ALLOWANCE_V,
  RESISTIVE_DROP_ALLOWANCE,
} from '../../src/topologies/cascade-bus.ts';
import { CBUS, COUT, L2, Q3, RECT1 } from '../../src/topologies/cascade-core.ts';
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

type Corner = Evaluation['corners'][number] & { duty2: number; iinA: number };
const params = (fswHz: number, rect: RectifierKind, ripple = 0.3): CandidateParams => ({
  topology: 'boost-then-buck',
  fswHz,
  ripple,
  rect,
});
const full = (ev: Evaluation) => (ev.corners as Corner[]).filter((c) => c.label !== 'light-load');
const light = (ev: Evaluation) => (ev.corners as Corner[]).find((c) => c.label === 'light-load')!;

describe('boost-then-buck: bus voltage', () => {
  it('puts the bus 15 % above the highest rail on the marine and USB-PD demo specs', () => {
    // 15 % margin: common practice (the technology presets record the same busMargin)
    const a = evaluateCandidate(marine, params(400e3, 'diode'), tech);
    expectClose(a.busV!, 14.6 * 1.15, { rtol: EXACT, what: 'marine bus (V)' });
    expect(a.feasible, JSON.stringify(a.reasons)).toBe(true);
    const b = evaluateCandidate(usbPd, params(500e3, 'sync'), tech);
    expectClose(b.busV!, 20 * 1.15, { rtol: EXACT, what: 'USB-PD bus (V)' });
    expect(b.feasible, JSON.stringify(b.reasons)).toBe(true);
    const caution = a.cautions.find((c) => c.code === 'bus-voltage')!;
    expect(caution.value).toBe(a.busV);
    expect(caution.message).toMatch(/15 % above the highest rail/);
  });

  it('raises the bus until the boost duty at the highest input clears the minimum on-time', () => {
    // 1.5 MHz with a 100 ns minimum on-time: Dmin = 0.15 > 1 − 14.6/16.79, so Vbus = Vin,max/(1 − Dmin)·(1 + edge)
    const fsw = 1.5e6;
    const dMin = tech.controller.minOnS * fsw;
    const ev = evaluateCandidate(marine, params(fsw, 'diode'), tech);
    expectClose(ev.busV!, (14.6 / (1 - dMin)) * (1 + BUS_EDGE), { rtol: EXACT, what: 'raised bus (V)' });
    expect(ev.feasible, JSON.stringify(ev.reasons)).toBe(true);
    const vinMax = full(ev).find((c) => c.label === 'vin-max')!;
    expect(vinMax.duty).toBeGreaterThanOrEqual(dMin);
  });

  it('is infeasible when the minimum on- and off-times leave no bus for both stages', () => {
    // USB-PD 5–20 V at 2 MHz: Dmin = 0.2, Dmax = 1 − 150 ns·2 MHz = 0.7. The boost at 20 V needs
    // Vbus ≥ 20/(1 − 0.2), the boost at 5 V needs Vbus ≤ 5·(1 − r)/(1 − 0.7) − Vd.
    for (const rect of ['diode', 'sync'] as const) {
      const ev = evaluateCandidate(usbPd, params(2e6, rect), tech);
      expect(ev.feasible).toBe(false);
      const bus = ev.reasons.find((r) => r.code === 'bus-voltage-unreachable')!;
      expectClose(bus.value!, (20 / 0.8) * (1 + BUS_EDGE), { rtol: EXACT, what: `${rect} lowest bus (V)` });
      expectClose(bus.limit!, (5 * (1 - RESISTIVE_DROP_ALLOWANCE)) / 0.3 - RECT_DROP_ALLOWANCE_V[rect], {
        rtol: EXACT,
        what: `${rect} highest bus (V)`,
      });
      expect(ev.reasons.some((r) => r.code === 'duty-above-max' && r.corner === 'vin-min')).toBe(true);
    }
    // a spec whose on- and off-time limits meet (Dmin = Dmax = 0.4 at 4 MHz) squeezes every bus out
    const squeezed = evaluateCandidate(marine, params(4e6, 'diode'), tech);
    expect(squeezed.reasons.map((r) => r.code)).toContain('bus-voltage-unreachable');
  });
});

describe('boost-then-buck: lossless CCM against the textbook', () => {
  for (const rect of ['diode', 'sync'] as const) {
    it(`matches the boost and buck relations at every full-load corner (${rect})`, () => {
      const fsw = 400e3;
      const ev = evaluateCandidate(marine, params(fsw, rect), ideal);
      const vbus = ev.busV!;
      const vout = 12;
      const iout = 2;
      for (const c of full(ev)) {
        const at = (what: string) => ({ rtol: EXACT, what: `${c.label} ${what}` });
        const k = c.components;
        const D = 1 - c.vinV / vbus; // E&M ch. 2: boost M = 1/(1 − D)
        const D2 = vout / vbus; // E&M ch. 2: buck M = D
        expect(c.mode).toBe('ccm');
        expectClose(c.duty, D, at('boost duty'));
        expectClose(c.duty2, D2, at('buck duty'));
        const iBus = (iout * vout) / vbus; // lossless: the bus carries the output power
        const il1 = iBus / (1 - D); // E&M ch. 2: boost IL = Io/(1 − D)
        const dI1 = (c.vinV * D) / (k.L1.value * fsw); // E&M ch. 2: ΔI = Vin·D/(L·fsw)
        const dI2 = ((vbus - vout) * D2) / (k.L2.value * fsw); // E&M ch. 2: ΔI = (Vin − Vout)·D/(L·fsw)
        expectClose(k.L1.iAvgA, il1, at('L1 average'));
        expectClose(c.iinA, il1, at('input current = L1 average'));
        expectClose(k.L2.iAvgA, iout, at('L2 average'));
        expectClose(k.L1.iPpA, dI1, at('L1 ripple'));
        expectClose(k.L2.iPpA, dI2, at('L2 ripple'));
        // peaks are average + half the ripple; every semiconductor blocks the bus
        expectClose(k.Q1.iPeakA, il1 + dI1 / 2, at('Q1 peak'));
        expectClose(k[rect === 'diode' ? 'D1' : 'Q2'].iPeakA, il1 + dI1 / 2, at('rectifier 1 peak'));
        expectClose(k.Q3.iPeakA, iout + dI2 / 2, at('Q3 peak'));
        for (const n of ['Q1', rect === 'diode' ? 'D1' : 'Q2', 'Q3', rect === 'diode' ? 'D2' : 'Q4'])
          expectClose(k[n].vPeakV, vbus, at(`${n} peak voltage`));
        // buck output ripple ΔV = ΔI/(8·fsw·C) (E&M ch. 2; Rashid, Power Electronics, 4th ed., 2014, Ex. 5.5)
        expectClose(k.Cout.vPpV, dI2 / (8 * fsw * k.Cout.value), at('Cout ripple'));
        expectClose(c.efficiency, 1, at('efficiency'));
      }
    });
  }

  it('reproduces Rashid Ex. 5.5 (buck regulator) in the buck stage', () => {
    const ex = WORKED_EXAMPLES.find((e) => e.id === 'rashid4-ex5.5-buck')!;
    const { vinV, voutV, loadOhm, fswHz, l1H, coutF } = ex.inputs;
    const spec = railSpec({ vin: [vinV, vinV, vinV], vout: voutV, iout: voutV / loadOhm });
    // the book's ripple is the CCM one even at its 10 mA load: the synchronous stage stays in CCM
    const pins = { L1: 100e-6, L2: l1H, Cin: 10e-6, Cbus: 10e-6, Cout: coutF };
    const d = pinnedDesign(boostThenBuck, spec, params(fswHz, 'sync'), ideal, pins, vinV);
    const { w, s } = operateAt(boostThenBuck, d, 0.8 * vinV, voutV / loadOhm);
    expectClose(s.duty2, ex.expected.duty, { rtol: ex.precision.duty, what: 'buck duty' });
    expectClose(w.max(L2) - w.min(L2), ex.expected.il1PpA, {
      rtol: ex.precision.il1PpA,
      what: 'buck inductor ripple',
    });
    expectClose(w.chargeSwing(COUT) / fswHz / coutF, ex.expected.coutVPpV, {
      rtol: ex.precision.coutVPpV,
      what: 'output ripple',
    });
  });

  it('keeps charge balance at the bus and sums the bus current on the common switching grid', () => {
    const spec = marine;
    const d = pinnedDesign(
      boostThenBuck,
      spec,
      params(400e3, 'diode'),
      ideal,
      { L1: 4.7e-6, L2: 10e-6 },
      16.79,
    );
    const { w } = operateAt(boostThenBuck, d, 12.8, 2);
    // what the boost rectifier delivers is what the buck switch draws (Kirchhoff at the bus)
    expectClose(w.average(RECT1), w.average(Q3), { rtol: EXACT, what: 'bus charge balance' });
    const ref = sampledStats((t) => sampleWave(w, RECT1, t) - sampleWave(w, Q3, t));
    expect(Math.abs(w.average(CBUS))).toBeLessThan(1e-12);
    expectClose(w.rms(CBUS), Math.sqrt(ref.rms ** 2 - ref.avg ** 2), { rtol: SAMPLED, what: 'Cbus RMS' });
    expectClose(w.chargeSwing(CBUS), ref.swing, { rtol: SAMPLED, what: 'Cbus charge swing' });
  });
});

describe('boost-then-buck: drops, light load, cautions', () => {
  it('solves the loss-inclusive duties of both stages like a bisection on volt-second balance', () => {
    const drops = {
      'Q1.ron': 0.03,
      'D1.vf': 0.4,
      'D1.rd': 0.02,
      'L1.dcr': 0.025,
      'Q3.ron': 0.02,
      'D2.vf': 0.35,
      'D2.rd': 0.015,
      'L2.dcr': 0.03,
    };
    const ev = evaluateCandidate(marine, params(400e3, 'diode'), ideal, drops);
    const vbus = ev.busV!;
    const [vo, io] = [12, 2];
    for (const c of full(ev)) {
      // stage 2 (buck): average voltage across L2 is zero (derived in stage-buck.ts)
      const vl2 = (D: number) =>
        D * (vbus - io * (0.02 + 0.03) - vo) - (1 - D) * (0.35 + 0.015 * io + io * 0.03 + vo);
      const D2 = bisect(vl2, 0, 1);
      const iBus = D2 * io;
      // stage 1 (boost): average voltage across L1 is zero with IL = iBus/(1 − D)
      const vl1 = (D: number) => {
        const il = iBus / (1 - D);
        return D * (c.vinV - il * (0.025 + 0.03)) + (1 - D) * (c.vinV - il * 0.025 - vbus - 0.4 - 0.02 * il);
      };
      const D1 = bisect(vl1, 0, 1 - c.vinV / vbus + 0.2);
      expectClose(c.duty2, D2, { rtol: 1e-9, what: `${c.label} buck duty with drops` });
      expectClose(c.duty, D1, { rtol: 1e-9, what: `${c.label} boost duty with drops` });
      expectClose(c.iinA, iBus / (1 - D1), { rtol: 1e-9, what: `${c.label} input current` });
    }
  });

  it('runs discontinuous at light load with diodes, at the DCM ratios of both stages', () => {
    const fsw = 500e3;
    const ev = evaluateCandidate(usbPd, params(fsw, 'diode'), ideal);
    const c = light(ev);
    const vbus = ev.busV!;
    expect(c.mode).toBe('dcm');
    // E&M ch. 5: K = 2L·fsw/R; buck M = 2/(1 + √(1 + 4K/D²)) ⇒ D = √(K·M²/(1 − M))
    const m2 = 12 / vbus;
    const k2 = (2 * c.components.L2.value * fsw) / (12 / c.ioutA);
    expectClose(c.duty2, Math.sqrt((k2 * m2 * m2) / (1 - m2)), { rtol: EXACT, what: 'buck DCM duty' });
    // boost M = ½ + √(¼ + D²/K) ⇒ D = √(K·M·(M − 1)), its load R = Vbus/iBus = Vbus²/Pout (lossless)
    const m1 = vbus / c.vinV;
    const k1 = (2 * c.components.L1.value * fsw) / ((vbus * vbus) / (12 * c.ioutA));
    expectClose(c.duty, Math.sqrt(k1 * m1 * (m1 - 1)), { rtol: EXACT, what: 'boost DCM duty' });
    expect(ev.cautions.map((x) => x.code)).toContain('light-load-dcm');
  });

  it('stays in forced CCM at light load with synchronous rectifiers', () => {
    const ev = evaluateCandidate(usbPd, params(500e3, 'sync'), ideal);
    const c = light(ev);
    expect(c.mode).toBe('ccm');
    expectClose(c.duty, 1 - c.vinV / ev.busV!, { rtol: EXACT, what: 'boost duty' });
    expectClose(c.duty2, 12 / ev.busV!, { rtol: EXACT, what: 'buck duty' });
    // the inductor current reverses in the valley (E&M ch. 5: a synchronous rectifier conducts both ways)
    expect(c.components.L2.iAvgA - c.components.L2.iPpA / 2).toBeLessThan(0);
  });

  it('warns about the boost RHP zero with the bus as its load, and about two loops', () => {
    const ev = evaluateCandidate(marine, params(400e3, 'sync'), ideal);
    const nom = full(ev).find((c) => c.label === 'vin-nom')!;
    const vbus = ev.busV!;
    const rBus = (vbus * vbus) / (12 * 2); // Vbus/iBus with iBus = Pout/Vbus (lossless)
    // E&M Table 8.2: boost ωz = D′²·R/L
    const fz = ((1 - nom.duty) ** 2 * rBus) / nom.components.L1.value / (2 * Math.PI);
    const rhp = ev.cautions.find((c) => c.code === 'rhp-zero')!;
    expectClose(rhp.value!, fz, { rtol: EXACT, what: 'RHP zero (Hz)' });
    const codes = ev.cautions.map((c) => c.code);
    expect(codes).toContain('cascade-two-loops');
    expect(codes).toContain('switching-loop');
  });
});
