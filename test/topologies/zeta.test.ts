/**
 * The Zeta converter against textbook relations and the waveform engine's exact periodic steady state and
 * state-space average of the switched circuit (a slow, obvious reference that knows nothing of the closed
 * forms). No published numeric Zeta example was found (test/reference/WORKED-EXAMPLES.md, "Gap: Zeta"), so
 * the switched circuit carries the weight here.
 */
import { describe, expect, it } from 'vitest';
import { evaluateCandidate } from '../../src/engine/evaluate.ts';
import type { CandidateParams, CornerResult, Pins, RectifierKind } from '../../src/engine/types.ts';
import { loadTechnology } from '../../src/spec/load.ts';
import type { RailSpec } from '../../src/spec/rail-spec.ts';
import { couplingRhpZeroHz } from '../../src/topologies/coupling-cautions.ts';
import { averageModel, solvePeriodicSteadyState } from '../../src/waveform/index.ts';
import { expectClose } from '../support/expect-close.ts';
import { railSpec } from '../support/specs.ts';
import { demoSpecs, numeratorAt, zetaNetlist } from './buck-boost-family-netlists.ts';

const ideal = loadTechnology('ideal');
const tech = loadTechnology('default');
type Corner = CornerResult & { iinA: number };

/** Closed form vs exact switched circuit: the closed form holds capacitor voltages constant (named tolerance). */
const RTOL_VS_SIMULATION = 2e-3;
/** Ideal closed forms evaluated by the engine: only floating-point error. */
const RTOL_EXACT = 1e-9;
/** Averaged numerator of the switched netlist (1 µΩ switches, 10 MΩ off) vs the ideal polynomial. */
const RTOL_AVERAGED = 1e-5;

const L1 = 10e-6;
const L2 = 22e-6;
const CS = 100e-6;
const COUT = 470e-6;
const FSW = 300e3;
const PINS: Pins = { L1, L2, Cs: CS, Cout: COUT };

const positiveRail = (over: Parameters<typeof railSpec>[0] = {}): RailSpec =>
  railSpec({
    vin: [9, 12, 16],
    vout: 12,
    iout: 2,
    imin: 0.1,
    output: { voltageV: 12, polarity: 'positive' },
    ...over,
  });

function evaluate(spec: RailSpec, fswHz: number, rect: RectifierKind, t = ideal, pins: Pins = PINS) {
  const params: CandidateParams = { topology: 'zeta', fswHz, ripple: 0.3, rect };
  return evaluateCandidate(spec, params, t, pins);
}

describe('Zeta converter', () => {
  it('follows the ideal CCM relations at every full-load corner', () => {
    // M = D/(1−D) (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001, ch. 6);
    // VCs = Vout, IL1 = Iout·D/(1−D), IL2 = Iout, ΔIk = Vin·D/(fsw·Lk), ΔVcs = Iout·D/(fsw·Cs),
    // ΔVout = ΔIL2/(8·fsw·Cout), switch and rectifier block Vin + Vout: from memory (standard Zeta analysis,
    // the "Zeta ripple" row of test/reference/WORKED-EXAMPLES.md), confirmed by the switched circuit below.
    const ev = evaluate(positiveRail(), FSW, 'diode');
    for (const c of ev.corners.filter((x) => x.label !== 'light-load') as Corner[]) {
      const vin = c.vinV;
      const d = 12 / (vin + 12);
      const di1 = (vin * d) / (L1 * FSW);
      const di2 = (vin * d) / (L2 * FSW);
      const il1 = (2 * d) / (1 - d);
      expect(c.mode).toBe('ccm');
      expectClose(c.duty, d, { rtol: RTOL_EXACT, what: `${c.label} duty` });
      expectClose(c.components.L1.iAvgA, il1, { rtol: RTOL_EXACT, what: `${c.label} IL1` });
      expectClose(c.components.L2.iAvgA, 2, { rtol: RTOL_EXACT, what: `${c.label} IL2` });
      expectClose(c.iinA, il1, { rtol: RTOL_EXACT, what: `${c.label} input current = IL1` });
      expectClose(c.components.Q1.iPeakA, il1 + 2 + (di1 + di2) / 2, {
        rtol: RTOL_EXACT,
        what: `${c.label} switch peak`,
      });
      expectClose(c.components.D1.iAvgA, 2, { rtol: RTOL_EXACT, what: `${c.label} rectifier average` });
      for (const n of ['Q1', 'D1']) {
        expectClose(c.components[n].vPeakV, vin + 12, {
          rtol: RTOL_EXACT,
          what: `${c.label} ${n} voltage Vin + Vout`,
        });
      }
      expectClose(c.components.Cs.vPeakV, 12, { rtol: RTOL_EXACT, what: `${c.label} Cs voltage Vout` });
      expectClose(c.components.Cs.vPpV, (2 * d) / (FSW * CS), { rtol: RTOL_EXACT, what: `${c.label} ΔVcs` });
      expectClose(c.components.Cout.vPpV, di2 / (8 * FSW * COUT), {
        rtol: RTOL_EXACT,
        what: `${c.label} ΔVout`,
      });
      // pulsating input current: the input is the switch current, average D·Isw = IL1
      expectClose(c.components.Q1.iAvgA, il1, { rtol: RTOL_EXACT, what: `${c.label} switch average` });
      expect(c.components.Cin.iRmsA).toBeGreaterThan(0.5 * il1);
    }
    expect(ev.cautions.some((x) => x.code === 'pulsating-input')).toBe(true);
  });

  for (const rect of ['diode', 'sync'] as const) {
    it(`solves the loss-inclusive duty that the switched circuit needs for the output (${rect})`, () => {
      const rectPins: Pins = rect === 'diode' ? { 'D1.vf': 0.4, 'D1.rd': 0.05 } : { 'Q2.ron': 0.05 };
      const pins: Pins = {
        ...PINS,
        'Q1.ron': 0.03,
        Rsense: 0.02,
        'L1.dcr': 0.04,
        'L2.dcr': 0.06,
        ...rectPins,
      };
      const ev = evaluate(positiveRail(), FSW, rect, tech, pins);
      for (const c of ev.corners as Corner[]) {
        const ss = solvePeriodicSteadyState(
          zetaNetlist({
            vinV: c.vinV,
            duty: c.duty,
            fswHz: FSW,
            l1H: L1,
            l2H: L2,
            csF: CS,
            coutF: COUT,
            rLoadOhm: 12 / c.ioutA,
            rqOhm: 0.05,
            vfV: rect === 'diode' ? 0.4 : 0,
            rrOhm: 0.05,
            dcr1Ohm: 0.04,
            dcr2Ohm: 0.06,
            sync: rect === 'sync',
          }),
        );
        const m = ss.metrics;
        expectClose(m['node(out)'].avg, 12, {
          rtol: RTOL_VS_SIMULATION,
          what: `${c.label} Vout of the circuit`,
        });
        expectClose(m['v(Cs)'].avg, c.components.Cs.vPeakV, {
          rtol: RTOL_VS_SIMULATION,
          what: `${c.label} VCs`,
        });
        expectClose(m['i(L2)'].max, c.components.L2.iPeakA, {
          rtol: RTOL_VS_SIMULATION,
          what: `${c.label} L2 peak`,
        });
        if (c.label !== 'light-load') {
          // the averaged input current leaves out the ripple part of I²R (booked apart as loss)
          expectClose(-m['i(Vin)'].avg, c.iinA, {
            rtol: 5 * RTOL_VS_SIMULATION,
            what: `${c.label} input current`,
          });
        }
      }
    });
  }

  it('enters DCM at light load with the diode, at D = M·√K with Le = L1‖L2', () => {
    // Erickson & Maksimović, 2nd ed., ch. 5 (M = D/√K, K = 2L/(R·Tsw)), with the parallel inductance of the
    // Ćuk/SEPIC DCM analysis: in the Zeta too both windings see the same voltage in each interval.
    const ev = evaluate(positiveRail(), FSW, 'diode');
    const c = ev.corners.find((x) => x.label === 'light-load') as Corner;
    const le = (L1 * L2) / (L1 + L2);
    const k = (2 * le * FSW) / (12 / c.ioutA);
    expect(c.mode).toBe('dcm');
    expectClose(c.duty, (12 / c.vinV) * Math.sqrt(k), { rtol: RTOL_EXACT, what: 'DCM duty' });
    const ss = solvePeriodicSteadyState(
      zetaNetlist({
        vinV: c.vinV,
        duty: c.duty,
        fswHz: FSW,
        l1H: L1,
        l2H: L2,
        csF: CS,
        coutF: COUT,
        rLoadOhm: 12 / c.ioutA,
      }),
    );
    expect(ss.hasDiodeEvents).toBe(true);
    expectClose(ss.metrics['node(out)'].avg, 12, {
      rtol: RTOL_VS_SIMULATION,
      what: 'DCM Vout of the circuit',
    });
    expectClose(-ss.metrics['i(Vin)'].avg, c.iinA, { rtol: RTOL_VS_SIMULATION, what: 'DCM input current' });
    expectClose(ss.metrics['i(S1)'].max, c.components.Q1.iPeakA, {
      rtol: RTOL_VS_SIMULATION,
      what: 'DCM switch peak',
    });
  });

  it('stays in forced CCM with the synchronous rectifier', () => {
    const c = evaluate(positiveRail(), FSW, 'sync').corners.find((x) => x.label === 'light-load')!;
    expect(c.mode).toBe('ccm');
    expectClose(c.duty, 12 / (c.vinV + 12), { rtol: RTOL_EXACT, what: 'forced-CCM duty' });
  });

  it('has the pair of RHP zeros its caution names, in the averaged switched circuit', () => {
    // Derived in src/topologies/coupling-cautions.ts: N(s) ∝ L1·Cs·s² − (L1·D²/(D′R))·s + D′, the same
    // polynomial as the Ćuk's.
    // Reference: numerical state-space averaging of the switched netlist (Middlebrook & Ćuk 1976;
    // Erickson & Maksimović, 2nd ed., ch. 7), its control-to-output numerator evaluated directly.
    const d = 0.4;
    const r = 6;
    for (const cs of [10e-6, 1e-9]) {
      // synchronous rectifier: the circuit stays in CCM even with the huge Cs ripple of the 1 nF case
      const netlist = zetaNetlist({
        vinV: 12,
        duty: d,
        fswHz: FSW,
        l1H: L1,
        l2H: L2,
        csF: cs,
        coutF: 47e-6,
        rLoadOhm: r,
        sync: true,
      });
      const model = averageModel(netlist, { control: ['q'] });
      const n0 = numeratorAt(model, 'node(out)', 0);
      const poly = (s: number) => (L1 * cs * s * s - ((L1 * d * d) / ((1 - d) * r)) * s + (1 - d)) / (1 - d);
      const wz = 2 * Math.PI * couplingRhpZeroHz(r, d, L1, cs);
      for (const k of [0.3, 1, 3]) {
        expectClose(numeratorAt(model, 'node(out)', k * wz) / n0, poly(k * wz), {
          rtol: RTOL_AVERAGED,
          atol: RTOL_AVERAGED,
          what: `N(${k}·ωz)/N(0), Cs ${cs}`,
        });
      }
      if (cs < 1e-8) expect(Math.abs(numeratorAt(model, 'node(out)', wz) / n0)).toBeLessThan(1e-4); // real pair: a root
    }
    const ev = evaluate(positiveRail(), FSW, 'diode');
    const nom = ev.corners.find((c) => c.label === 'vin-nom')!;
    const caution = ev.cautions.find((c) => c.code === 'rhp-zero')!;
    expectClose(caution.value!, couplingRhpZeroHz(6, nom.duty, L1, CS), {
      rtol: RTOL_EXACT,
      what: 'caution value',
    });
  });

  it('cautions that the L1–Cs–L2 loop rings, with Q = R0 / series resistance', () => {
    // the step reaches the loop through the switch, scaled by the duty (averaged-switch view)
    // series RLC: f0 = 1/(2π√(LC)), Q = √(L/C)/R (common practice)
    const pins: Pins = { ...PINS, 'L1.dcr': 0.04, 'L2.dcr': 0.06, 'Cs.esr': 0.01 };
    const ev = evaluate(positiveRail(), FSW, 'diode', tech, pins);
    const ring = ev.cautions.find((c) => c.code === 'resonant-overshoot')!;
    expectClose(ring.value!, Math.sqrt((L1 + L2) / CS) / 0.11, {
      rtol: RTOL_EXACT,
      what: 'Q of the coupling loop',
    });
    expect(ring.message).toContain('2.81 kHz'); // 1/(2π√(32 µH · 100 µF)) = 2.813 kHz
  });

  it('evaluates every corner of the four demo specs, flagging only the polarity of the negative one', () => {
    for (const { file, spec } of demoSpecs()) {
      for (const rect of ['diode', 'sync'] as const) {
        const ev = evaluate(spec, 400e3, rect, tech, {});
        for (const c of ev.corners) {
          expect(c.voutV, file).toBe(spec.output.voltageV);
          expect(c.efficiency, `${file} ${c.label}`).toBeGreaterThan(0.3);
          expect(c.efficiency, `${file} ${c.label}`).toBeLessThanOrEqual(1);
          expect(c.duty, `${file} ${c.label}`).toBeGreaterThan(0);
          expect(c.duty, `${file} ${c.label}`).toBeLessThan(1);
          for (const [name, s] of Object.entries(c.components)) {
            for (const v of Object.values(s))
              expect(Number.isFinite(v), `${file} ${c.label} ${name}`).toBe(true);
          }
        }
        expect(
          ev.reasons.some((r) => r.code === 'polarity-mismatch'),
          file,
        ).toBe(spec.output.polarity === 'negative');
      }
    }
  });
});
