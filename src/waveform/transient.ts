/**
 * Transient simulation with exact steps: between breakpoints (gate edges, source changes) the circuit
 * is linear and time-invariant, so x(t+h) = Φ(h)·x(t) + Γ(h)·u holds exactly; diode events inside are
 * located by root finding on that exact solution (see stepper.ts).
 *
 * A source step with a rise time is applied as a staircase of `riseSubsteps` equal stairs, each at the
 * ramp's value at the stair's midpoint: the time-shift error of each stair is at most riseS/(2·stairs).
 */
import { SimulationError } from './errors.ts';
import type { Netlist } from './netlist.ts';
import { diodeBits, phaseOf, pwmEdges, switchBits } from './pwm.ts';
import { WaveformRecorder, type Waveforms } from './recorder.ts';
import { type CompiledCircuit, compileCircuit } from './state-space.ts';
import { advance, newContext, resolveDiodes } from './stepper.ts';

export interface SourceStep {
  /** Name of a V or I source. */
  source: string;
  atS: number;
  /** New value: volts for a V source ... */
  toV?: number;
  /** ... or amperes for an I source (a load step). */
  toA?: number;
  /** 10–90 % is not modelled: the ramp runs linearly from atS to atS + riseS (default 0: a step). */
  riseS?: number;
}

export interface TransientOptions {
  tStopS: number;
  /** Initial states by element name (A for inductors, V for capacitors); default the elements' i0 / v0, else 0. */
  x0?: Record<string, number>;
  /** V/I source values at t = 0, overriding the netlist by name. */
  inputs?: Record<string, number>;
  sourceSteps?: SourceStep[];
  /** Sub-steps (and samples) per switching period (default 50). */
  samplesPerPeriod?: number;
  /** Stairs per ramped source step (default 8). */
  riseSubsteps?: number;
  /** Cap on diode events (default 200 000) and exact steps (default 5 000 000): exceeded ⇒ SimulationError. */
  maxEvents?: number;
  maxSteps?: number;
  /** Record only these outputs (default all). */
  outputs?: string[];
  circuit?: CompiledCircuit;
}

export interface Transient extends Waveforms {
  /** Final state in circuit.stateNames order. */
  xEnd: Float64Array;
  stateNames: string[];
  events: number;
  steps: number;
}

interface SourceChange {
  tS: number;
  input: number;
  value: number;
}

function sourceChanges(
  circuit: CompiledCircuit,
  u0: Float64Array,
  steps: SourceStep[],
  stairs: number,
): SourceChange[] {
  const changes: SourceChange[] = [];
  const current = u0.slice();
  for (const st of [...steps].sort((a, b) => a.atS - b.atS)) {
    const input = circuit.inputNames.indexOf(st.source);
    const kind = circuit.elements.find((e) => e.name === st.source)?.kind;
    const to = kind === 'V' ? st.toV : kind === 'I' ? st.toA : undefined;
    if (input < 0 || to === undefined || !Number.isFinite(to) || !(st.atS >= 0)) {
      throw new SimulationError(
        'invalid-netlist',
        `source step on '${st.source}' needs a V source with toV or an I source with toA, at atS ≥ 0`,
      );
    }
    const from = current[input];
    const rise = st.riseS ?? 0;
    if (rise > 0) {
      for (let k = 0; k < stairs; k++) {
        changes.push({
          tS: st.atS + (k * rise) / stairs,
          input,
          value: from + ((to - from) * (k + 0.5)) / stairs,
        });
      }
      changes.push({ tS: st.atS + rise, input, value: to });
    } else changes.push({ tS: st.atS, input, value: to });
    current[input] = to;
  }
  return changes.sort((a, b) => a.tS - b.tS);
}

function initialState(circuit: CompiledCircuit, given: Record<string, number> = {}): Float64Array {
  const x = new Float64Array(circuit.n);
  circuit.inductors.forEach((l, i) => {
    x[i] = l.i0 ?? 0;
  });
  circuit.capacitors.forEach((c, i) => {
    x[circuit.inductors.length + i] = c.v0 ?? 0;
  });
  for (const [name, value] of Object.entries(given)) x[circuit.stateIndex(name)] = value;
  return x;
}

export function simulateTransient(netlist: Netlist, opts: TransientOptions): Transient {
  if (!(opts.tStopS > 0) || !Number.isFinite(opts.tStopS)) {
    throw new SimulationError('invalid-netlist', `tStopS must be a positive number, got ${opts.tStopS}`);
  }
  const circuit = opts.circuit ?? compileCircuit(netlist);
  const T = 1 / netlist.fswHz;
  const edges = pwmEdges(netlist);
  const u = circuit.inputVector(opts.inputs);
  const changes = sourceChanges(circuit, u, opts.sourceSteps ?? [], opts.riseSubsteps ?? 8);
  const ctx = newContext(circuit, u, T, {
    maxEvents: opts.maxEvents ?? 200_000,
    maxSteps: opts.maxSteps ?? 5_000_000,
  });
  const hMax = T / (opts.samplesPerPeriod ?? 50);
  const rec = new WaveformRecorder(circuit, opts.outputs);
  const sink = { sample: (t: number, x: Float64Array, mask: number) => rec.push(t, x, mask, ctx.u) };
  const dBits = diodeBits(circuit);
  let x = initialState(circuit, opts.x0);
  let mask = 0;
  let t = 0;
  let nextChange = 0;
  let period = 0;
  let edge = 0;
  const edgeTime = () => (period + edges[edge]) * T;
  while (t < opts.tStopS) {
    while (nextChange < changes.length && changes[nextChange].tS <= t) {
      ctx.u[changes[nextChange].input] = changes[nextChange].value;
      nextChange++;
    }
    while (edgeTime() <= t) {
      edge++;
      if (edge === edges.length) {
        edge = 0;
        period++;
      }
    }
    const tNext = Math.min(
      opts.tStopS,
      edgeTime(),
      nextChange < changes.length ? changes[nextChange].tS : Infinity,
    );
    const gates = switchBits(circuit, netlist, phaseOf((t + tNext) / 2, netlist.fswHz));
    mask = resolveDiodes(ctx, x, gates | (mask & dBits));
    // A sample at every breakpoint, after the gate or source change: waveforms show the jump crisply.
    sink.sample(t, x, mask);
    ({ x, mask } = advance(ctx, x, t, tNext, mask, hMax, sink));
    t = tNext;
  }
  const waves = rec.result();
  return { ...waves, xEnd: x, stateNames: circuit.stateNames, events: ctx.events, steps: ctx.steps };
}
