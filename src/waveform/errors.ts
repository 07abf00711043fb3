/**
 * Numerical failure of the waveform engine. It is a bug or a circuit the engine cannot solve, never an
 * infeasible design: the caller shows it as an error naming the cause, not as a design verdict.
 */
export type SimulationErrorCode =
  | 'invalid-netlist' // an element value, a node or a gate reference is unusable
  | 'singular-configuration' // the resistive network of one switch configuration has no unique solution
  | 'ill-conditioned' // a configuration or a matrix exponential is too badly scaled for double precision
  | 'no-periodic-solution' // (I − Φ_T) is singular: an integrator (e.g. a capacitor fed only by current sources)
  | 'event-chatter' // diodes keep flipping at one instant or without time advancing
  | 'event-cap' // more diode events than allowed
  | 'step-cap' // more exact steps than allowed
  | 'sequence-not-converged' // the periodic steady state found no self-consistent diode sequence
  | 'averaging-requires-ccm'; // state-space averaging asked for a steady state with diode events

export class SimulationError extends Error {
  readonly code: SimulationErrorCode;
  /** Extra numbers or the underlying error, for the log and the error page. */
  override readonly cause: unknown;

  constructor(code: SimulationErrorCode, message: string, cause?: unknown) {
    super(message);
    this.name = 'SimulationError';
    this.code = code;
    this.cause = cause;
  }
}
