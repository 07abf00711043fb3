/**
 * The circuit of a candidate at one operating point: the sized (or pinned) design from the analytic
 * engine, the duty the engine commands there, and the topology's switched netlist at that duty. The
 * simulations run open loop: the duty stays at this value whatever the waveforms do.
 */
import type { Design } from '../engine/design.ts';
import { designCandidate, evaluateCorner } from '../engine/evaluate.ts';
import type { CandidateParams, Pins } from '../engine/types.ts';
import type { Technology } from '../parts/technology.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { buildNetlist } from '../topologies/netlists/index.ts';
import type { Topology } from '../topologies/topology.ts';
import { SimulationError } from '../waveform/errors.ts';
import type { Netlist } from '../waveform/netlist.ts';

export interface CandidateCircuit {
  topology: Topology;
  design: Design;
  vinV: number;
  ioutA: number;
  duty: number;
  duty2: number;
  mode: string;
  netlist: Netlist;
  /** Gates whose duty is the control input of the loop that regulates the output. */
  controlGates: string[];
  /** The main switch node (shown as `sw.v`). */
  switchNode: string;
}

export interface OperatingPointOptions {
  vinV?: number;
  ioutA?: number;
}

/**
 * The gates that regulate the output: the main switch of single-stage converters; the output stage of
 * a cascade (the first stage holds the bus); the active leg of the four-switch stage (its transition
 * region moves both legs, and the engine's `duty` there is the boost leg's).
 */
function controlGatesOf(topology: Topology, mode: string): string[] {
  if (topology.id === 'boost-then-buck' || topology.id === 'buck-then-boost') return ['q3'];
  if (topology.id === 'four-switch-buck-boost') return mode === 'buck' ? ['q1'] : ['q3'];
  return ['q1'];
}

/** The node Q1 shares with an inductor: the switch node of every topology here. */
function switchNodeOf(netlist: Netlist): string {
  const q1 = netlist.elements.find((e) => e.name === 'Q1');
  if (!q1 || q1.kind === 'K') return 'sw';
  const inductorNodes = new Set(
    netlist.elements.flatMap((e) => (e.kind === 'L' && e.name !== 'Lsrc' ? [e.a, e.b] : [])),
  );
  return [q1.a, q1.b].find((n) => n !== '0' && inductorNodes.has(n)) ?? q1.a;
}

export function candidateCircuit(
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins,
  opts: OperatingPointOptions = {},
): CandidateCircuit {
  const vinV = opts.vinV ?? spec.input.nomV;
  const ioutA = opts.ioutA ?? spec.load.maxA;
  if (!(vinV > 0) || !Number.isFinite(vinV)) {
    throw new SimulationError('invalid-netlist', `input voltage must be a positive number, got ${vinV}`);
  }
  if (!(ioutA > 0) || !Number.isFinite(ioutA)) {
    throw new SimulationError('invalid-netlist', `load current must be a positive number, got ${ioutA}`);
  }
  const { topology, design } = designCandidate(spec, params, tech, pins);
  const corner = { label: 'simulated', vinV, ioutA, fullLoad: ioutA >= spec.load.maxA };
  const op = evaluateCorner(topology, design, tech, corner);
  const okDuty = (d: number) => Number.isFinite(d) && d >= 0 && d <= 1;
  if (!okDuty(op.duty) || !okDuty(op.duty2)) {
    throw new SimulationError(
      'invalid-netlist',
      `simulation could not settle: the analytic engine finds no duty for ${vinV} V in at ${ioutA} A (duty ${op.duty})`,
    );
  }
  const netlist = buildNetlist(design, vinV, ioutA, { duty: op.duty, duty2: op.duty2, mode: op.mode });
  return {
    topology,
    design,
    vinV,
    ioutA,
    duty: op.duty,
    duty2: op.duty2,
    mode: op.mode,
    netlist,
    controlGates: controlGatesOf(topology, op.mode),
    switchNode: switchNodeOf(netlist),
  };
}
