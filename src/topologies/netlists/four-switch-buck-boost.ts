/**
 * Switched netlist of the four-switch buck-boost (src/topologies/four-switch-solve.ts):
 *   Vin → in ─Q1─ a;  Q2 / D1 (anode at ground) from 0 to a;  L1 a → Rsense → b (iL from a to b);
 *   Q3 b → 0;  Q4 / D2 (anode at b) from b to out;  Cin, Cout, Rload.
 * Gates per region, from the interval scheme A (Q1+Q3) = [0, D3), B (Q1+Q4) = [D3, D1), C (Q2+Q4) = [D1, 1):
 *   buck:        Q1 on [0, D1) with D1 = duty, Q2 its complement; Q3 off, Q4 on.
 *   boost:       Q1 on, Q2 off; Q3 on [0, D3) with D3 = duty, Q4 its complement.
 *   buck-boost:  three intervals, D3 = duty (boost leg), D1 = duty2 (buck leg).
 *   dcm (diode rectifiers): duty2 > 0 means both legs switch together (Q1 and Q3 on [0, duty)); otherwise
 *   the buck leg switches when Vin > |Vout| and the boost leg when not (the DutyCommand carries no region).
 */
import type { Design } from '../../engine/design.ts';
import type { Element, Netlist, PwmSignal } from '../../waveform/netlist.ts';
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

const ON: PwmSignal = { dutyFrom: 0, dutyTo: 1 };
const OFF: PwmSignal = { dutyFrom: 0, dutyTo: 0 };

/** Buck-leg duty D1 and boost-leg duty D3 for a command (see header). */
export function fourSwitchLegDuties(
  vinV: number,
  voutV: number,
  duty: DutyCommand,
): { d1: number; d3: number } {
  switch (duty.mode) {
    case 'buck':
      return { d1: duty.duty, d3: 0 };
    case 'boost':
      return { d1: 1, d3: duty.duty };
    case 'buck-boost':
      return { d1: duty.duty2, d3: duty.duty };
    default:
      if (duty.duty2 > 0) return { d1: duty.duty, d3: duty.duty };
      return vinV > Math.abs(voutV) ? { d1: duty.duty, d3: 0 } : { d1: 1, d3: duty.duty };
  }
}

export function buildFourSwitchNetlist(
  d: Design,
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
): Netlist {
  const diode = d.params.rect === 'diode';
  const els: Element[] = [...inputSource(vinV, 'in', opts)];
  els.push(inputCapacitor(d, 'in', opts));
  els.push(mosfet(d, 'Q1', 'in', 'a', 'q1'));
  els.push(rectifier(d, diode ? 'D1' : 'Q2', '0', 'a', 'q2'));
  const lEnd = sense(d, 'Rsense', 'l1r', 'b', els) ? 'l1r' : 'b';
  els.push(inductor(d, 'L1', 'a', lEnd));
  els.push(mosfet(d, 'Q3', 'b', '0', 'q3'));
  els.push(rectifier(d, diode ? 'D2' : 'Q4', 'b', 'out', 'q4'));
  els.push(capacitor(d, 'Cout', 'out', '0'));
  els.push(load(d, ioutA, 'out'));
  const { d1, d3 } = fourSwitchLegDuties(vinV, d.voutV, duty);
  const buck = d1 >= 1 ? { on: ON, off: OFF } : gatePair(d1);
  const boost = d3 <= 0 ? { on: OFF, off: ON } : gatePair(d3);
  return {
    elements: els,
    pwm: { q1: buck.on, q2: buck.off, q3: boost.on, q4: boost.off },
    fswHz: d.params.fswHz,
  };
}
