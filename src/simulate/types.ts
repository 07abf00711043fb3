/**
 * The simulation API of a candidate: plain data the CLI prints and the candidate sheet plots.
 * SI units; signal names are `<part>.i` (A, in the part's a → b direction), `<part>.v` (V, a − b) and
 * `<node>.v` (V to ground), plus `sw.v` for the main switch node and `out.v` for the load node.
 */

export type Analysis = 'steady' | 'startup' | 'step';

export interface SignalMetrics {
  avg: number;
  rms: number;
  min: number;
  max: number;
}

export interface SimulationResult {
  analysis: Analysis;
  vinV: number;
  ioutA: number;
  duty: number;
  duty2: number;
  fswHz: number;
  timeS: number[];
  /** 'L1.i', 'L2.i', 'Q1.i', 'D1.i' or 'Q2.i', 'Cs.v', 'Cout.v', 'out.v', 'sw.v', and every other part */
  signals: Record<string, number[]>;
  /** Over the simulated window, at full resolution (before the waveforms are thinned for display). */
  metrics: Record<string, SignalMetrics>;
  /**
   * step/startup: peak excursion of the switching-period average over the step divided by the final
   * change (1 = no overshoot), for out.v and each capacitor voltage but Cin's.
   */
  overshoot?: Record<string, number>;
  /** step/startup: time after the step (start-up: after t = 0) for out.v to stay within 2 % of its final change (s) */
  settlingTimeS?: number;
  /** step/startup: instantaneous peak (largest |v|, signed) reached during the transient */
  peaks?: Record<string, number>;
  /** step/startup: whether the states reached the final periodic steady state before the cap. */
  settled?: boolean;
  /** step: the input step applied (open loop: the duty stays at its value for `fromV`). */
  step?: { fromV: number; toV: number; riseS: number; atS: number };
  /** The operating mode the analytic engine found at this point ('ccm', 'dcm', 'buck', ...). */
  mode: string;
  /** Steady state: true when diodes change state away from the gate edges (discontinuous conduction). */
  hasDiodeEvents?: boolean;
}

export interface BodeCurve {
  magDb: number[];
  phaseDeg: number[];
}

export interface BodeResult {
  vinV: number;
  ioutA: number;
  duty: number;
  freqHz: number[];
  /** Output voltage per unit duty of the controlled gate(s). */
  controlToOutput: BodeCurve;
  /** Output voltage per input voltage (audio susceptibility). */
  lineToOutput: BodeCurve;
  /** Gates whose duty is the control input (cascades: the output stage; four-switch: the active leg). */
  controlGates: string[];
  /** Lowest RHP zero of control-to-output (Hz), if any. */
  rhpZeroHz?: number;
  /** Lightly damped pole pairs (Hz), increasing. */
  resonancesHz: number[];
  /** Their quality factors, same order. */
  resonanceQ: number[];
  /** A fifth of the RHP zero, below the lowest resonance and a tenth of fsw (common practice). */
  suggestedCrossoverHz?: number;
  /** Which limit set the suggested crossover, in words. */
  crossoverRule?: string;
}

export interface SimulateOptions {
  analysis: Analysis;
  /** Input voltage (V); default the spec's nominal. For a step: the step's starting voltage. */
  vinV?: number;
  /** Load current (A); default the spec's full load. */
  ioutA?: number;
  /** Thin the returned waveforms to about this many points (default 4000; metrics use every sample). */
  maxPoints?: number;
  /** Cap on the simulated switching periods of a transient (default 6000). */
  maxPeriods?: number;
}
