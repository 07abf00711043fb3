import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { parseQuantity } from '../../src/units/parse.ts';

/** Value of a successful parse; fails the test with the parser's message otherwise. */
function parsedValue(input: string | number, unit: string): number {
  const result = parseQuantity(input, unit);
  if (!result.ok) throw new Error(`expected ${JSON.stringify(input)} to parse: ${result.message}`);
  return result.value;
}

function messageOf(input: string | number, unit: string): string {
  const result = parseQuantity(input, unit);
  if (result.ok) throw new Error(`expected ${JSON.stringify(input)} to be rejected, got ${result.value}`);
  return result.message;
}

// Prefix values: The International System of Units (SI Brochure), BIPM, 9th edition, 2019, table 7.
const SI_PREFIXES: [string, number][] = [
  ['f', 1e-15],
  ['p', 1e-12],
  ['n', 1e-9],
  ['u', 1e-6],
  ['µ', 1e-6],
  ['μ', 1e-6],
  ['m', 1e-3],
  ['k', 1e3],
  ['M', 1e6],
  ['G', 1e9],
];

describe('parseQuantity', () => {
  it('takes a number as already in SI', () => {
    expect(parsedValue(12, 'V')).toBe(12);
    expect(parsedValue(-12, 'V')).toBe(-12);
    expect(parsedValue(4.7e-6, 'H')).toBe(4.7e-6);
  });

  it.each([
    ['500k', 'Hz', 500e3],
    ['500 kHz', 'Hz', 500e3],
    ['1.2 MHz', 'Hz', 1.2e6],
    ['1M', 'Hz', 1e6],
    ['4.7u', 'H', 4.7e-6],
    ['4.7 µH', 'H', 4.7e-6],
    ['4.7uH', 'H', 4.7e-6],
    ['4.7μH', 'H', 4.7e-6],
    ['50 mV', 'V', 0.05],
    ['50m', 'V', 0.05],
    ['-12', 'V', -12],
    ['-12 V', 'V', -12],
    ['\u221212 V', 'V', -12],
    ['+3.3V', 'V', 3.3],
    ['10e3', 'Hz', 10e3],
    ['1e-3 s', 's', 1e-3],
    ['2.2n', 'F', 2.2e-9],
    ['100p', 'F', 100e-12],
    ['10 fF', 'F', 10e-15],
    ['1 G', 'Hz', 1e9],
    ['.5 A', 'A', 0.5],
    ['  2 A  ', 'A', 2],
    ['12', 'V', 12],
    ['10 mΩ', 'Ω', 10e-3],
    ['10 mohm', 'Ω', 10e-3],
    ['1.5 Ohm', 'Ω', 1.5],
    ['25 W', 'W', 25],
    ['40 °C', '°C', 40],
    ['40°C', '°C', 40],
    ['-10 C', '°C', -10],
  ])('reads %j in %s as %d', (input, unit, expected) => {
    expect(parsedValue(input, unit)).toBe(expected);
  });

  it('keeps m (milli) and M (mega) apart', () => {
    expect(parsedValue('1m', 'Hz')).toBe(1e-3);
    expect(parsedValue('1M', 'Hz')).toBe(1e6);
    expect(parsedValue('1 mHz', 'Hz')).toBe(1e-3);
    expect(parsedValue('1 MHz', 'Hz')).toBe(1e6);
  });

  it('reads F as farad and f as femto', () => {
    expect(parsedValue('10 F', 'F')).toBe(10);
    expect(parsedValue('10 f', 'F')).toBe(10e-15);
  });

  it('accepts the unit spelled through an alias given as the expected unit', () => {
    expect(parsedValue('2 mΩ', 'ohm')).toBe(2e-3);
  });

  it('gives each prefix its SI value, exactly as the decimal literal would', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 0, max: 999_999 }),
        fc.integer({ min: 0, max: 5 }),
        fc.constantFrom(...SI_PREFIXES),
        (digits, decimals, [prefix, factor]) => {
          const mantissa = (digits / 10 ** decimals).toFixed(decimals);
          const exponent = Math.round(Math.log10(factor));
          // Slow, obvious reference: let the JavaScript number parser read the scientific literal.
          expect(parsedValue(`${mantissa}${prefix}`, 'V')).toBe(Number(`${mantissa}e${exponent}`));
          expect(parsedValue(`${mantissa} ${prefix}V`, 'V')).toBe(Number(`${mantissa}e${exponent}`));
        },
      ),
    );
  });

  describe('rejects, naming the problem', () => {
    it('NaN and infinities', () => {
      expect(messageOf(Number.NaN, 'V')).toMatch(/NaN/);
      expect(messageOf(Number.POSITIVE_INFINITY, 'V')).toMatch(/not a finite number/);
      expect(messageOf('NaN', 'V')).toMatch(/does not start with a number/);
      expect(messageOf('Infinity', 'V')).toMatch(/does not start with a number/);
      expect(messageOf('1e400', 'V')).toMatch(/not a finite number/);
    });

    it('an empty value', () => {
      expect(messageOf('', 'V')).toBe('empty value');
      expect(messageOf('   ', 'V')).toBe('empty value');
    });

    it('text that is not a number', () => {
      expect(messageOf('twelve', 'V')).toMatch(/"twelve" does not start with a number/);
    });

    it('an unknown prefix', () => {
      expect(messageOf('5 x', 'V')).toMatch(/unknown prefix or unit 'x'/);
      expect(messageOf('5 T', 'Hz')).toMatch(/unknown prefix or unit 'T'/);
    });

    it('common prefix mistakes, with a hint', () => {
      expect(messageOf('500K', 'Hz')).toMatch(/unknown prefix 'K' \(use 'k' for kilo\)/);
      expect(messageOf('500 KHz', 'Hz')).toMatch(/use 'k' for kilo/);
      expect(messageOf('1 meg', 'Hz')).toMatch(/use 'M' for mega/);
    });

    it('a unit that is not the expected one', () => {
      expect(messageOf('2 A', 'V')).toMatch(/wrong unit 'A': expected V/);
      expect(messageOf('500 kHz', 'V')).toMatch(/wrong unit 'Hz': expected V/);
      expect(messageOf('4.7 µF', 'H')).toMatch(/wrong unit 'F': expected H/);
      expect(messageOf('1 mA', 'V')).toMatch(/wrong unit 'A'/);
    });

    it('a unit in the wrong case', () => {
      expect(messageOf('1 mhz', 'Hz')).toMatch(/case-sensitive/);
      expect(messageOf('12 v', 'V')).toMatch(/unknown prefix or unit 'v'/);
    });

    it('a unit on a unitless value', () => {
      expect(messageOf('3 V', '')).toMatch(/unexpected unit 'V'/);
    });

    it('trailing garbage and thousands separators', () => {
      expect(messageOf('1.2.3', 'V')).toMatch(/unknown prefix or unit '.3'/);
      expect(messageOf('1,000', 'V')).toMatch(/unknown prefix or unit ',000'/);
    });

    it('anything that is neither a number nor a string', () => {
      expect(messageOf(true as unknown as number, 'V')).toMatch(/expected a number or a string/);
    });
  });
});
