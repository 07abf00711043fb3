/**
 * The waveform engine applied to a candidate: exact periodic steady state, start-up from rest and an
 * input step (open loop, at the duty the analytic engine commands), the small-signal Bode plot and the
 * SPICE netlist. Pure and synchronous; failures are SimulationError ("simulation could not settle: …").
 */
import type { CandidateParams, Pins } from '../engine/types.ts';
import type { Technology } from '../parts/technology.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { compileCircuit } from '../waveform/state-space.ts';
import { type SteadyState, solvePeriodicSteadyState } from '../waveform/steady-state.ts';
import { type CandidateCircuit, candidateCircuit } from './operating-point.ts';
import { metricsOf, renameSignals, thin } from './signals.ts';
import { transientFeatures } from './transient-features.ts';
import { runUntilSettled } from './transient-run.ts';
import type { SignalMetrics, SimulateOptions, SimulationResult } from './types.ts';

export { bodeCandidate } from './bode.ts';
export { netlistCandidate } from './spice-export.ts';
export type { Analysis, BodeResult, SimulateOptions, SimulationResult } from './types.ts';

/** Samples per period of the steady state shown, and of transients (exact steps: the density is for display and extremes). */
const STEADY_SAMPLES = 400;
const TRANSIENT_SAMPLES_PER_PERIOD = 20;
const DEFAULT_MAX_POINTS = 4000;
const DEFAULT_MAX_PERIODS = 6000;
/** Switching periods shown before an input step. */
const PRE_STEP_PERIODS = 10;
/** Input step when the spec gives none: +50 % of the starting input over 1 µs (the brief's default). */
const DEFAULT_STEP_RATIO = 1.5;
const DEFAULT_STEP_RISE_S = 1e-6;

function allMetrics(
  timeS: Float64Array,
  signals: Record<string, Float64Array>,
): Record<string, SignalMetrics> {
  return Object.fromEntries(Object.entries(signals).map(([k, y]) => [k, metricsOf(timeS, y)]));
}

function averages(cc: CandidateCircuit, ss: SteadyState): Record<string, number> {
  const named = renameSignals(ss.signals, cc.switchNode);
  return Object.fromEntries(Object.entries(allMetrics(ss.timeS, named)).map(([k, m]) => [k, m.avg]));
}

/** out.v and every capacitor voltage except the input capacitor's (it follows the source). */
function namesOfInterest(cc: CandidateCircuit): string[] {
  const caps = cc.netlist.elements
    .filter((e) => e.kind === 'C' && e.name !== 'Cin')
    .map((e) => `${e.name}.v`);
  return ['out.v', ...caps];
}

function base(cc: CandidateCircuit, analysis: SimulationResult['analysis']) {
  return {
    analysis,
    vinV: cc.vinV,
    ioutA: cc.ioutA,
    duty: cc.duty,
    duty2: cc.duty2,
    fswHz: cc.netlist.fswHz,
    mode: cc.mode,
  };
}

export function simulateCandidate(
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins,
  opts: SimulateOptions,
): SimulationResult {
  const maxPoints = opts.maxPoints ?? DEFAULT_MAX_POINTS;
  const maxPeriods = opts.maxPeriods ?? DEFAULT_MAX_PERIODS;
  if (opts.analysis === 'steady') {
    const cc = candidateCircuit(spec, params, tech, pins, opts);
    const ss = solvePeriodicSteadyState(cc.netlist, {}, { samples: STEADY_SAMPLES });
    const signals = renameSignals(ss.signals, cc.switchNode);
    return {
      ...base(cc, 'steady'),
      ...thin(ss.timeS, signals, Math.max(maxPoints, 2 * STEADY_SAMPLES)),
      metrics: allMetrics(ss.timeS, signals),
      hasDiodeEvents: ss.hasDiodeEvents,
    };
  }
  const T = 1 / params.fswHz;
  let fromV: number;
  let toV: number;
  let riseS: number;
  if (opts.analysis === 'step') {
    const st = spec.step;
    fromV = opts.vinV ?? st?.fromV ?? spec.input.nomV;
    toV = st ? fromV + (st.toV - st.fromV) : DEFAULT_STEP_RATIO * fromV;
    riseS = st ? st.riseS : DEFAULT_STEP_RISE_S;
  } else {
    fromV = opts.vinV ?? spec.input.nomV;
    toV = fromV;
    riseS = 0;
  }
  const cc = candidateCircuit(spec, params, tech, pins, { vinV: fromV, ioutA: opts.ioutA });
  const circuit = compileCircuit(cc.netlist);
  const ssTo = solvePeriodicSteadyState(cc.netlist, { Vin: toV }, { circuit, samples: 40 });
  const final = averages(cc, ssTo);
  let initial: Record<string, number>;
  let x0: Float64Array;
  const atS = opts.analysis === 'step' ? PRE_STEP_PERIODS * T : 0;
  if (opts.analysis === 'step') {
    const ssFrom = solvePeriodicSteadyState(cc.netlist, { Vin: fromV }, { circuit, samples: 40 });
    initial = averages(cc, ssFrom);
    x0 = ssFrom.x0;
  } else {
    initial = Object.fromEntries(Object.keys(final).map((k) => [k, 0]));
    x0 = new Float64Array(circuit.n);
    // Cin sits across the ideal source: it charges within ESR·C (nanoseconds, an inrush the real source
    // impedance limits), so it starts at Vin rather than drawing a kiloampere spike from the ideal source.
    const cin = circuit.stateNames.indexOf('Cin');
    if (cin >= 0) x0[cin] = fromV;
  }
  const run = runUntilSettled(cc.netlist, circuit, {
    x0,
    inputs: { Vin: fromV },
    steps: opts.analysis === 'step' ? [{ source: 'Vin', atS, toV, riseS }] : [],
    target: ssTo.x0,
    maxPeriods,
    samplesPerPeriod: TRANSIENT_SAMPLES_PER_PERIOD,
  });
  const signals = renameSignals(run.signals, cc.switchNode);
  const features = transientFeatures(run.timeS, signals, namesOfInterest(cc), T, atS, initial, final);
  return {
    ...base(cc, opts.analysis),
    ...thin(run.timeS, signals, maxPoints),
    metrics: allMetrics(run.timeS, signals),
    ...features,
    settled: run.settled,
    ...(opts.analysis === 'step' ? { step: { fromV, toV, riseS, atS } } : {}),
  };
}
