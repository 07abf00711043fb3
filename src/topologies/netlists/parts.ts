/**
 * Building blocks of the switched netlists: one netlist element per design component, named exactly
 * like the component (Q1, D1, L1, Cs ...) so waveform and SPICE results map 1:1 onto the analytic
 * corner results. Values come from the sized or pinned design (SI units).
 */
import type { Design, PartDesign } from '../../engine/design.ts';
import type { Element, Netlist, PwmSignal } from '../../waveform/netlist.ts';

/** What the topology's operate() decided at this point: the commanded duties and the mode. */
export interface DutyCommand {
  duty: number;
  duty2: number;
  mode: string;
}

/** Extra circuit around the power stage, for checks that need it (not part of the design). */
export interface NetlistOptions {
  /**
   * Series inductance (H) between the ideal input source and the stage. The analytic engine assumes Cin
   * carries all of the input current's AC part; an ideal source across Cin would take it instead, so a
   * choke that blocks fsw reproduces the analytic assumption. Default 0: the source feeds `in` directly.
   */
  sourceInductanceH?: number;
}

export type NetlistBuilder = (
  design: Design,
  vinV: number,
  ioutA: number,
  duty: DutyCommand,
  opts?: NetlistOptions,
) => Netlist;

/**
 * Off-state resistance of switches and diodes (Ω): large against every impedance of the stage, small
 * enough to keep the circuit matrices well conditioned (common practice for switch models).
 */
export const ROFF_OHM = 1e6;
/**
 * Smallest on-resistance written (Ω). The ideal preset gives 0 Ω, which the piecewise-linear engine
 * rejects (a switch is a resistance); 0.1 mΩ shifts Vout by less than 0.01 % at the currents here.
 */
export const RON_FLOOR_OHM = 1e-4;
/** Largest coupling written for a coupled inductor: k = 1 makes the inductance matrix singular. */
export const K_MAX = 0.999;

export function partOf(d: Design, name: string): PartDesign {
  const p = d.parts.find((x) => x.name === name);
  if (!p) throw new Error(`design of ${d.params.topology} has no component ${name}`);
  return p;
}

export function hasPart(d: Design, name: string): boolean {
  return d.parts.some((x) => x.name === name);
}

export function inputSource(vinV: number, node: string, opts: NetlistOptions = {}): Element[] {
  const lH = opts.sourceInductanceH ?? 0;
  if (!(lH > 0)) return [{ kind: 'V', name: 'Vin', a: node, b: '0', volt: vinV }];
  return [
    { kind: 'V', name: 'Vin', a: 'src', b: '0', volt: vinV },
    { kind: 'L', name: 'Lsrc', a: 'src', b: node, henry: lH, dcrOhm: 0 },
  ];
}

/**
 * ESR written for an ESR-free Cin that sits straight across the ideal source (Ω): the piecewise-linear
 * engine cannot solve a loop of a voltage source and an ideal capacitor, and across an ideal source the
 * capacitor's voltage is fixed anyway, so 1 mΩ changes nothing else.
 */
export const CIN_ESR_FLOOR_OHM = 1e-3;

/** The input capacitor Cin from `node` to ground (see CIN_ESR_FLOOR_OHM). */
export function inputCapacitor(d: Design, node: string, opts: NetlistOptions = {}): Element {
  const el = capacitor(d, 'Cin', node, '0');
  const choke = (opts.sourceInductanceH ?? 0) > 0;
  if (el.kind === 'C' && !choke && !((el.esrOhm ?? 0) > 0)) return { ...el, esrOhm: CIN_ESR_FLOOR_OHM };
  return el;
}

/** Resistive load R = |Vout| / Iout (Ω) from the rail node to ground. */
export function load(d: Design, ioutA: number, node: string): Element {
  return { kind: 'R', name: 'Rload', a: node, b: '0', ohm: Math.abs(d.voutV) / Math.max(ioutA, 1e-6) };
}

export function inductor(d: Design, name: string, a: string, b: string): Element {
  const p = partOf(d, name);
  return { kind: 'L', name, a, b, henry: p.value, dcrOhm: p.dcrOhm };
}

export function capacitor(d: Design, name: string, a: string, b: string): Element {
  const p = partOf(d, name);
  return { kind: 'C', name, a, b, farad: p.value, esrOhm: p.esrOhm };
}

export function resistor(d: Design, name: string, a: string, b: string): Element {
  return { kind: 'R', name, a, b, ohm: partOf(d, name).value };
}

/** A controlled MOSFET (main switch or synchronous rectifier): ronOhm when its gate is on. */
export function mosfet(d: Design, name: string, a: string, b: string, gate: string): Element {
  const ron = Math.max(partOf(d, name).ronOhm, RON_FLOOR_OHM);
  return { kind: 'S', name, a, b, ronOhm: ron, roffOhm: ROFF_OHM, gate };
}

/**
 * The rectifier slot: a diode (anode a, cathode b; drop vf + rd·i) or, for 'sync', a MOSFET driven by
 * `syncGate` (the complement of the switch it rectifies for).
 */
export function rectifier(d: Design, name: string, a: string, b: string, syncGate: string): Element {
  const p = partOf(d, name);
  if (p.role === 'diode') {
    return { kind: 'D', name, a, b, vfV: p.vfV, ronOhm: Math.max(p.rdOhm, RON_FLOOR_OHM), roffOhm: ROFF_OHM };
  }
  return mosfet(d, name, a, b, syncGate);
}

/**
 * A current-sense resistor from a to b (current a → b) when the design has one with a value; returns
 * whether it was placed, so the caller joins the sensed switch to b, or straight to a when there is no
 * resistor (no 0 Ω element is ever written).
 */
export function sense(d: Design, name: string, a: string, b: string, out: Element[]): boolean {
  if (!hasPart(d, name) || !(partOf(d, name).value > 0)) return false;
  out.push(resistor(d, name, a, b));
  return true;
}

/** Coupling of two windings, clamped below 1 (see K_MAX). */
export function coupling(d: Design, l1: string, l2: string): Element {
  return { kind: 'K', name: `K_${l1}_${l2}`, l1, l2, k: Math.min(d.coupling, K_MAX) };
}

/** Gate on during [0, duty) and its complement on during [duty, 1). */
export function gatePair(duty: number): { on: PwmSignal; off: PwmSignal } {
  const dd = Math.min(Math.max(duty, 0), 1);
  return { on: { dutyFrom: 0, dutyTo: dd }, off: { dutyFrom: dd, dutyTo: 1 } };
}
