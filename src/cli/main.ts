/**
 * The command line. Bad input exits 2 with every message; a bug or numerical failure exits 1 with a
 * one-line message (no stack trace unless STRADDLE_DEBUG is set).
 */
import type { Writable } from 'node:stream';
import { UsageError } from './args.ts';
import { evaluateCommand } from './evaluate-command.ts';

const USAGE = `usage:
  straddle evaluate SPEC --topology ID --fsw FREQ [--ripple RATIO] [--rect diode|sync] [--tech NAME] [--set NAME=VALUE]... [--json]
`;

type Command = (argv: string[], err: Writable) => string | Promise<string>;

const COMMANDS: Record<string, Command> = {
  evaluate: (argv) => evaluateCommand(argv),
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
      err.write(`straddle ${name}: ${error.messages.length} problem${error.messages.length > 1 ? 's' : ''}\n`);
      for (const m of error.messages) err.write(`  ${m}\n`);
      return 2;
    }
    if (error instanceof TypeError && (error as { code?: string }).code?.startsWith('ERR_PARSE_ARGS')) {
      err.write(`straddle ${name}: ${error.message}\n${USAGE}`);
      return 2;
    }
    err.write(`straddle ${name}: internal error: ${(error as Error).message}\n`);
    if (process.env.STRADDLE_DEBUG) err.write(`${(error as Error).stack}\n`);
    return 1;
  }
}
