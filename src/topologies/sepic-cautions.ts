/** Design cautions of the SEPIC family, each with its reason and numbers. */
import type { Design } from '../engine/design.ts';
import type { Caution } from '../engine/types.ts';
import { designDampingLeg } from '../parts/damping.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { formatSi } from '../units/format.ts';
import { rhpZeroCaution } from './rhp-zero.ts';
import type { SepicVariant } from './sepic-core.ts';
import type { OperatingScalars } from './topology.ts';

const part = (d: Design, name: string) => d.parts.find((p) => p.name === name);

export function sepicCautions(
  d: Design,
  spec: RailSpec,
  nominal: OperatingScalars,
  variant: SepicVariant,
): Caution[] {
  const out: Caution[] = [];
  const l1 = part(d, 'L1')?.value ?? 0;
  const l2 = part(d, 'L2')?.value ?? 0;
  const cs = part(d, 'Cs')?.value ?? 0;
  const loopL = l1 + l2;
  if (variant === 'separate' && cs > 0 && loopL > 0) {
    // An input step drives the series loop L1–Cs–L2: an undamped series LC rings to twice the step
    // (common practice); only winding and ESR resistance damp it.
    const leg = designDampingLeg(loopL, cs);
    const rSeries =
      (part(d, 'L1')?.dcrOhm ?? 0) + (part(d, 'L2')?.dcrOhm ?? 0) + (part(d, 'Cs')?.esrOhm ?? 0);
    const q = rSeries > 0 ? leg.r0Ohm / rSeries : Number.POSITIVE_INFINITY;
    const stepV = spec.step ? Math.abs(spec.step.toV - spec.step.fromV) : 0.5 * spec.input.nomV;
    out.push({
      code: 'resonant-overshoot',
      ...(Number.isFinite(q) ? { value: q } : {}),
      message:
        `Coupling network L1+L2 = ${formatSi(loopL, 'H')} with Cs = ${formatSi(cs, 'F')} resonates at ` +
        `${formatSi(leg.f0Hz, 'Hz')} (R0 = ${formatSi(leg.r0Ohm, 'Ω')}, Q ≈ ${Number.isFinite(q) ? q.toFixed(0) : '∞'} from ` +
        `winding and ESR resistance only): an input step of ${formatSi(stepV, 'V')} can ring Cs towards twice the step ` +
        `(≈ ${formatSi(2 * stepV, 'V')} of excursion). Remedy: a coupled inductor, or a damping leg ` +
        `Rd ≈ ${formatSi(leg.rdOhm, 'Ω')} in series with Cd ≈ ${formatSi(leg.cdF, 'F')} (≈ ${leg.n.toFixed(1)}·Cs) across Cs.`,
    });
  }
  if (variant === 'coupled') {
    out.push({
      code: 'coupled-equal-windings',
      value: d.coupling,
      message:
        `Both windings must have equal inductance (${formatSi(l1, 'H')} each, coupling k = ${d.coupling.toFixed(3)}); ` +
        'the coupling capacitor absorbs the leakage energy, so no snubber is needed, but winding mismatch steers the ripple into one winding.',
    });
  }
  // RHP zero: with a stiff coupling capacitor the SEPIC's small-signal model is that of a buck-boost
  // whose inductance is the one the switch current sees: Le = L1‖L2 for separate windings (the same Le
  // as its DCM analysis, Erickson & Maksimović ch. 5), and (1+k)·L/2 for equal coupled windings, whose
  // currents each ramp at v/((1+k)·L). Checked against the averaged model of the switched circuit.
  const lEff = variant === 'coupled' ? ((1 + d.coupling) * l1) / 2 : (l1 * l2) / (l1 + l2);
  const rLoad = spec.output.voltageV / spec.load.maxA;
  out.push(rhpZeroCaution(rLoad, nominal.duty, lEff, 'buck-boost'));
  out.push({
    code: 'switching-loop',
    message:
      'Keep the switching loop Q1 → Cs → rectifier → Cout → ground tight: its pulsating current sets the output ripple and ringing (common practice).',
  });
  return out;
}
