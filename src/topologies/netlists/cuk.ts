/**
 * Switched netlist of the Ćuk converter (src/topologies/cuk.ts):
 *   Vin → in ─L1─ a;  Q1 a → Rsense → 0;  Cs a → b;  rectifier from b (D1 anode / Q2) to 0;  L2 from out to b.
 * iL1 flows from the input into a, iL2 from the (negative) output through L2 into b, Cs holds
 * V(a) − V(b) ≈ Vin + |Vout|, as in operate(). Cout is written from 0 to out (positive DC voltage).
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

export function buildCukNetlist(
  d: Design,
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
): Netlist {
  const els: Element[] = [...inputSource(vinV, 'in', opts)];
  els.push(inputCapacitor(d, 'in', opts));
  els.push(inductor(d, 'L1', 'in', 'a'));
  const src = sense(d, 'Rsense', 'q1s', '0', els) ? 'q1s' : '0';
  els.push(mosfet(d, 'Q1', 'a', src, 'q1'));
  els.push(capacitor(d, 'Cs', 'a', 'b'));
  els.push(rectifier(d, d.params.rect === 'diode' ? 'D1' : 'Q2', 'b', '0', 'q1n'));
  els.push(inductor(d, 'L2', 'out', 'b'));
  els.push(capacitor(d, 'Cout', '0', 'out'));
  els.push(load(d, ioutA, 'out'));
  const g = gatePair(duty.duty);
  return { elements: els, pwm: { q1: g.on, q1n: g.off }, fswHz: d.params.fswHz };
}
