/**
 * Domain types shared by the engine, the study, the reports and the web app.
 * Everything is SI: volts, amperes, ohms, henries, farads, hertz, seconds, watts, cubic metres
 * (volumes are reported in mm³ only at the objective/report edge, as the field name says).
 */

import type { Technology } from '../parts/technology.ts';
import type { RailSpec } from '../spec/rail-spec.ts';

export type TopologyId =
  | 'sepic'
  | 'sepic-coupled'
  | 'sepic-damped'
  | 'inverting-buck-boost'
  | 'four-switch-buck-boost'
  | 'boost-then-buck'
  | 'buck-then-boost'
  | 'cuk'
  | 'zeta';

export type RectifierKind = 'diode' | 'sync';

/** What a power-stage part does; decides its loss model, its sizing rule and how it is counted. */
export type Role =
  | 'switch' // controlled MOSFET
  | 'sync' // MOSFET used as a synchronous rectifier
  | 'diode' // rectifier diode
  | 'inductor'
  | 'coupled-inductor' // one two-winding part; its windings are separate components that share the part
  | 'capacitor' // ceramic bank
  | 'damping-capacitor' // electrolytic of the SEPIC damping leg
  | 'sense' // current-sense resistor
  | 'damping-resistor'
  | 'controller';

/** Static description of one component of a topology. */
export interface ComponentInfo {
  /** Reference designator: Q1, Q2, D1, L1, L2, Cs, Cd, Rd, Cin, Cout, Cbus, Rsense, U1 ... */
  name: string;
  role: Role;
  /** What it is for, in words, for the candidate sheet. */
  duty: string;
}

/** A design choice that defines a candidate. */
export interface CandidateParams {
  topology: TopologyId;
  fswHz: number;
  /** Peak-to-peak inductor ripple over the inductor's largest full-load average current. */
  ripple: number;
  rect: RectifierKind;
}

/** A corner: one operating point the candidate must survive. */
export interface Corner {
  label: string; // 'vin-min', 'vin-nom', 'vin-max', 'vin-near-vout', 'light-load'
  vinV: number;
  ioutA: number;
  fullLoad: boolean;
}

export type Mode = 'ccm' | 'dcm' | 'buck' | 'boost' | 'buck-boost';

/** Stresses and loss of one component at one corner. */
export interface ComponentStress {
  /** Value: H for inductors, F for capacitors, Ω for resistors and MOSFET on-resistance, V forward drop for diodes. */
  value: number;
  iAvgA: number;
  iRmsA: number;
  /** Largest instantaneous |i|. */
  iPeakA: number;
  iPpA: number;
  /** Largest instantaneous |v| across the part. */
  vPeakV: number;
  /** Peak-to-peak voltage (capacitors: ripple; others: swing). */
  vPpV: number;
  lossW: number;
}

export interface CornerResult {
  label: string;
  vinV: number;
  ioutA: number;
  /** Signed: negative for inverting topologies. */
  voutV: number;
  /** On-time fraction of the switch that controls the active stage. */
  duty: number;
  mode: Mode;
  efficiency: number;
  lossW: number;
  pinW: number;
  poutW: number;
  components: Record<string, ComponentStress>;
}

export type ReasonCode =
  | 'period-too-short'
  | 'duty-below-min-on-time'
  | 'duty-above-max'
  | 'dcm-light-load'
  | 'polarity-mismatch'
  | 'coupled-inductances-unequal'
  | 'ripple-unreachable'
  | 'no-voltage-class'
  | 'bus-voltage-unreachable'
  | 'not-converged';

/** A broken limit, with the numbers. Infeasibility is data, never an exception. */
export interface Reason {
  code: ReasonCode;
  message: string;
  corner?: string;
  value?: number;
  limit?: number;
  component?: string;
}

export type CautionCode =
  | 'resonant-overshoot'
  | 'rhp-zero'
  | 'pulsating-input'
  | 'negative-output'
  | 'light-load-dcm'
  | 'cascade-two-loops'
  | 'transition-region'
  | 'coupled-equal-windings'
  | 'switching-loop'
  | 'high-voltage-stress'
  | 'bus-voltage';

export interface Caution {
  code: CautionCode;
  message: string;
  value?: number;
}

export interface Objectives {
  parts: number;
  lossW: number;
  stress: number;
  volumeMm3: number;
}

/** The full evaluation of one candidate. */
export interface Evaluation {
  topology: TopologyId;
  fswHz: number;
  ripple: number;
  rect: RectifierKind;
  feasible: boolean;
  reasons: Reason[];
  cautions: Caution[];
  objectives: Objectives;
  /** Part count by role (a coupled inductor is one part; a capacitor bank counts each unit). */
  partsByRole: Record<string, number>;
  /** Intermediate bus of cascades (V), or undefined. */
  busV?: number;
  /** Efficiency at the nominal-input full-load corner. */
  efficiencyNom: number;
  corners: CornerResult[];
  /** Sized part descriptions (value, rating, class) for the candidate sheet and BOM. */
  parts: PartSummary[];
}

export interface PartSummary {
  name: string;
  role: Role;
  value: number;
  unit: 'H' | 'F' | 'Ω' | 'V' | '';
  /** Human description: voltage class, die area, bank of n units, winding count ... */
  detail: string;
  count: number;
  volumeMm3: number;
  /** Suggested minimum voltage and current ratings including the derating margin. */
  ratingV?: number;
  ratingA?: number;
}

/** Values or parasitics pinned by the user instead of sized: key is 'L1', 'Cs', 'L1.dcr', 'Q1.ron' ... */
export type Pins = Record<string, number>;

export interface EvaluateRequest {
  spec: RailSpec;
  params: CandidateParams;
  tech: Technology;
  pins?: Pins;
}
