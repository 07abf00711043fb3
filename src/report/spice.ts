/**
 * SPICE export of a switched netlist: standard SPICE3 text that runs unchanged in ngspice.
 *
 * Mapping (each choice keeps the SPICE circuit equal to the piecewise-linear model of src/waveform/):
 * - inductor DCR and capacitor ESR become separate series resistors, so `L…`/`C…` are ideal and their
 *   initial conditions (IC=) are the state of the ideal element;
 * - a switch S becomes a voltage-controlled `SW` (VT = 0.5 V, no hysteresis, RON/ROFF from the element)
 *   driven by a 0/1 V PULSE source per gate signal, plus a 0 V source in series that measures its current;
 * - a diode D (drop vf + rd·i when on) becomes a SPICE diode with a tiny emission coefficient in series
 *   with a DC source: v = N·Vt·ln(i/IS) + RS·i + Vsrc with N = 0.05, IS = 1 nA, RS = rd and
 *   Vsrc = vf − N·Vt·ln(1 A / IS), so the drop is vf + rd·i exactly at 1 A and within ±3 mV from 0.1 A to
 *   10 A (N·Vt ≈ 1.3 mV per e-fold of current). The series source also measures the diode current.
 *   CJO = 100 pF by default keeps ngspice from aborting with "Timestep too small" at the diode's turn-off
 *   (without junction capacitance the stiff exponential has no time constant). With the ideal switches
 *   here it also draws a spike of about V/(RON + RS) for picoseconds when a switch reverses the diode
 *   (a few nC per cycle: averages are untouched, instantaneous peaks are not); `diodeCjoF: 0` removes it.
 * - gate edges: a PULSE with rise = fall = tEdge crosses the 0.5 V threshold tEdge/2 after its nominal
 *   start, so every gate is delayed by the same tEdge/2 and complementary gates never overlap.
 * Names: SPICE decides an element's type by its first letter, so a name whose first letter differs from
 * the type gets the type letter as prefix (Q1 → S_Q1); characters outside [A-Za-z0-9_] become '_'.
 * Pure function: text in, text out.
 */
import type { Element, Netlist, PwmSignal } from '../waveform/netlist.ts';

export interface SpiceOptions {
  title: string;
  tStopS: number;
  /** Print step (s); also the default maximum internal step. */
  tStepS: number;
  /** Maximum internal step (s); default tStepS. */
  tMaxS?: number;
  /** Start of the saved output (s); default 0. */
  tStartS?: number;
  /** Write IC= on every L and C (their i0/v0, default 0) and run the transient with `uic`. */
  initialConditions?: boolean;
  /** Integration method; gear damps the numerical ringing trapezoidal integration shows at hard edges. */
  method?: 'gear' | 'trap';
  /**
   * Diode junction capacitance (F), default DIODE_CJO_F. 0 matches the piecewise-linear model exactly
   * (no charge spike when a switch reverses the diode) and ran in ngspice with gear for every topology
   * here; the default keeps other circuits from aborting.
   */
  diodeCjoF?: number;
}

/** Emission coefficient and saturation current of the diode stand-in (see the header). */
export const DIODE_N = 0.05;
export const DIODE_IS_A = 1e-9;
export const DIODE_CJO_F = 100e-12;
/** Thermal voltage at ngspice's default 27 °C (V): k·T/q with T = 300.15 K. */
export const THERMAL_VOLTAGE_V = (1.380649e-23 * 300.15) / 1.602176634e-19;

/** SPICE vector names for one netlist element, lower case as ngspice reports them. */
export interface SpiceProbe {
  /** Current vector in the element's a → b direction, when SPICE saves one ('i(l1)', 'i(v_q1_i)'). */
  current?: string;
  /** Node names of the element's terminals a and b ('0' is ground). */
  a: string;
  b: string;
  /** For capacitors: the terminals of the ideal capacitance (behind the ESR). */
  stateA?: string;
  stateB?: string;
}

export interface SpiceMap {
  elements: Record<string, SpiceProbe>;
  /** SPICE element name of each netlist element. */
  names: Record<string, string>;
}

const LETTER: Record<Element['kind'], string> = {
  R: 'R',
  L: 'L',
  K: 'K',
  C: 'C',
  V: 'V',
  I: 'I',
  S: 'S',
  D: 'D',
};

function clean(s: string): string {
  return s.replace(/[^A-Za-z0-9_]/g, '_');
}

/** SPICE node name of a netlist node. */
export function spiceNodeName(n: string): string {
  // user nodes get 'n_', internal nodes 'x_', gate nodes 'g_': they can never collide
  return n === '0' ? '0' : `n_${clean(n)}`.toLowerCase();
}

/** Gate-signal nodes get their own prefix 'g_'. */
function gateNode(gate: string): string {
  return `g_${clean(gate)}`.toLowerCase();
}

function spiceName(e: Element): string {
  const c = clean(e.name);
  return c[0]?.toUpperCase() === LETTER[e.kind] ? c : `${LETTER[e.kind]}_${c}`;
}

function num(x: number, what: string): string {
  if (!Number.isFinite(x)) throw new Error(`SPICE export: ${what} is not a finite number (${x})`);
  return String(x);
}

/** Where each element's current and voltages are found in the SPICE results. */
export function spiceMap(netlist: Netlist): SpiceMap {
  const elements: Record<string, SpiceProbe> = {};
  const names: Record<string, string> = {};
  const seen = new Set<string>();
  for (const e of netlist.elements) {
    const name = spiceName(e);
    if (seen.has(name.toLowerCase())) throw new Error(`SPICE export: element name ${name} is used twice`);
    seen.add(name.toLowerCase());
    names[e.name] = name;
    if (e.kind === 'K') continue;
    const a = spiceNodeName(e.a);
    const b = spiceNodeName(e.b);
    const low = name.toLowerCase();
    const probe: SpiceProbe = { a, b };
    if (e.kind === 'L' || e.kind === 'V') probe.current = `i(${low})`;
    if (e.kind === 'S') probe.current = `i(v_${low}_i)`;
    if (e.kind === 'D') probe.current = `i(v_${low}_vf)`;
    if (e.kind === 'C') {
      probe.stateA = e.esrOhm && e.esrOhm > 0 ? `x_${low}_esr` : a;
      probe.stateB = b;
    }
    elements[e.name] = probe;
  }
  return { elements, names };
}

/** PULSE source text of one gate signal: 0/1 V at the netlist frequency (see header for the edges). */
function gateSource(name: string, sig: PwmSignal, periodS: number, tEdgeS: number): string {
  const node = gateNode(name);
  const src = `V_gate_${clean(name)} ${node} 0`;
  const span = sig.dutyTo - sig.dutyFrom;
  if (span >= 1) return `${src} DC 1`;
  const from = sig.dutyFrom - Math.floor(sig.dutyFrom);
  const to = sig.dutyTo - Math.floor(sig.dutyTo);
  if (from === to) return `${src} DC 0`;
  // a window that wraps past the period end is the complement of [to, from): an inverted pulse
  const [v1, v2, start, width] = from < to ? [0, 1, from, to - from] : [1, 0, to, from - to];
  const pw = Math.max(width * periodS - tEdgeS, tEdgeS);
  return `${src} PULSE(${v1} ${v2} ${num(start * periodS, 'gate delay')} ${num(tEdgeS, 'edge')} ${num(tEdgeS, 'edge')} ${num(pw, 'pulse width')} ${num(periodS, 'period')})`;
}

export function toSpice(netlist: Netlist, opts: SpiceOptions): string {
  const map = spiceMap(netlist);
  const periodS = 1 / netlist.fswHz;
  const tEdgeS = periodS * 1e-3;
  const ic = opts.initialConditions === true;
  const lines: string[] = [`* ${opts.title.replace(/\s+/g, ' ')}`];
  const models: string[] = [];
  for (const e of netlist.elements) {
    const name = map.names[e.name];
    const low = name.toLowerCase();
    if (e.kind === 'K') {
      lines.push(`${name} ${map.names[e.l1]} ${map.names[e.l2]} ${num(e.k, `${e.name} coupling`)}`);
      continue;
    }
    const p = map.elements[e.name];
    switch (e.kind) {
      case 'R':
        lines.push(`${name} ${p.a} ${p.b} ${num(e.ohm, `${e.name} resistance`)}`);
        break;
      case 'V':
        lines.push(`${name} ${p.a} ${p.b} DC ${num(e.volt, `${e.name} voltage`)}`);
        break;
      case 'I':
        lines.push(`${name} ${p.a} ${p.b} DC ${num(e.amp, `${e.name} current`)}`);
        break;
      case 'L': {
        const dcr = e.dcrOhm ?? 0;
        const mid = dcr > 0 ? `x_${low}_dcr` : p.b;
        lines.push(
          `${name} ${p.a} ${mid} ${num(e.henry, `${e.name} inductance`)}${ic ? ` IC=${num(e.i0 ?? 0, `${e.name} i0`)}` : ''}`,
        );
        if (dcr > 0) lines.push(`R_${name}_dcr ${mid} ${p.b} ${num(dcr, `${e.name} DCR`)}`);
        break;
      }
      case 'C': {
        const esr = e.esrOhm ?? 0;
        if (esr > 0) lines.push(`R_${name}_esr ${p.a} ${p.stateA} ${num(esr, `${e.name} ESR`)}`);
        lines.push(
          `${name} ${p.stateA} ${p.b} ${num(e.farad, `${e.name} capacitance`)}${ic ? ` IC=${num(e.v0 ?? 0, `${e.name} v0`)}` : ''}`,
        );
        break;
      }
      case 'S': {
        const gate = netlist.pwm[e.gate];
        if (!gate)
          throw new Error(`SPICE export: switch ${e.name} names gate ${e.gate}, which has no signal`);
        const mid = `x_${low}_i`;
        lines.push(`${name} ${p.a} ${mid} ${gateNode(e.gate)} 0 SW_${low}`);
        lines.push(`V_${low}_i ${mid} ${p.b} DC 0`);
        models.push(
          `.model SW_${low} SW(VT=0.5 VH=0 RON=${num(e.ronOhm, `${e.name} ron`)} ROFF=${num(e.roffOhm, `${e.name} roff`)})`,
        );
        break;
      }
      case 'D': {
        const mid = `x_${low}_k`;
        const logTerm = DIODE_N * THERMAL_VOLTAGE_V * Math.log(1 / DIODE_IS_A);
        lines.push(`${name} ${p.a} ${mid} DM_${low}`);
        lines.push(`V_${low}_vf ${mid} ${p.b} DC ${num(e.vfV - logTerm, `${e.name} vf`)}`);
        models.push(
          `.model DM_${low} D(IS=${DIODE_IS_A} N=${DIODE_N} RS=${num(e.ronOhm, `${e.name} rd`)} CJO=${num(opts.diodeCjoF ?? DIODE_CJO_F, 'diode CJO')})`,
        );
        break;
      }
    }
  }
  // only the gates some switch uses: a source on an otherwise unconnected node is a dangling node in SPICE
  const used = new Set(netlist.elements.flatMap((e) => (e.kind === 'S' ? [e.gate] : [])));
  for (const [g, sig] of Object.entries(netlist.pwm))
    if (used.has(g)) lines.push(gateSource(g, sig, periodS, tEdgeS));
  lines.push(...models);
  const tMax = opts.tMaxS ?? opts.tStepS;
  lines.push(`.options method=${opts.method ?? 'gear'} reltol=1e-4 abstol=1e-9 vntol=1e-6`);
  lines.push(
    `.tran ${num(opts.tStepS, 'tStepS')} ${num(opts.tStopS, 'tStopS')} ${num(opts.tStartS ?? 0, 'tStartS')} ${num(tMax, 'tMaxS')}${ic ? ' uic' : ''}`,
  );
  lines.push('.end');
  return `${lines.join('\n')}\n`;
}
