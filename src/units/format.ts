/**
 * SI number out, engineering notation in: 4.7e-6 H → '4.70 µH', 500000 Hz → '500 kHz'.
 * Output always parses back with parseQuantity (ASCII minus, prefixes f…G, micro sign µ).
 */
import { MAX_PREFIX_EXPONENT, MIN_PREFIX_EXPONENT, PREFIX_SYMBOLS, UNPREFIXED_UNITS } from './prefixes.ts';

/**
 * Format with an SI prefix and `digits` significant digits, trailing zeros kept so columns line up
 * (`4.70 µH`, `12.0 V`). Zero prints as `0 H`. Values beyond the prefix range keep the extreme prefix.
 */
export function formatSi(value: number, unit: string, digits = 3): string {
  return joinUnit(formatSiParts(value, unit, digits, false), unit);
}

/** Like formatSi but drops trailing zeros (`4.7 µH`, `20 V`, `14.6 V`): for messages and labels. */
export function formatSiShort(value: number, unit: string, digits = 4): string {
  return joinUnit(formatSiParts(value, unit, digits, true), unit);
}

/** Fraction as a percentage with fixed decimals: 0.9123 → '91.2 %'. */
export function formatPercent(fraction: number, decimals = 1): string {
  if (!Number.isFinite(fraction)) return `${fraction} %`;
  return `${normaliseZero((fraction * 100).toFixed(decimals))} %`;
}

interface SiParts {
  number: string;
  prefix: string;
}

function formatSiParts(value: number, unit: string, digits: number, trim: boolean): SiParts {
  if (!Number.isFinite(value)) return { number: String(value), prefix: '' };
  if (value === 0) return { number: '0', prefix: '' };
  const sig = Math.min(100, Math.max(1, Math.round(digits)));
  // Round once, in decimal, from the exact binary value; a carry (999.96 k → 1.00e6) lands in the exponent.
  const [mantissa, exponentText] = Math.abs(value)
    .toExponential(sig - 1)
    .split('e');
  const significand = mantissa.replace('.', '');
  const exponent10 = Number(exponentText);
  const prefixExponent = UNPREFIXED_UNITS.has(unit)
    ? 0
    : Math.min(MAX_PREFIX_EXPONENT, Math.max(MIN_PREFIX_EXPONENT, Math.floor(exponent10 / 3) * 3));
  let text = placePoint(significand, exponent10 - prefixExponent + 1);
  if (trim && text.includes('.')) text = text.replace(/\.?0+$/, '');
  return { number: (value < 0 ? '-' : '') + text, prefix: PREFIX_SYMBOLS[prefixExponent] };
}

/** Put the decimal point after `integerDigits` digits of a significand, padding with zeros either side. */
function placePoint(significand: string, integerDigits: number): string {
  if (integerDigits <= 0) return `0.${'0'.repeat(-integerDigits)}${significand}`;
  if (integerDigits >= significand.length)
    return significand + '0'.repeat(integerDigits - significand.length);
  return `${significand.slice(0, integerDigits)}.${significand.slice(integerDigits)}`;
}

function normaliseZero(text: string): string {
  return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
}

/** '4.70 µH' with a unit; '4.70µ' without one (both parse back). */
function joinUnit({ number, prefix }: SiParts, unit: string): string {
  return unit === '' ? number + prefix : `${number} ${prefix}${unit}`;
}
