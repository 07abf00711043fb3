/**
 * Initial state of a switched netlist from the analytic operating point: every inductor starts at the
 * analytic average current and every capacitor at its analytic DC voltage, so a transient (or a shooting
 * steady-state search) starts next to the periodic steady state instead of from zero.
 * The builders orient every capacitor so that its DC voltage is positive and every inductor so that its
 * current has the analytic waveform's sign; the source choke (when present) carries the input current.
 */
import type { Design } from '../../engine/design.ts';
import { WaveSet } from '../../engine/wave.ts';
import type { Netlist } from '../../waveform/netlist.ts';
import type { OperatingScalars, Topology } from '../topology.ts';

export function seedInitialState(
  netlist: Netlist,
  topology: Topology,
  d: Design,
  vinV: number,
  ioutA: number,
): Netlist {
  const w = new WaveSet(d.parts.length);
  const s: OperatingScalars = { duty: 0, duty2: 0, mode: 'ccm', iinA: 0, converged: true };
  topology.operate(d, { vinV, ioutA }, w, s);
  const slot = new Map(d.parts.map((p, k) => [p.name, k]));
  const elements = netlist.elements.map((e) => {
    const k = slot.get(e.name);
    if (e.kind === 'L') return { ...e, i0: k === undefined ? s.iinA : w.average(k) };
    if (e.kind === 'C' && k !== undefined) return { ...e, v0: Math.abs(w.vDc(k)) };
    return e;
  });
  return { ...netlist, elements };
}
