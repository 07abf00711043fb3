/**
 * Switched netlists of the two cascades (src/topologies/cascade-core.ts): two plain stages clocked in phase
 * at the same frequency, joined by the bus capacitor Cbus. Stage 1 uses Q1, Rsense, D1/Q2, L1 and the gate
 * `q1` at `duty`; stage 2 uses Q3, Rsense2, D2/Q4, L2 and the gate `q3` at `duty2`; each synchronous
 * rectifier takes its stage's complementary gate.
 *   boost stage (from node x to node y):  x ─L─ sw;  switch sw → sense → 0;  rectifier sw → y.
 *   buck stage  (from node x to node y):  x ─sense─ ─switch─ sw;  rectifier from 0 (anode) to sw;  L sw → y.
 * Inductor currents flow from the stage input towards its output, as in the stage models.
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

interface StageNames {
  sw: string;
  sense: string;
  rect: string;
  inductor: string;
  gate: string;
  gateN: string;
  node: string;
}

function boostStage(d: Design, n: StageNames, from: string, to: string, els: Element[]): void {
  els.push(inductor(d, n.inductor, from, n.node));
  const src = sense(d, n.sense, `${n.node}s`, '0', els) ? `${n.node}s` : '0';
  els.push(mosfet(d, n.sw, n.node, src, n.gate));
  els.push(rectifier(d, n.rect, n.node, to, n.gateN));
}

function buckStage(d: Design, n: StageNames, from: string, to: string, els: Element[]): void {
  const drain = sense(d, n.sense, from, `${n.node}d`, els) ? `${n.node}d` : from;
  els.push(mosfet(d, n.sw, drain, n.node, n.gate));
  els.push(rectifier(d, n.rect, '0', n.node, n.gateN));
  els.push(inductor(d, n.inductor, n.node, to));
}

export function buildCascadeNetlist(
  d: Design,
  order: 'boost-buck' | 'buck-boost',
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
): Netlist {
  const diode = d.params.rect === 'diode';
  const s1: StageNames = {
    sw: 'Q1',
    sense: 'Rsense',
    rect: diode ? 'D1' : 'Q2',
    inductor: 'L1',
    gate: 'q1',
    gateN: 'q1n',
    node: 'sw1',
  };
  const s2: StageNames = {
    sw: 'Q3',
    sense: 'Rsense2',
    rect: diode ? 'D2' : 'Q4',
    inductor: 'L2',
    gate: 'q3',
    gateN: 'q3n',
    node: 'sw2',
  };
  const els: Element[] = [...inputSource(vinV, 'in', opts)];
  els.push(inputCapacitor(d, 'in', opts));
  if (order === 'boost-buck') {
    boostStage(d, s1, 'in', 'bus', els);
    buckStage(d, s2, 'bus', 'out', els);
  } else {
    buckStage(d, s1, 'in', 'bus', els);
    boostStage(d, s2, 'bus', 'out', els);
  }
  els.push(capacitor(d, 'Cbus', 'bus', '0'));
  els.push(capacitor(d, 'Cout', 'out', '0'));
  els.push(load(d, ioutA, 'out'));
  const g1 = gatePair(duty.duty);
  const g2 = gatePair(duty.duty2);
  return { elements: els, pwm: { q1: g1.on, q1n: g1.off, q3: g2.on, q3n: g2.off }, fswHz: d.params.fswHz };
}
