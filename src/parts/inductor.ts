/**
 * Inductor sizing by area product and core loss by the improved generalized Steinmetz equation.
 *
 * Area product (McLyman, Transformer and Inductor Design Handbook, 3rd ed., CRC Press 2004, ch. 8):
 *   Ap = Wa·Ac = L·Ipk·Irms / (Bmax·J·Ku)          [m⁴; H, A, A, T, A/m², –]
 * For a two-winding part on one core the flux is set by the summed linkage and the window holds both
 * windings: Ap = (L1·I1pk + M·I2pk)·(I1rms + I2rms) / (Bmax·J·Ku).
 * A geometrically scaled core family has every length ∝ Ap^¼, so box volume = kV·Ap^¾ (kV calibrated
 * in the technology preset). With the current density J held, copper loss = ρ·J²·Vcu, hence
 * DCR = ρ·J²·Vcu / Irms².
 *
 * iGSE (Venkatachalam, Sullivan, Abdallah & Tacca, "Accurate prediction of ferrite core loss with
 * nonsinusoidal waveforms using only Steinmetz parameters", IEEE COMPEL 2002):
 *   Pv = (1/T)∫ ki·|dB/dt|^α·(ΔB)^(β−α) dt,  ki = k / ((2π)^(α−1)·∫₀^{2π}|cos θ|^α·2^(β−α) dθ)
 * For piecewise-linear flux this is ki·ΔB^(β−α)·Σⱼ fⱼ·|ΔBⱼ/(fⱼ·T)|^α. For the usual triangle (two
 * segments, ΔB₀ = −ΔB₁ = ΔB) it reduces to ki·fsw^α·ΔB^β·(f₀^(1−α) + f₁^(1−α)).
 */

import { POW_RESULT, POW_SLOTS, POW_X, type PowerLaw, powerLaw } from './power-law.ts';
import type { CoreMaterial, Technology } from './technology.ts';

export interface InductorSize {
  volumeM3: number;
  coreM3: number;
  copperM3: number;
}

export function sizeInductorCore(tech: Technology, areaProductM4: number): InductorSize {
  const t = tech.inductor;
  const volumeM3 = t.volumeCoeff * Math.max(areaProductM4, 0) ** 0.75;
  return { volumeM3, coreM3: volumeM3 * t.coreFraction, copperM3: volumeM3 * t.copperFraction };
}

export function areaProductM4(tech: Technology, linkagePeakWb: number, iRmsSumA: number): number {
  const t = tech.inductor;
  return (linkagePeakWb * iRmsSumA) / (t.material.bMaxT * t.currentDensityApm2 * t.windowFill);
}

/** Winding resistance that gives copper loss ρ·J²·Vcu at the design RMS current (Ω). */
export function windingDcr(tech: Technology, copperM3: number, iRmsA: number): number {
  if (!(iRmsA > 0)) return 0;
  const t = tech.inductor;
  return (t.copperResistivityOhmM * t.currentDensityApm2 ** 2 * copperM3) / (iRmsA * iRmsA);
}

const kiCache = new Map<CoreMaterial, number>();
let lastMaterial: CoreMaterial | undefined;
let lastKi = 0;

/** ki of the iGSE for a material, by numerical integration of |cos θ|^α (Simpson, 2000 panels). */
export function igseKi(m: CoreMaterial): number {
  if (m === lastMaterial) return lastKi;
  const cached = kiCache.get(m);
  if (cached !== undefined) {
    lastMaterial = m;
    lastKi = cached;
    return cached;
  }
  const n = 2000;
  const h = (2 * Math.PI) / n;
  let s = 0;
  for (let i = 0; i <= n; i++) {
    const w = i === 0 || i === n ? 1 : i % 2 === 1 ? 4 : 2;
    s += w * Math.abs(Math.cos(i * h)) ** m.alpha;
  }
  const integral = (s * h) / 3;
  const ki = m.k / ((2 * Math.PI) ** (m.alpha - 1) * integral * 2 ** (m.beta - m.alpha));
  kiCache.set(m, ki);
  return ki;
}

/**
 * Inputs and result of the iGSE functions that take no floating-point arguments (igseInto,
 * igseTriangleInto): the corner loop fills the inputs and reads the result here, because V8 boxes a
 * number passed to (or returned from) a call it leaves out of line.
 */
export const IGSE_FSW = 0;
/** Peak-to-peak flux swing (T); for the triangle, its rise (= fall). */
export const IGSE_DB = 1;
/** Triangle only: fractions of the period of the rise and the fall. */
export const IGSE_F0 = 2;
export const IGSE_F1 = 3;
/** Result: loss density (W/m³). */
export const IGSE_PV = 4;
export const IGSE_SLOTS = 5;
/** The io of the number-returning wrappers below (tests and cold paths). */
const scratchIo = new Float64Array(IGSE_SLOTS);

/**
 * Core loss density (W/m³) for piecewise-linear flux: segment fractions f, flux changes dB (T) per
 * segment, peak-to-peak swing dBpp (T), period T = 1/fsw.
 */
export function igseLossDensity(
  m: CoreMaterial,
  fswHz: number,
  dBppT: number,
  n: number,
  f: ArrayLike<number>,
  dB: ArrayLike<number>,
): number {
  const io = scratchIo;
  io[IGSE_FSW] = fswHz;
  io[IGSE_DB] = dBppT;
  igseInto(m, n, f, dB, io);
  return io[IGSE_PV];
}

/** igseLossDensity with fsw and the peak-to-peak swing read from io, the density written to io[IGSE_PV]. */
export function igseInto(
  m: CoreMaterial,
  n: number,
  f: ArrayLike<number>,
  dB: ArrayLike<number>,
  io: Float64Array,
): void {
  const fswHz = io[IGSE_FSW];
  const dBppT = io[IGSE_DB];
  if (!(dBppT > 0) || m.k === 0) {
    io[IGSE_PV] = 0;
    return;
  }
  const ki = igseKi(m);
  // Σ fⱼ·|ΔBⱼ·fsw/fⱼ|^α = Σ exp(ln fⱼ + α·ln|ΔBⱼ·fsw/fⱼ|): one log and one exp per segment; for the
  // usual α = 1.5 of power ferrites fⱼ·(x/fⱼ)^1.5 = x·√(x/fⱼ), a square root instead
  const a = m.alpha;
  let s = 0;
  if (a === 1.5) {
    for (let j = 0; j < n; j++) {
      const fj = f[j];
      const x = Math.abs(dB[j] * fswHz);
      if (fj <= 0 || x === 0) continue;
      s += x * Math.sqrt(x / fj);
    }
  } else {
    for (let j = 0; j < n; j++) {
      const fj = f[j];
      const x = Math.abs(dB[j] * fswHz);
      if (fj <= 0 || x === 0) continue;
      const lf = Math.log(fj);
      s += Math.exp(lf + a * (Math.log(x) - lf));
    }
  }
  if (m !== sumMaterial) {
    sumMaterial = m;
    sumLaw = powerLaw(m.beta - a);
  }
  pw[POW_X] = dBppT;
  sumLaw.into(pw);
  io[IGSE_PV] = ki * pw[POW_RESULT] * s;
}

/** ΔB to a material's power (PowerLaw.into: numbers in a typed array, no boxing). */
const pw = new Float64Array(POW_SLOTS);
/** ΔB^(β−α) of the general sum, for the last material seen. */
let sumMaterial: CoreMaterial | undefined;
let sumLaw: PowerLaw = powerLaw(1);

// Per-call constants of the triangle form, kept from the previous call: a study evaluates one design
// (one material, one fsw) at several corners, and the windings of one corner share their fractions.
// The numbers live in a typed array: a module-level `let` holding a double is a context slot, and
// every store to it allocates a heap number (V8), which the corner loop must not do.
let triMaterial: CoreMaterial | undefined;
/** ΔB^β of triMaterial. */
let triLaw: PowerLaw = powerLaw(1);
const tri = new Float64Array([Number.NaN, 0, Number.NaN, Number.NaN, 0]);
const TRI_FSW = 0;
const TRI_KI_FSW = 1;
const TRI_F0 = 2;
const TRI_F1 = 3;
const TRI_SHAPE = 4;

/**
 * iGSE core loss density (W/m³) of a triangular flux: rise by dBT (T, > 0) over fraction f0 of the
 * period, fall by the same over f1 (both > 0). Pv = ki·fsw^α·ΔB^β·(f₀^(1−α) + f₁^(1−α)), the
 * two-segment case of igseLossDensity (same result to rounding), with ki·fsw^α and the fraction term
 * reused from the previous call when they repeat.
 */
export function igseTriangleLossDensity(
  m: CoreMaterial,
  fswHz: number,
  dBT: number,
  f0: number,
  f1: number,
): number {
  const io = scratchIo;
  io[IGSE_FSW] = fswHz;
  io[IGSE_DB] = dBT;
  io[IGSE_F0] = f0;
  io[IGSE_F1] = f1;
  igseTriangleInto(m, io);
  return io[IGSE_PV];
}

/** igseTriangleLossDensity with its numbers in io (IGSE_FSW, IGSE_DB, IGSE_F0, IGSE_F1 → IGSE_PV). */
export function igseTriangleInto(m: CoreMaterial, io: Float64Array): void {
  const dBT = io[IGSE_DB];
  if (!(dBT > 0) || m.k === 0) {
    io[IGSE_PV] = 0;
    return;
  }
  // the per-design and per-corner factors, refreshed out of line only when they change (this body stays
  // small enough for the JIT to inline it into the corner loop)
  if (m !== triMaterial || io[IGSE_FSW] !== tri[TRI_FSW]) refreshFrequencyTerm(m, io[IGSE_FSW]);
  if (io[IGSE_F0] !== tri[TRI_F0] || io[IGSE_F1] !== tri[TRI_F1]) refreshShapeTerm(m, io);
  pw[POW_X] = dBT;
  triLaw.into(pw);
  io[IGSE_PV] = tri[TRI_KI_FSW] * pw[POW_RESULT] * tri[TRI_SHAPE];
}

/** ki·fsw^α of the triangle form for material m at fswHz (fsw from io: no number argument). */
function refreshFrequencyTerm(m: CoreMaterial, fswHz: number): void {
  tri[TRI_KI_FSW] = igseKi(m) * Math.exp(m.alpha * Math.log(fswHz));
  triMaterial = m;
  triLaw = powerLaw(m.beta);
  tri[TRI_FSW] = fswHz;
  tri[TRI_F0] = Number.NaN;
}

/** f₀^(1−α) + f₁^(1−α) for the fractions in io. */
function refreshShapeTerm(m: CoreMaterial, io: Float64Array): void {
  const f0 = io[IGSE_F0];
  const f1 = io[IGSE_F1];
  const a = m.alpha;
  // for the usual α = 1.5 of power ferrites f^(1−α) is 1/√f, a square root instead of exp and log
  tri[TRI_SHAPE] =
    a === 1.5
      ? 1 / Math.sqrt(f0) + 1 / Math.sqrt(f1)
      : Math.exp((1 - a) * Math.log(f0)) + Math.exp((1 - a) * Math.log(f1));
  tri[TRI_F0] = f0;
  tri[TRI_F1] = f1;
}
