/** Shared option parsing of the command line: engineering-notation values, repeated --set pins. */
import { parseQuantity } from '../units/parse.ts';

/** Bad input on the command line: exit status 2 with every message. */
export class UsageError extends Error {
  constructor(readonly messages: string[]) {
    super(messages.join('\n'));
    this.name = 'UsageError';
  }
}

export function quantityOption(
  name: string,
  raw: string | undefined,
  unit: string,
  problems: string[],
): number | undefined {
  if (raw === undefined) return undefined;
  const q = parseQuantity(raw, unit);
  if (!q.ok) {
    problems.push(`--${name} ${raw}: ${q.message}`);
    return undefined;
  }
  return q.value;
}

const PIN_UNITS: Record<string, string> = {
  dcr: 'Ω',
  esr: 'Ω',
  ron: 'Ω',
  rd: 'Ω',
  vf: 'V',
  cj: 'F',
  qg: 'C',
  qsw: 'C',
  qoss: 'C',
};

/** Parse `NAME=VALUE` pins; the unit follows from the name (L… H, C… F, R… Ω) or the suffix. */
export function parsePins(list: string[] | undefined, problems: string[]): Record<string, number> {
  const pins: Record<string, number> = {};
  for (const item of list ?? []) {
    const eq = item.indexOf('=');
    if (eq <= 0) {
      problems.push(`--set ${item}: expected NAME=VALUE, e.g. L1=22u or L1.dcr=20m`);
      continue;
    }
    const key = item.slice(0, eq).trim();
    const [name, suffix] = key.split('.', 2);
    const unit = suffix
      ? (PIN_UNITS[suffix] ?? '')
      : name.startsWith('L')
        ? 'H'
        : name.startsWith('C')
          ? 'F'
          : name.startsWith('R')
            ? 'Ω'
            : '';
    const q = parseQuantity(item.slice(eq + 1).trim(), unit);
    if (!q.ok) problems.push(`--set ${item}: ${q.message}`);
    else pins[key] = q.value;
  }
  return pins;
}
