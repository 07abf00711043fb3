/**
 * Switched netlist of the SEPIC family (separate, coupled and damped share this circuit):
 *   Vin → in ─L1─ sw ─Cs─ b ─rect─ out;  Q1 sw → Rsense → 0;  L2 from 0 up into b;  Cin, Cout, Rload.
 * Node and sign conventions follow src/topologies/sepic-core.ts: iL1 flows from the input into the
 * switch node, iL2 from ground up into b, the coupling-capacitor voltage is V(sw) − V(b). For the coupled
 * inductor the dots are at `in` (L1) and `0` (L2): both windings see +Vin while Q1 conducts.
 * Damped: Cd from sw to the damping node, Rd from there to b (the leg across Cs).
 */
import type { Design } from '../../engine/design.ts';
import type { Element, Netlist } from '../../waveform/netlist.ts';
import {
  capacitor,
  coupling,
  type DutyCommand,
  gatePair,
  inductor,
  inputCapacitor,
  inputSource,
  load,
  mosfet,
  type NetlistOptions,
  rectifier,
  resistor,
  sense,
} from './parts.ts';

export type SepicNetlistVariant = 'separate' | 'coupled' | 'damped';

export function buildSepicFamilyNetlist(
  d: Design,
  variant: SepicNetlistVariant,
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
): Netlist {
  const els: Element[] = [...inputSource(vinV, 'in', opts)];
  els.push(inputCapacitor(d, 'in', opts));
  els.push(inductor(d, 'L1', 'in', 'sw'));
  const src = sense(d, 'Rsense', 'q1s', '0', els) ? 'q1s' : '0';
  els.push(mosfet(d, 'Q1', 'sw', src, 'q1'));
  els.push(capacitor(d, 'Cs', 'sw', 'b'));
  els.push(inductor(d, 'L2', '0', 'b'));
  if (variant === 'coupled') els.push(coupling(d, 'L1', 'L2'));
  if (variant === 'damped') {
    els.push(capacitor(d, 'Cd', 'sw', 'dmp'));
    els.push(resistor(d, 'Rd', 'dmp', 'b'));
  }
  const rect = d.params.rect === 'diode' ? 'D1' : 'Q2';
  els.push(rectifier(d, rect, 'b', 'out', 'q1n'));
  els.push(capacitor(d, 'Cout', 'out', '0'));
  els.push(load(d, ioutA, 'out'));
  const g = gatePair(duty.duty);
  return { elements: els, pwm: { q1: g.on, q1n: g.off }, fswHz: d.params.fswHz };
}

export function buildSepicNetlist(
  d: Design,
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
): Netlist {
  return buildSepicFamilyNetlist(d, 'separate', vinV, ioutA, duty, opts);
}
