/**
 * What the candidate routes ask of the waveform engine, as one replaceable object (tests swap in a
 * failing one).
 */
import type { CandidateParams, Pins } from '../../engine/types.ts';
import type { Technology } from '../../parts/technology.ts';
import { bodeCandidate, netlistCandidate, simulateCandidate } from '../../simulate/candidate.ts';
import type { RailSpec } from '../../spec/rail-spec.ts';

export interface CandidateSimulator {
  simulate: typeof simulateCandidate;
  bode: typeof bodeCandidate;
  netlist: typeof netlistCandidate;
}

export const ENGINE_SIMULATOR: CandidateSimulator = {
  simulate: simulateCandidate,
  bode: bodeCandidate,
  netlist: netlistCandidate,
};

export interface SimulationInput {
  spec: RailSpec;
  params: CandidateParams;
  tech: Technology;
  pins: Pins;
}
