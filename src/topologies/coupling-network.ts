/**
 * Operating point of the two-inductor, coupling-capacitor members of the buck-boost family (Ćuk and
 * Zeta; the SEPIC is the third member, in sepic-core.ts). All three share one switching structure:
 * during D the switch carries iL1 + iL2, during D′ the rectifier carries iL1 + iL2, and charge balance
 * on the coupling capacitor Cs gives D·IL2 = D′·IL1. With L2 feeding the output (Ćuk, Zeta), IL2 = Iout,
 * IL1 = Iout·D/(1−D) and Isw = Iout/(1−D) (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd
 * ed., Springer 2001, ch. 2 (Ćuk example) and ch. 6; Rashid, Power Electronics, 4th ed., Pearson 2014,
 * Ex. 5.8, Ćuk regulator).
 *
 * Volt-second balance with drops (Rq = Q1 Ron + Rsense, rectifier Vd = Vf + rr·Isw, windings R1, R2),
 * derived here for each circuit (the Ćuk and Zeta derivations are in cuk.ts and zeta.ts), gives the same
 * duty equation for both and for the SEPIC:
 *   D/(1−D) = (|Vout| + Vd + R2·IL2) / (Vin − R1·IL1 − Rq·Isw)
 * and both inductors see the same on-state voltage vOn = Vin − R1·IL1 − Rq·Isw (ideal: Vin), off-state
 * −(|Vout| + Vd + R2·IL2) for L2 and −vOn·D/(1−D) for L1. Ripples: ΔIk = vOn·D/(Lk·fsw)
 * (Rashid 4th ed. Ex. 5.8: ΔI1 = Vs·k/(f·L1), ΔI2 = Vs·k/(f·L2)).
 *
 * DCM with the diode (summed current iL1 + iL2 at zero): see buck-boost-family.ts; Le = L1‖L2, each
 * winding takes the share Le/Lk of the summed ramp, and during the idle interval a constant current i0
 * circulates (iL1 = i0, iL2 = −i0), set by charge balance on Cs:
 *   D·(i0 − ΔI2/2) + D2·(i0 + ΔI1/2) + D3·i0 = 0  ⇒  i0 = (D·ΔI2 − D2·ΔI1)/2.
 * The DCM drops are approximated by the ramp share: rOn = Rq + R1·(Le/L1)² + R2·(Le/L2)² (i0's own I²R is
 * left out, small at the light load where DCM occurs).
 */
import type { Design } from '../engine/design.ts';
import { type Fractions3, SEGMENT_0, SEGMENT_1, type WaveSet } from '../engine/wave.ts';
import {
  type CcmDuty,
  type DcmDuty,
  parallelInductance,
  solveCcmDuty,
  solveDcmDuty,
} from './buck-boost-family.ts';

/** Fixed component slots of the Ćuk and Zeta (same order as their components()). */
export const Q1 = 0;
export const RS = 1;
export const RECT = 2;
export const L1 = 3;
export const L2 = 4;
export const CS = 5;
export const CIN = 6;
export const COUT = 7;
export const U1 = 8;

/** Everything the Ćuk and Zeta need from one operating point (SI units). */
export interface CouplingPoint {
  mode: 'ccm' | 'dcm';
  duty: number;
  converged: boolean;
  /** CCM duty, which sets the coupling-capacitor voltage in both modes (its DC value does not depend on mode). */
  dutyCcm: number;
  il1A: number;
  il2A: number;
  iswA: number;
  /** Rectifier drop at Isw (V). */
  vdV: number;
  /** On-state voltage across each winding (V); off-state magnitudes of L1 and L2 (V). */
  vOnV: number;
  v1OffV: number;
  v2OffV: number;
  di1A: number;
  di2A: number;
  /** DCM: interval fractions, circulating idle current (A), peak of the summed current (A). */
  f: Fractions3;
  i0A: number;
  peakA: number;
}

export function newCouplingPoint(): CouplingPoint {
  return {
    mode: 'ccm',
    duty: 0,
    converged: false,
    dutyCcm: 0,
    il1A: 0,
    il2A: 0,
    iswA: 0,
    vdV: 0,
    vOnV: 0,
    v1OffV: 0,
    v2OffV: 0,
    di1A: 0,
    di2A: 0,
    f: { d0: 0, d1: 0, d2: 0 },
    i0A: 0,
    peakA: 0,
  };
}

const ccm: CcmDuty = { duty: 0, converged: false };
const dcm: DcmDuty = { duty: 0, duty2: 0, peakA: 0, vOnV: 0, vOffV: 0, converged: false };

/** Solve the operating point (duty, currents, ripples, mode) of a Ćuk or Zeta stage into `pt`. */
export function solveCouplingNetwork(d: Design, vin: number, iout: number, pt: CouplingPoint): void {
  const p = d.parts;
  const vo = Math.abs(d.voutV);
  const fsw = d.params.fswHz;
  const T = 1 / fsw;
  const rq = p[Q1].ronOhm + p[RS].value;
  const sync = d.params.rect === 'sync';
  const vf = sync ? 0 : p[RECT].vfV;
  const rr = sync ? p[RECT].ronOhm : p[RECT].rdOhm;
  const l1 = p[L1].value;
  const l2 = p[L2].value;
  const r1 = p[L1].dcrOhm;
  const r2 = p[L2].dcrOhm;

  solveCcmDuty(vin, vo, vf, rr, rq, r1, r2, 0, iout, ccm);
  const D = ccm.duty;
  pt.dutyCcm = D;
  pt.il2A = iout;
  pt.il1A = (iout * D) / (1 - D);
  pt.iswA = pt.il1A + pt.il2A;
  pt.vdV = vf + rr * pt.iswA;
  pt.vOnV = vin - r1 * pt.il1A - rq * pt.iswA;
  pt.v1OffV = (pt.vOnV * D) / (1 - D);
  pt.v2OffV = vo + pt.vdV + r2 * iout;
  pt.di1A = (pt.vOnV * D * T) / l1;
  pt.di2A = (pt.vOnV * D * T) / l2;
  pt.mode = 'ccm';
  pt.duty = D;
  pt.converged = ccm.converged;

  // Diode rectifier: the summed current must stay positive, else DCM.
  if (sync || pt.iswA - 0.5 * (pt.di1A + pt.di2A) >= 0) return;
  const le = parallelInductance(l1, l2);
  const rl = r1 * (le / l1) ** 2 + r2 * (le / l2) ** 2;
  solveDcmDuty(vin, vo, vf, iout, le, fsw, rq + rl, rr + rl, dcm);
  if (dcm.duty + dcm.duty2 >= 1) return; // at the boundary: keep the CCM solution
  pt.mode = 'dcm';
  pt.duty = dcm.duty;
  pt.converged = dcm.converged;
  pt.peakA = dcm.peakA;
  pt.di1A = (dcm.peakA * le) / l1;
  pt.di2A = (dcm.peakA * le) / l2;
  pt.f.d0 = dcm.duty;
  pt.f.d1 = dcm.duty2;
  pt.f.d2 = 1 - dcm.duty - dcm.duty2;
  pt.i0A = 0.5 * (dcm.duty * pt.di2A - dcm.duty2 * pt.di1A);
  pt.vOnV = dcm.vOnV;
  pt.v2OffV = dcm.vOffV;
  pt.v1OffV = dcm.vOffV;
}

/**
 * Waveforms common to the Ćuk and Zeta: L1 (positive into the switch node side), L2 (positive towards the
 * load), the switch, its sense resistor, the rectifier, and the output capacitor, which takes L2's ripple
 * (L2 feeds the output continuously), with the switching edges (vQ1SwV, vRectSwV: voltages switched, V).
 * Returns the average of iL1 (A).
 */
export function writeCommonWaves(
  pt: CouplingPoint,
  iout: number,
  vQ1SwV: number,
  vRectSwV: number,
  w: WaveSet,
): number {
  let il1Avg: number;
  if (pt.mode === 'ccm') {
    const D = pt.duty;
    const a1 = pt.il1A - pt.di1A / 2;
    const b1 = pt.il1A + pt.di1A / 2;
    const a2 = pt.il2A - pt.di2A / 2;
    const b2 = pt.il2A + pt.di2A / 2;
    w.set2(L1, D, a1, b1, b1, a1);
    w.set2(L2, D, a2, b2, b2, a2);
    w.iOnA[Q1] = a1 + a2;
    w.iOffA[Q1] = b1 + b2;
    w.iOnA[RECT] = a1 + a2;
    w.iOffA[RECT] = b1 + b2;
    il1Avg = pt.il1A;
  } else {
    const f = pt.f;
    const i0 = pt.i0A;
    const h1 = i0 + pt.di1A;
    const h2 = -i0 + pt.di2A;
    w.set3(L1, f, i0, h1, h1, i0, i0, i0);
    w.set3(L2, f, -i0, h2, h2, -i0, -i0, -i0);
    w.iOffA[Q1] = pt.peakA; // on at zero current; the rectifier turns off at zero current
    il1Avg = i0 + 0.5 * pt.di1A * (f.d0 + f.d1);
  }
  w.vSwV[Q1] = Math.abs(vQ1SwV);
  w.vSwV[RECT] = Math.abs(vRectSwV);
  // the switch (and its sense resistor) carries both inductor currents while on, the rectifier both
  // while off; Cout takes L2's ripple (CCM and DCM alike)
  w.combine(Q1, L1, 1, SEGMENT_0, L2, 1, SEGMENT_0);
  w.copy(RS, Q1);
  w.combine(RECT, L1, 1, SEGMENT_1, L2, 1, SEGMENT_1);
  w.copy(COUT, L2);
  w.shift(COUT, -iout);
  return il1Avg;
}
