/**
 * The one interface every topology implements. Adding a topology = one file implementing this and
 * one line in src/topologies/registry.ts; the shared contract suite (test/topologies/contract.test.ts)
 * then runs against it.
 */
import type { Design } from '../engine/design.ts';
import type { Caution, ComponentInfo, Mode, Reason, RectifierKind, TopologyId } from '../engine/types.ts';
import type { WaveSet } from '../engine/wave.ts';
import type { RailSpec } from '../spec/rail-spec.ts';

/** How the generic sizer chooses a component's value. */
export type SizingRule =
  | { kind: 'inductor' } // from the ripple ratio at the worst corner
  | { kind: 'winding'; of: string } // second winding of a coupled inductor: same value as `of`
  | { kind: 'capacitor'; ripple: 'output' | 'input' | 'coupling' | 'bus' }
  | { kind: 'switch' }
  | { kind: 'sync' }
  | { kind: 'diode' }
  | { kind: 'sense'; of: string } // sense resistor in series with component `of`
  | { kind: 'damping-capacitor'; of: string } // damping leg across coupling capacitor `of`
  | { kind: 'damping-resistor'; of: string }
  | { kind: 'controller' };

export interface ComponentSpec extends ComponentInfo {
  sizing: SizingRule;
}

/** Scalars of one operating point that a topology writes beside the waveforms. */
/**
 * Where a topology is operated: input voltage (V) and load current (A). An engine Corner is one. The
 * point travels as an object because V8 boxes a number passed to a call it leaves out of line, and
 * operate is called through the topology table in the corner loop.
 */
export interface OperatingPoint {
  vinV: number;
  ioutA: number;
}

export interface OperatingScalars {
  duty: number;
  /**
   * Second commanded duty where a second leg switches at this point (four-switch in its transition
   * region: the buck leg; cascades: the second stage); 0 when there is none. Both duties are checked
   * against the minimum on-time and off-time.
   */
  duty2: number;
  mode: Mode;
  /** Average current drawn from the input source by the power stage (A), from charge balance. */
  iinA: number;
  /** false when no steady state exists with the present drops (the duty iteration ran away). */
  converged: boolean;
}

export interface Topology {
  id: TopologyId;
  title: string;
  /** One paragraph for the candidate sheet: how it works and when it is used. */
  summary: string;
  /** +1 positive output, −1 inverting. */
  outputSign: 1 | -1;
  rectifiers: readonly RectifierKind[];
  /** Stages that change mode with input (four-switch) get a corner at the input nearest the output. */
  modeChanging: boolean;
  /** Number of separate control loops (cascades: 2). */
  loops: number;
  /** The components, in a fixed order, for a rectifier choice. */
  components(rect: RectifierKind): ComponentSpec[];
  /** Candidate-level choices made before sizing (e.g. the bus voltage of a cascade). */
  prepare?(design: Design, spec: RailSpec): void;
  /**
   * Steady state at one operating point: write every component's current waveform and peak/DC
   * voltage into `waves`, and the scalars into `out`. `waves` arrives zeroed (WaveSet.reset). Must not
   * allocate: write voltages and edges as element stores into the WaveSet's arrays, and keep
   * floating-point arguments off calls the JIT may leave out of line (see wave.ts). Voltages and
   * currents use the design's present parasitics (drops included in the duty).
   */
  operate(design: Design, at: OperatingPoint, waves: WaveSet, out: OperatingScalars): void;
  /** Topology-specific cautions (resonant overshoot, RHP zero ...) for a sized design. */
  cautions?(design: Design, spec: RailSpec, nominal: OperatingScalars): Caution[];
  /**
   * Candidate-level infeasibility the corner checks cannot name (e.g. no cascade bus satisfies both
   * stages' duty limits); collected by evaluate beside the sizing and corner reasons.
   */
  reasons?(design: Design, spec: RailSpec): Reason[];
}
