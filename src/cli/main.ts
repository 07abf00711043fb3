/**
 * The command line. Bad input exits 2 with every message; a bug or numerical failure exits 1 with a
 * one-line message (no stack trace unless STRADDLE_DEBUG is set).
 */
import type { Writable } from 'node:stream';
import { SimulationError } from '../waveform/errors.ts';
import { UsageError } from './args.ts';
import { evaluateCommand } from './evaluate-command.ts';
import { netlistCommand } from './netlist-command.ts';
import { simulateCommand } from './simulate-command.ts';
import { studyCommand } from './study-command.ts';

const USAGE = `usage:
  straddle evaluate SPEC --topology ID --fsw FREQ [--ripple RATIO] [--rect diode|sync] [--tech NAME] [--set NAME=VALUE]... [--json]
  straddle study SPEC [--objectives parts,lossW,stress] [--frequencies 32] [--ripple 0.2,0.3,0.4,0.6] [--weights 1,1,1] [--band MIN,MAX] [--epsilon E] [--max-candidates N] [--tech NAME] [--format json|csv|md]
  straddle simulate SPEC --topology ID --fsw FREQ [--ripple R] [--rect diode|sync] [--tech NAME] [--set NAME=VALUE]... (--steady|--startup|--step) (--csv|--json) [--vin V] [--iout A]
  straddle netlist SPEC --topology ID --fsw FREQ [--ripple R] [--rect diode|sync] [--tech NAME] [--set NAME=VALUE]... [--vin V] [--iout A] [--steady|--startup|--step]
`;

type Command = (argv: string[], err: Writable) => string | Promise<string>;

const COMMANDS: Record<string, Command> = {
  evaluate: (argv) => evaluateCommand(argv),
  study: (argv, err) => studyCommand(argv, err),
  simulate: (argv) => simulateCommand(argv),
  netlist: (argv) => netlistCommand(argv),
};

export async function main(argv: string[], out: Writable, err: Writable): Promise<number> {
  const [name, ...rest] = argv;
  const command = name ? COMMANDS[name] : undefined;
  if (!command) {
    err.write(name && name !== '--help' ? `straddle: unknown command ${name}\n${USAGE}` : USAGE);
    return name && name !== '--help' ? 2 : 0;
  }
  try {
    out.write(await command(rest, err));
    return 0;
  } catch (error) {
    if (error instanceof UsageError) {
      err.write(
        `straddle ${name}: ${error.messages.length} problem${error.messages.length > 1 ? 's' : ''}\n`,
      );
      for (const m of error.messages) err.write(`  ${m}\n`);
      return 2;
    }
    if (error instanceof TypeError && (error as { code?: string }).code?.startsWith('ERR_PARSE_ARGS')) {
      err.write(`straddle ${name}: ${error.message}\n${USAGE}`);
      return 2;
    }
    if (error instanceof SimulationError) {
      const m = error.message.startsWith('simulation could not settle')
        ? error.message
        : `simulation could not settle: ${error.message}`;
      err.write(`straddle ${name}: ${m}\n`);
      return 1;
    }
    err.write(`straddle ${name}: internal error: ${(error as Error).message}\n`);
    if (process.env.STRADDLE_DEBUG) err.write(`${(error as Error).stack}\n`);
    return 1;
  }
}
