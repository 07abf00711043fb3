/**
 * A transient that runs until the circuit has reached its final periodic steady state, or a cap.
 * The run is made of whole switching periods in chunks; after each chunk the state at the period
 * boundary is compared with the exact periodic steady state x₀ of the final operating point (known
 * beforehand from solvePeriodicSteadyState): settled when every state is within SETTLE_RTOL of the
 * largest state of its kind, at two chunk ends in a row.
 */
import type { Netlist } from '../waveform/netlist.ts';
import type { CompiledCircuit } from '../waveform/state-space.ts';
import { type SourceStep, simulateTransient } from '../waveform/transient.ts';

/** Settling tolerance on the states, relative to the largest inductor current or capacitor voltage. */
export const SETTLE_RTOL = 2e-3;
/** Periods per chunk between settling checks. */
const CHUNK_PERIODS = 50;

export interface SettleRun {
  timeS: Float64Array;
  /** Engine output names (`i(L1)`, `node(out)` ...). */
  signals: Record<string, Float64Array>;
  settled: boolean;
  periods: number;
}

export interface SettleOptions {
  x0: Float64Array;
  /** Source values at t = 0 by name. */
  inputs: Record<string, number>;
  /** Source changes (all inside the first chunk); afterwards the sources hold their final values. */
  steps?: SourceStep[];
  /** Exact periodic steady state at the final operating point (period-start state). */
  target: Float64Array;
  maxPeriods: number;
  samplesPerPeriod: number;
}

function scaleByKind(circuit: CompiledCircuit, target: Float64Array): Float64Array {
  const nl = circuit.inductors.length;
  let iMax = 1e-9;
  let vMax = 1e-9;
  target.forEach((v, i) => {
    if (i < nl) iMax = Math.max(iMax, Math.abs(v));
    else vMax = Math.max(vMax, Math.abs(v));
  });
  return target.map((_, i) => (i < nl ? iMax : vMax));
}

function concat(parts: Float64Array[], total: number): Float64Array {
  const out = new Float64Array(total);
  let at = 0;
  for (const p of parts) {
    out.set(p, at);
    at += p.length;
  }
  return out;
}

export function runUntilSettled(netlist: Netlist, circuit: CompiledCircuit, opts: SettleOptions): SettleRun {
  const T = 1 / netlist.fswHz;
  const scale = scaleByKind(circuit, opts.target);
  const lastStep = Math.max(0, ...(opts.steps ?? []).map((s) => s.atS + (s.riseS ?? 0)));
  const firstPeriods = Math.max(CHUNK_PERIODS, Math.ceil(lastStep / T) + CHUNK_PERIODS);
  const finalInputs = { ...opts.inputs };
  for (const s of opts.steps ?? []) finalInputs[s.source] = (s.toV ?? s.toA)!;
  const times: Float64Array[] = [];
  const columns = new Map<string, Float64Array[]>();
  let total = 0;
  let x = opts.x0;
  let periods = 0;
  let inRow = 0;
  let settled = false;
  while (periods < opts.maxPeriods) {
    const first = periods === 0;
    const chunk = Math.min(first ? firstPeriods : CHUNK_PERIODS, opts.maxPeriods - periods);
    const run = simulateTransient(netlist, {
      tStopS: chunk * T,
      x0: Object.fromEntries(circuit.stateNames.map((name, i) => [name, x[i]])),
      inputs: first ? opts.inputs : finalInputs,
      sourceSteps: first ? opts.steps : [],
      samplesPerPeriod: opts.samplesPerPeriod,
      circuit,
    });
    // later chunks repeat the previous chunk's last sample at their start: drop it
    const skip = first ? 0 : 1;
    const offset = periods * T;
    times.push(run.timeS.subarray(skip).map((t) => t + offset));
    for (const [name, y] of Object.entries(run.signals)) {
      const list = columns.get(name) ?? [];
      columns.set(name, list);
      list.push(y.subarray(skip));
    }
    total += run.timeS.length - skip;
    x = run.xEnd;
    periods += chunk;
    let worst = 0;
    x.forEach((v, i) => {
      worst = Math.max(worst, Math.abs(v - opts.target[i]) / scale[i]);
    });
    inRow = worst <= SETTLE_RTOL ? inRow + 1 : 0;
    if (inRow >= 2) {
      settled = true;
      break;
    }
  }
  const signals: Record<string, Float64Array> = {};
  for (const [name, list] of columns) signals[name] = concat(list, total);
  return { timeS: concat(times, total), signals, settled, periods };
}
