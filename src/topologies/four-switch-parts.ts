/**
 * Four-switch (non-inverting) buck-boost: its components, their fixed slots, and the series resistances
 * and diode knees of its conduction paths. The circuit, intervals and averaged model: four-switch-solve.ts.
 */
import type { Design } from '../engine/design.ts';
import type { RectifierKind } from '../engine/types.ts';
import type { ComponentSpec } from './topology.ts';

export function fourSwitchComponents(rect: RectifierKind): ComponentSpec[] {
  return [
    {
      name: 'Q1',
      role: 'switch',
      duty: 'buck leg, high side (Vin to node A); on continuously in the boost region',
      sizing: { kind: 'switch' },
    },
    rect === 'diode'
      ? {
          name: 'D1',
          role: 'diode',
          duty: 'buck leg freewheeling diode (ground to node A)',
          sizing: { kind: 'diode' },
        }
      : { name: 'Q2', role: 'sync', duty: 'buck leg, low side (synchronous)', sizing: { kind: 'sync' } },
    {
      name: 'Q3',
      role: 'switch',
      duty: 'boost leg, low side (node B to ground); off in the buck region',
      sizing: { kind: 'switch' },
    },
    rect === 'diode'
      ? {
          name: 'D2',
          role: 'diode',
          duty: 'boost leg output diode (node B to Vout)',
          sizing: { kind: 'diode' },
        }
      : {
          name: 'Q4',
          role: 'sync',
          duty: 'boost leg, high side (synchronous); on continuously in the buck region',
          sizing: { kind: 'sync' },
        },
    {
      name: 'L1',
      role: 'inductor',
      duty: 'the one inductor, between the two legs',
      sizing: { kind: 'inductor' },
    },
    {
      name: 'Rsense',
      role: 'sense',
      duty: 'inductor current-sense resistor (carries iL all the time)',
      sizing: { kind: 'sense', of: 'L1' },
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
    {
      name: 'U1',
      role: 'controller',
      duty: 'four-switch buck-boost controller (peak/valley current mode)',
      sizing: { kind: 'controller' },
    },
  ];
}

/** Fixed component slots (same order as fourSwitchComponents for either rectifier). */
export const Q1 = 0;
export const R2 = 1; // Q2 or D1
export const Q3 = 2;
export const R4 = 3; // Q4 or D2
export const L1 = 4;
export const RS = 5;
export const CIN = 6;
export const COUT = 7;
export const U1 = 8;

/** Series resistances (Ω) and diode knees (V) of the conduction paths, from the design's parasitics. */
export interface FourSwitchDrops {
  rq1Ohm: number;
  r2Ohm: number;
  rq3Ohm: number;
  r4Ohm: number;
  /** DCR + Rsense: in the inductor path in every interval. */
  rlOhm: number;
  vf1V: number;
  vf2V: number;
}

export function newDrops(): FourSwitchDrops {
  return { rq1Ohm: 0, r2Ohm: 0, rq3Ohm: 0, r4Ohm: 0, rlOhm: 0, vf1V: 0, vf2V: 0 };
}

export function readDrops(d: Design, out: FourSwitchDrops): void {
  const p = d.parts;
  const sync = d.params.rect === 'sync';
  out.rq1Ohm = p[Q1].ronOhm;
  out.r2Ohm = sync ? p[R2].ronOhm : p[R2].rdOhm;
  out.vf1V = sync ? 0 : p[R2].vfV;
  out.rq3Ohm = p[Q3].ronOhm;
  out.r4Ohm = sync ? p[R4].ronOhm : p[R4].rdOhm;
  out.vf2V = sync ? 0 : p[R4].vfV;
  out.rlOhm = p[L1].dcrOhm + p[RS].value;
}
