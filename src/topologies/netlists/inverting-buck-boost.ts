/**
 * Switched netlist of the inverting buck-boost (src/topologies/inverting-buck-boost.ts):
 *   Vin → in ─Rsense─ q1d ─Q1─ sw;  L1 sw → 0;  rectifier from out (D1 anode / Q2) to sw;  Cout, Rload.
 * The output node sits below ground; Cout is written from 0 to out so its DC voltage is positive
 * (initial-state.ts). iL1 flows from sw to ground, the rectifier current from out to sw, as in operate().
 */
import type { Design } from '../../engine/design.ts';
import type { Element, Netlist } from '../../waveform/netlist.ts';
import {
  capacitor,
  type DutyCommand,
  gatePair,
  inductor,
  inputCapacitor,
  inputSource,
  load,
  mosfet,
  type NetlistOptions,
  rectifier,
  sense,
} from './parts.ts';

export function buildInvertingBuckBoostNetlist(
  d: Design,
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
): Netlist {
  const els: Element[] = [...inputSource(vinV, 'in', opts)];
  els.push(inputCapacitor(d, 'in', opts));
  const drain = sense(d, 'Rsense', 'in', 'q1d', els) ? 'q1d' : 'in';
  els.push(mosfet(d, 'Q1', drain, 'sw', 'q1'));
  els.push(inductor(d, 'L1', 'sw', '0'));
  els.push(rectifier(d, d.params.rect === 'diode' ? 'D1' : 'Q2', 'out', 'sw', 'q1n'));
  els.push(capacitor(d, 'Cout', '0', 'out'));
  els.push(load(d, ioutA, 'out'));
  const g = gatePair(duty.duty);
  return { elements: els, pwm: { q1: g.on, q1n: g.off }, fswHz: d.params.fswHz };
}
