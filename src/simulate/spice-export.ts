/**
 * SPICE netlist of a candidate for each analysis, runnable as is in ngspice (src/report/spice.ts writes
 * the circuit):
 * - steady: initial conditions (IC=, `uic`) from the waveform engine's exact periodic steady state, so the
 *   first simulated period is already periodic; a few periods are simulated.
 * - startup: every state at rest (Cin at Vin, see candidate.ts), `uic`, simulated for the settling time
 *   estimated from the averaged model's slowest pole.
 * - step: initial conditions from the steady state at the step's starting voltage, the source as a PWL
 *   ramp to the final voltage, and the same settling estimate after it.
 */
import type { CandidateParams, Pins } from '../engine/types.ts';
import type { Technology } from '../parts/technology.ts';
import { type SpiceOptions, spiceMap, toSpice } from '../report/spice.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { averageModel } from '../waveform/averaged.ts';
import { SimulationError } from '../waveform/errors.ts';
import { findPoles } from '../waveform/features.ts';
import type { Netlist } from '../waveform/netlist.ts';
import { type CompiledCircuit, compileCircuit } from '../waveform/state-space.ts';
import { solvePeriodicSteadyState } from '../waveform/steady-state.ts';
import { candidateCircuit } from './operating-point.ts';
import { SETTLE_RTOL } from './transient-run.ts';
import type { Analysis } from './types.ts';

const STEADY_EXPORT_PERIODS = 10;
const STEADY_STEPS_PER_PERIOD = 200;
const TRANSIENT_STEPS_PER_PERIOD = 100;
const PRE_STEP_PERIODS = 10;
/** Bounds on an exported transient, in switching periods; the fallback when averaging is not possible (DCM). */
const MIN_TRANSIENT_PERIODS = 100;
const MAX_TRANSIENT_PERIODS = 6000;
const FALLBACK_TRANSIENT_PERIODS = 2000;

export interface NetlistExportOptions {
  vinV?: number;
  ioutA?: number;
  analysis?: Analysis;
  /** Diode junction capacitance written (F); default the SPICE writer's. */
  diodeCjoF?: number;
  /** Override the simulated time after the step / from rest (s). */
  tStopS?: number;
}

/** The netlist with i0/v0 set from a state vector in the circuit's state order. */
export function withInitialState(netlist: Netlist, circuit: CompiledCircuit, x: Float64Array): Netlist {
  const value = new Map(circuit.stateNames.map((name, i) => [name, x[i]]));
  return {
    ...netlist,
    elements: netlist.elements.map((e) => {
      if (e.kind === 'L') return { ...e, i0: value.get(e.name) ?? 0 };
      if (e.kind === 'C') return { ...e, v0: value.get(e.name) ?? 0 };
      return e;
    }),
  };
}

/** Time for the slowest averaged-model mode to decay to SETTLE_RTOL: ln(1/rtol)/σ_min (s). */
function settleEstimateS(netlist: Netlist, circuit: CompiledCircuit, control: string[]): number {
  const T = 1 / netlist.fswHz;
  let periods = FALLBACK_TRANSIENT_PERIODS;
  try {
    const model = averageModel(netlist, { control, circuit });
    const sigma = Math.min(...findPoles(model).map((p) => -p.re));
    if (sigma > 0) periods = Math.log(1 / SETTLE_RTOL) / sigma / T;
  } catch (error) {
    if (!(error instanceof SimulationError)) throw error;
  }
  return Math.min(MAX_TRANSIENT_PERIODS, Math.max(MIN_TRANSIENT_PERIODS, Math.ceil(periods))) * T;
}

/** Replace the DC input source by a PWL ramp from fromV to toV over [atS, atS + riseS]. */
export function rampInput(
  text: string,
  netlist: Netlist,
  fromV: number,
  toV: number,
  atS: number,
  riseS: number,
): string {
  const map = spiceMap(netlist);
  const name = map.names.Vin;
  const p = map.elements.Vin;
  const rise = Math.max(riseS, 1e-3 / netlist.fswHz);
  const pwl = `${name} ${p.a} ${p.b} PWL(0 ${fromV} ${atS} ${fromV} ${atS + rise} ${toV})`;
  const lines = text.split('\n');
  const i = lines.findIndex((l) => l.startsWith(`${name} `));
  if (i < 0) throw new Error(`SPICE export: no line for ${name}`);
  lines[i] = pwl;
  return lines.join('\n');
}

export function netlistCandidate(
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins,
  opts: NetlistExportOptions = {},
): string {
  const analysis = opts.analysis ?? 'steady';
  const step = analysis === 'step' ? spec.step : undefined;
  const fromV = opts.vinV ?? step?.fromV ?? spec.input.nomV;
  const cc = candidateCircuit(spec, params, tech, pins, { vinV: fromV, ioutA: opts.ioutA });
  const T = 1 / cc.netlist.fswHz;
  const circuit = compileCircuit(cc.netlist);
  const title = `Straddle ${cc.topology.id} (${params.rect}) ${analysis}: Vin ${fromV} V, Iout ${cc.ioutA} A, fsw ${cc.netlist.fswHz} Hz, duty ${cc.duty.toFixed(6)}${cc.duty2 > 0 ? ` / ${cc.duty2.toFixed(6)}` : ''} (open loop)`;
  const spiceOpts = (tStopS: number, steps: number): SpiceOptions => ({
    title,
    tStopS,
    tStepS: T / steps,
    initialConditions: true,
    ...(opts.diodeCjoF === undefined ? {} : { diodeCjoF: opts.diodeCjoF }),
  });
  if (analysis === 'steady') {
    const ss = solvePeriodicSteadyState(cc.netlist, {}, { circuit, samples: 20 });
    const tStop = opts.tStopS ?? STEADY_EXPORT_PERIODS * T;
    return toSpice(withInitialState(cc.netlist, circuit, ss.x0), spiceOpts(tStop, STEADY_STEPS_PER_PERIOD));
  }
  const settleS = opts.tStopS ?? settleEstimateS(cc.netlist, circuit, cc.controlGates);
  if (analysis === 'startup') {
    const x0 = new Float64Array(circuit.n);
    const cin = circuit.stateNames.indexOf('Cin');
    if (cin >= 0) x0[cin] = fromV;
    return toSpice(withInitialState(cc.netlist, circuit, x0), spiceOpts(settleS, TRANSIENT_STEPS_PER_PERIOD));
  }
  const toV = step ? fromV + (step.toV - step.fromV) : 1.5 * fromV;
  const riseS = step ? step.riseS : 1e-6;
  const atS = PRE_STEP_PERIODS * T;
  const ss = solvePeriodicSteadyState(cc.netlist, {}, { circuit, samples: 20 });
  const seeded = withInitialState(cc.netlist, circuit, ss.x0);
  const text = toSpice(seeded, spiceOpts(atS + riseS + settleS, TRANSIENT_STEPS_PER_PERIOD));
  return rampInput(text, seeded, fromV, toV, atS, riseS);
}
