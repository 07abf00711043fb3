/**
 * The table-driven power x^y of the core-loss hot path against Math.pow, the language's own power
 * function (ECMAScript Math.pow; V8 computes it with the fdlibm-derived ieee754 routines), across the
 * whole normal range of x and the exponents core-loss data use (Steinmetz β about 2–3, β − α about
 * 0.5–2). Method: P. T. P. Tang, "Table-driven implementation of the logarithm function in IEEE
 * floating-point arithmetic", ACM TOMS 16(4), 1990 (see power-law.ts).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { PowerLaw, powerLaw } from '../../src/parts/power-law.ts';
import { expectClose } from '../support/expect-close.ts';

/** A few units in the last place of a double. */
const RTOL = 1e-14;

describe('PowerLaw: x^y by tables and a short series', () => {
  it('matches Math.pow for any normal x and exponents of core-loss data', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -700, max: 700, noNaN: true }),
        fc.double({ min: 0.2, max: 3.5, noNaN: true }),
        (lnX, y) => {
          const x = Math.exp(lnX);
          const expected = x ** y;
          if (!(expected > 0 && Number.isFinite(expected))) return;
          expectClose(powerLaw(y).pow(x), expected, { rtol: RTOL, what: `${x} ** ${y}` });
        },
      ),
      { numRuns: 2000 },
    );
  });

  it('matches Math.pow at every mantissa cell edge and inside, for the default ferrite β = 2.6', () => {
    const law = new PowerLaw(2.6);
    // ΔB of real designs (mT to a few hundred mT): walk the cells of two binades densely
    for (let k = 0; k < 4096; k++) {
      const x = 0.0625 * (1 + k / 2048);
      expectClose(law.pow(x), x ** 2.6, { rtol: RTOL, what: `${x} ** 2.6` });
    }
  });

  it('is exact where Math.pow is: powers of two, x = 1, square roots', () => {
    const law = powerLaw(2.6);
    expect(law.pow(1)).toBe(1);
    for (let e = -40; e <= 40; e++) expect(law.pow(2 ** e)).toBe((2 ** e) ** 2.6);
    expect(powerLaw(0.5).pow(4)).toBe(2);
    expect(powerLaw(0.5).pow(2)).toBe(Math.SQRT2);
  });

  it('gives Math.pow’s answer outside the table: 0, subnormal, ∞, NaN, negative x, extreme results', () => {
    const law = powerLaw(2.6);
    for (const x of [0, 5e-324, 1e-310, Number.POSITIVE_INFINITY, Number.NaN, -1, 1e-300, 1e300])
      expect(law.pow(x)).toBe(x ** 2.6);
    // a small exponent near the top of the range (x·2^−e/c_j would be subnormal there)
    for (const x of [1.5e308, 2 ** 1023, 1e305]) expect(powerLaw(0.1).pow(x)).toBe(x ** 0.1);
  });
});
