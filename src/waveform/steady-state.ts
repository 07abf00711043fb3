/**
 * Exact periodic steady state of a switched piecewise-linear circuit.
 *
 * Gate edges fix part of the configuration sequence; diodes fix the rest. Starting from x₀ = 0: simulate
 * one period exactly (diode events by root finding) to learn a sequence, solve that sequence's periodic
 * steady state directly from (I − Φ_T)·x₀ = c_T with its diode-event times adjusted by Newton, then simulate
 * one period from the new x₀. When that period meets the same sequence and returns to x₀ the solution is
 * self-consistent (CCM and DCM alike); otherwise repeat with the sequence just met.
 */
import { maxAbs } from './dense.ts';
import { SimulationError } from './errors.ts';
import type { Netlist } from './netlist.ts';
import { pwmEdges } from './pwm.ts';
import { type SignalMetrics, summarize, WaveformRecorder, type Waveforms } from './recorder.ts';
import { type SequenceSegment, sameStructure, simulatePeriod, solveSequence } from './sequence.ts';
import { type CompiledCircuit, compileCircuit } from './state-space.ts';
import { applyStep, cachedStepMaps, newContext } from './stepper.ts';

export interface SteadyStateOptions {
  /** Approximate number of samples over the period (default 200); each segment gets its share plus its ends. */
  samples?: number;
  /** Outer iterations allowed to find a self-consistent diode sequence (default 40). */
  maxIterations?: number;
  /** A circuit already compiled from this netlist's elements, to reuse its caches. */
  circuit?: CompiledCircuit;
}

export interface SegmentInfo {
  startS: number;
  endS: number;
  mask: number;
  /** Switches and diodes conducting. */
  on: string[];
  /** 'gate' when the segment starts at a gate edge or t = 0; otherwise the diode event that starts it. */
  startsAt: 'gate' | { diode: string; turns: 'on' | 'off' };
}

export interface SteadyState extends Waveforms {
  periodS: number;
  /** State at t = 0 of the period, in circuit.stateNames order. */
  x0: Float64Array;
  stateNames: string[];
  metrics: Record<string, SignalMetrics>;
  segments: SegmentInfo[];
  /** The diodes conducting in each segment: the conduction sequence (CCM: follows the gates; DCM: extra intervals). */
  diodeSequence: { startS: number; endS: number; conducting: string[] }[];
  /** True when some segment starts at a diode event rather than a gate edge (e.g. DCM). */
  hasDiodeEvents: boolean;
  iterations: number;
}

function describe(circuit: CompiledCircuit, segs: SequenceSegment[], diodeNames: string[]): SegmentInfo[] {
  return segs.map((s) => ({
    startS: s.startS,
    endS: s.endS,
    mask: s.mask,
    on: circuit.twoState.filter((_, j) => (s.mask & (1 << j)) !== 0).map((e) => e.name),
    startsAt: s.cause ? { diode: diodeNames[s.cause.diode], turns: s.cause.kind } : 'gate',
  }));
}

/**
 * Periodic steady state. `inputs` overrides V/I source values by element name.
 * Throws SimulationError ('no-periodic-solution', 'sequence-not-converged', 'singular-configuration', ...).
 */
export function solvePeriodicSteadyState(
  netlist: Netlist,
  inputs: Record<string, number> = {},
  opts: SteadyStateOptions = {},
): SteadyState {
  const circuit = opts.circuit ?? compileCircuit(netlist);
  const u = circuit.inputVector(inputs);
  const T = 1 / netlist.fswHz;
  const edges = pwmEdges(netlist);
  const ctx = newContext(circuit, u, T, { maxEvents: 10_000, maxSteps: 1_000_000 });
  const maxIterations = opts.maxIterations ?? 40;
  let x0: Float64Array = new Float64Array(circuit.n);
  let mask = 0;
  let segs: SequenceSegment[] | undefined;
  for (let iter = 1; iter <= maxIterations; iter++) {
    const sim = simulatePeriod(ctx, netlist, edges, x0, mask);
    const scale = Math.max(maxAbs(x0), maxAbs(sim.xEnd), 1e-12);
    let drift = 0;
    for (let i = 0; i < x0.length; i++) drift = Math.max(drift, Math.abs(sim.xEnd[i] - x0[i]));
    if (segs && sameStructure(sim.segments, segs) && drift <= 1e-7 * scale) {
      return finish(
        circuit,
        u,
        T,
        segs,
        x0,
        opts.samples ?? 200,
        iter,
        ctx.diodes.map((d) => d.name),
      );
    }
    mask = sim.endMask;
    const solved = solveSequence(ctx, sim.segments);
    // Past a few rounds without agreement, take the simulated end state too: a damped fixed-point
    // step that breaks two-sequence cycles near a mode boundary.
    if (iter > 8 && iter % 2 === 1)
      for (let i = 0; i < x0.length; i++) solved.x0[i] = 0.5 * (solved.x0[i] + sim.xEnd[i]);
    x0 = solved.x0;
    segs = solved.segments;
  }
  throw new SimulationError(
    'sequence-not-converged',
    `simulation could not settle: no self-consistent diode sequence after ${maxIterations} iterations`,
    { segments: segs?.length },
  );
}

function finish(
  circuit: CompiledCircuit,
  u: Float64Array,
  T: number,
  segs: SequenceSegment[],
  x0: Float64Array,
  samples: number,
  iterations: number,
  diodeNames: string[],
): SteadyState {
  const rec = new WaveformRecorder(circuit);
  let x = x0;
  for (const s of segs) {
    const dur = s.endS - s.startS;
    const steps = Math.max(1, Math.round((dur / T) * samples));
    const maps = cachedStepMaps(circuit, s.mask, dur / steps);
    rec.push(s.startS, x, s.mask, u);
    for (let k = 1; k <= steps; k++) {
      x = applyStep(maps, x, u);
      rec.push(k === steps ? s.endS : s.startS + (k * dur) / steps, x, s.mask, u);
    }
  }
  const waves = rec.result();
  const metrics: Record<string, SignalMetrics> = {};
  for (const [name, y] of Object.entries(waves.signals)) metrics[name] = summarize(waves.timeS, y);
  const segments = describe(circuit, segs, diodeNames);
  const diodeSet = new Set(diodeNames);
  return {
    ...waves,
    periodS: T,
    x0,
    stateNames: circuit.stateNames,
    metrics,
    segments,
    diodeSequence: segments.map((s) => ({
      startS: s.startS,
      endS: s.endS,
      conducting: s.on.filter((name) => diodeSet.has(name)),
    })),
    hasDiodeEvents: segs.some((s) => s.cause),
    iterations,
  };
}
