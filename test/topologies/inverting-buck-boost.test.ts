/**
 * The inverting buck-boost against textbook relations, a published worked example and the waveform
 * engine's exact periodic steady state of the switched circuit (a slow, obvious reference that knows
 * nothing of the closed forms).
 */
import { describe, expect, it } from 'vitest';
import { evaluateCandidate } from '../../src/engine/evaluate.ts';
import type { CandidateParams, CornerResult, Pins, RectifierKind } from '../../src/engine/types.ts';
import { loadTechnology } from '../../src/spec/load.ts';
import type { RailSpec } from '../../src/spec/rail-spec.ts';
import { rhpZeroHz } from '../../src/topologies/rhp-zero.ts';
import { averageModel, solvePeriodicSteadyState } from '../../src/waveform/index.ts';
import { WORKED_EXAMPLES } from '../reference/worked-examples.ts';
import { expectClose } from '../support/expect-close.ts';
import { railSpec } from '../support/specs.ts';
import { demoSpecs, invertingNetlist, numeratorAt } from './buck-boost-family-netlists.ts';

const ideal = loadTechnology('ideal');
const tech = loadTechnology('default');
type Corner = CornerResult & { iinA: number };

/** Closed form vs exact switched circuit: the closed form holds capacitor voltages constant (named tolerance). */
const RTOL_VS_SIMULATION = 2e-3;
/** Ideal closed forms evaluated by the engine: only floating-point error. */
const RTOL_EXACT = 1e-9;

const negativeRail = (over: Parameters<typeof railSpec>[0] = {}): RailSpec =>
  railSpec({
    vin: [9, 12, 16],
    vout: 12,
    iout: 2,
    imin: 0.1,
    output: { voltageV: 12, polarity: 'negative' },
    ...over,
  });

function evaluate(spec: RailSpec, fswHz: number, rect: RectifierKind, t = ideal, pins: Pins = {}) {
  const params: CandidateParams = { topology: 'inverting-buck-boost', fswHz, ripple: 0.3, rect };
  return evaluateCandidate(spec, params, t, pins);
}

describe('inverting buck-boost', () => {
  it('reproduces Rashid Ex. 5.7 (buck-boost regulator) on the ideal technology', () => {
    // Rashid, Power Electronics: Devices, Circuits, and Applications, 4th ed., Pearson 2014, Ex. 5.7
    const ex = WORKED_EXAMPLES.find((e) => e.id === 'rashid4-ex5.7-inverting')!;
    const { vinV, fswHz, l1H, coutF, ioutA, duty } = ex.inputs;
    const spec = railSpec({ vin: vinV, iout: ioutA, output: { voltageV: 4, polarity: 'negative' } });
    const c = evaluate(spec, fswHz, 'diode', ideal, { L1: l1H, Cout: coutF }).corners[0] as Corner;
    const e = ex.expected;
    const tol = ex.precision;
    expectClose(c.duty, duty, { rtol: RTOL_EXACT, what: 'duty k' });
    expectClose(c.voutV, e.voutV, { rtol: tol.voutV, what: 'Vout' });
    expectClose(c.components.Cout.vPpV, e.coutVPpV, { rtol: tol.coutVPpV, what: 'output ripple Ia·k/(f·C)' });
    expectClose(c.components.L1.iPpA, e.il1PpA, { rtol: tol.il1PpA, what: 'ΔI = Vs·k/(f·L)' });
    expectClose(c.iinA, e.iinAvgA, { rtol: tol.iinAvgA, what: 'Is = Ia·k/(1−k)' });
    expectClose(c.components.Q1.iPeakA, e.qPeakA, { rtol: tol.qPeakA, what: 'switch peak Is/k + ΔI/2' });
  });

  it('follows the ideal CCM relations at every full-load corner', () => {
    // Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001, ch. 2 (buck-boost):
    // M = −D/(1−D), IL = Iout/(1−D), ΔI = Vin·D/(L·fsw); switch and rectifier block Vin + |Vout|;
    // output ripple (charge part) Iout·D/(fsw·C) while the rectifier current stays above Iout (Rashid Ex. 5.7 form).
    const fsw = 300e3;
    const l = 10e-6;
    const cout = 470e-6;
    const ev = evaluate(negativeRail(), fsw, 'diode', ideal, { L1: l, Cout: cout });
    for (const c of ev.corners.filter((x) => x.label !== 'light-load') as Corner[]) {
      const vin = c.vinV;
      const d = 12 / (vin + 12);
      const il = 2 / (1 - d);
      const di = (vin * d) / (l * fsw);
      expect(c.mode).toBe('ccm');
      expect(c.voutV).toBe(-12);
      expectClose(c.duty, d, { rtol: RTOL_EXACT, what: `${c.label} duty` });
      expectClose(c.components.L1.iAvgA, il, { rtol: RTOL_EXACT, what: `${c.label} IL` });
      expectClose(c.components.L1.iPpA, di, { rtol: RTOL_EXACT, what: `${c.label} ΔIL` });
      expectClose(c.components.Q1.iPeakA, il + di / 2, { rtol: RTOL_EXACT, what: `${c.label} switch peak` });
      expectClose(c.components.D1.iAvgA, 2, {
        rtol: RTOL_EXACT,
        what: `${c.label} rectifier average = Iout`,
      });
      expectClose(c.iinA, d * il, { rtol: RTOL_EXACT, what: `${c.label} input current` });
      expectClose(c.components.Q1.vPeakV, vin + 12, { rtol: RTOL_EXACT, what: `${c.label} switch voltage` });
      expectClose(c.components.D1.vPeakV, vin + 12, {
        rtol: RTOL_EXACT,
        what: `${c.label} rectifier voltage`,
      });
      expect(il - di / 2).toBeGreaterThan(2); // precondition of the ripple formula below
      expectClose(c.components.Cout.vPpV, (2 * d) / (fsw * cout), {
        rtol: RTOL_EXACT,
        what: `${c.label} ΔVout`,
      });
    }
  });

  for (const rect of ['diode', 'sync'] as const) {
    it(`solves the loss-inclusive duty that the switched circuit needs for the output (${rect})`, () => {
      const fsw = 300e3;
      const rectPins: Pins = rect === 'diode' ? { 'D1.vf': 0.4, 'D1.rd': 0.05 } : { 'Q2.ron': 0.05 };
      const pins: Pins = {
        L1: 10e-6,
        Cout: 470e-6,
        'Q1.ron': 0.03,
        Rsense: 0.02,
        'L1.dcr': 0.04,
        ...rectPins,
      };
      const ev = evaluate(negativeRail(), fsw, rect, tech, pins);
      for (const c of ev.corners as Corner[]) {
        // the same duty drives the netlist with the same drops; its exact steady state must reach −12 V
        const ss = solvePeriodicSteadyState(
          invertingNetlist({
            vinV: c.vinV,
            duty: c.duty,
            fswHz: fsw,
            l1H: 10e-6,
            coutF: 470e-6,
            rLoadOhm: 12 / c.ioutA,
            rqOhm: 0.05,
            vfV: rect === 'diode' ? 0.4 : 0,
            rrOhm: 0.05,
            dcr1Ohm: 0.04,
            sync: rect === 'sync',
          }),
        );
        expectClose(ss.metrics['node(out)'].avg, -12, {
          rtol: RTOL_VS_SIMULATION,
          what: `${c.label} Vout of the circuit`,
        });
        // the averaged model leaves out the ripple part of I²R (booked apart as loss), which dominates
        // only at light load with forced CCM: compare currents at full load
        if (c.label !== 'light-load') {
          expectClose(-ss.metrics['i(Vin)'].avg, c.iinA, {
            rtol: 5 * RTOL_VS_SIMULATION,
            what: `${c.label} input current`,
          });
          expectClose(ss.metrics['i(L1)'].max, c.components.L1.iPeakA, {
            rtol: RTOL_VS_SIMULATION,
            what: `${c.label} inductor peak`,
          });
        }
      }
    });
  }

  it('enters DCM at light load with the diode, at D = M·√K, K = 2·L·fsw/R', () => {
    // Erickson & Maksimović, 2nd ed., ch. 5, Table 5.2 (buck-boost): M = D/√K in DCM; K = 2L/(R·Tsw).
    const l = 10e-6;
    const fsw = 300e3;
    const ev = evaluate(negativeRail(), fsw, 'diode', ideal, { L1: l, Cout: 470e-6 });
    const c = ev.corners.find((x) => x.label === 'light-load') as Corner;
    const m = 12 / c.vinV;
    const k = (2 * l * fsw) / (12 / c.ioutA);
    expect(c.mode).toBe('dcm');
    expectClose(c.duty, m * Math.sqrt(k), { rtol: RTOL_EXACT, what: 'DCM duty' });
    expect(c.components.L1.iPeakA).toBeCloseTo((c.vinV * c.duty) / (l * fsw), 9);
    const ss = solvePeriodicSteadyState(
      invertingNetlist({
        vinV: c.vinV,
        duty: c.duty,
        fswHz: fsw,
        l1H: l,
        coutF: 470e-6,
        rLoadOhm: 12 / c.ioutA,
      }),
    );
    expect(ss.hasDiodeEvents).toBe(true); // the circuit agrees: the diode turns off before the period ends
    expectClose(ss.metrics['node(out)'].avg, -12, {
      rtol: RTOL_VS_SIMULATION,
      what: 'DCM Vout of the circuit',
    });
    expect(ev.cautions.some((x) => x.code === 'light-load-dcm')).toBe(true);
  });

  it('stays in forced CCM with the synchronous rectifier, its inductor current going negative', () => {
    const ev = evaluate(negativeRail(), 300e3, 'sync', ideal, { L1: 10e-6, Cout: 470e-6 });
    const c = ev.corners.find((x) => x.label === 'light-load')!;
    expect(c.mode).toBe('ccm');
    expectClose(c.duty, 12 / (c.vinV + 12), { rtol: RTOL_EXACT, what: 'forced-CCM duty' });
    expect(c.components.L1.iAvgA - c.components.L1.iPpA / 2).toBeLessThan(0);
  });

  it('reports the duty ceiling and the minimum on-time at 2 MHz', () => {
    // default preset: max duty 0.9, min off-time 150 ns, min on-time 100 ns (data/technology/default.json)
    const low = evaluate(negativeRail({ vin: [4, 6, 8] }), 2e6, 'diode', tech);
    const high = low.reasons.find((r) => r.code === 'duty-above-max' && r.corner === 'vin-min')!;
    expect(high.limit).toBeCloseTo(1 - 150e-9 * 2e6, 9);
    expect(high.value).toBeGreaterThan(12 / 16); // ideal duty at 4 V, drops make it larger
    const lowDuty = evaluate(
      negativeRail({ vin: [40, 50, 60], vout: 3.3, output: { voltageV: 3.3, polarity: 'negative' } }),
      2e6,
      'diode',
      tech,
    );
    const short = lowDuty.reasons.find((r) => r.code === 'duty-below-min-on-time' && r.corner === 'vin-max')!;
    expect(short.limit).toBeCloseTo(100e-9 * 2e6, 9);
    expect(low.feasible).toBe(false);
  });

  it('places the RHP zero of its caution where the averaged switched circuit has it', () => {
    // Erickson & Maksimović, 2nd ed., ch. 8, Table 8.2: buck-boost ωz = D′²·R/(D·L)
    const l = 10e-6;
    const ev = evaluate(negativeRail(), 300e3, 'diode', ideal, { L1: l, Cout: 470e-6 });
    const nom = ev.corners.find((c) => c.label === 'vin-nom')!;
    const fz = ev.cautions.find((c) => c.code === 'rhp-zero')!.value!;
    expectClose(fz, rhpZeroHz(6, nom.duty, l, 'buck-boost'), { rtol: RTOL_EXACT, what: 'caution value' });
    const model = averageModel(
      invertingNetlist({ vinV: 12, duty: nom.duty, fswHz: 300e3, l1H: l, coutF: 470e-6, rLoadOhm: 6 }),
    );
    const n0 = numeratorAt(model, 'node(out)', 0);
    expect(Math.abs(numeratorAt(model, 'node(out)', 2 * Math.PI * fz) / n0)).toBeLessThan(1e-4);
  });

  it('evaluates every corner of the four demo specs, flagging only the polarity of positive ones', () => {
    for (const { file, spec } of demoSpecs()) {
      for (const rect of ['diode', 'sync'] as const) {
        const ev = evaluate(spec, 400e3, rect, tech);
        for (const c of ev.corners) {
          expect(c.voutV, file).toBe(-spec.output.voltageV);
          expect(c.efficiency, `${file} ${c.label}`).toBeGreaterThan(0.3);
          expect(c.efficiency, `${file} ${c.label}`).toBeLessThanOrEqual(1);
          expect(c.duty, `${file} ${c.label}`).toBeGreaterThan(0);
          expect(c.duty, `${file} ${c.label}`).toBeLessThan(1);
          for (const [name, s] of Object.entries(c.components)) {
            for (const v of Object.values(s))
              expect(Number.isFinite(v), `${file} ${c.label} ${name}`).toBe(true);
          }
        }
        const mismatch = ev.reasons.some((r) => r.code === 'polarity-mismatch');
        expect(mismatch, file).toBe(spec.output.polarity === 'positive');
      }
    }
  });
});
