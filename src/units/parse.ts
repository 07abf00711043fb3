/**
 * Engineering notation in, SI number out: `500k`, `500 kHz`, `4.7u`, `4.7 µH`, `50 mV`, `-12 V`, `10e3`.
 * A number is taken as already in SI. A unit, when written, must be the expected one.
 */
import { canonicalUnit, PREFIX_EXPONENTS, UNIT_SPELLINGS } from './prefixes.ts';

export type QuantityResult = { ok: true; value: number } | { ok: false; message: string };

/** Sign (ASCII or U+2212 minus), mantissa, optional exponent; the rest is the suffix. */
const NUMBER_PATTERN = /^([+\-\u2212]?)(\d+(?:\.\d*)?|\.\d+)(?:[eE]([+\-\u2212]?\d+))?\s*(.*)$/s;

/** Prefix-looking mistakes worth a specific hint. */
const PREFIX_HINTS: Readonly<Record<string, string>> = {
  K: "use 'k' for kilo",
  meg: "use 'M' for mega",
  Meg: "use 'M' for mega",
  MEG: "use 'M' for mega",
  g: "use 'G' for giga",
};

/**
 * Parse a quantity in the expected unit (canonical symbol such as 'V', 'Hz', 'Ω', '°C', or '' for none).
 * Returns the value in SI or a message naming the problem.
 */
export function parseQuantity(input: string | number, unit: string): QuantityResult {
  const expected = canonicalUnit(unit) ?? unit;
  if (typeof input === 'number') return checkFinite(input, String(input));
  if (typeof input !== 'string')
    return { ok: false, message: `expected a number or a string, got ${typeof input}` };
  const text = input.trim();
  if (text === '') return { ok: false, message: 'empty value' };
  const match = NUMBER_PATTERN.exec(text);
  if (!match) return { ok: false, message: `"${text}" does not start with a number` };
  const [, sign, mantissa, exponent, suffix] = match;
  const scale = parseSuffix(suffix.trim(), expected);
  if (!scale.ok) return { ok: false, message: `"${text}": ${scale.message}` };
  // Rebuild the decimal literal with the prefix folded into the exponent, so `4.7u` parses to exactly 4.7e-6.
  const exp = Number((exponent ?? '0').replace('\u2212', '-')) + scale.exponent;
  const negative = sign === '-' || sign === '\u2212';
  return checkFinite(Number(`${negative ? '-' : ''}${mantissa}e${exp}`), `"${text}"`);
}

function checkFinite(value: number, shown: string): QuantityResult {
  if (Number.isNaN(value)) return { ok: false, message: 'NaN is not a number' };
  if (!Number.isFinite(value)) return { ok: false, message: `${shown} is not a finite number` };
  return { ok: true, value };
}

type SuffixResult = { ok: true; exponent: number } | { ok: false; message: string };

/** Split a suffix into prefix and unit: '', 'k', 'kHz', 'Hz', 'µ', 'µH'. Exact unit spellings win over prefixes. */
function parseSuffix(suffix: string, expected: string): SuffixResult {
  if (suffix === '') return { ok: true, exponent: 0 };
  const spellings = UNIT_SPELLINGS[expected] ?? [expected];
  if (spellings.includes(suffix)) return { ok: true, exponent: 0 };
  for (const [wrong, hint] of Object.entries(PREFIX_HINTS)) {
    if (suffix.startsWith(wrong)) return { ok: false, message: `unknown prefix '${wrong}' (${hint})` };
  }
  const first = [...suffix][0];
  const rest = suffix.slice(first.length);
  const exponent = PREFIX_EXPONENTS[first];
  if (exponent !== undefined) {
    if (rest === '' || spellings.includes(rest)) return { ok: true, exponent };
    return { ok: false, message: describeUnitMismatch(rest, expected) };
  }
  if (canonicalUnit(suffix) !== undefined)
    return { ok: false, message: describeUnitMismatch(suffix, expected) };
  return {
    ok: false,
    message: `unknown prefix or unit '${suffix}' (prefixes: f p n u µ m k M G; unit: ${expected || 'none'})`,
  };
}

function describeUnitMismatch(written: string, expected: string): string {
  if (expected === '') return `unexpected unit '${written}' (this value has no unit)`;
  const known = canonicalUnit(written);
  if (known !== undefined) return `wrong unit '${written}': expected ${expected}`;
  if (written.toLowerCase() === expected.toLowerCase()) {
    return `unit '${written}' is not '${expected}' (units and prefixes are case-sensitive)`;
  }
  return `unknown unit '${written}': expected ${expected}`;
}
