/**
 * Human-readable part list of a sized design with suggested minimum ratings: voltage rating from the
 * peak voltage over the technology's derating, current rating from the worst-corner peak (switches,
 * inductors: saturation) or RMS (capacitors) current with a 20 % margin (common practice).
 */
import type { Technology } from '../parts/technology.ts';
import { formatSi } from '../units/format.ts';
import type { Design } from './design.ts';
import type { CornerResult, PartSummary } from './types.ts';

export const CURRENT_RATING_MARGIN = 1.2;

export function summarizeParts(d: Design, tech: Technology, corners: CornerResult[]): PartSummary[] {
  return d.parts.map((p) => {
    const vPk = Math.max(0, ...corners.map((c) => c.components[p.name]?.vPeakV ?? 0));
    const iPk = Math.max(0, ...corners.map((c) => c.components[p.name]?.iPeakA ?? 0));
    const iRms = Math.max(0, ...corners.map((c) => c.components[p.name]?.iRmsA ?? 0));
    const base = { name: p.name, role: p.role, count: p.units, volumeMm3: p.volumeMm3 };
    switch (p.role) {
      case 'switch':
      case 'sync':
        return {
          ...base,
          value: p.ronOhm,
          unit: 'Ω',
          detail: `${p.ratedV} V class MOSFET, ${p.areaMm2.toFixed(1)} mm² die, Ron ${formatSi(p.ronOhm, 'Ω')} hot, Qg ${formatSi(p.qgC, 'C')}`,
          ratingV: vPk / tech.mosfet.voltageDerating,
          ratingA: iPk * CURRENT_RATING_MARGIN,
        };
      case 'diode':
        return {
          ...base,
          value: p.vfV,
          unit: 'V',
          detail: `${p.ratedV} V Schottky-class rectifier, ${p.ratedA.toFixed(1)} A average rating, Vf ${p.vfV.toFixed(2)} V`,
          ratingV: vPk / tech.diode.voltageDerating,
          ratingA: iPk * CURRENT_RATING_MARGIN,
        };
      case 'inductor':
      case 'coupled-inductor':
        return {
          ...base,
          value: p.value,
          unit: 'H',
          detail:
            p.units === 0
              ? `second winding of the coupled part, DCR ${formatSi(p.dcrOhm, 'Ω')}`
              : `${p.role === 'coupled-inductor' ? 'two-winding coupled inductor' : 'inductor'}, DCR ${formatSi(p.dcrOhm, 'Ω')}, ≈ ${p.volumeMm3.toFixed(0)} mm³`,
          ratingA: iPk * CURRENT_RATING_MARGIN,
        };
      case 'capacitor':
        return {
          ...base,
          value: p.value,
          unit: 'F',
          detail: `${p.units} × ${formatSi(p.units > 0 ? p.nominalF / p.units : 0, 'F')} ${p.ratedV} V ceramic (effective ${formatSi(p.value, 'F')} at DC bias), ESR ${formatSi(p.esrOhm, 'Ω')}`,
          ratingV: vPk / tech.capacitor.voltageDerating,
          ratingA: iRms * CURRENT_RATING_MARGIN,
        };
      case 'damping-capacitor':
        return {
          ...base,
          value: p.value,
          unit: 'F',
          detail: `${p.ratedV} V aluminium electrolytic`,
          ratingV: vPk / 0.8,
        };
      case 'sense':
      case 'damping-resistor':
        return {
          ...base,
          value: p.value,
          unit: 'Ω',
          detail: p.role === 'sense' ? 'current-sense resistor' : 'damping resistor',
          ratingA: iRms * CURRENT_RATING_MARGIN,
        };
      default: // controller
        return { ...base, value: 0, unit: '', detail: 'PWM controller' };
    }
  });
}
