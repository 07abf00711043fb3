/**
 * `straddle simulate SPEC --topology ID --fsw FREQ [--ripple R] [--tech NAME] [--rect diode|sync]
 *  [--set NAME=VALUE]... (--steady|--startup|--step) (--csv|--json) [--vin V] [--iout A]`
 * The waveform engine on one candidate (open loop at the analytic engine's duty). Bad input → UsageError
 * (exit 2); a circuit the engine cannot solve → SimulationError, shown as "simulation could not settle: …".
 */
import { parseArgs } from 'node:util';
import { createDesign } from '../engine/evaluate.ts';
import { checkPins } from '../engine/pins.ts';
import type { CandidateParams, Pins, RectifierKind } from '../engine/types.ts';
import type { Technology } from '../parts/technology.ts';
import { simulateCandidate } from '../simulate/candidate.ts';
import type { Analysis, SimulationResult } from '../simulate/types.ts';
import { loadSpecFile, loadTechnology } from '../spec/load.ts';
import type { RailSpec } from '../spec/rail-spec.ts';
import { getTopology, topologyIds } from '../topologies/registry.ts';
import { parsePins, quantityOption, UsageError } from './args.ts';
import { DEFAULT_RIPPLE } from './evaluate-command.ts';

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

/** `time_s,<signals>` then one row per sample; numbers in full precision. */
export function simulationCsv(r: SimulationResult): string {
  const names = Object.keys(r.signals);
  const lines = [['time_s', ...names].join(',')];
  for (let i = 0; i < r.timeS.length; i++)
    lines.push([r.timeS[i], ...names.map((k) => r.signals[k][i])].join(','));
  return `${lines.join('\n')}\n`;
}

export function simulateCommand(argv: string[]): string {
  const { values, positionals } = parseArgs({
    args: argv,
    allowPositionals: true,
    options: {
      ...CANDIDATE_OPTIONS,
      steady: { type: 'boolean' },
      startup: { type: 'boolean' },
      step: { type: 'boolean' },
      csv: { type: 'boolean' },
      json: { type: 'boolean' },
    },
  });
  const problems: string[] = [];
  const analyses = (['steady', 'startup', 'step'] as Analysis[]).filter((a) => values[a]);
  if (analyses.length !== 1) problems.push('choose one analysis: --steady, --startup or --step');
  const formats = (['csv', 'json'] as const).filter((f) => values[f]);
  if (formats.length !== 1) problems.push('choose one output format: --csv or --json');
  const c = parseCandidateArgs('simulate', values, positionals, problems);
  const result = simulateCandidate(c.spec, c.params, c.tech, c.pins, {
    analysis: analyses[0],
    ...(c.vinV === undefined ? {} : { vinV: c.vinV }),
    ...(c.ioutA === undefined ? {} : { ioutA: c.ioutA }),
  });
  return formats[0] === 'csv' ? simulationCsv(result) : `${JSON.stringify(result)}\n`;
}
