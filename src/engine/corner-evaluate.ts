/**
 * One corner of a sized design: the allocation-free inner loop (operateWithLosses) and, for reports,
 * the full per-component record of the corner built from the same buffers.
 */
import type { Technology } from '../parts/technology.ts';
import type { OperatingPoint, OperatingScalars, Topology } from '../topologies/topology.ts';
import { type Design, ROLE_CAPACITOR, ROLE_DAMPING_CAPACITOR, ROLE_SENSE } from './design.ts';
import { computeLosses, LOSS_KINDS, LOSS_SLOTS, LOSS_TOTAL } from './losses.ts';
import { newScalars } from './size.ts';
import type { ComponentStress, Corner, CornerResult } from './types.ts';
import { WaveSet } from './wave.ts';

export interface CornerDetail extends CornerResult {
  iinA: number;
  duty2: number;
  lossByKind: Record<string, number>;
}

/** Buffers of one part count, reused by every corner and candidate evaluated on this thread. */
export interface Scratch {
  w: WaveSet;
  per: Float64Array;
  kinds: Float64Array;
  /** Worst full-load peak voltage and current of each part (V, A). */
  vPk: Float64Array;
  iPk: Float64Array;
}

const scratch = new Map<number, Scratch>();

export function scratchFor(n: number): Scratch {
  let s = scratch.get(n);
  if (!s) {
    s = {
      w: new WaveSet(n),
      per: new Float64Array(n),
      kinds: new Float64Array(LOSS_SLOTS),
      vPk: new Float64Array(n),
      iPk: new Float64Array(n),
    };
    scratch.set(n, s);
  }
  return s;
}

/** average, rms, max, min of one waveform (WaveSet.stats). */
const stats = new Float64Array(4);

/** Back to newScalars()'s values: every corner starts from the same scalars. */
export function resetScalars(s: OperatingScalars): void {
  s.duty = 0;
  s.duty2 = 0;
  s.mode = 'ccm';
  s.iinA = 0;
  s.converged = true;
}

/**
 * The inner loop: steady state and losses of a sized design at one operating point, into caller-owned
 * buffers; the total loss (W) lands in byKind[LOSS_TOTAL] (size byKind LOSS_SLOTS). This is what the
 * benchmark counts.
 */
export function operateWithLosses(
  topology: Topology,
  d: Design,
  tech: Technology,
  at: OperatingPoint,
  w: WaveSet,
  s: OperatingScalars,
  perPart: Float64Array,
  byKind: Float64Array,
): void {
  w.reset();
  topology.operate(d, at, w, s);
  computeLosses(d, tech, at, w, perPart, byKind);
}

export function evaluateCorner(topology: Topology, d: Design, tech: Technology, c: Corner): CornerDetail {
  const { w, per, kinds } = scratchFor(d.parts.length);
  const s: OperatingScalars = newScalars();
  operateWithLosses(topology, d, tech, c, w, s, per, kinds);
  return cornerDetail(d, c, w, s, per, kinds, kinds[LOSS_TOTAL]);
}

/** The full record of one corner from the buffers operateWithLosses filled. */
export function cornerDetail(
  d: Design,
  c: Corner,
  w: WaveSet,
  s: OperatingScalars,
  per: Float64Array,
  kinds: Float64Array,
  lossW: number,
): CornerDetail {
  const n = d.parts.length;
  const T = 1 / d.params.fswHz;
  const components: Record<string, ComponentStress> = {};
  for (let k = 0; k < n; k++) {
    const p = d.parts[k];
    w.stats(k, stats);
    const mx = stats[2];
    const mn = stats[3];
    const isCap = p.roleCode === ROLE_CAPACITOR || p.roleCode === ROLE_DAMPING_CAPACITOR;
    components[p.name] = {
      value: p.value,
      iAvgA: stats[0],
      iRmsA: stats[1],
      iPeakA: Math.max(Math.abs(mx), Math.abs(mn)),
      iPpA: mx - mn,
      // a sense resistor's peak voltage is Ohm's law on its peak current (what the controller sees)
      vPeakV: p.roleCode === ROLE_SENSE ? p.value * Math.max(Math.abs(mx), Math.abs(mn)) : w.vPeak(k),
      vPpV: isCap && p.value > 0 ? (w.chargeSwing(k) * T) / p.value + p.esrOhm * (mx - mn) : 0,
      lossW: per[k],
    };
  }
  const poutW = Math.abs(d.voutV) * c.ioutA;
  const lossByKind: Record<string, number> = {};
  LOSS_KINDS.forEach((kind, i) => {
    lossByKind[kind] = kinds[i];
  });
  return {
    label: c.label,
    vinV: c.vinV,
    ioutA: c.ioutA,
    voutV: d.voutV,
    duty: s.duty,
    duty2: s.duty2,
    mode: s.mode,
    efficiency: poutW / (poutW + lossW),
    lossW,
    pinW: poutW + lossW,
    poutW,
    iinA: s.iinA,
    lossByKind,
    components,
    ...(s.converged ? {} : { notConverged: true }),
  };
}
