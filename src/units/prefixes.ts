/**
 * SI prefixes and unit spellings shared by the parser and the formatter.
 * Prefixes are case-sensitive on purpose: `m` is milli and `M` is mega (SI Brochure, BIPM, 9th ed. 2019).
 */

/** Decimal exponent of each accepted prefix. `u`, `µ` (micro sign) and `μ` (Greek mu) all mean micro. */
export const PREFIX_EXPONENTS: Readonly<Record<string, number>> = {
  f: -15,
  p: -12,
  n: -9,
  u: -6,
  µ: -6,
  μ: -6,
  m: -3,
  k: 3,
  M: 6,
  G: 9,
};

/** Prefix printed for each exponent (multiples of 3, femto to giga). */
export const PREFIX_SYMBOLS: Readonly<Record<number, string>> = {
  [-15]: 'f',
  [-12]: 'p',
  [-9]: 'n',
  [-6]: 'µ',
  [-3]: 'm',
  0: '',
  3: 'k',
  6: 'M',
  9: 'G',
};

export const MIN_PREFIX_EXPONENT = -15;
export const MAX_PREFIX_EXPONENT = 9;

/**
 * Spellings accepted for each canonical unit. The canonical symbol is always accepted.
 * `C` alone means degrees Celsius here: no quantity in a rail spec is a charge.
 */
export const UNIT_SPELLINGS: Readonly<Record<string, readonly string[]>> = {
  Hz: ['Hz'],
  V: ['V'],
  A: ['A'],
  H: ['H'],
  F: ['F'],
  Ω: ['Ω', 'Ω', 'ohm', 'ohms', 'Ohm', 'Ohms'],
  W: ['W'],
  s: ['s'],
  '°C': ['°C', '℃', 'C', 'degC'],
};

/** Units printed without a prefix (a milli-degree is never what anyone means). */
export const UNPREFIXED_UNITS: ReadonlySet<string> = new Set(['°C']);

/** Canonical unit for a spelling, or undefined if the spelling is not a unit we know. */
export function canonicalUnit(spelling: string): string | undefined {
  for (const [unit, spellings] of Object.entries(UNIT_SPELLINGS)) {
    if (spellings.includes(spelling)) return unit;
  }
  return undefined;
}
