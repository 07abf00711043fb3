/**
 * Switched-circuit netlists of the inverting buck-boost, Ćuk and Zeta, drawn by hand from their circuit
 * diagrams (independently of the closed forms under test), for the waveform engine's exact periodic
 * steady state and its state-space average. Gate 'q' drives the switch during [0, duty); with `sync`,
 * gate 'qb' drives the synchronous rectifier during [duty, 1).
 */
import { readdirSync, readFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { loadSpecText } from '../../src/spec/load.ts';
import type { RailSpec } from '../../src/spec/rail-spec.ts';
import type { AveragedModel } from '../../src/waveform/averaged.ts';
import type { Element, Netlist } from '../../src/waveform/netlist.ts';

export interface StageParams {
  vinV: number;
  duty: number;
  fswHz: number;
  l1H: number;
  l2H?: number;
  csF?: number;
  coutF: number;
  rLoadOhm: number;
  /** Switch on-resistance plus sense resistor (Ω). */
  rqOhm?: number;
  vfV?: number;
  /** Diode slope (Ω) or synchronous-rectifier Ron. */
  rrOhm?: number;
  dcr1Ohm?: number;
  dcr2Ohm?: number;
  /** Synchronous rectifier: a switch on gate 'qb' during [duty, 1) instead of the diode. */
  sync?: boolean;
}

/** Smallest resistance used for "ideal" parts: keeps every configuration non-singular. */
const TINY_OHM = 1e-6;
const OFF_OHM = 1e7;

function switchAndRectifier(p: StageParams, sw: [string, string], rect: [string, string]): Element[] {
  const q: Element = {
    kind: 'S',
    name: 'S1',
    a: sw[0],
    b: sw[1],
    ronOhm: p.rqOhm || TINY_OHM,
    roffOhm: OFF_OHM,
    gate: 'q',
  };
  const r: Element = p.sync
    ? {
        kind: 'S',
        name: 'S2',
        a: rect[0],
        b: rect[1],
        ronOhm: p.rrOhm || TINY_OHM,
        roffOhm: OFF_OHM,
        gate: 'qb',
      }
    : {
        kind: 'D',
        name: 'D1',
        a: rect[0],
        b: rect[1],
        vfV: p.vfV ?? 0,
        ronOhm: p.rrOhm || TINY_OHM,
        roffOhm: OFF_OHM,
      };
  return [q, r];
}

function gates(p: StageParams): Netlist['pwm'] {
  return p.sync
    ? { q: { dutyFrom: 0, dutyTo: p.duty }, qb: { dutyFrom: p.duty, dutyTo: 1 } }
    : { q: { dutyFrom: 0, dutyTo: p.duty } };
}

/** Vin; S1 in→sw; L1 sw→0; D1 out→sw (anode at the negative output); Cout, R out→0. */
export function invertingNetlist(p: StageParams): Netlist {
  return {
    fswHz: p.fswHz,
    pwm: gates(p),
    elements: [
      { kind: 'V', name: 'Vin', a: 'in', b: '0', volt: p.vinV },
      ...switchAndRectifier(p, ['in', 'sw'], ['out', 'sw']),
      { kind: 'L', name: 'L1', a: 'sw', b: '0', henry: p.l1H, dcrOhm: p.dcr1Ohm ?? 0 },
      { kind: 'C', name: 'Cout', a: 'out', b: '0', farad: p.coutF },
      { kind: 'R', name: 'Rload', a: 'out', b: '0', ohm: p.rLoadOhm },
    ],
  };
}

/** Vin; L1 in→a; S1 a→0; Cs a→b; D1 b→0 (anode at b); L2 out→b; Cout, R out→0. */
export function cukNetlist(p: StageParams): Netlist {
  return {
    fswHz: p.fswHz,
    pwm: gates(p),
    elements: [
      { kind: 'V', name: 'Vin', a: 'in', b: '0', volt: p.vinV },
      { kind: 'L', name: 'L1', a: 'in', b: 'a', henry: p.l1H, dcrOhm: p.dcr1Ohm ?? 0 },
      ...switchAndRectifier(p, ['a', '0'], ['b', '0']),
      { kind: 'C', name: 'Cs', a: 'a', b: 'b', farad: p.csF ?? 0 },
      { kind: 'L', name: 'L2', a: 'out', b: 'b', henry: p.l2H ?? 0, dcrOhm: p.dcr2Ohm ?? 0 },
      { kind: 'C', name: 'Cout', a: 'out', b: '0', farad: p.coutF },
      { kind: 'R', name: 'Rload', a: 'out', b: '0', ohm: p.rLoadOhm },
    ],
  };
}

/** Vin; S1 in→a; L1 a→0; Cs b→a (so v(Cs) = V(b) − V(a)); D1 0→b (cathode at b); L2 b→out; Cout, R out→0. */
export function zetaNetlist(p: StageParams): Netlist {
  return {
    fswHz: p.fswHz,
    pwm: gates(p),
    elements: [
      { kind: 'V', name: 'Vin', a: 'in', b: '0', volt: p.vinV },
      ...switchAndRectifier(p, ['in', 'a'], ['0', 'b']),
      { kind: 'L', name: 'L1', a: 'a', b: '0', henry: p.l1H, dcrOhm: p.dcr1Ohm ?? 0 },
      { kind: 'C', name: 'Cs', a: 'b', b: 'a', farad: p.csF ?? 0 },
      { kind: 'L', name: 'L2', a: 'b', b: 'out', henry: p.l2H ?? 0, dcrOhm: p.dcr2Ohm ?? 0 },
      { kind: 'C', name: 'Cout', a: 'out', b: '0', farad: p.coutF },
      { kind: 'R', name: 'Rload', a: 'out', b: '0', ohm: p.rLoadOhm },
    ],
  };
}

/** Determinant by Gaussian elimination with partial pivoting (n×n, row-major copy). */
function det(m: Float64Array, n: number): number {
  const a = m.slice();
  let d = 1;
  for (let k = 0; k < n; k++) {
    let p = k;
    for (let i = k + 1; i < n; i++) if (Math.abs(a[i * n + k]) > Math.abs(a[p * n + k])) p = i;
    if (a[p * n + k] === 0) return 0;
    if (p !== k) {
      for (let j = 0; j < n; j++) [a[k * n + j], a[p * n + j]] = [a[p * n + j], a[k * n + j]];
      d = -d;
    }
    d *= a[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const f = a[i * n + k] / a[k * n + k];
      for (let j = k; j < n; j++) a[i * n + j] -= f * a[k * n + j];
    }
  }
  return d;
}

/**
 * Numerator of the control-to-output transfer function of an averaged model at a real s:
 * N(s) = det(sI − A)·(c·(sI − A)⁻¹·b_d + e_d) = det(sI − A + b_d·c) − det(sI − A) + e_d·det(sI − A)
 * (matrix determinant lemma), so its roots are the transfer function's zeros.
 */
export function numeratorAt(model: AveragedModel, output: string, s: number): number {
  const { n, a, c, bd, ed } = model;
  const k = model.outputNames.indexOf(output);
  if (k < 0) throw new Error(`no output ${output}`);
  const m = new Float64Array(n * n);
  const mc = new Float64Array(n * n);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      m[i * n + j] = (i === j ? s : 0) - a[i * n + j];
      mc[i * n + j] = m[i * n + j] + bd[i] * c[k * n + j];
    }
  }
  const d0 = det(m, n);
  return det(mc, n) - d0 + ed[k] * d0;
}

/** The four demo rail specs of data/specs, parsed through the spec boundary. */
export function demoSpecs(): { file: string; spec: RailSpec }[] {
  const dir = fileURLToPath(new URL('../../data/specs/', import.meta.url));
  return readdirSync(dir)
    .filter((f) => f.endsWith('.yaml'))
    .map((file) => {
      const r = loadSpecText(readFileSync(join(dir, file), 'utf8'), file);
      if (!r.ok) throw new Error(`${file}: ${r.issues.map((i) => i.message).join('; ')}`);
      return { file, spec: r.spec };
    });
}
