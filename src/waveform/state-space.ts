/**
 * State-space model of each switch/diode configuration, by modified nodal analysis.
 *
 * With every inductor replaced by a current source of its current and every capacitor by a voltage source
 * of its (inner) voltage behind its ESR, the rest is a resistive network driven by w = [x; u]. Solving its
 * nodal equations G·z = R·w once per configuration gives every node voltage and source current as a linear
 * map of w, hence every element's voltage and current (y = C·x + D·u) and the state derivatives:
 *   inductors:  L_matrix · di/dt = v_branch − DCR·i   (v_branch = v(a) − v(b); L_matrix holds M = k·√(L1·L2))
 *   capacitors: C · dv/dt = i_branch
 * (standard MNA, e.g. Ho, Ruehli & Brennan, "The modified nodal approach to network analysis", IEEE Trans.
 * Circuits and Systems 22(6), 1975). A conducting diode is ron in series with its forward drop, an input.
 */
import { type CircuitIndex, indexCircuit } from './circuit-graph.ts';
import { identity, luFactor, luSolve } from './dense.ts';
import { SimulationError } from './errors.ts';
import type { Netlist } from './netlist.ts';

/** ẋ = A·x + B·u, y = C·x + D·u for one configuration. Row-major. */
export interface StateSpace {
  mask: number;
  n: number;
  m: number;
  p: number;
  a: Float64Array;
  b: Float64Array;
  c: Float64Array;
  d: Float64Array;
}

export interface CompiledCircuit extends CircuitIndex {
  n: number;
  m: number;
  p: number;
  /** The configuration with two-state element j conducting when bit j of mask is set; cached by mask. */
  configuration(mask: number): StateSpace;
  /** Input vector from the element defaults, with V/I sources overridden by name. */
  inputVector(overrides?: Record<string, number>): Float64Array;
  outputIndex(name: string): number;
  stateIndex(name: string): number;
}

/** Inverse of the inductance matrix (coupled windings) by LU; |k| < 1 makes it positive definite. */
function inverseInductance(idx: CircuitIndex): Float64Array {
  const nl = idx.inductors.length;
  const lm = new Float64Array(nl * nl);
  const pos = new Map(idx.inductors.map((l, i) => [l.name, i]));
  idx.inductors.forEach((l, i) => {
    lm[i * nl + i] = l.henry;
  });
  for (const e of idx.elements) {
    if (e.kind !== 'K') continue;
    const i = pos.get(e.l1)!;
    const j = pos.get(e.l2)!;
    const mutual = e.k * Math.sqrt(idx.inductors[i].henry * idx.inductors[j].henry);
    lm[i * nl + j] += mutual;
    lm[j * nl + i] += mutual;
  }
  const f = luFactor(lm, nl);
  if (!(f.pivotRatio > 1e-12)) {
    throw new SimulationError(
      'invalid-netlist',
      'the inductance matrix is singular (couplings too close to 1)',
      {
        pivotRatio: f.pivotRatio,
      },
    );
  }
  return luSolve(f, identity(nl), nl);
}

function buildConfiguration(idx: CircuitIndex, lInv: Float64Array, mask: number): StateSpace {
  const { nodes, nodeIndex, elements } = idx;
  const nl = idx.inductors.length;
  const n = nl + idx.capacitors.length;
  const m = idx.inputNames.length;
  const w = n + m;
  const stateCol = new Map(idx.stateNames.map((s, i) => [s, i]));
  const inputCol = new Map(idx.inputNames.map((s, i) => [s, n + i]));
  const bit = new Map(idx.twoState.map((e, j) => [e.name, 1 << j]));
  // Unknowns: node voltages, then the currents of V sources and ESR-free capacitors.
  // Switches and diodes carry their current as an unknown too: with ron ≪ 1 Ω, a current recovered from
  // a node-voltage difference would lose most of its digits, and diode events hinge on that current.
  const branchRow = new Map<string, number>();
  for (const e of elements) {
    if (
      e.kind === 'V' ||
      e.kind === 'S' ||
      e.kind === 'D' ||
      (e.kind === 'C' && !(e.esrOhm && e.esrOhm > 0))
    ) {
      branchRow.set(e.name, nodes.length + branchRow.size);
    }
  }
  const size = nodes.length + branchRow.size;
  const g = new Float64Array(size * size);
  const rhs = new Float64Array(size * w);
  const node = (name: string) => (name === '0' ? -1 : nodeIndex.get(name)!);
  const conductance = (a: number, b: number, y: number) => {
    if (a >= 0) g[a * size + a] += y;
    if (b >= 0) g[b * size + b] += y;
    if (a >= 0 && b >= 0) {
      g[a * size + b] -= y;
      g[b * size + a] -= y;
    }
  };
  // A source of value k·w[col] pushing current from a to b through itself.
  const current = (a: number, b: number, col: number, k: number) => {
    if (a >= 0) rhs[a * w + col] -= k;
    if (b >= 0) rhs[b * w + col] += k;
  };
  // Branch with its current i as unknown: v(a) − v(b) − r·i = w[col] (the forward drop, or nothing),
  // divided by r when r > 1 Ω so that off-state rows stay of order one.
  const resistiveBranch = (a: number, b: number, row: number, r: number, col: number) => {
    const k = r > 1 ? 1 / r : 1;
    if (a >= 0) {
      g[a * size + row] += 1;
      g[row * size + a] += k;
    }
    if (b >= 0) {
      g[b * size + row] -= 1;
      g[row * size + b] -= k;
    }
    g[row * size + row] -= r * k;
    if (col >= 0) rhs[row * w + col] += k;
  };
  const voltage = (a: number, b: number, row: number, col: number) => {
    if (a >= 0) {
      g[a * size + row] += 1;
      g[row * size + a] += 1;
    }
    if (b >= 0) {
      g[b * size + row] -= 1;
      g[row * size + b] -= 1;
    }
    rhs[row * w + col] += 1;
  };
  for (const e of elements) {
    if (e.kind === 'K') continue;
    const a = node(e.a);
    const b = node(e.b);
    switch (e.kind) {
      case 'R':
        conductance(a, b, 1 / e.ohm);
        break;
      case 'S':
      case 'D': {
        const on = (mask & bit.get(e.name)!) !== 0;
        const r = on ? e.ronOhm : e.roffOhm;
        const vf = e.kind === 'D' && on ? inputCol.get(`${e.name}.vf`)! : -1;
        resistiveBranch(a, b, branchRow.get(e.name)!, r, vf);
        break;
      }
      case 'L':
        current(a, b, stateCol.get(e.name)!, 1);
        break;
      case 'C':
        if (e.esrOhm && e.esrOhm > 0) {
          // i = (v − vC)/esr
          conductance(a, b, 1 / e.esrOhm);
          current(a, b, stateCol.get(e.name)!, -1 / e.esrOhm);
        } else voltage(a, b, branchRow.get(e.name)!, stateCol.get(e.name)!);
        break;
      case 'V':
        voltage(a, b, branchRow.get(e.name)!, inputCol.get(e.name)!);
        break;
      case 'I':
        current(a, b, inputCol.get(e.name)!, 1);
        break;
    }
  }
  const f = luFactor(g, size);
  if (!(f.pivotRatio > 1e-15)) {
    const weak = f.weakestRow < nodes.length ? `node '${nodes[f.weakestRow]}'` : 'a source branch';
    const on = idx.twoState.filter((_, j) => (mask & (1 << j)) !== 0).map((e) => e.name);
    throw new SimulationError(
      'singular-configuration',
      `configuration with [${on.join(', ')}] conducting has singular nodal equations near ${weak}`,
      { mask, pivotRatio: f.pivotRatio },
    );
  }
  const z = size > 0 ? luSolve(f, rhs, w) : new Float64Array(0);
  const row = (name: string): Float64Array => {
    const i = node(name);
    return i < 0 ? new Float64Array(w) : z.subarray(i * w, (i + 1) * w);
  };
  const p = idx.outputNames.length;
  const y = new Float64Array(p * w);
  const dx = new Float64Array(n * w);
  let out = 0;
  for (const e of elements) {
    if (e.kind === 'K') continue;
    const va = row(e.a);
    const vb = row(e.b);
    const vRow = new Float64Array(w);
    for (let j = 0; j < w; j++) vRow[j] = va[j] - vb[j];
    const iRow = new Float64Array(w);
    switch (e.kind) {
      case 'R':
        for (let j = 0; j < w; j++) iRow[j] = vRow[j] / e.ohm;
        break;
      case 'S':
      case 'D':
      case 'V': {
        const r = branchRow.get(e.name)!;
        iRow.set(z.subarray(r * w, (r + 1) * w));
        break;
      }
      case 'L': {
        const s = stateCol.get(e.name)!;
        iRow[s] = 1;
        // v_branch − DCR·i, to be mixed by the inverse inductance matrix below.
        dx.set(vRow, s * w);
        dx[s * w + s] -= e.dcrOhm ?? 0;
        break;
      }
      case 'C': {
        const s = stateCol.get(e.name)!;
        if (e.esrOhm && e.esrOhm > 0) {
          for (let j = 0; j < w; j++) iRow[j] = vRow[j] / e.esrOhm;
          iRow[s] -= 1 / e.esrOhm;
        } else iRow.set(z.subarray(branchRow.get(e.name)! * w, (branchRow.get(e.name)! + 1) * w));
        for (let j = 0; j < w; j++) dx[s * w + j] = iRow[j] / e.farad;
        break;
      }
      case 'I':
        iRow[inputCol.get(e.name)!] = 1;
        break;
    }
    y.set(iRow, out++ * w);
    y.set(vRow, out++ * w);
  }
  for (const nd of nodes) y.set(row(nd), out++ * w);
  // Inductor rows: di/dt = L_matrix⁻¹ · (v_branch − DCR·i).
  const raw = dx.slice(0, nl * w);
  for (let i = 0; i < nl; i++) {
    for (let j = 0; j < w; j++) {
      let s = 0;
      for (let k = 0; k < nl; k++) s += lInv[i * nl + k] * raw[k * w + j];
      dx[i * w + j] = s;
    }
  }
  const split = (src: Float64Array, rows: number) => {
    const left = new Float64Array(rows * n);
    const right = new Float64Array(rows * m);
    for (let i = 0; i < rows; i++) {
      for (let j = 0; j < n; j++) left[i * n + j] = src[i * w + j];
      for (let j = 0; j < m; j++) right[i * m + j] = src[i * w + n + j];
    }
    return [left, right];
  };
  const [a, b] = split(dx, n);
  const [c, d] = split(y, p);
  return { mask, n, m, p, a, b, c, d };
}

/** Indexes and checks the netlist; configurations are built on first use and cached by mask. */
export function compileCircuit(netlist: Netlist): CompiledCircuit {
  const idx = indexCircuit(netlist);
  const lInv = inverseInductance(idx);
  const cache = new Map<number, StateSpace>();
  const outputs = new Map(idx.outputNames.map((s, i) => [s, i]));
  const states = new Map(idx.stateNames.map((s, i) => [s, i]));
  const n = idx.stateNames.length;
  return {
    ...idx,
    n,
    m: idx.inputNames.length,
    p: idx.outputNames.length,
    configuration(mask: number): StateSpace {
      let ss = cache.get(mask);
      if (!ss) {
        ss = buildConfiguration(idx, lInv, mask);
        cache.set(mask, ss);
      }
      return ss;
    },
    inputVector(overrides: Record<string, number> = {}): Float64Array {
      const u = idx.inputDefaults.slice();
      for (const [name, value] of Object.entries(overrides)) {
        const i = idx.inputNames.indexOf(name);
        if (i < 0 || name.endsWith('.vf')) {
          throw new SimulationError('invalid-netlist', `'${name}' is not a V or I source of this netlist`);
        }
        if (!Number.isFinite(value))
          throw new SimulationError('invalid-netlist', `source ${name} = ${value}`);
        u[i] = value;
      }
      return u;
    },
    outputIndex(name: string): number {
      const i = outputs.get(name);
      if (i === undefined) throw new SimulationError('invalid-netlist', `no output named '${name}'`);
      return i;
    },
    stateIndex(name: string): number {
      const i = states.get(name);
      if (i === undefined) throw new SimulationError('invalid-netlist', `no state named '${name}'`);
      return i;
    },
  };
}
