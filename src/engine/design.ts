/**
 * A sized (or pinned) design: one PartDesign per component of the topology, in the topology's
 * component order, plus the candidate-level choices. Plain numbers, SI units.
 */
import type { ComponentSpec } from '../topologies/topology.ts';
import type { CandidateParams, ComponentInfo, Role } from './types.ts';

export interface PartDesign {
  name: string;
  role: Role;
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
  /** Which fields were pinned by the user (so sizing leaves them alone). */
  pinned: Set<string>;
}

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
    pinned: new Set(),
  };
}

/** Index of a component by name; throws for a programming error (unknown name). */
export function indexOf(components: ComponentInfo[], name: string): number {
  const i = components.findIndex((c) => c.name === name);
  if (i < 0) throw new Error(`unknown component ${name}`);
  return i;
}
