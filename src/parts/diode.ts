/**
 * Rectifier diode model: v = Vf + rd·i when conducting; rd scales inversely with the rated current.
 * Loss = Vf·Iavg + rd·Irms² + ½·Cj·V²·fsw (junction charge, common practice).
 */
import type { DiodeClass, Technology } from './technology.ts';

export function pickDiodeClass(tech: Technology, vPeakV: number): DiodeClass | undefined {
  const need = vPeakV / tech.diode.voltageDerating;
  return tech.diode.classes.find((c) => c.vrV >= need);
}

export function diodeLoss(
  vfV: number,
  rdOhm: number,
  cjF: number,
  fswHz: number,
  iAvgA: number,
  iRmsA: number,
  vRevV: number,
): { conductionW: number; switchingW: number } {
  return {
    conductionW: vfV * Math.abs(iAvgA) + rdOhm * iRmsA * iRmsA,
    switchingW: 0.5 * cjF * vRevV * vRevV * fswHz,
  };
}

export function diodeVolumeMm3(ratedA: number): number {
  return 8 + 4 * ratedA;
}
