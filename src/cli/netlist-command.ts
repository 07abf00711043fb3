/**
 * `straddle netlist SPEC --topology ID --fsw FREQ [--ripple R] [--tech NAME] [--rect diode|sync]
 *  [--set NAME=VALUE]... [--vin V] [--iout A] [--steady|--startup|--step]`
 * Prints the candidate's SPICE netlist (steady state by default), runnable as is in ngspice.
 */
import { parseArgs } from 'node:util';
import { netlistCandidate } from '../simulate/candidate.ts';
import type { Analysis } from '../simulate/types.ts';
import { UsageError } from './args.ts';
import { CANDIDATE_OPTIONS, parseCandidateArgs } from './candidate-args.ts';

export function netlistCommand(argv: string[]): string {
  const { values, positionals } = parseArgs({
    args: argv,
    allowPositionals: true,
    options: {
      ...CANDIDATE_OPTIONS,
      steady: { type: 'boolean' },
      startup: { type: 'boolean' },
      step: { type: 'boolean' },
    },
  });
  const problems: string[] = [];
  const analyses = (['steady', 'startup', 'step'] as Analysis[]).filter((a) => values[a]);
  if (analyses.length > 1) problems.push('choose at most one analysis: --steady, --startup or --step');
  const c = parseCandidateArgs('netlist', values, positionals, problems);
  if (problems.length) throw new UsageError(problems);
  return netlistCandidate(c.spec, c.params, c.tech, c.pins, {
    analysis: analyses[0] ?? 'steady',
    ...(c.vinV === undefined ? {} : { vinV: c.vinV }),
    ...(c.ioutA === undefined ? {} : { ioutA: c.ioutA }),
  });
}
