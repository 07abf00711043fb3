/**
 * zod building block for one physical quantity: a number (SI) or an engineering-notation string,
 * parsed by src/units/parse.ts and checked against a range taken from SPEC_LIMITS.
 * A failed field yields z.NEVER; cross-field checks only use fields that came out as finite numbers.
 */
import { z } from 'zod';
import { formatSiShort } from '../units/format.ts';
import { parseQuantity } from '../units/parse.ts';
import { showValue } from './errors.ts';

export interface QuantityRange {
  /** Inclusive lower bound. */
  min?: number;
  /** Inclusive upper bound. */
  max?: number;
  /** Exclusive lower bound (the value must be greater). */
  above?: number;
  /** Check |value| instead of value (signed output voltage). */
  magnitude?: boolean;
  /** Word used for a two-sided range in messages: 'range' or 'band'. */
  noun?: string;
}

/** The rule a value broke, in words with units, or undefined if it is within range. */
export function describeRangeViolation(
  value: number,
  unit: string,
  range: QuantityRange,
): string | undefined {
  const show = (x: number) => formatSiShort(x, unit);
  const checked = range.magnitude ? Math.abs(value) : value;
  const what = show(value);
  const noun = `${range.magnitude ? 'magnitude ' : ''}${range.noun ?? 'range'}`;
  if (range.above !== undefined && !(checked > range.above)) {
    return `${what} must be greater than ${show(range.above)}${range.magnitude ? ' in magnitude' : ''}`;
  }
  const low = range.min !== undefined && checked < range.min;
  const high = range.max !== undefined && checked > range.max;
  if (!low && !high) return undefined;
  if (range.min !== undefined && range.max !== undefined) {
    // An en dash next to a minus sign reads as a double minus; spell the range out when a bound is negative.
    const dash = range.min < 0 || range.max < 0 ? ' to ' : '–';
    return `${what} is outside the allowed ${noun} ${show(range.min)}${dash}${show(range.max)}`;
  }
  const qualifier = range.magnitude ? ' magnitude' : '';
  return low
    ? `${what} is below the minimum${qualifier} ${show(range.min!)}`
    : `${what} is above the maximum${qualifier} ${show(range.max!)}`;
}

/** Required quantity in `unit`; the output is the SI value. */
export function quantity(unit: string, range: QuantityRange = {}) {
  return z.unknown().transform((raw, ctx): number => {
    const parsed = parseField(raw, unit, range);
    if (typeof parsed === 'number') return parsed;
    ctx.addIssue({ code: 'custom', message: parsed.message, input: raw });
    return z.NEVER;
  });
}

/** Optional quantity: absent, or blank as an empty form field sends it, gives undefined. */
export function optionalQuantity(unit: string, range: QuantityRange = {}) {
  const blankToAbsent = (raw: unknown) => (typeof raw === 'string' && raw.trim() === '' ? undefined : raw);
  return z.preprocess(blankToAbsent, quantity(unit, range).optional());
}

function parseField(raw: unknown, unit: string, range: QuantityRange): number | { message: string } {
  if (raw === undefined) return { message: 'is required' };
  if (typeof raw !== 'number' && typeof raw !== 'string') {
    return { message: `expected a number or a value like "4.7 ${unit}", got ${showValue(raw)}` };
  }
  const parsed = parseQuantity(raw, unit);
  if (!parsed.ok) return { message: parsed.message };
  const violation = describeRangeViolation(parsed.value, unit, range);
  return violation === undefined ? parsed.value : { message: violation };
}
