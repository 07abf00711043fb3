/**
 * The rail spec in SI units, as the engine sees it after the zod boundary (src/spec/schema.ts)
 * has parsed engineering notation, defaults and polarity.
 */
export type Polarity = 'positive' | 'negative' | 'either';

export interface InputStep {
  /** Input voltage before the step (V). */
  fromV: number;
  /** Input voltage after the step (V). */
  toV: number;
  /** Rise time of the step (s). */
  riseS: number;
}

export interface RailSpec {
  name: string;
  input: { minV: number; nomV: number; maxV: number };
  /** voltageV is the magnitude of the output voltage (always > 0); polarity says which sign is allowed. */
  output: { voltageV: number; polarity: Polarity };
  /** ccmRequired: light-load DCM becomes a feasibility limit instead of a caution. */
  load: { maxA: number; minA: number; ccmRequired: boolean };
  ripple: { outputVpp: number; inputVpp?: number };
  switching: { minHz: number; maxHz: number };
  ambientC: number;
  technology: string;
  step?: InputStep;
}
