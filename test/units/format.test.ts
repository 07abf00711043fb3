import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { formatPercent, formatSi, formatSiShort } from '../../src/units/format.ts';
import { parseQuantity } from '../../src/units/parse.ts';

describe('formatSi', () => {
  it.each([
    [4.7e-6, 'H', '4.70 µH'],
    [500e3, 'Hz', '500 kHz'],
    [1.2e6, 'Hz', '1.20 MHz'],
    [0.05, 'V', '50.0 mV'],
    [12, 'V', '12.0 V'],
    [-12, 'V', '-12.0 V'],
    [-400e-6, 'A', '-400 µA'],
    [2.2e-9, 'F', '2.20 nF'],
    [100e-12, 'F', '100 pF'],
    [1e9, 'Hz', '1.00 GHz'],
    [0.0123, 'Ω', '12.3 mΩ'],
    [1, 'W', '1.00 W'],
    [999, 'V', '999 V'],
    [1000, 'V', '1.00 kV'],
  ])('writes %d %s as %j', (value, unit, expected) => {
    expect(formatSi(value, unit)).toBe(expected);
  });

  it('writes zero without a prefix', () => {
    expect(formatSi(0, 'H')).toBe('0 H');
    expect(formatSi(-0, 'V')).toBe('0 V');
  });

  it('moves to the next prefix when rounding carries (999.96 k → 1.00 M)', () => {
    expect(formatSi(999.96e3, 'Hz')).toBe('1.00 MHz');
    expect(formatSi(999.4e3, 'Hz')).toBe('999 kHz');
    expect(formatSi(-999.96e-6, 'A')).toBe('-1.00 mA');
  });

  it('honours the number of significant digits', () => {
    expect(formatSi(4.7e-6, 'H', 2)).toBe('4.7 µH');
    expect(formatSi(4.7e-6, 'H', 5)).toBe('4.7000 µH');
    expect(formatSi(123456, 'Hz', 2)).toBe('120 kHz');
    expect(formatSi(1.2345e6, 'Hz', 4)).toBe('1.235 MHz'); // 1234500 is exact in binary: a true decimal tie, rounded up
  });

  it('keeps the extreme prefix beyond femto and giga', () => {
    expect(formatSi(1e-18, 'F')).toBe('0.00100 fF');
    expect(formatSi(5e12, 'Hz')).toBe('5000 GHz');
  });

  it('writes temperatures without a prefix', () => {
    expect(formatSi(25, '°C')).toBe('25.0 °C');
    expect(formatSi(-0.5, '°C')).toBe('-0.500 °C');
  });

  it('writes a unitless value with the prefix attached', () => {
    expect(formatSi(4.7e-6, '')).toBe('4.70µ');
    expect(formatSi(1.5, '')).toBe('1.50');
  });

  it('writes non-finite values as they are', () => {
    expect(formatSi(Number.NaN, 'V')).toBe('NaN V');
    expect(formatSi(Number.NEGATIVE_INFINITY, 'V')).toBe('-Infinity V');
  });

  it('round-trips through parseQuantity within the printed precision', () => {
    const rtol = 5e-6; // half a unit in the 6th significant digit
    fc.assert(
      fc.property(
        fc.double({ min: 1e-15, max: 1e11, noNaN: true }),
        fc.boolean(),
        fc.constantFrom('V', 'A', 'Hz', 'H', 'F', 'Ω', 's', 'W', ''),
        (magnitude, negative, unit) => {
          const value = negative ? -magnitude : magnitude;
          const parsed = parseQuantity(formatSi(value, unit, 6), unit);
          expect(parsed.ok).toBe(true);
          if (parsed.ok) expect(Math.abs(parsed.value - value)).toBeLessThanOrEqual(rtol * Math.abs(value));
        },
      ),
    );
  });
});

describe('formatSiShort', () => {
  it('drops trailing zeros', () => {
    expect(formatSiShort(20, 'V')).toBe('20 V');
    expect(formatSiShort(14.6, 'V')).toBe('14.6 V');
    expect(formatSiShort(4.7e-6, 'H')).toBe('4.7 µH');
    expect(formatSiShort(10e3, 'Hz')).toBe('10 kHz');
    expect(formatSiShort(1.2345e6, 'Hz')).toBe('1.235 MHz');
  });
});

describe('formatPercent', () => {
  it('writes a fraction as a percentage with fixed decimals', () => {
    expect(formatPercent(0.9123)).toBe('91.2 %');
    expect(formatPercent(0.9123, 2)).toBe('91.23 %');
    expect(formatPercent(1)).toBe('100.0 %');
    expect(formatPercent(-0.05)).toBe('-5.0 %');
    expect(formatPercent(-0.00001)).toBe('0.0 %');
  });
});
