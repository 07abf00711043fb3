/**
 * Switched netlist of the Zeta converter (src/topologies/zeta.ts):
 *   Vin → in ─Rsense─ q1d ─Q1─ a;  L1 a → 0;  Cs from b to a;  rectifier from 0 (D1 anode / Q2) to b;
 *   L2 b → out;  Cout, Rload.
 * iL1 flows from a to ground and iL2 from b to the output, as in operate(). Cs is written from b to a so its
 * DC voltage V(b) − V(a) ≈ Vout is positive (initial-state.ts); its current is therefore the negative of
 * operate()'s "from A to B" Cs current.
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

export function buildZetaNetlist(
  d: Design,
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
): Netlist {
  const els: Element[] = [...inputSource(vinV, 'in', opts)];
  els.push(inputCapacitor(d, 'in', opts));
  const drain = sense(d, 'Rsense', 'in', 'q1d', els) ? 'q1d' : 'in';
  els.push(mosfet(d, 'Q1', drain, 'a', 'q1'));
  els.push(inductor(d, 'L1', 'a', '0'));
  els.push(capacitor(d, 'Cs', 'b', 'a'));
  els.push(rectifier(d, d.params.rect === 'diode' ? 'D1' : 'Q2', '0', 'b', 'q1n'));
  els.push(inductor(d, 'L2', 'b', 'out'));
  els.push(capacitor(d, 'Cout', 'out', '0'));
  els.push(load(d, ioutA, 'out'));
  const g = gatePair(duty.duty);
  return { elements: els, pwm: { q1: g.on, q1n: g.off }, fswHz: d.params.fswHz };
}
