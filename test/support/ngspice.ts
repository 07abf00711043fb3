/**
 * ngspice as a test reference (ngspice, via the eecircuit-engine WebAssembly build, npm): one
 * instance per test file in a worker thread, runs that fail loudly, and the periodic steady state of a
 * switched netlist found by shooting instead of by simulating thousands of periods.
 *
 * Shooting (Aprille & Trick, "Steady-state analysis of nonlinear circuits with periodic inputs",
 * Proc. IEEE 60(1), 1972): with x the inductor currents and capacitor voltages at the period start, one
 * simulated period is a map P(x). In CCM the switch sequence is fixed, so P is affine, P(x) = Φ·x + c;
 * Φ comes from n perturbed one-period runs and the fixed point from (I − Φ)·Δ = P(x) − x. Chord steps
 * with the same Φ absorb ngspice's integration noise and mild nonlinearity (diode conduction edges).
 * Slow, lightly damped modes (a SEPIC coupling network at a few kHz, Q ≈ 25) cost nothing this way.
 */
import { Worker } from 'node:worker_threads';
import {
  type SpiceMap,
  type SpiceOptions,
  spiceMap,
  spiceNodeName,
  toSpice,
} from '../../src/report/spice.ts';
import type { Element, Netlist } from '../../src/waveform/netlist.ts';

export class NgspiceError extends Error {
  constructor(
    message: string,
    readonly log: string,
  ) {
    super(message);
    this.name = 'NgspiceError';
  }
}

export interface SpiceRun {
  vectors: Record<string, Float64Array>;
  /** Non-fatal messages ngspice printed on its error stream. */
  warnings: string[];
  log: string;
}

interface Reply {
  id: number;
  ok: boolean;
  ready?: boolean;
  vectors?: Record<string, Float64Array>;
  errors?: string[];
  log?: string;
  message?: string;
}

/** Messages on ngspice's error stream that mean the run did not complete (the engine itself never throws). */
const FATAL = /timestep too small|aborted|error|fatal|singular|cannot|unknown|no such|not found|failed/i;

export class Ngspice {
  private nextId = 1;
  private pending = new Map<number, (r: Reply) => void>();

  private constructor(private readonly worker: Worker) {
    worker.on('message', (r: Reply) => {
      const done = this.pending.get(r.id);
      this.pending.delete(r.id);
      done?.(r);
    });
    // a crashed worker fails every run in flight
    worker.on('error', (error) => {
      for (const done of this.pending.values()) done({ id: 0, ok: false, message: String(error) });
      this.pending.clear();
    });
  }

  /** Start ngspice in a worker (1–3 s, ~500 MB): once per test file. */
  static async start(): Promise<Ngspice> {
    const worker = new Worker(new URL('./ngspice-worker.mjs', import.meta.url));
    await new Promise<void>((resolve, reject) => {
      worker.once('error', reject);
      worker.once('message', (r: Reply) =>
        r.ready ? resolve() : reject(new Error('ngspice worker did not start')),
      );
    });
    return new Ngspice(worker);
  }

  /** Run one netlist; throws NgspiceError when ngspice reports a failure or returns no time axis. */
  async run(text: string, expectStopS?: number): Promise<SpiceRun> {
    const id = this.nextId++;
    const reply = await new Promise<Reply>((resolve) => {
      this.pending.set(id, resolve);
      this.worker.postMessage({ id, text });
    });
    const log = reply.log ?? '';
    if (!reply.ok) throw new NgspiceError(`ngspice worker failed: ${reply.message}`, log);
    const errors = reply.errors ?? [];
    const fatal = errors.filter((e) => FATAL.test(e) && !/^warning/i.test(e.trim()));
    if (fatal.length > 0) throw new NgspiceError(`ngspice: ${fatal.join(' | ')}`, log);
    const vectors = reply.vectors ?? {};
    const time = vectors.time;
    if (!time || time.length < 2) throw new NgspiceError('ngspice returned no transient data', log);
    // a failed run can leave the previous run's output file behind: check that this run reached its end
    if (expectStopS !== undefined && Math.abs(time[time.length - 1] - expectStopS) > 1e-6 * expectStopS) {
      throw new NgspiceError(
        `ngspice stopped at ${time[time.length - 1]} s instead of ${expectStopS} s`,
        log,
      );
    }
    return { vectors, warnings: errors, log };
  }

  async stop(): Promise<void> {
    await this.worker.terminate();
  }
}

/** Extremes and time average of one signal over a window. */
export interface SignalStats {
  avg: number;
  min: number;
  max: number;
  pp: number;
  peakAbs: number;
}

/** Linear interpolation of y(t) at t (t inside the time axis). */
function at(time: Float64Array, y: Float64Array, t: number): number {
  let lo = 0;
  let hi = time.length - 1;
  while (hi - lo > 1) {
    const mid = (lo + hi) >> 1;
    if (time[mid] <= t) lo = mid;
    else hi = mid;
  }
  const span = time[hi] - time[lo];
  return span > 0 ? y[lo] + ((y[hi] - y[lo]) * (t - time[lo])) / span : y[hi];
}

/** Average (trapezoidal, on ngspice's own time points), min and max of y over [t0, t1]. */
export function windowStats(time: Float64Array, y: Float64Array, t0: number, t1: number): SignalStats {
  let area = 0;
  let tPrev = t0;
  let yPrev = at(time, y, t0);
  let min = yPrev;
  let max = yPrev;
  for (let i = 0; i < time.length; i++) {
    if (time[i] <= t0) continue;
    const t = Math.min(time[i], t1);
    const v = time[i] <= t1 ? y[i] : at(time, y, t1);
    area += 0.5 * (v + yPrev) * (t - tPrev);
    min = Math.min(min, v);
    max = Math.max(max, v);
    tPrev = t;
    yPrev = v;
    if (time[i] >= t1) break;
  }
  return { avg: area / (t1 - t0), min, max, pp: max - min, peakAbs: Math.max(Math.abs(min), Math.abs(max)) };
}

export interface PeriodicOptions {
  title?: string;
  /** Periods simulated from the steady state for the statistics (the last `statPeriods` are used). */
  periods?: number;
  statPeriods?: number;
  /** Maximum internal step as a fraction of the period: period / stepsPerPeriod. */
  stepsPerPeriod?: number;
  maxChordSteps?: number;
  /** Skip shooting: simulate `periods` from the netlist's own initial state. */
  noShooting?: boolean;
  /** SPICE export choices passed through (diode capacitance, integration method). */
  spice?: Pick<SpiceOptions, 'diodeCjoF' | 'method'>;
}

export interface PeriodicSteadyState {
  /** Element currents in the netlist's a → b direction (L, S, D, V, and R from its voltage). */
  currents: Record<string, SignalStats>;
  /** Element terminal voltages v(a) − v(b). */
  voltages: Record<string, SignalStats>;
  /** Node voltages. */
  nodes: Record<string, SignalStats>;
  /** Largest |P(x) − x| over the states at the accepted point, relative to each state's scale. */
  residual: number;
  runs: number;
}

type StateElement = Extract<Element, { kind: 'L' } | { kind: 'C' }>;

function stateElements(netlist: Netlist): StateElement[] {
  return netlist.elements.filter((e): e is StateElement => e.kind === 'L' || e.kind === 'C');
}

function withState(netlist: Netlist, states: StateElement[], x: number[]): Netlist {
  const value = new Map(states.map((e, i) => [e.name, x[i]]));
  const elements = netlist.elements.map((e) => {
    if (e.kind === 'L') return { ...e, i0: value.get(e.name) };
    if (e.kind === 'C') return { ...e, v0: value.get(e.name) };
    return e;
  });
  return { ...netlist, elements };
}

function nodeVector(run: SpiceRun, node: string): Float64Array {
  if (node === '0') return new Float64Array(run.vectors.time.length);
  const v = run.vectors[`v(${node})`];
  if (!v) throw new Error(`ngspice result has no v(${node})`);
  return v;
}

function finalState(run: SpiceRun, map: SpiceMap, states: StateElement[]): number[] {
  const last = run.vectors.time.length - 1;
  return states.map((e) => {
    const p = map.elements[e.name];
    if (e.kind === 'L') return run.vectors[p.current!][last];
    return nodeVector(run, p.stateA!)[last] - nodeVector(run, p.stateB!)[last];
  });
}

/** Solve A·x = b (n small) by Gaussian elimination with partial pivoting. */
function solve(a: number[][], b: number[]): number[] {
  const n = b.length;
  const m = a.map((row, i) => [...row, b[i]]);
  for (let c = 0; c < n; c++) {
    let p = c;
    for (let r = c + 1; r < n; r++) if (Math.abs(m[r][c]) > Math.abs(m[p][c])) p = r;
    [m[c], m[p]] = [m[p], m[c]];
    if (m[c][c] === 0) throw new Error('shooting: singular (I − Φ)');
    for (let r = c + 1; r < n; r++) {
      const f = m[r][c] / m[c][c];
      for (let k = c; k <= n; k++) m[r][k] -= f * m[c][k];
    }
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r--) {
    let s = m[r][n];
    for (let k = r + 1; k < n; k++) s -= m[r][k] * x[k];
    x[r] = s / m[r][r];
  }
  return x;
}

/**
 * Periodic steady state of a switched netlist in ngspice. The netlist's i0/v0 are the starting guess
 * (seed them from the analytic engine: the shooting then converges in one chord step).
 */
export async function periodicSteadyState(
  ng: Ngspice,
  netlist: Netlist,
  opts: PeriodicOptions = {},
): Promise<PeriodicSteadyState> {
  const T = 1 / netlist.fswHz;
  const steps = opts.stepsPerPeriod ?? 200;
  const title = opts.title ?? 'periodic steady state';
  const map = spiceMap(netlist);
  const states = stateElements(netlist);
  const scale = states.map((e) =>
    e.kind === 'L' ? Math.max(Math.abs(e.i0 ?? 0), 0.1) : Math.max(Math.abs(e.v0 ?? 0), 1),
  );
  let runs = 0;
  const period = async (x: number[]): Promise<number[]> => {
    const text = toSpice(withState(netlist, states, x), {
      ...opts.spice,
      title,
      tStopS: T,
      tStepS: T / steps,
      initialConditions: true,
    });
    runs++;
    return finalState(await ng.run(text, T), map, states);
  };

  let x = states.map((e) => (e.kind === 'L' ? (e.i0 ?? 0) : (e.v0 ?? 0)));
  let residual = Number.POSITIVE_INFINITY;
  if (!opts.noShooting) {
    const px = await period(x);
    const delta = states.map((e, i) => (e.kind === 'L' ? 0.02 : 0.01) * scale[i]);
    // Jacobian of the period map, column by column: Φ[:, j] = (P(x + δ_j·e_j) − P(x)) / δ_j
    const phi = states.map(() => new Array<number>(states.length).fill(0));
    for (let j = 0; j < states.length; j++) {
      const xj = [...x];
      xj[j] += delta[j];
      const pj = await period(xj);
      for (let i = 0; i < states.length; i++) phi[i][j] = (pj[i] - px[i]) / delta[j];
    }
    const iMinusPhi = phi.map((row, i) => row.map((v, j) => (i === j ? 1 : 0) - v));
    let r = px.map((v, i) => v - x[i]);
    for (let k = 0; k < (opts.maxChordSteps ?? 4); k++) {
      const dx = solve(iMinusPhi, r);
      x = x.map((v, i) => v + dx[i]);
      const p = await period(x);
      r = p.map((v, i) => v - x[i]);
      residual = Math.max(...r.map((v, i) => Math.abs(v) / scale[i]));
      if (residual < 1e-5) break;
    }
  }

  const periods = opts.periods ?? 3;
  const statPeriods = Math.min(opts.statPeriods ?? 2, periods);
  const tStop = periods * T;
  const text = toSpice(withState(netlist, states, x), {
    ...opts.spice,
    title,
    tStopS: tStop,
    tStepS: T / steps,
    initialConditions: true,
  });
  const run = await ng.run(text, tStop);
  runs++;
  if (opts.noShooting)
    residual = Math.max(...finalState(run, map, states).map((v, i) => Math.abs(v - x[i]) / scale[i]));
  const time = run.vectors.time;
  const t0 = tStop - statPeriods * T;
  const stats = (y: Float64Array) => windowStats(time, y, t0, tStop);
  const currents: Record<string, SignalStats> = {};
  const voltages: Record<string, SignalStats> = {};
  const nodes: Record<string, SignalStats> = {};
  const nodeNames = new Set<string>();
  for (const e of netlist.elements) {
    if (e.kind === 'K') continue;
    const p = map.elements[e.name];
    const va = nodeVector(run, p.a);
    const vb = nodeVector(run, p.b);
    const v = va.map((x, i) => x - vb[i]);
    voltages[e.name] = stats(v);
    if (p.current) currents[e.name] = stats(run.vectors[p.current]);
    else if (e.kind === 'R') currents[e.name] = stats(v.map((x) => x / e.ohm));
    nodeNames.add(e.a);
    nodeNames.add(e.b);
  }
  for (const n of nodeNames) if (n !== '0') nodes[n] = stats(nodeVector(run, spiceNodeName(n)));
  return { currents, voltages, nodes, residual, runs };
}
