/**
 * Small-signal Bode plot of a candidate: the state-space averaged model (src/waveform/averaged.ts) at the
 * operating point, control-to-output (per unit duty of the gates that regulate the output) and
 * line-to-output, with the RHP zero and the lightly damped resonances located from the model's zeros and
 * poles (src/waveform/features.ts).
 *
 * Suggested maximum crossover (common practice for a voltage-mode loop): no more than a fifth of the
 * RHP zero (its phase lag grows as the loop gain still rises), below the lowest lightly damped resonance
 * (its phase drop and the SEPIC coupling network's RHP pair cannot be crossed safely), and no more than a
 * tenth of the switching frequency (where the averaged model stops describing the switched circuit).
 */
import type { CandidateParams, Pins } from '../engine/types.ts';
import type { Technology } from '../parts/technology.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { averageModel } from '../waveform/averaged.ts';
import { findResonances, findRhpZero } from '../waveform/features.ts';
import { frequencyResponse, logFrequencyGrid } from '../waveform/small-signal.ts';
import { compileCircuit } from '../waveform/state-space.ts';
import { solvePeriodicSteadyState } from '../waveform/steady-state.ts';
import { candidateCircuit } from './operating-point.ts';
import type { BodeResult } from './types.ts';

/** Fractions of the common-practice crossover rule (see header). */
export const CROSSOVER_OF_RHP_ZERO = 1 / 5;
export const CROSSOVER_OF_FSW = 1 / 10;
const POINTS_PER_DECADE = 60;

export function bodeCandidate(
  spec: RailSpec,
  params: CandidateParams,
  tech: Technology,
  pins: Pins,
  opts: { vinV?: number; ioutA?: number; fromHz?: number; toHz?: number } = {},
): BodeResult {
  const cc = candidateCircuit(spec, params, tech, pins, opts);
  const fsw = cc.netlist.fswHz;
  const circuit = compileCircuit(cc.netlist);
  const steady = solvePeriodicSteadyState(cc.netlist, {}, { circuit, samples: 20 });
  const model = averageModel(cc.netlist, { control: cc.controlGates, steady, circuit });
  const grid = logFrequencyGrid(
    opts.fromHz ?? Math.max(1, fsw / 1e4),
    opts.toHz ?? fsw / 2,
    POINTS_PER_DECADE,
  );
  const curve = (input: string) => {
    const r = frequencyResponse(model, input, 'node(out)', grid);
    return { magDb: Array.from(r.magDb), phaseDeg: Array.from(r.phaseDeg) };
  };
  const rhp = findRhpZero(model, 'duty', 'node(out)');
  const resonances = findResonances(model);
  const limits: [number, string][] = [[CROSSOVER_OF_FSW * fsw, 'a tenth of the switching frequency']];
  if (rhp) limits.push([CROSSOVER_OF_RHP_ZERO * rhp.freqHz, 'a fifth of the RHP zero']);
  if (resonances.length) limits.push([resonances[0].freqHz, 'the lowest resonance']);
  const [suggested, rule] = limits.reduce((a, b) => (b[0] < a[0] ? b : a));
  return {
    vinV: cc.vinV,
    ioutA: cc.ioutA,
    duty: cc.duty,
    freqHz: Array.from(grid),
    controlToOutput: curve('duty'),
    lineToOutput: curve('Vin'),
    controlGates: cc.controlGates,
    ...(rhp ? { rhpZeroHz: rhp.freqHz } : {}),
    resonancesHz: resonances.map((r) => r.freqHz),
    resonanceQ: resonances.map((r) => r.q),
    suggestedCrossoverHz: suggested,
    crossoverRule: `${rule} (common practice: at most a fifth of the RHP zero, below the lowest resonance, at most a tenth of fsw)`,
  };
}
