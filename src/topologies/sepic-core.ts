/**
 * SEPIC power stage shared by the separate-inductor, coupled-inductor and damped variants.
 *
 * Nodes: A = switch node (L1, Q1 drain, Cs), B = Cs / L2 / rectifier anode. iL1 flows from the input
 * into A; iL2 flows from ground up through L2 into B; the coupling capacitor voltage is V(A) − V(B).
 * CCM relations (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed., 2001, ch. 2 and
 * problem 2.x; common practice):
 *   charge balance on Cs: (1−D)·IL1 = D·IL2; at the output: (1−D)·(IL1+IL2) = Iout ⇒ IL2 = Iout,
 *   IL1 = Iout·D/(1−D); ideal D = Vout/(Vin+Vout); VCs = Vin; switch and rectifier block Vin+Vout.
 * With drops (switch + sense Rq, rectifier Vd, winding R1, R2), volt-second balance on both inductors
 * gives (derived here, averaged model):
 *   D/(1−D) = (Vout + Vd + IL2·R2) / (Vin − IL1·R1 − Isw·Rq),  Isw = IL1 + IL2
 *   VCs = [(1−D)(Vout+Vd) + IL2·R2 + D·Isw·Rq] / D
 * solved in closed form as a quadratic in 1/(1−D) (see operateSepic).
 * Coupled windings (L1 = L2 = L, M = k·L): v1 = L·di1/dt + M·di2/dt, v2 = M·di1/dt + L·di2/dt, so
 * di1/dt = (L2·v1 − M·v2)/(L1·L2 − M²); with v1 = v2 each winding ramps at v/(L+M): about half the
 * inductance per winding gives the separate design's ripple when k → 1 (common practice).
 */
import type { Design } from '../engine/design.ts';
import type { RectifierKind } from '../engine/types.ts';
import { ALL_SEGMENTS, newTriangle, SEGMENT_0, SEGMENT_1, type WaveSet } from '../engine/wave.ts';
import type { ComponentSpec, OperatingPoint, OperatingScalars } from './topology.ts';

export type SepicVariant = 'separate' | 'coupled' | 'damped';

export function sepicComponents(variant: SepicVariant, rect: RectifierKind): ComponentSpec[] {
  const coupled = variant === 'coupled';
  const list: ComponentSpec[] = [
    { name: 'Q1', role: 'switch', duty: 'main switch (low side)', sizing: { kind: 'switch' } },
    {
      name: 'Rsense',
      role: 'sense',
      duty: 'current-sense resistor in the switch source',
      sizing: { kind: 'sense', of: 'Q1' },
    },
    rect === 'diode'
      ? { name: 'D1', role: 'diode', duty: 'output rectifier', sizing: { kind: 'diode' } }
      : { name: 'Q2', role: 'sync', duty: 'synchronous output rectifier', sizing: { kind: 'sync' } },
    coupled
      ? {
          name: 'L1',
          role: 'coupled-inductor',
          duty: 'input winding of the coupled inductor',
          sizing: { kind: 'inductor' },
        }
      : { name: 'L1', role: 'inductor', duty: 'input inductor', sizing: { kind: 'inductor' } },
    coupled
      ? {
          name: 'L2',
          role: 'coupled-inductor',
          duty: 'output winding of the coupled inductor (same part as L1)',
          sizing: { kind: 'winding', of: 'L1' },
        }
      : { name: 'L2', role: 'inductor', duty: 'inductor to ground', sizing: { kind: 'inductor' } },
    {
      name: 'Cs',
      role: 'capacitor',
      duty: 'coupling capacitor',
      sizing: { kind: 'capacitor', ripple: 'coupling' },
    },
    {
      name: 'Cin',
      role: 'capacitor',
      duty: 'input capacitor',
      sizing: { kind: 'capacitor', ripple: 'input' },
    },
    {
      name: 'Cout',
      role: 'capacitor',
      duty: 'output capacitor',
      sizing: { kind: 'capacitor', ripple: 'output' },
    },
    { name: 'U1', role: 'controller', duty: 'current-mode controller', sizing: { kind: 'controller' } },
  ];
  if (variant === 'damped') {
    list.push(
      {
        name: 'Cd',
        role: 'damping-capacitor',
        duty: 'damping-leg capacitor (electrolytic) across Cs',
        sizing: { kind: 'damping-capacitor', of: 'Cs' },
      },
      {
        name: 'Rd',
        role: 'damping-resistor',
        duty: 'damping-leg resistor in series with Cd',
        sizing: { kind: 'damping-resistor', of: 'Cs' },
      },
    );
  }
  return list;
}

/** Fixed component slots (same order as sepicComponents). */
const Q1 = 0;
const RS = 1;
const RECT = 2;
const L1 = 3;
const L2 = 4;
const CS = 5;
const CIN = 6;
const COUT = 7;
const U1 = 8;
const CD = 9;
const RD = 10;

/**
 * Ripple of two windings over one interval: in v1, v2 (winding voltages, V) and t (interval, s), out
 * r1, r2 (A peak-to-peak). One object for inputs and outputs, filled by the caller: the corner loop
 * passes no numbers as arguments (V8 boxes them when the call stays out of line).
 */
export interface WindingRipples {
  v1: number;
  v2: number;
  t: number;
  r1: number;
  r2: number;
}

export function windingRipples(d: Design, x: WindingRipples): void {
  const l1 = d.parts[L1].value;
  const l2 = d.parts[L2].value;
  const k = d.coupling;
  const v1 = x.v1;
  const v2 = x.v2;
  const t = x.t;
  if (k <= 0) {
    x.r1 = (v1 * t) / l1;
    x.r2 = (v2 * t) / l2;
    return;
  }
  const m = k * Math.sqrt(l1 * l2);
  const det = l1 * l2 - m * m;
  if (det <= 1e-9 * l1 * l2) {
    // perfectly coupled limit: both windings carry the same ripple, set by the mean voltage
    const r = (0.5 * (v1 + v2) * t) / (l1 + m);
    x.r1 = r;
    x.r2 = r;
    return;
  }
  x.r1 = ((l2 * v1 - m * v2) * t) / det;
  x.r2 = ((l1 * v2 - m * v1) * t) / det;
}

const rip: WindingRipples = { v1: 0, v2: 0, t: 0, r1: 0, r2: 0 };
const tri = newTriangle();
/** The coupling capacitor's charge swing (period units), from WaveSet.chargeSwingInto. */
const swing = new Float64Array(1);

/**
 * Winding-current bows: in the winding averages il1, il2 (A) and the interval lengths tOn, tOff (s),
 * out the midpoint bows (A) of each winding in each interval (one object, as for WindingRipples).
 */
export interface SepicBows {
  il1: number;
  il2: number;
  tOn: number;
  tOff: number;
  w1on: number;
  w1off: number;
  w2on: number;
  w2off: number;
}

const bows: SepicBows = { il1: 0, il2: 0, tOn: 0, tOff: 0, w1on: 0, w1off: 0, w2on: 0, w2off: 0 };

/**
 * The coupling capacitor's voltage ramps at σon = −IL2/Cs while the switch is on and σoff = +IL1/Cs
 * while it is off (small-ripple means). With Γ = L⁻¹ (L1, L2, M = k·√(L1·L2)): on-time dv2/dt = σon,
 * off-time dv1/dt = −σoff, so d²i/dt² = Γ·dv/dt and the midpoint bow of an interval of length t is
 * −(d²i/dt²)·t²/8. A perfectly coupled pair (singular L) is the textbook idealisation: no bow.
 */
export function bowSepic(d: Design, x: SepicBows): void {
  const l1 = d.parts[L1].value;
  const l2 = d.parts[L2].value;
  const cs = d.parts[CS].value;
  const m = d.coupling > 0 ? d.coupling * Math.sqrt(l1 * l2) : 0;
  const det = l1 * l2 - m * m;
  if (!(det > 1e-9 * l1 * l2)) {
    x.w1on = 0;
    x.w1off = 0;
    x.w2on = 0;
    x.w2off = 0;
    return;
  }
  const on = cs > 0 ? -x.il2 / cs : 0;
  const off = cs > 0 ? x.il1 / cs : 0;
  // Γ = [[l2, −m], [−m, l1]] / det
  const c1on = (-m * on) / det;
  const c2on = (l1 * on) / det;
  const c1off = (l2 * -off) / det;
  const c2off = (-m * -off) / det;
  const tOn = x.tOn;
  const tOff = x.tOff;
  x.w1on = (-c1on * tOn * tOn) / 8;
  x.w2on = (-c2on * tOn * tOn) / 8;
  x.w1off = (-c1off * tOff * tOff) / 8;
  x.w2off = (-c2off * tOff * tOff) / 8;
}
const dcmFractions = { d0: 0, d1: 0, d2: 0 };

export function operateSepic(
  d: Design,
  variant: SepicVariant,
  at: OperatingPoint,
  w: WaveSet,
  s: OperatingScalars,
): void {
  const vin = at.vinV;
  const iout = at.ioutA;
  const p = d.parts;
  const vout = Math.abs(d.voutV);
  const fsw = d.params.fswHz;
  const T = 1 / fsw;
  const rq = p[Q1].ronOhm + p[RS].value;
  const sync = d.params.rect === 'sync';
  const vf = sync ? 0 : p[RECT].vfV;
  const rr = sync ? p[RECT].ronOhm : p[RECT].rdOhm;
  const r1 = p[L1].dcrOhm;
  const r2 = p[L2].dcrOhm;

  // Duty with drops. With u = 1/(1−D): Isw = Iout·u, IL1 = Iout·(u−1), and the balance above becomes
  //   B·u² − (A + B − E)·u + (A + C) = 0,  A = Vin + Iout·R1, B = Iout·(R1 + Rq), C = Vout + Vf + Iout·R2,
  //   E = rd·Iout (rectifier slope). The smaller root is the physical one (the larger lies past the peak
  //   of the loss-limited conversion ratio); written in the cancellation-free form 2c / (q + √(q² − 4Bc)).
  const A = vin + iout * r1;
  const B = iout * (r1 + rq);
  const C = vout + vf + iout * r2;
  const E = rr * iout;
  const q = A + B - E;
  const disc = q * q - 4 * B * (A + C);
  const converged = q > 0 && disc >= 0;
  const u = converged ? (2 * (A + C)) / (q + Math.sqrt(disc)) : 1 / (1 - 0.999);
  let D = 1 - 1 / u;
  const Dp = 1 - D;
  const il2 = iout;
  const il1 = (iout * D) / Dp;
  const isw = il1 + il2;
  const vd = vf + rr * isw;
  const vcs = (Dp * (vout + vd) + il2 * r2 + D * isw * rq) / D;

  // on-state winding voltages; off-state follows from volt-second balance
  const v1on = vin - il1 * r1 - isw * rq;
  const v2on = vcs - isw * rq - il2 * r2;
  rip.v1 = v1on;
  rip.v2 = v2on;
  rip.t = D * T;
  windingRipples(d, rip);
  let dI1 = rip.r1;
  let dI2 = rip.r2;
  let mode: 'ccm' | 'dcm' = 'ccm';
  let d2 = Dp;

  // Diode rectifier: the rectifier current iL1 + iL2 must stay positive, else DCM.
  const sumValley = il1 + il2 - 0.5 * (dI1 + dI2);
  if (!sync && sumValley < 0) {
    mode = 'dcm';
    // DCM of the buck-boost family: during D the summed current rises by ΣΔ = v·D·T/Le, during D2 it
    // falls to zero; Iout = ½·ΣΔ·D2 with D2 = D·v1on/(Vout+Vd) (Erickson & Maksimović ch. 5: D = √K·M).
    const vo = vout + vf;
    rip.v1 = vin; // slopes per unit on-time at ideal on-state voltages
    rip.v2 = vin;
    rip.t = T;
    windingRipples(d, rip);
    const sumPerD = rip.r1 + rip.r2;
    D = Math.sqrt((2 * iout * vo) / (sumPerD * vin));
    d2 = (D * vin) / vo;
    rip.t = D * T;
    windingRipples(d, rip);
    dI1 = rip.r1;
    dI2 = rip.r2;
  }
  s.duty = D;
  s.duty2 = 0;
  s.mode = mode;
  s.converged = converged || mode === 'dcm';

  if (mode === 'ccm') {
    // Bow of each winding current: the coupling capacitor's ripple ramps the winding voltage that
    // contains VCs (v2 while the switch is on, v1 while it is off), so each winding current bends with
    // d²i/dt² from the inverse inductance matrix; a segment of length t then bows by −c·t²/8 at its
    // midpoint. Tight coupling magnifies it (the leakage inductance is what the ramp drives).
    bows.il1 = il1;
    bows.il2 = il2;
    bows.tOn = D * T;
    bows.tOff = Dp * T;
    bowSepic(d, bows);
    const w1on = bows.w1on;
    const w1off = bows.w1off;
    const w2on = bows.w2on;
    const w2off = bows.w2off;
    // Bows raise a segment's mean by 2w/3, so the winding offsets follow again from the two charge
    // balances: output Dp·(<i1>off + <i2>off) = Iout and coupling capacitor D·<i2>on = Dp·<i1>off.
    // That keeps avg(iL2) = Iout exactly and moves IL1 by the bows' second-order share.
    const s2 = -(2 / 3) * (D * w2on + Dp * w2off);
    const s1 = (D * (s2 + (2 / 3) * w2on) - Dp * (2 / 3) * w1off) / Dp;
    const a1 = il1 - dI1 / 2 + s1;
    const b1 = il1 + dI1 / 2 + s1;
    const a2 = il2 - dI2 / 2 + s2;
    const b2 = il2 + dI2 / 2 + s2;
    // the input current is the input winding's average, bows included
    const iin = il1 + s1 + (2 / 3) * (D * w1on + Dp * w1off);
    s.iinA = iin;
    // winding triangles, handed over in a module object (numbers as arguments would be boxed)
    tri.duty = D;
    tri.lo = a1;
    tri.hi = b1;
    tri.bowRise = w1on;
    tri.bowFall = w1off;
    w.setTriangle(L1, tri);
    tri.lo = a2;
    tri.hi = b2;
    tri.bowRise = w2on;
    tri.bowFall = w2off;
    w.setTriangle(L2, tri);
    w.iOnA[Q1] = a1 + a2;
    w.iOffA[Q1] = b1 + b2;
    w.vSwV[Q1] = Math.abs(vcs + vout + vd);
    w.iOnA[RECT] = a1 + a2;
    w.iOffA[RECT] = b1 + b2;
    w.vSwV[RECT] = Math.abs(vcs + vout - isw * rq);
  } else {
    // three intervals: D (switch), d2 (rectifier), d3 (idle, iL1 = −iL2 = i0)
    const d3 = Math.max(0, 1 - D - d2);
    const f = dcmFractions;
    f.d0 = D;
    f.d1 = d2;
    f.d2 = d3;
    // offsets from the known averages: avg(iL2) = Iout, iL1 + iL2 = 0 while idle
    const shapeAvg2 = dI2 * 0.5 * (D + d2);
    const i0 = shapeAvg2 - iout; // iL1 during idle; iL2 = −i0
    const shapeAvg1 = dI1 * 0.5 * (D + d2);
    const il1dcm = i0 + shapeAvg1;
    s.iinA = il1dcm;
    tri.lo = i0;
    tri.hi = i0 + dI1;
    w.setTriangleIdle(L1, tri, f);
    tri.lo = -i0;
    tri.hi = -i0 + dI2;
    w.setTriangleIdle(L2, tri, f);
    const pk = dI1 + dI2;
    w.iOffA[Q1] = pk;
    w.vSwV[Q1] = Math.abs(vin + vout);
    w.vSwV[RECT] = Math.abs(vin + vout);
  }
  // Every other branch follows from the two winding currents, the same way in CCM and DCM: the switch
  // (and its sense resistor) carries both while on, the rectifier both while off, the coupling
  // capacitor −iL2 while on and iL1 otherwise; Cin carries iL1's AC, Cout the rectifier's minus Iout.
  w.combine(Q1, L1, 1, SEGMENT_0, L2, 1, SEGMENT_0);
  w.copy(RS, Q1);
  w.combine(RECT, L1, 1, SEGMENT_1, L2, 1, SEGMENT_1);
  w.combine(CS, L2, -1, SEGMENT_0, L1, 1, ALL_SEGMENTS & ~SEGMENT_0);
  w.copy(CIN, L1);
  w.shift(CIN, -s.iinA);
  w.copy(COUT, RECT);
  w.shift(COUT, -iout);
  w.setDc(U1, 0);
  w.vPeakV[Q1] = Math.abs(vcs + vout + vd);
  w.vPeakV[RECT] = Math.abs(vcs + vout);
  w.vPeakV[L1] = Math.max(Math.abs(v1on), Math.abs(vcs + vout + vd - vin));
  w.vPeakV[L2] = Math.max(Math.abs(v2on), Math.abs(vout + vd));
  w.vPeakV[CS] = Math.abs(vcs);
  w.vDcV[CS] = vcs;
  w.vPeakV[CIN] = Math.abs(vin);
  w.vDcV[CIN] = vin;
  w.vPeakV[COUT] = Math.abs(vout);
  w.vDcV[COUT] = vout;
  w.vPeakV[U1] = Math.abs(vin);
  w.vDcV[U1] = vin;

  if (variant === 'damped') {
    // The damping leg sees the coupling capacitor's ripple; at fsw Cd is nearly a short, so the
    // leg current is about ΔVcs/Rd peak-to-peak, a triangle (common practice estimate).
    const cs = p[CS].value;
    const rd = p[RD].value;
    w.chargeSwingInto(CS, swing, 0);
    const dv = cs > 0 ? (swing[0] * T) / cs : 0;
    const x = rd > 0 ? (0.5 * dv) / rd : 0;
    tri.duty = D;
    tri.lo = -x;
    tri.hi = x;
    tri.bowRise = 0;
    tri.bowFall = 0;
    w.setTriangle(RD, tri);
    w.copy(CD, RD);
    w.vPeakV[CD] = Math.abs(vcs);
    w.vDcV[CD] = vcs;
    w.vPeakV[RD] = Math.abs(dv);
  }
}
