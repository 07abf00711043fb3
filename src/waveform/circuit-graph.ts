/**
 * Structural checks and indexing of a netlist, done once before any configuration is built:
 * node numbering, state / input / output naming, and the two topological faults that make every
 * configuration's nodal equations singular whatever the element values (a node reached only through
 * current-like branches, a loop of voltage-like branches).
 */
import { SimulationError } from './errors.ts';
import { type Element, GROUND, type Netlist } from './netlist.ts';

export type L = Extract<Element, { kind: 'L' }>;
export type C = Extract<Element, { kind: 'C' }>;
export type TwoState = Extract<Element, { kind: 'S' | 'D' }>;

export interface CircuitIndex {
  elements: Element[];
  /** Non-ground node names; index = row in the nodal equations. */
  nodes: string[];
  nodeIndex: Map<string, number>;
  inductors: L[];
  capacitors: C[];
  /** Names of the states: inductor currents, then capacitor voltages (the ideal capacitance, inside the ESR). */
  stateNames: string[];
  /** Inputs: V source values, I source values, then each diode's forward drop as `<name>.vf`. */
  inputNames: string[];
  /** Default input vector from the element values. */
  inputDefaults: Float64Array;
  /** Switches and diodes in element order; bit j of a configuration mask is 1 when twoState[j] conducts. */
  twoState: TwoState[];
  /** Every output: `i(<element>)`, `v(<element>)` for each element except K, then `node(<node>)`. */
  outputNames: string[];
}

function fail(message: string, detail?: unknown): never {
  throw new SimulationError('invalid-netlist', message, detail);
}

function requirePositive(e: Element, field: string, value: number | undefined, allowZero = false): void {
  if (value === undefined) return;
  if (!Number.isFinite(value) || value < 0 || (!allowZero && value === 0)) {
    fail(
      `${e.kind} ${e.name}: ${field} must be a ${allowZero ? 'non-negative' : 'positive'} number, got ${value}`,
    );
  }
}

function validateElement(e: Element): void {
  switch (e.kind) {
    case 'R':
      requirePositive(e, 'ohm', e.ohm);
      break;
    case 'L':
      requirePositive(e, 'henry', e.henry);
      requirePositive(e, 'dcrOhm', e.dcrOhm, true);
      break;
    case 'C':
      requirePositive(e, 'farad', e.farad);
      requirePositive(e, 'esrOhm', e.esrOhm, true);
      break;
    case 'S':
    case 'D':
      requirePositive(e, 'ronOhm', e.ronOhm);
      requirePositive(e, 'roffOhm', e.roffOhm);
      break;
    case 'K':
      if (!(Math.abs(e.k) < 1)) fail(`K ${e.name}: coupling must satisfy |k| < 1, got ${e.k}`);
      break;
    default:
      break;
  }
}

class UnionFind {
  private parent = new Map<string, string>();
  find(x: string): string {
    let p = this.parent.get(x) ?? x;
    if (p !== x) {
      p = this.find(p);
      this.parent.set(x, p);
    }
    return p;
  }
  /** Returns false when a and b were already joined (the new edge closes a loop). */
  union(a: string, b: string): boolean {
    const ra = this.find(a);
    const rb = this.find(b);
    if (ra === rb) return false;
    this.parent.set(ra, rb);
    return true;
  }
}

/** A node tied to ground only through inductors or current sources has no defined voltage. */
function checkTopology(elements: Element[], nodes: string[]): void {
  const resistive = new UnionFind();
  const voltageLike = new UnionFind();
  for (const e of elements) {
    if (e.kind === 'K' || e.kind === 'L' || e.kind === 'I') continue;
    resistive.union(e.a, e.b);
    if (e.kind === 'V' || (e.kind === 'C' && !(e.esrOhm && e.esrOhm > 0))) {
      if (!voltageLike.union(e.a, e.b)) {
        fail(`${e.kind} ${e.name} closes a loop of voltage sources and ESR-free capacitors`);
      }
    }
  }
  for (const node of nodes) {
    if (resistive.find(node) !== resistive.find(GROUND)) {
      throw new SimulationError(
        'singular-configuration',
        `node '${node}' reaches ground only through inductors or current sources, so its voltage is undefined`,
        { node },
      );
    }
  }
}

export function indexCircuit(netlist: Netlist): CircuitIndex {
  const elements = netlist.elements;
  const names = new Set<string>();
  const nodes: string[] = [];
  const nodeIndex = new Map<string, number>();
  for (const e of elements) {
    if (names.has(e.name)) fail(`duplicate element name '${e.name}'`);
    names.add(e.name);
    validateElement(e);
    if (e.kind === 'K') continue;
    for (const node of [e.a, e.b]) {
      if (node !== GROUND && !nodeIndex.has(node)) {
        nodeIndex.set(node, nodes.length);
        nodes.push(node);
      }
    }
    if (e.kind === 'S' && !netlist.pwm[e.gate])
      fail(`switch ${e.name}: gate '${e.gate}' is not a pwm signal`);
  }
  const inductors = elements.filter((e): e is L => e.kind === 'L');
  const capacitors = elements.filter((e): e is C => e.kind === 'C');
  for (const e of elements) {
    if (e.kind !== 'K') continue;
    for (const l of [e.l1, e.l2]) {
      if (!inductors.some((x) => x.name === l)) fail(`K ${e.name}: '${l}' is not an inductor`);
    }
  }
  const vSources = elements.filter((e) => e.kind === 'V');
  const iSources = elements.filter((e) => e.kind === 'I');
  const twoState = elements.filter((e): e is TwoState => e.kind === 'S' || e.kind === 'D');
  if (twoState.length > 30) fail(`at most 30 switches and diodes, got ${twoState.length}`);
  const diodes = twoState.filter((e) => e.kind === 'D');
  const inputNames = [
    ...vSources.map((e) => e.name),
    ...iSources.map((e) => e.name),
    ...diodes.map((d) => `${d.name}.vf`),
  ];
  const inputDefaults = Float64Array.from([
    ...vSources.map((e) => (e.kind === 'V' ? e.volt : 0)),
    ...iSources.map((e) => (e.kind === 'I' ? e.amp : 0)),
    ...diodes.map((d) => (d.kind === 'D' ? d.vfV : 0)),
  ]);
  if (!inputDefaults.every(Number.isFinite)) fail('source values and forward drops must be finite');
  checkTopology(elements, nodes);
  const outputNames: string[] = [];
  for (const e of elements) if (e.kind !== 'K') outputNames.push(`i(${e.name})`, `v(${e.name})`);
  for (const node of nodes) outputNames.push(`node(${node})`);
  return {
    elements,
    nodes,
    nodeIndex,
    inductors,
    capacitors,
    stateNames: [...inductors.map((l) => l.name), ...capacitors.map((c) => c.name)],
    inputNames,
    inputDefaults,
    twoState,
    outputNames,
  };
}
