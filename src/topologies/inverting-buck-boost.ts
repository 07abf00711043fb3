/**
 * Inverting buck-boost: one inductor, output below ground.
 *
 * Form chosen: the common one built from a buck-type controller whose reference is the negative output.
 * Q1 (bootstrapped N-channel, its gate drive floats on the switch node) connects the input to the switch
 * node SW; L1 runs from SW to ground; the rectifier (D1 anode, or Q2 source, at the negative output)
 * returns the inductor current from the output to SW during the off-time. Rsense is in series with Q1.
 * The controller U1, Q1 and the rectifier all see Vin + |Vout|.
 *
 * Currents (iL flows from SW through L1 to ground): the switch carries iL during D, the rectifier during
 * D′ = 1−D, so both input and output currents pulsate. Ideal CCM (Erickson & Maksimović, Fundamentals of
 * Power Electronics, 2nd ed., Springer 2001, ch. 2; Rashid, Power Electronics, 4th ed., Pearson 2014,
 * Ex. 5.7, buck-boost regulator): Vout = −Vin·D/(1−D), IL = Iout/(1−D), Iin = D·IL, ΔIL = Vin·D/(L·fsw),
 * switch and rectifier block Vin + |Vout|.
 * With drops (Rq = Q1 Ron + Rsense, rectifier Vf + rr·i or sync Ron, winding RL), volt-second balance:
 *   D·(Vin − IL·Rq − IL·RL) = (1−D)·(|Vout| + Vf + rr·IL + IL·RL)
 * which is the family equation of buck-boost-family.ts with Rb = RL (the winding carries IL in both
 * intervals). DCM with the diode: D = M·√K, K = 2·L·fsw/R (Erickson & Maksimović ch. 5).
 */
import type { Design } from '../engine/design.ts';
import type { Caution, RectifierKind } from '../engine/types.ts';
import { type Fractions3, newTriangle, SEGMENT_0, SEGMENT_1, type WaveSet } from '../engine/wave.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { formatSi } from '../units/format.ts';
import { newCcmDuty, newDcmDuty, solveCcmDuty, solveDcmDuty } from './buck-boost-family.ts';
import { rhpZeroCaution } from './rhp-zero.ts';
import type { ComponentSpec, OperatingPoint, OperatingScalars, Topology } from './topology.ts';

function components(rect: RectifierKind): ComponentSpec[] {
  return [
    {
      name: 'Q1',
      role: 'switch',
      duty: 'main switch, input to switch node (N-channel, bootstrapped floating gate drive)',
      sizing: { kind: 'switch' },
    },
    {
      name: 'Rsense',
      role: 'sense',
      duty: 'current-sense resistor in series with Q1',
      sizing: { kind: 'sense', of: 'Q1' },
    },
    rect === 'diode'
      ? {
          name: 'D1',
          role: 'diode',
          duty: 'rectifier from the negative output to the switch node',
          sizing: { kind: 'diode' },
        }
      : {
          name: 'Q2',
          role: 'sync',
          duty: 'synchronous rectifier, source at the negative output',
          sizing: { kind: 'sync' },
        },
    {
      name: 'L1',
      role: 'inductor',
      duty: 'inductor from the switch node to ground',
      sizing: { kind: 'inductor' },
    },
    {
      name: 'Cin',
      role: 'capacitor',
      duty: 'input capacitor (pulsating input current)',
      sizing: { kind: 'capacitor', ripple: 'input' },
    },
    {
      name: 'Cout',
      role: 'capacitor',
      duty: 'output capacitor (pulsating output current)',
      sizing: { kind: 'capacitor', ripple: 'output' },
    },
    {
      name: 'U1',
      role: 'controller',
      duty: 'current-mode controller referenced to the negative output',
      sizing: { kind: 'controller' },
    },
  ];
}

/** Fixed component slots (same order as components()). */
const Q1 = 0;
const RS = 1;
const RECT = 2;
const L1 = 3;
const CIN = 4;
const COUT = 5;
const U1 = 6;

const ccm = newCcmDuty();
const dcm = newDcmDuty();
const frac: Fractions3 = { d0: 0, d1: 0, d2: 0 };
const tri = newTriangle();

function operate(d: Design, at: OperatingPoint, w: WaveSet, s: OperatingScalars): void {
  const vin = at.vinV;
  const iout = at.ioutA;
  const p = d.parts;
  const vo = Math.abs(d.voutV);
  const fsw = d.params.fswHz;
  const T = 1 / fsw;
  const l = p[L1].value;
  const rq = p[Q1].ronOhm + p[RS].value;
  const sync = d.params.rect === 'sync';
  const vf = sync ? 0 : p[RECT].vfV;
  const rr = sync ? p[RECT].ronOhm : p[RECT].rdOhm;
  const rl = p[L1].dcrOhm;

  ccm.vinV = vin;
  ccm.voV = vo;
  ccm.vfV = vf;
  ccm.rrOhm = rr;
  ccm.rqOhm = rq;
  ccm.r1Ohm = 0;
  ccm.r2Ohm = 0;
  ccm.rBothOhm = rl; // the single inductor carries the switch current in both intervals
  ccm.ioutA = iout;
  solveCcmDuty(ccm);
  let D = ccm.duty;
  const il = iout / (1 - D);
  const vd = vf + rr * il;
  const vOn = vin - il * (rq + rl); // across L1 during D
  const vOff = vo + vd + il * rl; // magnitude across L1 during 1−D
  const dI = (vOn * D * T) / l;
  const a = il - dI / 2;
  const b = il + dI / 2;

  // Diode rectifier: a negative valley in the CCM solution means the diode stops: DCM.
  let mode: 'ccm' | 'dcm' = 'ccm';
  if (!sync && a < 0) {
    dcm.vinV = vin;
    dcm.voV = vo;
    dcm.vfV = vf;
    dcm.ioutA = iout;
    dcm.leH = l;
    dcm.fswHz = fsw;
    dcm.rOnOhm = rq + rl;
    dcm.rOffOhm = rr + rl;
    solveDcmDuty(dcm);
    if (dcm.duty + dcm.duty2 < 1) mode = 'dcm';
  }
  s.duty2 = 0;
  s.mode = mode;

  if (mode === 'ccm') {
    s.duty = D;
    s.converged = ccm.converged;
    const iin = D * il;
    s.iinA = iin;
    tri.duty = D;
    tri.lo = a;
    tri.hi = b;
    w.setTriangle(L1, tri);
    w.iOnA[Q1] = a;
    w.iOffA[Q1] = b;
    w.vSwV[Q1] = Math.abs(vin + vo + vd);
    w.iOnA[RECT] = a;
    w.iOffA[RECT] = b;
    w.vSwV[RECT] = Math.abs(vin - il * rq + vo);
  } else {
    // three intervals: D (switch), D2 (rectifier), D3 (idle, iL = 0)
    D = dcm.duty;
    const pk = dcm.peakA;
    const f = frac;
    f.d0 = D;
    f.d1 = dcm.duty2;
    f.d2 = 1 - D - dcm.duty2;
    const iin = 0.5 * pk * D;
    s.duty = D;
    s.converged = dcm.converged;
    s.iinA = iin;
    tri.lo = 0;
    tri.hi = pk;
    w.setTriangleIdle(L1, tri, f);
    w.iOffA[Q1] = pk;
    w.vSwV[Q1] = Math.abs(vin + vo + vf);
    w.vSwV[RECT] = Math.abs(vin + vo);
  }
  // The switch (and its sense resistor) carries the inductor current while on, the rectifier while off;
  // Cin carries the switch current's AC, Cout the rectifier's minus Iout (CCM and DCM alike).
  w.combine(Q1, L1, 1, SEGMENT_0, L1, 0, 0);
  w.copy(RS, Q1);
  w.combine(RECT, L1, 1, SEGMENT_1, L1, 0, 0);
  w.copy(CIN, Q1);
  w.shift(CIN, -s.iinA);
  w.copy(COUT, RECT);
  w.shift(COUT, -iout);
  w.setDc(U1, 0);
  w.vPeakV[Q1] = Math.abs(vin + vo + vd);
  w.vPeakV[RECT] = Math.abs(vin - il * rq + vo);
  w.vPeakV[L1] = Math.max(Math.abs(vOn), Math.abs(vOff));
  w.vPeakV[CIN] = Math.abs(vin);
  w.vDcV[CIN] = vin;
  w.vPeakV[COUT] = Math.abs(vo);
  w.vDcV[COUT] = vo;
  w.vPeakV[U1] = Math.abs(vin + vo);
  w.vDcV[U1] = vin + vo;
}

function cautions(d: Design, spec: RailSpec, nominal: OperatingScalars): Caution[] {
  const l = d.parts[L1].value;
  const vo = spec.output.voltageV;
  const rLoad = vo / spec.load.maxA;
  const vStress = spec.input.maxV + vo;
  return [
    rhpZeroCaution(rLoad, nominal.duty, l, 'buck-boost'),
    {
      code: 'high-voltage-stress',
      value: vStress,
      message:
        `Q1, the rectifier and the controller (referenced to the negative output) see Vin + |Vout| = ` +
        `${formatSi(vStress, 'V')} at maximum input: rate all three for it, with the switch-node ringing on top.`,
    },
    {
      code: 'switching-loop',
      message:
        'Input and output currents both pulsate: the hot loop Cin → Q1 → rectifier → Cout → ground holds both capacitors, so place them side by side at the switch (common practice).',
    },
  ];
}

export const invertingBuckBoost: Topology = {
  id: 'inverting-buck-boost',
  title: 'Inverting buck-boost',
  summary:
    'One switch, one inductor, one rectifier: the inductor charges from the input and discharges into an output below ground, |Vout| = Vin·D/(1−D), above or below the input. Fewest parts; input and output currents both pulsate; the switch, rectifier and controller block Vin + |Vout|.',
  outputSign: -1,
  rectifiers: ['diode', 'sync'],
  modeChanging: false,
  loops: 1,
  components,
  operate,
  cautions,
};
