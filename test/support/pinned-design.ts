/**
 * Pinned designs for the simulator cross-checks: every value and parasitic that decides the waveforms is
 * pinned (`--set` equivalents), so the analytic engine and a simulator see the same circuit whatever the
 * sizer would choose. The same pins go to evaluateCandidate (the CLI JSON) and to the Design the netlist
 * is built from; the caller can check both agree.
 */
import { cornersFor } from '../../src/engine/corners.ts';
import type { Design } from '../../src/engine/design.ts';
import { createDesign, evaluateCandidate } from '../../src/engine/evaluate.ts';
import { sizeDesign } from '../../src/engine/size.ts';
import type { CandidateParams, Evaluation, Pins } from '../../src/engine/types.ts';
import type { Technology } from '../../src/parts/technology.ts';
import type { RailSpec } from '../../src/spec/rail-spec.ts';
import { getTopology } from '../../src/topologies/registry.ts';
import type { Topology } from '../../src/topologies/topology.ts';

/** Pinned values by component name (H, F, Ω) and parasitics, chosen as plausible round numbers. */
const VALUE: Record<string, number> = {
  L1: 22e-6,
  L2: 22e-6,
  Cs: 10e-6,
  Cin: 22e-6,
  Cout: 47e-6,
  Cbus: 22e-6,
  Cd: 47e-6,
  Rd: 1,
};
export const PINNED = {
  dcrOhm: 0.03,
  coupledH: 15e-6,
  switchRonOhm: 0.02,
  syncRonOhm: 0.015,
  senseOhm: 0.01,
  diodeVfV: 0.35,
  diodeRdOhm: 0.02,
};

/** Pins for every component of a topology variant (controllers have nothing to pin). */
export function pinsFor(topology: Topology, params: CandidateParams): Pins {
  const pins: Pins = {};
  for (const c of topology.components(params.rect)) {
    switch (c.role) {
      case 'inductor':
        pins[c.name] = VALUE[c.name];
        pins[`${c.name}.dcr`] = PINNED.dcrOhm;
        break;
      case 'coupled-inductor':
        pins[c.name] = PINNED.coupledH;
        pins[`${c.name}.dcr`] = PINNED.dcrOhm;
        break;
      case 'capacitor':
      case 'damping-capacitor':
      case 'damping-resistor':
        pins[c.name] = VALUE[c.name];
        break;
      case 'switch':
        pins[`${c.name}.ron`] = PINNED.switchRonOhm;
        break;
      case 'sync':
        pins[`${c.name}.ron`] = PINNED.syncRonOhm;
        break;
      case 'diode':
        pins[`${c.name}.vf`] = PINNED.diodeVfV;
        pins[`${c.name}.rd`] = PINNED.diodeRdOhm;
        break;
      case 'sense':
        pins[c.name] = PINNED.senseOhm;
        break;
      default:
        break;
    }
  }
  return pins;
}

export interface PinnedDesign {
  topology: Topology;
  design: Design;
  evaluation: Evaluation;
  pins: Pins;
}

export function pinnedDesign(
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  extra: Pins = {},
): PinnedDesign {
  const topology = getTopology(params.topology);
  if (!topology) throw new Error(`topology ${params.topology} is not registered`);
  const pins = { ...pinsFor(topology, params), ...extra };
  const evaluation = evaluateCandidate(spec, params, tech, pins);
  const design = createDesign(topology, spec, params, tech, pins);
  sizeDesign(topology, design, spec, tech, cornersFor(spec, topology));
  return { topology, design, evaluation, pins };
}
