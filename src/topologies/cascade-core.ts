/**
 * Two independent stages in series with an intermediate bus capacitor Cbus, shared by boost-then-buck
 * and buck-then-boost. Each stage is a plain boost or buck (stage-boost.ts, stage-buck.ts) with its own
 * inductor, switch, sense resistor, rectifier and controller.
 *
 * Solution order at one operating point: the second stage first, at its output voltage and current;
 * its average input current, from its own charge balance, is the bus load iBus (it includes the second
 * stage's conduction drops: Vbus·iBus = Vout·Iout + drops of stage 2). The first stage then delivers
 * Vbus at iBus, and its own average input current is the converter's input current. Since each stage's
 * averaged model conserves energy with its drops, Vin·Iin = Vout·Iout + conduction drops of both.
 *
 * Capacitor currents by Kirchhoff's current law at each node (both stages clocked in phase):
 *   Cin  = Iin − (stage-1 input current);   Cbus = (stage-1 output current) − (stage-2 input current);
 *   Cout = (stage-2 output current) − Iout.
 * A boost draws its inductor current and delivers its rectifier current; a buck draws its switch
 * current and delivers its inductor current.
 */
import type { Design } from '../engine/design.ts';
import type { RectifierKind } from '../engine/types.ts';
import type { WaveSet } from '../engine/wave.ts';
import type { CascadeOrder } from './cascade-bus.ts';
import { newStageState, type StageSlots, type StageState } from './stage.ts';
import { operateBoostStage } from './stage-boost.ts';
import { operateBuckStage } from './stage-buck.ts';
import type { ComponentSpec, OperatingPoint, OperatingScalars } from './topology.ts';
import { sumWaves } from './wave-sum.ts';

/** Fixed component slots (same order as cascadeComponents). */
export const Q1 = 0;
export const RS1 = 1;
export const RECT1 = 2;
export const L1 = 3;
export const Q3 = 4;
export const RS2 = 5;
export const RECT2 = 6;
export const L2 = 7;
export const CIN = 8;
export const CBUS = 9;
export const COUT = 10;
export const U1 = 11;
export const U2 = 12;

export const STAGE1: StageSlots = { sw: Q1, sense: RS1, rect: RECT1, inductor: L1 };
export const STAGE2: StageSlots = { sw: Q3, sense: RS2, rect: RECT2, inductor: L2 };

const BOOST_WORDS = {
  sw: 'switch (low side)',
  rect: 'rectifier',
  l: 'inductor (input side)',
  sense: 'in the switch source',
};
const BUCK_WORDS = {
  sw: 'switch (high side)',
  rect: 'rectifier (low side, freewheeling)',
  l: 'inductor (output side)',
  sense: 'in series with the high-side switch',
};

export function cascadeComponents(order: CascadeOrder, rect: RectifierKind): ComponentSpec[] {
  const [k1, k2] = order === 'boost-buck' ? ['boost', 'buck'] : ['buck', 'boost'];
  const w1 = k1 === 'boost' ? BOOST_WORDS : BUCK_WORDS;
  const w2 = k2 === 'boost' ? BOOST_WORDS : BUCK_WORDS;
  const diode = rect === 'diode';
  return [
    { name: 'Q1', role: 'switch', duty: `stage-1 ${k1} ${w1.sw}`, sizing: { kind: 'switch' } },
    {
      name: 'Rsense',
      role: 'sense',
      duty: `stage-1 current-sense resistor ${w1.sense}`,
      sizing: { kind: 'sense', of: 'Q1' },
    },
    diode
      ? { name: 'D1', role: 'diode', duty: `stage-1 ${k1} ${w1.rect}`, sizing: { kind: 'diode' } }
      : { name: 'Q2', role: 'sync', duty: `stage-1 ${k1} synchronous ${w1.rect}`, sizing: { kind: 'sync' } },
    { name: 'L1', role: 'inductor', duty: `stage-1 ${k1} ${w1.l}`, sizing: { kind: 'inductor' } },
    { name: 'Q3', role: 'switch', duty: `stage-2 ${k2} ${w2.sw}`, sizing: { kind: 'switch' } },
    {
      name: 'Rsense2',
      role: 'sense',
      duty: `stage-2 current-sense resistor ${w2.sense}`,
      sizing: { kind: 'sense', of: 'Q3' },
    },
    diode
      ? { name: 'D2', role: 'diode', duty: `stage-2 ${k2} ${w2.rect}`, sizing: { kind: 'diode' } }
      : { name: 'Q4', role: 'sync', duty: `stage-2 ${k2} synchronous ${w2.rect}`, sizing: { kind: 'sync' } },
    { name: 'L2', role: 'inductor', duty: `stage-2 ${k2} ${w2.l}`, sizing: { kind: 'inductor' } },
    {
      name: 'Cin',
      role: 'capacitor',
      duty: 'input capacitor',
      sizing: { kind: 'capacitor', ripple: 'input' },
    },
    {
      name: 'Cbus',
      role: 'capacitor',
      duty: 'intermediate bus capacitor between the stages',
      sizing: { kind: 'capacitor', ripple: 'bus' },
    },
    {
      name: 'Cout',
      role: 'capacitor',
      duty: 'output capacitor',
      sizing: { kind: 'capacitor', ripple: 'output' },
    },
    {
      name: 'U1',
      role: 'controller',
      duty: `stage-1 ${k1} current-mode controller`,
      sizing: { kind: 'controller' },
    },
    {
      name: 'U2',
      role: 'controller',
      duty: `stage-2 ${k2} current-mode controller`,
      sizing: { kind: 'controller' },
    },
  ];
}

const st1 = newStageState();
const st2 = newStageState();

/**
 * Steady state of the cascade at one operating point, with both stage states written to s1 and s2
 * (the topology's `operate` passes module scratch; cautions pass their own).
 */
export function solveCascade(
  d: Design,
  order: CascadeOrder,
  at: OperatingPoint,
  w: WaveSet,
  s1: StageState,
  s2: StageState,
): void {
  const vin = at.vinV;
  const iout = at.ioutA;
  const vout = Math.abs(d.voutV);
  const vbus = d.busV;
  if (order === 'boost-buck') {
    s2.viV = vbus;
    s2.voV = vout;
    s2.ioA = iout;
    operateBuckStage(d, STAGE2, w, s2);
    s1.viV = vin;
    s1.voV = vbus;
    s1.ioA = s2.iinA;
    operateBoostStage(d, STAGE1, w, s1);
    sumWaves(w, CIN, L1, -1, -1, 0, true); // input: the boost inductor current
    sumWaves(w, CBUS, RECT1, 1, Q3, -1, true); // boost rectifier in, buck switch out
    sumWaves(w, COUT, L2, 1, -1, 0, true); // output: the buck inductor current
  } else {
    s2.viV = vbus;
    s2.voV = vout;
    s2.ioA = iout;
    operateBoostStage(d, STAGE2, w, s2);
    s1.viV = vin;
    s1.voV = vbus;
    s1.ioA = s2.iinA;
    operateBuckStage(d, STAGE1, w, s1);
    sumWaves(w, CIN, Q1, -1, -1, 0, true); // input: the buck switch current
    sumWaves(w, CBUS, L1, 1, L2, -1, true); // buck inductor in, boost inductor out
    sumWaves(w, COUT, RECT2, 1, -1, 0, true); // output: the boost rectifier current
  }
  w.vPeakV[CIN] = Math.abs(vin);
  w.vDcV[CIN] = vin;
  w.vPeakV[CBUS] = Math.abs(vbus);
  w.vDcV[CBUS] = vbus;
  w.vPeakV[COUT] = Math.abs(vout);
  w.vDcV[COUT] = vout;
  w.setDc(U1, 0);
  w.setDc(U2, 0);
  w.vPeakV[U1] = Math.abs(vin);
  w.vDcV[U1] = vin;
  w.vPeakV[U2] = Math.abs(vbus);
  w.vDcV[U2] = vbus;
}

/** The topology's `operate`: both stages, then the scalars (duty = stage 1, duty2 = stage 2). */
export function operateCascade(
  d: Design,
  order: CascadeOrder,
  at: OperatingPoint,
  w: WaveSet,
  s: OperatingScalars,
): void {
  solveCascade(d, order, at, w, st1, st2);
  s.duty = st1.duty;
  s.duty2 = st2.duty;
  s.mode = st1.mode === 'dcm' || st2.mode === 'dcm' ? 'dcm' : 'ccm';
  s.iinA = st1.iinA;
  s.converged = st1.converged && st2.converged;
}
