/**
 * A sized (or pinned) design: one PartDesign per component of the topology, in the topology's
 * component order, plus the candidate-level choices. Plain numbers, SI units.
 */
import type { ComponentSpec } from '../topologies/topology.ts';
import type { CandidateParams, ComponentInfo, Role } from './types.ts';

export interface PartDesign {
  name: string;
  role: Role;
  /** `role` as a small integer (ROLE_CODE), so the corner loop dispatches without comparing strings. */
  roleCode: number;
  /** H (inductor, per winding), F (capacitor, effective at its DC bias), Ω (resistors), 0 otherwise. */
  value: number;
  /** Switch / synchronous rectifier on-resistance at the hot junction (Ω). */
  ronOhm: number;
  /** MOSFET charges for this die (C): total gate, switching (Miller) and output charge at rated voltage. */
  qgC: number;
  qswC: number;
  qossC: number;
  /** Voltage class of a MOSFET, diode or capacitor (V). */
  ratedV: number;
  areaMm2: number;
  /** Diode forward knee (V), dynamic resistance (Ω), junction capacitance (F); rated average current (A). */
  vfV: number;
  rdOhm: number;
  cjF: number;
  ratedA: number;
  /** Inductor winding resistance (Ω), core volume (m³), peak flux at the sizing current (T). */
  dcrOhm: number;
  coreM3: number;
  /** Flux density per unit of the winding's flux-linkage measure: ΔB = bPerWb · (L·Δi (+ M·Δi₂)) (T/Wb). */
  bPerWb: number;
  /** Capacitor bank: equivalent series resistance (Ω), number of units, nominal capacitance. */
  esrOhm: number;
  units: number;
  nominalF: number;
  volumeMm3: number;
  /**
   * Which fields were pinned by the user (so sizing leaves them alone). Unpinned parts share the
   * read-only NO_PINS set (a study creates tens of thousands of parts); pinning replaces it.
   */
  pinned: ReadonlySet<string>;
}

/** Role codes for the numeric dispatch of the loss and stress loops (same meaning as Role). */
export const ROLE_SWITCH = 0;
export const ROLE_SYNC = 1;
export const ROLE_DIODE = 2;
export const ROLE_INDUCTOR = 3;
export const ROLE_COUPLED_INDUCTOR = 4;
export const ROLE_CAPACITOR = 5;
export const ROLE_DAMPING_CAPACITOR = 6;
export const ROLE_SENSE = 7;
export const ROLE_DAMPING_RESISTOR = 8;
export const ROLE_CONTROLLER = 9;

export const ROLE_CODE: Readonly<Record<Role, number>> = {
  switch: ROLE_SWITCH,
  sync: ROLE_SYNC,
  diode: ROLE_DIODE,
  inductor: ROLE_INDUCTOR,
  'coupled-inductor': ROLE_COUPLED_INDUCTOR,
  capacitor: ROLE_CAPACITOR,
  'damping-capacitor': ROLE_DAMPING_CAPACITOR,
  sense: ROLE_SENSE,
  'damping-resistor': ROLE_DAMPING_RESISTOR,
  controller: ROLE_CONTROLLER,
};

/** The pin set of every part nothing was pinned on: shared, never mutated (see applyPins). */
export const NO_PINS: ReadonlySet<string> = new Set<string>();

export interface Design {
  params: CandidateParams;
  /** Signed output voltage (V). */
  voutV: number;
  /** The topology's components with their sizing rules, in slot order. */
  components: ComponentSpec[];
  parts: PartDesign[];
  /** Coupling coefficient of a coupled inductor (0 for separate windings). */
  coupling: number;
  /** Intermediate bus of a cascade (V); 0 otherwise. */
  busV: number;
  /** Margin of a cascade's bus beyond the rail it must clear (fraction, from the technology preset). */
  busMargin: number;
  /** Ideal technology: no drops and no losses beyond pinned parasitics. */
  ideal: boolean;
  /** Topology-specific constants (e.g. duty limits, transition-region settings). */
  dutyMin: number;
  dutyMax: number;
}

export function blankPart(info: ComponentInfo): PartDesign {
  return {
    name: info.name,
    role: info.role,
    roleCode: ROLE_CODE[info.role],
    value: 0,
    ronOhm: 0,
    qgC: 0,
    qswC: 0,
    qossC: 0,
    ratedV: 0,
    areaMm2: 0,
    vfV: 0,
    rdOhm: 0,
    cjF: 0,
    ratedA: 0,
    dcrOhm: 0,
    coreM3: 0,
    bPerWb: 0,
    esrOhm: 0,
    units: 0,
    nominalF: 0,
    volumeMm3: 0,
    pinned: NO_PINS,
  };
}

/**
 * Return a part to its blank state (blankPart's values) in place: the study's summary path reuses one
 * design per topology and rectifier instead of allocating thousands of parts.
 */
export function resetPart(p: PartDesign): void {
  p.value = 0;
  p.ronOhm = 0;
  p.qgC = 0;
  p.qswC = 0;
  p.qossC = 0;
  p.ratedV = 0;
  p.areaMm2 = 0;
  p.vfV = 0;
  p.rdOhm = 0;
  p.cjF = 0;
  p.ratedA = 0;
  p.dcrOhm = 0;
  p.coreM3 = 0;
  p.bPerWb = 0;
  p.esrOhm = 0;
  p.units = 0;
  p.nominalF = 0;
  p.volumeMm3 = 0;
  p.pinned = NO_PINS;
}

/** Index of a component by name; throws for a programming error (unknown name). */
export function indexOf(components: ComponentInfo[], name: string): number {
  const i = components.findIndex((c) => c.name === name);
  if (i < 0) throw new Error(`unknown component ${name}`);
  return i;
}
