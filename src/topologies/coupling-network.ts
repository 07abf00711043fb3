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
import { type Fractions3, newTriangle, SEGMENT_0, SEGMENT_1, type WaveSet } from '../engine/wave.ts';
import {
  newCcmDuty,
  newDcmDuty,
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

/**
 * Everything the Ćuk and Zeta need from one operating point (SI units). The inputs travel in it too
 * (vinV, ioutA; the switched voltages for writeCommonWaves): the corner loop passes no numbers as
 * arguments, which V8 boxes when a call stays out of line.
 */
export interface CouplingPoint {
  vinV: number;
  ioutA: number;
  /**
   * Voltages the switch and the rectifier switch (V), the coupling capacitor's DC voltage and the output
   * magnitude (V), set before writeCommonWaves.
   */
  vQ1SwV: number;
  vRectSwV: number;
  vcsV: number;
  voV: number;
  /** Averages of iL1 and of the switch current (A), written by writeCommonWaves. */
  il1AvgA: number;
  iswAvgA: number;
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
    vinV: 0,
    ioutA: 0,
    vQ1SwV: 0,
    vRectSwV: 0,
    vcsV: 0,
    voV: 0,
    il1AvgA: 0,
    iswAvgA: 0,
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

const ccm = newCcmDuty();
const dcm = newDcmDuty();
const tri = newTriangle();

/** Solve the operating point (duty, currents, ripples, mode) of a Ćuk or Zeta stage at pt.vinV, pt.ioutA. */
export function solveCouplingNetwork(d: Design, pt: CouplingPoint): void {
  const vin = pt.vinV;
  const iout = pt.ioutA;
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

  ccm.vinV = vin;
  ccm.voV = vo;
  ccm.vfV = vf;
  ccm.rrOhm = rr;
  ccm.rqOhm = rq;
  ccm.r1Ohm = r1;
  ccm.r2Ohm = r2;
  ccm.rBothOhm = 0;
  ccm.ioutA = iout;
  solveCcmDuty(ccm);
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
  dcm.vinV = vin;
  dcm.voV = vo;
  dcm.vfV = vf;
  dcm.ioutA = iout;
  dcm.leH = le;
  dcm.fswHz = fsw;
  dcm.rOnOhm = rq + rl;
  dcm.rOffOhm = rr + rl;
  solveDcmDuty(dcm);
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
 * (L2 feeds the output continuously), the controller's supply, the switching edges and every part's
 * peak and DC voltage (from pt.vQ1SwV, pt.vRectSwV, pt.vcsV, pt.voV and the winding voltages). Writes
 * the averages of iL1 and of the switch current (A) to pt.il1AvgA, pt.iswAvgA. The topology adds Cs and
 * Cin, whose currents differ between the Ćuk and the Zeta.
 */
export function writeCommonWaves(pt: CouplingPoint, w: WaveSet): void {
  if (pt.mode === 'ccm') {
    const a1 = pt.il1A - pt.di1A / 2;
    const b1 = pt.il1A + pt.di1A / 2;
    const a2 = pt.il2A - pt.di2A / 2;
    const b2 = pt.il2A + pt.di2A / 2;
    tri.duty = pt.duty;
    tri.lo = a1;
    tri.hi = b1;
    w.setTriangle(L1, tri);
    tri.lo = a2;
    tri.hi = b2;
    w.setTriangle(L2, tri);
    w.iOnA[Q1] = a1 + a2;
    w.iOffA[Q1] = b1 + b2;
    w.iOnA[RECT] = a1 + a2;
    w.iOffA[RECT] = b1 + b2;
    pt.il1AvgA = pt.il1A;
    pt.iswAvgA = pt.duty * (pt.il1A + pt.il2A); // both windings' triangles, centred on their averages
  } else {
    const f = pt.f;
    const i0 = pt.i0A;
    tri.lo = i0;
    tri.hi = i0 + pt.di1A;
    w.setTriangleIdle(L1, tri, f);
    tri.lo = -i0;
    tri.hi = -i0 + pt.di2A;
    w.setTriangleIdle(L2, tri, f);
    w.iOffA[Q1] = pt.peakA; // on at zero current; the rectifier turns off at zero current
    pt.il1AvgA = i0 + 0.5 * pt.di1A * (f.d0 + f.d1);
    pt.iswAvgA = 0.5 * pt.peakA * f.d0; // the summed current ramps from 0 to the peak while Q1 is on
  }
  w.vSwV[Q1] = Math.abs(pt.vQ1SwV);
  w.vSwV[RECT] = Math.abs(pt.vRectSwV);
  // the switch (and its sense resistor) carries both inductor currents while on, the rectifier both
  // while off; Cout takes L2's ripple (CCM and DCM alike)
  w.combine(Q1, L1, 1, SEGMENT_0, L2, 1, SEGMENT_0);
  w.copy(RS, Q1);
  w.combine(RECT, L1, 1, SEGMENT_1, L2, 1, SEGMENT_1);
  w.copy(COUT, L2);
  w.shift(COUT, -pt.ioutA);
  w.setDc(U1, 0);
  // peak and DC voltages: the switch and rectifier block what they switch, each winding sees vOn while
  // Q1 conducts and its off-state voltage otherwise
  w.vPeakV[Q1] = Math.abs(pt.vQ1SwV);
  w.vPeakV[RECT] = Math.abs(pt.vRectSwV);
  w.vPeakV[L1] = Math.max(Math.abs(pt.vOnV), Math.abs(pt.v1OffV));
  w.vPeakV[L2] = Math.max(Math.abs(pt.vOnV), Math.abs(pt.v2OffV));
  w.vPeakV[CS] = Math.abs(pt.vcsV);
  w.vDcV[CS] = pt.vcsV;
  w.vPeakV[CIN] = Math.abs(pt.vinV);
  w.vDcV[CIN] = pt.vinV;
  w.vPeakV[COUT] = Math.abs(pt.voV);
  w.vDcV[COUT] = pt.voV;
  w.vPeakV[U1] = Math.abs(pt.vinV);
  w.vDcV[U1] = pt.vinV;
}
