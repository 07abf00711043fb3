/**
 * Configuration sequences over one period: discovering them by an exact one-period simulation, and
 * solving the periodic steady state of a fixed sequence whose diode-event times are unknowns.
 *
 * For a fixed sequence with segment maps x_{k+1} = Φ_k·x_k + Γ_k·u, one period is x(T) = Φ_T·x₀ + c_T with
 * Φ_T = Φ_{K−1}···Φ_0 and c_T accumulated alongside; periodicity x(T) = x₀ gives (I − Φ_T)·x₀ = c_T.
 * A boundary caused by a diode event must sit where that diode's margin (on: current; off: vf − v) is
 * zero at the end of the preceding segment; Newton's method on those times (finite-difference Jacobian,
 * step limited so boundaries keep their order) makes the sequence self-consistent.
 */
import { identity, luFactor, luSolve, maxAbs } from './dense.ts';
import { SimulationError } from './errors.ts';
import type { Netlist } from './netlist.ts';
import { diodeBits, switchBits } from './pwm.ts';
import {
  advance,
  applyStep,
  cachedStepMaps,
  type DiodeEvent,
  diodeMargin,
  resolveDiodes,
  type StepContext,
} from './stepper.ts';

export interface SequenceSegment {
  startS: number;
  endS: number;
  mask: number;
  /** Set when the segment starts at a diode event (a variable time); absent at gate edges and t = 0. */
  cause?: DiodeEvent;
}

/**
 * Newton stops when every event margin is below this fraction of the circuit scale (0.1 of the diode
 * tolerance, see stepper.ts); roundoff in the margins sits near 1e-11.
 */
const RESIDUAL_TOL = 1e-10;

/** Segments shorter than this fraction of the period are merged into a neighbour. */
const MIN_SEGMENT = 1e-9;

function mergeTinySegments(segs: SequenceSegment[], periodS: number): SequenceSegment[] {
  const out = segs.map((s) => ({ ...s }));
  for (let k = 0; k < out.length; ) {
    const s = out[k];
    if (out.length === 1 || s.endS - s.startS >= MIN_SEGMENT * periodS) {
      k++;
      continue;
    }
    const next = out[k + 1];
    if (k > 0 && !next?.cause) out[k - 1].endS = s.endS;
    else {
      next.startS = s.startS;
      next.cause = s.cause;
    }
    out.splice(k, 1);
  }
  return out;
}

/** Simulates one period exactly from x0 and reports the configuration sequence met. */
export function simulatePeriod(
  ctx: StepContext,
  netlist: Netlist,
  edges: number[],
  x0: Float64Array,
  hintMask: number,
): { segments: SequenceSegment[]; xEnd: Float64Array; endMask: number } {
  const T = ctx.periodS;
  const dBits = diodeBits(ctx.circuit);
  const segs: SequenceSegment[] = [];
  let x = x0;
  let mask = hintMask;
  const sink = {
    sample() {},
    boundary(t: number, m: number, cause: DiodeEvent) {
      segs.push({ startS: t, endS: T, mask: m, cause });
    },
  };
  for (let k = 0; k < edges.length; k++) {
    const tA = edges[k] * T;
    const tB = (k + 1 < edges.length ? edges[k + 1] : 1) * T;
    const sw = switchBits(ctx.circuit, netlist, (tA + tB) / (2 * T));
    mask = resolveDiodes(ctx, x, sw | (mask & dBits));
    segs.push({ startS: tA, endS: tB, mask });
    ({ x, mask } = advance(ctx, x, tA, tB, mask, T / 64, sink));
  }
  for (let k = 0; k + 1 < segs.length; k++) segs[k].endS = segs[k + 1].startS;
  segs[segs.length - 1].endS = T;
  return { segments: mergeTinySegments(segs, T), xEnd: x, endMask: mask };
}

export function sameStructure(a: SequenceSegment[], b: SequenceSegment[]): boolean {
  return (
    a.length === b.length &&
    a.every((s, k) => {
      const o = b[k];
      if (s.mask !== o.mask || !s.cause !== !o.cause) return false;
      if (!s.cause) return Math.abs(s.startS - o.startS) <= 1e-12 * b[b.length - 1].endS;
      return s.cause.diode === o.cause!.diode && s.cause.kind === o.cause!.kind;
    })
  );
}

interface Evaluation {
  x0: Float64Array;
  /** Diode margins at the variable boundaries, in units of 1e9 tolerances (≈ relative to circuit scale). */
  residual: Float64Array;
}

function evaluate(ctx: StepContext, segs: SequenceSegment[], varIdx: number[]): Evaluation {
  const n = ctx.circuit.n;
  let phiT = identity(n);
  let c: Float64Array = new Float64Array(n);
  const maps = segs.map((s) => cachedStepMaps(ctx.circuit, s.mask, s.endS - s.startS));
  for (const mp of maps) {
    // Φ_T ← Φ_k·Φ_T; c ← Φ_k·c + Γ_k·u
    const next = new Float64Array(n * n);
    for (let i = 0; i < n; i++)
      for (let k = 0; k < n; k++) {
        const p = mp.phi[i * n + k];
        if (p !== 0) for (let j = 0; j < n; j++) next[i * n + j] += p * phiT[k * n + j];
      }
    phiT = next;
    c = applyStep(mp, c, ctx.u);
  }
  const m = identity(n);
  for (let i = 0; i < n * n; i++) m[i] -= phiT[i];
  const f = luFactor(m, n);
  if (!(f.pivotRatio > 1e-13)) {
    throw new SimulationError(
      'no-periodic-solution',
      `no unique periodic steady state: (I − Φ_T) is singular near state '${ctx.circuit.stateNames[f.weakestRow]}' (an integrator without DC path?)`,
      { pivotRatio: f.pivotRatio },
    );
  }
  const x0 = luSolve(f, c, 1);
  const residual = new Float64Array(varIdx.length);
  let x = x0;
  let next = 0;
  segs.forEach((s, k) => {
    if (next < varIdx.length && varIdx[next] === k) {
      const prev = ctx.circuit.configuration(segs[k - 1].mask);
      residual[next++] = 1e-9 * diodeMargin(ctx, prev, ctx.diodes[s.cause!.diode], x);
    }
    x = applyStep(maps[k], x, ctx.u);
  });
  return { x0, residual };
}

function withTimes(segs: SequenceSegment[], varIdx: number[], times: number[]): SequenceSegment[] {
  const out = segs.map((s) => ({ ...s }));
  varIdx.forEach((k, j) => {
    out[k].startS = times[j];
    out[k - 1].endS = times[j];
  });
  return out;
}

/** Periodic steady state of a fixed sequence, moving its diode-event boundaries onto their zero crossings. */
export function solveSequence(
  ctx: StepContext,
  segsIn: SequenceSegment[],
): { x0: Float64Array; segments: SequenceSegment[]; residual: number } {
  const T = ctx.periodS;
  const varIdx = segsIn.flatMap((s, k) => (s.cause && k > 0 ? [k] : []));
  let segs = segsIn;
  let ev = evaluate(ctx, segs, varIdx);
  let norm = maxAbs(ev.residual);
  const nv = varIdx.length;
  for (let iter = 0; iter < 40 && nv > 0 && norm > RESIDUAL_TOL; iter++) {
    const times = varIdx.map((k) => segs[k].startS);
    const jac = new Float64Array(nv * nv);
    for (let j = 0; j < nv; j++) {
      const k = varIdx[j];
      const room = Math.min(segs[k - 1].endS - segs[k - 1].startS, segs[k].endS - segs[k].startS);
      const delta = Math.min(1e-7 * T, 0.25 * room);
      const pert = times.slice();
      pert[j] += delta;
      const evp = evaluate(ctx, withTimes(segs, varIdx, pert), varIdx);
      for (let i = 0; i < nv; i++) jac[i * nv + j] = (evp.residual[i] - ev.residual[i]) / delta;
    }
    const f = luFactor(jac, nv);
    if (!(f.pivotRatio > 1e-14)) break;
    const step = luSolve(
      f,
      ev.residual.map((r) => -r),
      1,
    );
    // Keep each boundary inside its neighbours (half the room, so two moving boundaries cannot cross).
    let alpha = 1;
    varIdx.forEach((k, j) => {
      const lo = segs[k - 1].startS;
      const hi = segs[k].endS;
      if (step[j] < 0) alpha = Math.min(alpha, (0.5 * (times[j] - lo)) / -step[j]);
      if (step[j] > 0) alpha = Math.min(alpha, (0.5 * (hi - times[j])) / step[j]);
    });
    let improved = false;
    for (let tries = 0; tries < 12 && !improved; tries++) {
      const trial = withTimes(
        segs,
        varIdx,
        times.map((t, j) => t + alpha * step[j]),
      );
      const evt = evaluate(ctx, trial, varIdx);
      const nt = maxAbs(evt.residual);
      if (nt < norm) {
        segs = trial;
        ev = evt;
        norm = nt;
        improved = true;
      } else alpha /= 2;
    }
    if (!improved || alpha * maxAbs(step) < 1e-12 * T) break;
  }
  return { x0: ev.x0, segments: segs, residual: norm };
}
