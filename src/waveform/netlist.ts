/**
 * The switched-circuit netlist the waveform engine solves: plain data, SI units.
 * Nodes are strings; '0' is ground. Every two-terminal element's voltage is v(a) − v(b) and its current
 * flows from a to b through the element (SPICE convention: for a V source, into its + terminal).
 */
export type Element =
  | { kind: 'R'; name: string; a: string; b: string; ohm: number }
  /** Inductor with series winding resistance; i0 is the initial current for transients (A). */
  | { kind: 'L'; name: string; a: string; b: string; henry: number; dcrOhm?: number; i0?: number }
  /** Magnetic coupling 0 ≤ |k| < 1 between two L by name; the dot is at each inductor's node a. */
  | { kind: 'K'; name: string; l1: string; l2: string; k: number }
  /** Capacitor with series ESR; v0 is the initial voltage of the ideal capacitance for transients (V). */
  | { kind: 'C'; name: string; a: string; b: string; farad: number; esrOhm?: number; v0?: number }
  /** Independent DC voltage source, a(+) b(−); the analysis may override or step its value. */
  | { kind: 'V'; name: string; a: string; b: string; volt: number }
  /** Independent DC current source; amp flows from a to b through the source (a load when a is the rail). */
  | { kind: 'I'; name: string; a: string; b: string; amp: number }
  /** Controlled switch: a resistance ronOhm when its gate signal is on, roffOhm when off. */
  | { kind: 'S'; name: string; a: string; b: string; ronOhm: number; roffOhm: number; gate: string }
  /** Diode, anode a, cathode b: on ⇒ v = vfV + ronOhm·i, off ⇒ v = roffOhm·i; the state is found by the engine. */
  | { kind: 'D'; name: string; a: string; b: string; vfV: number; ronOhm: number; roffOhm: number };

export type ElementKind = Element['kind'];

/**
 * A gate signal: on during [dutyFrom, dutyTo) of each period, as fractions of the period.
 * dutyFrom > dutyTo wraps around the period end (on in [dutyFrom, 1) ∪ [0, dutyTo)).
 * dutyTo − dutyFrom ≥ 1 is always on; dutyFrom = dutyTo is always off.
 */
export interface PwmSignal {
  dutyFrom: number;
  dutyTo: number;
}

export interface Netlist {
  elements: Element[];
  /** Gate signals by name, referenced by the switches' `gate`. */
  pwm: Record<string, PwmSignal>;
  /** Switching frequency (Hz): the period of every gate signal. */
  fswHz: number;
}

export const GROUND = '0';
