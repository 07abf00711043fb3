/**
 * Gate timing: which switches conduct at a given phase of the period, and where the edges are.
 */

import { SimulationError } from './errors.ts';
import type { Netlist, PwmSignal } from './netlist.ts';
import type { CompiledCircuit } from './state-space.ts';

/** Phase in [0, 1) of a time (s) at switching frequency fswHz. */
export function phaseOf(tS: number, fswHz: number): number {
  const p = tS * fswHz;
  return p - Math.floor(p);
}

/** On during [dutyFrom, dutyTo), wrapping past the period end when dutyFrom > dutyTo. */
export function isGateOn(sig: PwmSignal, phase: number): boolean {
  if (sig.dutyTo - sig.dutyFrom >= 1) return true;
  const from = sig.dutyFrom - Math.floor(sig.dutyFrom);
  const to = sig.dutyTo - Math.floor(sig.dutyTo);
  if (from === to) return false;
  return from < to ? phase >= from && phase < to : phase >= from || phase < to;
}

/** Sorted distinct edge phases in [0, 1), always including 0 (the period start). */
export function pwmEdges(netlist: Netlist): number[] {
  if (!(netlist.fswHz > 0) || !Number.isFinite(netlist.fswHz)) {
    throw new SimulationError('invalid-netlist', `fswHz must be a positive number, got ${netlist.fswHz}`);
  }
  const edges = [0];
  for (const [name, sig] of Object.entries(netlist.pwm)) {
    if (!Number.isFinite(sig.dutyFrom) || !Number.isFinite(sig.dutyTo)) {
      throw new SimulationError('invalid-netlist', `pwm ${name}: duty limits must be finite`);
    }
    if (sig.dutyTo - sig.dutyFrom >= 1 || sig.dutyTo === sig.dutyFrom) continue;
    for (const e of [sig.dutyFrom, sig.dutyTo]) edges.push(e - Math.floor(e));
  }
  edges.sort((x, y) => x - y);
  return edges.filter((e, i) => i === 0 || e - edges[i - 1] > 1e-12);
}

/** Mask bits of the switches whose gate is on at this phase (diode bits are zero). */
export function switchBits(circuit: CompiledCircuit, netlist: Netlist, phase: number): number {
  let mask = 0;
  circuit.twoState.forEach((e, j) => {
    if (e.kind === 'S' && isGateOn(netlist.pwm[e.gate], phase)) mask |= 1 << j;
  });
  return mask;
}

/** Mask with every diode bit set. */
export function diodeBits(circuit: CompiledCircuit): number {
  let mask = 0;
  circuit.twoState.forEach((e, j) => {
    if (e.kind === 'D') mask |= 1 << j;
  });
  return mask;
}
