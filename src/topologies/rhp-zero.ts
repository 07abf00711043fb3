/**
 * Right-half-plane zero of boost-derived stages in CCM (Erickson & Maksimović, Fundamentals of Power
 * Electronics, 2nd ed., 2001, Table 8.2):
 *   boost:       ωz = D′²·R / L
 *   buck-boost:  ωz = D′²·R / (D·L)
 * The loop crossover is usually held to a fifth to a third of it (common practice).
 */
import type { Caution } from '../engine/types.ts';
import { formatSi } from '../units/format.ts';

export function rhpZeroHz(
  rLoadOhm: number,
  duty: number,
  inductanceH: number,
  kind: 'boost' | 'buck-boost',
): number {
  const dp = 1 - duty;
  const w =
    kind === 'boost' ? (dp * dp * rLoadOhm) / inductanceH : (dp * dp * rLoadOhm) / (duty * inductanceH);
  return w / (2 * Math.PI);
}

export function rhpZeroCaution(
  rLoadOhm: number,
  duty: number,
  inductanceH: number,
  kind: 'boost' | 'buck-boost',
): Caution {
  const fz = rhpZeroHz(rLoadOhm, duty, inductanceH, kind);
  return {
    code: 'rhp-zero',
    value: fz,
    message:
      `Right-half-plane zero near ${formatSi(fz, 'Hz')} at full load and nominal input (duty ${(duty * 100).toFixed(0)} %): ` +
      `hold the loop crossover below about ${formatSi(fz / 5, 'Hz')}–${formatSi(fz / 3, 'Hz')} (a fifth to a third of it).`,
  };
}
