/**
 * Ceramic capacitor banks: n identical units in parallel.
 *
 * Peak-to-peak ripple of a bank (common practice: charge and ESR terms added, which is conservative
 * because their peaks do not coincide):
 *   ΔV = ΔQ / (n·Cu,eff) + (ESRu / n)·ΔIpp   ⇒   n ≥ (ΔQ/Cu,eff + ESRu·ΔIpp) / ΔVlimit
 * plus n ≥ Irms / Irms,unit for the ripple-current rating.
 * Class-II dielectric DC-bias derating: Ceff = C / (1 + a·(V/Vrated)²) (from memory; a ≈ 1.86 leaves
 * about 35 % at rated voltage and 68 % at half rated voltage).
 */
import type { CeramicClass, Technology } from './technology.ts';

export function pickCeramicClass(tech: Technology, vPeakV: number): CeramicClass | undefined {
  const need = Math.abs(vPeakV) / tech.capacitor.voltageDerating;
  return tech.capacitor.ceramic.find((c) => c.ratedV >= need);
}

export function dcBiasFactor(tech: Technology, cls: CeramicClass, vDcV: number): number {
  const x = Math.abs(vDcV) / cls.ratedV;
  return 1 / (1 + tech.capacitor.dcBiasA * x * x);
}

export interface BankSize {
  units: number;
  effectiveF: number;
  nominalF: number;
  esrOhm: number;
}

export function sizeCeramicBank(
  tech: Technology,
  cls: CeramicClass,
  vDcV: number,
  chargeC: number,
  iPpA: number,
  iRmsA: number,
  rippleLimitV: number,
): BankSize {
  const cu = cls.unitF * dcBiasFactor(tech, cls, vDcV);
  const byRipple = rippleLimitV > 0 ? (chargeC / cu + cls.esrOhm * iPpA) / rippleLimitV : 1;
  const byCurrent = cls.irmsA > 0 ? iRmsA / cls.irmsA : 1;
  const units = Math.max(1, Math.ceil(Math.max(byRipple, byCurrent) - 1e-9));
  return { units, effectiveF: units * cu, nominalF: units * cls.unitF, esrOhm: cls.esrOhm / units };
}
