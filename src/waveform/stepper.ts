/**
 * Exact stepping of a piecewise-linear circuit with diode events.
 *
 * Between events the configuration is fixed and x(t+h) = Φ(h)·x(t) + Γ(h)·u is exact. A diode is
 * consistent when on with i ≥ 0, or off with v ≤ vf (the on-state voltage at zero current). After each
 * sub-step every diode is checked; the earliest sign change is located by Illinois regula falsi on the
 * exact solution, the configuration flips there, and stepping resumes. A diode whose margin returns to
 * the same sign inside one sub-step (two crossings) is not seen: sub-steps are kept short for that reason.
 */
import { maxAbs } from './dense.ts';
import { SimulationError } from './errors.ts';
import { type StepMaps, stepMaps } from './expm.ts';
import type { CompiledCircuit, StateSpace } from './state-space.ts';

export interface DiodeRef {
  bit: number;
  name: string;
  iOut: number;
  vOut: number;
  vfInput: number;
}

/** Boundary cause: a diode turning on or off (not a gate edge). */
export interface DiodeEvent {
  diode: number; // index into StepContext.diodes
  kind: 'on' | 'off';
}

export interface StepContext {
  circuit: CompiledCircuit;
  u: Float64Array;
  diodes: DiodeRef[];
  /** Thresholds under which a diode current (A) or excess voltage (V) counts as zero. */
  tolA: number;
  tolV: number;
  periodS: number;
  events: number;
  maxEvents: number;
  steps: number;
  maxSteps: number;
  lastEventS: number;
  stalledEvents: number;
}

export interface StepSink {
  sample(tS: number, x: Float64Array, mask: number): void;
  boundary?(tS: number, mask: number, cause: DiodeEvent): void;
}

const stepCache = new WeakMap<CompiledCircuit, Map<string, StepMaps>>();

/** Φ(h), Γ(h) of one configuration, cached per (mask, h) on the circuit. */
export function cachedStepMaps(circuit: CompiledCircuit, mask: number, h: number): StepMaps {
  let cache = stepCache.get(circuit);
  if (!cache) {
    cache = new Map();
    stepCache.set(circuit, cache);
  }
  const key = `${mask}:${h}`;
  let maps = cache.get(key);
  if (!maps) {
    const ss = circuit.configuration(mask);
    maps = stepMaps(ss.a, ss.b, ss.n, ss.m, h);
    if (cache.size > 4096) cache.clear();
    cache.set(key, maps);
  }
  return maps;
}

/** x⁺ = Φ·x + Γ·u. */
export function applyStep(maps: StepMaps, x: Float64Array, u: Float64Array): Float64Array {
  const n = x.length;
  const m = u.length;
  const out = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    let s = 0;
    for (let j = 0; j < n; j++) s += maps.phi[i * n + j] * x[j];
    for (let j = 0; j < m; j++) s += maps.gamma[i * m + j] * u[j];
    out[i] = s;
  }
  return out;
}

/** One output y_k = C_k·x + D_k·u. */
export function outputAt(ss: StateSpace, k: number, x: Float64Array, u: Float64Array): number {
  let s = 0;
  for (let j = 0; j < ss.n; j++) s += ss.c[k * ss.n + j] * x[j];
  for (let j = 0; j < ss.m; j++) s += ss.d[k * ss.m + j] * u[j];
  return s;
}

/** Time derivative of output k (inputs constant): C_k·(A·x + B·u). */
function outputRate(ss: StateSpace, k: number, x: Float64Array, u: Float64Array): number {
  let s = 0;
  for (let i = 0; i < ss.n; i++) {
    const cki = ss.c[k * ss.n + i];
    if (cki === 0) continue;
    let xdot = 0;
    for (let j = 0; j < ss.n; j++) xdot += ss.a[i * ss.n + j] * x[j];
    for (let j = 0; j < ss.m; j++) xdot += ss.b[i * ss.m + j] * u[j];
    s += cki * xdot;
  }
  return s;
}

export function diodeRefs(circuit: CompiledCircuit): DiodeRef[] {
  const refs: DiodeRef[] = [];
  circuit.twoState.forEach((e, j) => {
    if (e.kind !== 'D') return;
    refs.push({
      bit: 1 << j,
      name: e.name,
      iOut: circuit.outputIndex(`i(${e.name})`),
      vOut: circuit.outputIndex(`v(${e.name})`),
      vfInput: circuit.inputNames.indexOf(`${e.name}.vf`),
    });
  });
  return refs;
}

/**
 * Consistency margin of a diode in its present state, in units of its tolerance: on ⇒ i/tolA,
 * off ⇒ (vf − v)/tolV. Negative beyond −1 means the assumed state is wrong.
 */
export function diodeMargin(ctx: StepContext, ss: StateSpace, d: DiodeRef, x: Float64Array): number {
  if ((ss.mask & d.bit) !== 0) return outputAt(ss, d.iOut, x, ctx.u) / ctx.tolA;
  return (ctx.u[d.vfInput] - outputAt(ss, d.vOut, x, ctx.u)) / ctx.tolV;
}

function diodeMarginRate(ctx: StepContext, ss: StateSpace, d: DiodeRef, x: Float64Array): number {
  if ((ss.mask & d.bit) !== 0) return outputRate(ss, d.iOut, x, ctx.u) / ctx.tolA;
  return -outputRate(ss, d.vOut, x, ctx.u) / ctx.tolV;
}

/**
 * The consistent diode states at one instant, starting from `mask`: flip the most violated diode until
 * none is; a diode at its threshold (|margin| ≤ 1) flips when its margin is heading negative.
 */
export function resolveDiodes(ctx: StepContext, x: Float64Array, mask: number): number {
  const limit = 4 * ctx.diodes.length + 4;
  for (let iter = 0; iter <= limit; iter++) {
    const ss = ctx.circuit.configuration(mask);
    let worst = -1;
    let worstScore = 0;
    ctx.diodes.forEach((d, k) => {
      const g = diodeMargin(ctx, ss, d, x);
      let score = 0;
      if (g < -1) score = -g;
      else if (Math.abs(g) <= 1 && diodeMarginRate(ctx, ss, d, x) < 0) score = 0.5;
      if (score > worstScore) {
        worstScore = score;
        worst = k;
      }
    });

    if (worst < 0) return mask;
    mask ^= ctx.diodes[worst].bit;
  }
  // Greedy flipping can cycle when diodes interact (two rectifiers sharing one inductor at zero current).
  // With few diodes, search every combination of the diode bits for a consistent one, the one with
  // the fewest flips from the present mask first (a small linear complementarity problem, solved by
  // enumeration).
  const consistent = enumerateDiodes(ctx, x, mask);
  if (consistent >= 0) return consistent;
  throw new SimulationError(
    'event-chatter',
    'simulation could not settle: diodes keep flipping at one instant',
    {
      mask,
      diodes: ctx.diodes.map((d) => d.name),
    },
  );
}

/** Largest number of diodes the instant-resolution search enumerates (2^n configurations). */
const ENUMERATE_MAX_DIODES = 8;

function enumerateDiodes(ctx: StepContext, x: Float64Array, mask: number): number {
  const n = ctx.diodes.length;
  if (n === 0 || n > ENUMERATE_MAX_DIODES) return -1;
  let allBits = 0;
  for (const d of ctx.diodes) allBits |= d.bit;
  // Score of a combination: hard violations (margin beyond tolerance) rule it out; a diode sitting
  // within tolerance of its threshold but heading the wrong way is a soft violation (it changes state
  // at the next event anyway). Best: no violation, then fewest soft ones, then fewest flips.
  let best = -1;
  let bestSoft = Number.POSITIVE_INFINITY;
  let bestFlips = Number.POSITIVE_INFINITY;
  for (let combo = 0; combo < 1 << n; combo++) {
    let candidate = mask & ~allBits;
    let flips = 0;
    for (let k = 0; k < n; k++) {
      const on = (combo >> k) & 1;
      if (on) candidate |= ctx.diodes[k].bit;
      if (((mask & ctx.diodes[k].bit) !== 0) !== (on === 1)) flips++;
    }
    const ss = ctx.circuit.configuration(candidate);
    let soft = 0;
    let hard = false;
    for (const d of ctx.diodes) {
      const g = diodeMargin(ctx, ss, d, x);
      if (g < -1) {
        hard = true;
        break;
      }
      if (Math.abs(g) <= 1 && diodeMarginRate(ctx, ss, d, x) < 0) soft++;
    }
    if (hard) continue;
    if (soft < bestSoft || (soft === bestSoft && flips < bestFlips)) {
      best = candidate;
      bestSoft = soft;
      bestFlips = flips;
    }
  }
  return best;
}

/** Earliest s in [0, h] where a diode's margin crosses zero, by Illinois regula falsi on the exact solution. */
function locateEvent(
  ctx: StepContext,
  mask: number,
  x: Float64Array,
  h: number,
  d: DiodeRef,
  g0: number,
  gh: number,
): { s: number; x: Float64Array } {
  if (g0 <= 0) return { s: 0, x };
  const ss = ctx.circuit.configuration(mask);
  const at = (s: number) => applyStep(stepMaps(ss.a, ss.b, ss.n, ss.m, s), x, ctx.u);
  let a = 0;
  let fa = g0;
  let b = h;
  let fb = gh;
  let xb = at(h);
  let side = 0;
  for (let iter = 0; iter < 80; iter++) {
    const s = (a * fb - b * fa) / (fb - fa);
    const xs = at(s);
    const fs = diodeMargin(ctx, ss, d, xs);
    if (fs <= 0) {
      b = s;
      fb = fs;
      xb = xs;
      if (side === -1) fa /= 2;
      side = -1;
    } else {
      a = s;
      fa = fs;
      if (side === 1) fb /= 2;
      side = 1;
    }
    if (Math.abs(fs) < 1e-3 || b - a < 1e-13 * ctx.periodS) break;
  }
  // Report the first point at or past the crossing, so the flipped state is the consistent one.
  return { s: b, x: xb };
}

/**
 * Advances x from t0 to t1 starting in configuration `mask` (already consistent), in sub-steps no longer
 * than hMax, flipping diodes at their events. Gates must not change inside (t0, t1).
 */
export function advance(
  ctx: StepContext,
  x: Float64Array,
  t0: number,
  t1: number,
  mask: number,
  hMax: number,
  sink?: StepSink,
): { x: Float64Array; mask: number } {
  let t = t0;
  const eps = 1e-14 * ctx.periodS;
  while (t1 - t > eps) {
    const nSub = Math.max(1, Math.ceil((t1 - t) / hMax - 1e-9));
    const h = (t1 - t) / nSub;
    const start = t;
    let event = false;
    // The configuration is fixed until an event, which ends this loop.
    const ss = ctx.circuit.configuration(mask);
    const maps = cachedStepMaps(ctx.circuit, mask, h);
    for (let k = 0; k < nSub && !event; k++) {
      if (++ctx.steps > ctx.maxSteps) {
        throw new SimulationError(
          'step-cap',
          `simulation could not settle: more than ${ctx.maxSteps} exact steps`,
          {
            tS: t,
          },
        );
      }
      const xn = applyStep(maps, x, ctx.u);
      let hit: { s: number; x: Float64Array; k: number } | undefined;
      for (let di = 0; di < ctx.diodes.length; di++) {
        const d = ctx.diodes[di];
        const gh = diodeMargin(ctx, ss, d, xn);
        if (gh >= -1) continue;
        const found = locateEvent(ctx, mask, x, h, d, diodeMargin(ctx, ss, d, x), gh);
        if (!hit || found.s < hit.s) hit = { ...found, k: di };
      }
      if (!hit) {
        x = xn;
        t = k === nSub - 1 ? t1 : start + (k + 1) * h;
        sink?.sample(t, x, mask);
        continue;
      }
      event = true;
      t = Math.min(t1, start + k * h + hit.s);
      x = hit.x;
      sink?.sample(t, x, mask);
      const d = ctx.diodes[hit.k];
      const cause: DiodeEvent = { diode: hit.k, kind: (mask & d.bit) !== 0 ? 'off' : 'on' };
      mask = resolveDiodes(ctx, x, mask ^ d.bit);
      recordEvent(ctx, t);
      sink?.boundary?.(t, mask, cause);
      sink?.sample(t, x, mask);
    }
    if (!event) break;
  }
  return { x, mask };
}

function recordEvent(ctx: StepContext, t: number): void {
  if (++ctx.events > ctx.maxEvents) {
    throw new SimulationError(
      'event-cap',
      `simulation could not settle: more than ${ctx.maxEvents} diode events`,
      {
        tS: t,
      },
    );
  }
  ctx.stalledEvents = t - ctx.lastEventS < 1e-9 * ctx.periodS ? ctx.stalledEvents + 1 : 0;
  ctx.lastEventS = t;
  if (ctx.stalledEvents > 20) {
    throw new SimulationError(
      'event-chatter',
      'simulation could not settle: diode events without time advancing',
      {
        tS: t,
      },
    );
  }
}

/**
 * Diode thresholds from the circuit's scale (common practice for event detection): tolV = 1e-9 of the
 * largest source value; tolA = 1e-9 of the largest of that voltage over the smallest resistor (a load
 * current) and the largest current source.
 */
export function defaultTolerances(circuit: CompiledCircuit, u: Float64Array): { tolA: number; tolV: number } {
  const vScale = Math.max(1e-3, maxAbs(u));
  const rMin = Math.min(...circuit.elements.map((e) => (e.kind === 'R' ? e.ohm : Number.POSITIVE_INFINITY)));
  const iScale = Math.max(1e-6, vScale / (Number.isFinite(rMin) ? rMin : 1), maxAbs(u));
  return { tolA: 1e-9 * iScale, tolV: 1e-9 * vScale };
}

export function newContext(
  circuit: CompiledCircuit,
  u: Float64Array,
  periodS: number,
  limits: { maxEvents: number; maxSteps: number },
): StepContext {
  return {
    circuit,
    u,
    diodes: diodeRefs(circuit),
    ...defaultTolerances(circuit, u),
    periodS,
    events: 0,
    steps: 0,
    lastEventS: Number.NEGATIVE_INFINITY,
    stalledEvents: 0,
    ...limits,
  };
}
