/** The piecewise-linear waveform engine: netlist → exact steady state, transients, averaged small-signal model. */
export { type AveragedModel, type AveragingOptions, averageModel } from './averaged.ts';
export { SimulationError, type SimulationErrorCode } from './errors.ts';
export { expm, type StepMaps, stepMaps } from './expm.ts';
export type { Element, ElementKind, Netlist, PwmSignal } from './netlist.ts';
export type { SignalMetrics, Waveforms } from './recorder.ts';
export { type FrequencyResponse, frequencyResponse, logFrequencyGrid } from './small-signal.ts';
export { type CompiledCircuit, compileCircuit, type StateSpace } from './state-space.ts';
export {
  type SegmentInfo,
  type SteadyState,
  type SteadyStateOptions,
  solvePeriodicSteadyState,
} from './steady-state.ts';
export { type SourceStep, simulateTransient, type Transient, type TransientOptions } from './transient.ts';
