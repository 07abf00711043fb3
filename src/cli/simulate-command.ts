/**
 * `straddle simulate SPEC --topology ID --fsw FREQ [--ripple R] [--tech NAME] [--rect diode|sync]
 *  [--set NAME=VALUE]... (--steady|--startup|--step) (--csv|--json) [--vin V] [--iout A]`
 * The waveform engine on one candidate (open loop at the analytic engine's duty). Bad input → UsageError
 * (exit 2); a circuit the engine cannot solve → SimulationError, shown as "simulation could not settle: …".
 */
import { parseArgs } from 'node:util';
import { simulateCandidate } from '../simulate/candidate.ts';
import type { Analysis, SimulationResult } from '../simulate/types.ts';
import { CANDIDATE_OPTIONS, parseCandidateArgs } from './candidate-args.ts';

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
