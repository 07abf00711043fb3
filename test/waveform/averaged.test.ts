import { describe, expect, it } from 'vitest';
import { averageModel } from '../../src/waveform/averaged.ts';
import { SimulationError } from '../../src/waveform/errors.ts';
import { frequencyResponse, logFrequencyGrid } from '../../src/waveform/small-signal.ts';
import { expectClose } from './close.ts';
import { boostNetlist } from './netlists.ts';

/**
 * Boost small-signal model, Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001,
 * ch. 8 (Table 8.2):
 *   G_vd(s) = (V/D′)·(1 − s/ωz) / (1 + s/(Q·ω0) + (s/ω0)²),  G_vg(s) = (1/D′) / (same denominator),
 *   ωz = D′²R/L (right half-plane), ω0 = D′/√(LC), Q = D′R·√(C/L).
 * The near-ideal netlist (1 µΩ on, 10 MΩ off, no ESR/DCR/drop) makes these exact to ~1e-6.
 */
const RTOL_TEXTBOOK = 1e-3;

describe('averaged model of a boost', () => {
  const [vin, d, fsw, l, c, r] = [12, 0.6, 100e3, 50e-6, 100e-6, 20];
  const dp = 1 - d;
  const v = vin / dp;
  const wz = (dp * dp * r) / l;
  const w0 = dp / Math.sqrt(l * c);
  const q = dp * r * Math.sqrt(c / l);
  const model = averageModel(boostNetlist({ vinV: vin, duty: d, fswHz: fsw, lH: l, cF: c, rOhm: r }));
  const den = (w: number) => ({ re: 1 - (w / w0) ** 2, im: w / (q * w0) });
  const div = (a: { re: number; im: number }, b: { re: number; im: number }) => {
    const m2 = b.re * b.re + b.im * b.im;
    return { re: (a.re * b.re + a.im * b.im) / m2, im: (a.im * b.re - a.re * b.im) / m2 };
  };

  it('puts the operating point at V = Vin/D′, I_L = V/(D′R) (ch. 2)', () => {
    expectClose(model.x[model.stateNames.indexOf('Cout')], v, { rtol: RTOL_TEXTBOOK }, 'V');
    expectClose(model.x[model.stateNames.indexOf('L1')], v / (dp * r), { rtol: RTOL_TEXTBOOK }, 'I_L');
  });

  it('has its double pole at ω0 = D′/√(LC): det(A) = ω0² for the two-state model', () => {
    const [a11, a12, a21, a22] = model.a;
    expectClose(Math.sqrt(a11 * a22 - a12 * a21), w0, { rtol: RTOL_TEXTBOOK }, 'ω0');
  });

  it('has its control-to-output zero in the right half-plane at ωz = D′²R/L', () => {
    // Numerator of c·(sI − A)⁻¹·b_d for two states: c·adj(sI − A)·b_d = n1·s + n0; zero at s = −n0/n1.
    const [a11, a12, a21, a22] = model.a;
    const k = model.outputNames.indexOf('node(out)');
    const [c1, c2] = model.c.subarray(2 * k, 2 * k + 2);
    const [b1, b2] = model.bd;
    const n1 = c1 * b1 + c2 * b2;
    const n0 = c1 * (-a22 * b1 + a12 * b2) + c2 * (a21 * b1 - a11 * b2);
    expect(model.ed[k]).toBeCloseTo(0, 9);
    expectClose(-n0 / n1, wz, { rtol: RTOL_TEXTBOOK }, 'ωz');
  });

  it('matches G_vd(jω) in magnitude and phase from a decade below ω0 to a decade above ωz', () => {
    const f = logFrequencyGrid(w0 / (2 * Math.PI) / 10, (10 * wz) / (2 * Math.PI), 40);
    const h = frequencyResponse(model, 'duty', 'node(out)', f);
    f.forEach((fHz, i) => {
      const w = 2 * Math.PI * fHz;
      const ref = div({ re: v / dp, im: (-(v / dp) * w) / wz }, den(w));
      const err = Math.hypot(h.re[i] - ref.re, h.im[i] - ref.im) / Math.hypot(ref.re, ref.im);
      expect(err, `at ${fHz} Hz`).toBeLessThan(RTOL_TEXTBOOK);
    });
    const dc = frequencyResponse(model, 'duty', 'node(out)', [0.01]);
    expectClose(dc.magDb[0], 20 * Math.log10(v / dp), { atol: 0.01 }, 'G_d0 in dB');
    expectClose(dc.phaseDeg[0], 0, { atol: 0.01 }, 'phase at DC');
    // Two poles and a right-half-plane zero: the phase falls toward −270°, not −90°.
    expect(h.phaseDeg[h.phaseDeg.length - 1]).toBeLessThan(-250);
  });

  it('matches the line-to-output G_vg(jω) = (1/D′)/den', () => {
    const f = logFrequencyGrid(10, 100e3, 20);
    const h = frequencyResponse(model, 'Vin', 'node(out)', f);
    f.forEach((fHz, i) => {
      const ref = div({ re: 1 / dp, im: 0 }, den(2 * Math.PI * fHz));
      const err = Math.hypot(h.re[i] - ref.re, h.im[i] - ref.im) / Math.hypot(ref.re, ref.im);
      expect(err, `at ${fHz} Hz`).toBeLessThan(RTOL_TEXTBOOK);
    });
    // Resonant peak ≈ Q/D′ near ω0 (Q = 11.3 here).
    const peak = Math.max(...h.magDb);
    expectClose(peak, 20 * Math.log10(q / dp), { atol: 0.2 }, 'peak dB');
  });

  it('refuses to average a steady state with diode events (DCM)', () => {
    const dcm = boostNetlist({ vinV: 12, duty: 0.4, fswHz: 100e3, lH: 10e-6, cF: 100e-6, rOhm: 400 });
    try {
      averageModel(dcm);
      expect.unreachable('DCM must be refused');
    } catch (e) {
      expect(e).toBeInstanceOf(SimulationError);
      expect((e as SimulationError).code).toBe('averaging-requires-ccm');
    }
  });
});
