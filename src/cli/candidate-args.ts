/**
 * The options every candidate command shares (`evaluate`, `simulate`, `netlist`): topology, switching
 * frequency, ripple ratio, rectifier, technology, pins, and the operating point. Every problem is
 * collected, then thrown as one UsageError (exit 2).
 */
import { createDesign } from '../engine/evaluate.ts';
import { checkPins } from '../engine/pins.ts';
import type { CandidateParams, Pins, RectifierKind } from '../engine/types.ts';
import type { Technology } from '../parts/technology.ts';
import { loadSpecFile, loadTechnology } from '../spec/load.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { getTopology, topologyIds } from '../topologies/registry.ts';
import { parsePins, quantityOption, UsageError } from './args.ts';

/** Ripple ratio when --ripple is not given. */
export const DEFAULT_RIPPLE = 0.3;

export interface CandidateArgs {
  spec: RailSpec;
  params: CandidateParams;
  tech: Technology;
  pins: Pins;
  vinV?: number;
  ioutA?: number;
}

/** Options every candidate command shares (those of `evaluate`, plus --vin and --iout). */
export const CANDIDATE_OPTIONS = {
  topology: { type: 'string' },
  fsw: { type: 'string' },
  ripple: { type: 'string' },
  rect: { type: 'string' },
  tech: { type: 'string' },
  set: { type: 'string', multiple: true },
  vin: { type: 'string' },
  iout: { type: 'string' },
} as const;

type CandidateValues = {
  topology?: string;
  fsw?: string;
  ripple?: string;
  rect?: string;
  tech?: string;
  set?: string[];
  vin?: string;
  iout?: string;
};

/** Validate the candidate options and load the spec; every problem is collected into `problems`. */
export function parseCandidateArgs(
  command: string,
  values: CandidateValues,
  positionals: string[],
  problems: string[],
): CandidateArgs {
  if (positionals.length !== 1) problems.push(`${command} takes exactly one SPEC file`);
  const topology = values.topology ? getTopology(values.topology) : undefined;
  if (!values.topology) problems.push(`--topology is required (one of ${topologyIds().join(', ')})`);
  else if (!topology)
    problems.push(`--topology ${values.topology}: unknown (one of ${topologyIds().join(', ')})`);
  const fsw = quantityOption('fsw', values.fsw, 'Hz', problems);
  if (values.fsw === undefined) problems.push('--fsw is required, e.g. --fsw 400k');
  else if (fsw !== undefined && !(fsw >= 1e3 && fsw <= 1e8))
    problems.push(`--fsw ${values.fsw}: outside 1 kHz–100 MHz`);
  const ripple = values.ripple === undefined ? DEFAULT_RIPPLE : Number(values.ripple);
  if (!(ripple > 0 && ripple <= 2)) problems.push(`--ripple ${values.ripple}: a ripple ratio in (0, 2]`);
  const rect = (values.rect ?? 'diode') as RectifierKind;
  if (rect !== 'diode' && rect !== 'sync') problems.push(`--rect ${values.rect}: diode or sync`);
  else if (topology && !topology.rectifiers.includes(rect))
    problems.push(`--rect ${rect}: ${topology.id} offers ${topology.rectifiers.join(', ')}`);
  const pins = parsePins(values.set, problems);
  const vinV = quantityOption('vin', values.vin, 'V', problems);
  if (vinV !== undefined && !(vinV > 0 && vinV < 1e4))
    problems.push(`--vin ${values.vin}: a positive input voltage`);
  const ioutA = quantityOption('iout', values.iout, 'A', problems);
  if (ioutA !== undefined && !(ioutA > 0 && ioutA < 1e4))
    problems.push(`--iout ${values.iout}: a positive load current`);
  if (problems.length) throw new UsageError(problems);

  const loaded = loadSpecFile(positionals[0]);
  if (!loaded.ok)
    throw new UsageError(loaded.issues.map((i) => (i.path ? `${i.path}: ${i.message}` : i.message)));
  const spec = loaded.spec;
  let tech: Technology;
  try {
    tech = loadTechnology(values.tech ?? spec.technology);
  } catch (error) {
    throw new UsageError([`--tech: ${(error as Error).message}`]);
  }
  const params: CandidateParams = { topology: topology!.id, fswHz: fsw!, ripple, rect };
  const pinProblems = checkPins(createDesign(topology!, spec, params, tech), pins);
  if (pinProblems.length) throw new UsageError(pinProblems);
  return { spec, params, tech, pins, vinV, ioutA };
}
