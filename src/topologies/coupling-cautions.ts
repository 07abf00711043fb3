/**
 * Cautions of the Ćuk and Zeta stages: the resonance of their coupling network and their pair of
 * right-half-plane zeros.
 *
 * RHP zeros, derived here by state-space averaging (Erickson & Maksimović, Fundamentals of Power
 * Electronics, 2nd ed., Springer 2001, ch. 7; Middlebrook & Ćuk, IEEE PESC 1976) of the ideal CCM stage
 * with states iL1, vCs, iL2, vout. Both the Ćuk and the Zeta give a control-to-output numerator
 *   N(s) ∝ L1·Cs·s² − (L1·D²/(D′·R))·s + D′        (R = |Vout|/Iout, D′ = 1−D)
 * whose two roots both lie in the right half plane: complex when (L1·D²/(D′R))² < 4·L1·Cs·D′ (the usual
 * case), at |s| = √(D′/(L1·Cs)), near the L1–Cs resonance; real otherwise, the lower one tending to
 * D′²·R/(D²·L1) when Cs is small. L2 does not appear. test/topologies/cuk.test.ts checks the roots against
 * a numerical average of the switched state equations.
 */
import type { Design } from '../engine/design.ts';
import type { Caution } from '../engine/types.ts';
import { designDampingLeg } from '../parts/damping.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { formatSi } from '../units/format.ts';

/** Magnitude (Hz) of the lower RHP zero of the Ćuk / Zeta control-to-output transfer function (see header). */
export function couplingRhpZeroHz(rLoadOhm: number, duty: number, l1H: number, csF: number): number {
  const dp = 1 - duty;
  const a = l1H * csF;
  const b = (l1H * duty * duty) / (dp * rLoadOhm);
  const c = dp;
  const disc = b * b - 4 * a * c;
  // complex pair: |s|² = c/a; real pair: the smaller root, in the cancellation-free form 2c/(b + √disc)
  const w = disc < 0 ? Math.sqrt(c / a) : (2 * c) / (b + Math.sqrt(disc));
  return w / (2 * Math.PI);
}

export function couplingRhpZeroCaution(rLoadOhm: number, duty: number, l1H: number, csF: number): Caution {
  const fz = couplingRhpZeroHz(rLoadOhm, duty, l1H, csF);
  return {
    code: 'rhp-zero',
    value: fz,
    message:
      `A pair of right-half-plane zeros near ${formatSi(fz, 'Hz')} (set by L1 = ${formatSi(l1H, 'H')} and ` +
      `Cs = ${formatSi(csF, 'F')} at full load and nominal input, duty ${(duty * 100).toFixed(0)} %): hold the loop ` +
      `crossover below about ${formatSi(fz / 5, 'Hz')}–${formatSi(fz / 3, 'Hz')} (a fifth to a third of it), or damp Cs.`,
  };
}

const part = (d: Design, name: string) => d.parts.find((p) => p.name === name);

/**
 * The series loop L1–Cs–L2 (closed through the input or ground and the output capacitor) rings when a
 * step reaches it; only winding and ESR resistance damp it, so it can ring the coupling capacitor towards
 * twice the step it sees (common practice, as for the SEPIC in sepic-cautions.ts). `stepShare` is the
 * part of the input step that reaches the loop (1 for the Ćuk, whose L1 takes the input directly; the
 * duty for the Zeta, whose input reaches the network only through the switch: averaged-switch view).
 */
export function couplingResonanceCaution(
  d: Design,
  spec: RailSpec,
  stepShare: number,
  entry: string,
): Caution | undefined {
  const l1 = part(d, 'L1')?.value ?? 0;
  const l2 = part(d, 'L2')?.value ?? 0;
  const cs = part(d, 'Cs')?.value ?? 0;
  const loopL = l1 + l2;
  if (!(cs > 0 && loopL > 0)) return undefined;
  const leg = designDampingLeg(loopL, cs);
  const rSeries = (part(d, 'L1')?.dcrOhm ?? 0) + (part(d, 'L2')?.dcrOhm ?? 0) + (part(d, 'Cs')?.esrOhm ?? 0);
  const q = rSeries > 0 ? leg.r0Ohm / rSeries : Number.POSITIVE_INFINITY;
  const stepV = (spec.step ? Math.abs(spec.step.toV - spec.step.fromV) : 0.5 * spec.input.nomV) * stepShare;
  return {
    code: 'resonant-overshoot',
    value: q,
    message:
      `Coupling network L1+L2 = ${formatSi(loopL, 'H')} with Cs = ${formatSi(cs, 'F')} resonates at ` +
      `${formatSi(leg.f0Hz, 'Hz')} (R0 = ${formatSi(leg.r0Ohm, 'Ω')}, Q ≈ ${Number.isFinite(q) ? q.toFixed(0) : '∞'} from ` +
      `winding and ESR resistance only). An input step reaches it ${entry} (≈ ${formatSi(stepV, 'V')}) and can ring Cs ` +
      `towards twice that (≈ ${formatSi(2 * stepV, 'V')} of excursion). Remedy: a damping leg ` +
      `Rd ≈ ${formatSi(leg.rdOhm, 'Ω')} in series with Cd ≈ ${formatSi(leg.cdF, 'F')} (≈ ${leg.n.toFixed(1)}·Cs) across Cs, or a slower loop.`,
  };
}
