/**
 * Optimal damping of a parallel R–Cd damping leg across a capacitor C that resonates with an
 * inductance L (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., Springer 2001,
 * ch. 10 "Input filter design", parallel Rf–Cb damping, Eqs. 10.39–10.41):
 *   n = Cd / C,  R0 = √(L/C),  f0 = 1/(2π√(LC))
 *   Q_opt = R/R0 = √[(2+n)(4+3n) / (2n²(4+n))]
 *   peak impedance ‖Z‖mm = R0·√(2(2+n))/n, reached at f0·√(2/(2+n))
 * The leg's size n is chosen as the smallest one whose optimally damped peak impedance stays at or
 * below a target fraction of R0; the common-practice rule Cd ≈ 5·C is checked against it.
 */

export function optimalDampingQ(n: number): number {
  return Math.sqrt(((2 + n) * (4 + 3 * n)) / (2 * n * n * (4 + n)));
}

export function dampedPeakImpedanceRatio(n: number): number {
  return Math.sqrt(2 * (2 + n)) / n;
}

/** Smallest n with √(2(2+n))/n ≤ target: solve n² t² = 2(2+n), the positive root. */
export function dampingRatioForPeak(target: number): number {
  const t2 = target * target;
  return (2 + Math.sqrt(4 + 16 * t2)) / (2 * t2);
}

/** Target peak impedance of the damped coupling network relative to R0 (gives n ≈ 5, common practice). */
export const DAMPING_PEAK_TARGET = 0.75;

export interface DampingLeg {
  n: number;
  cdF: number;
  rdOhm: number;
  r0Ohm: number;
  f0Hz: number;
}

export function designDampingLeg(
  inductanceH: number,
  capacitanceF: number,
  target = DAMPING_PEAK_TARGET,
): DampingLeg {
  const n = dampingRatioForPeak(target);
  const r0Ohm = Math.sqrt(inductanceH / capacitanceF);
  return {
    n,
    cdF: n * capacitanceF,
    rdOhm: optimalDampingQ(n) * r0Ohm,
    r0Ohm,
    f0Hz: 1 / (2 * Math.PI * Math.sqrt(inductanceH * capacitanceF)),
  };
}
