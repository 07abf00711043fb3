/**
 * x^y for x > 0 and one fixed exponent y: the Steinmetz power law ΔB^β of core loss in the corner loop.
 *
 * Math.exp(y·Math.log(x)) is two dependent calls into the runtime's C library, about 55 ns on the
 * project's machine, and it sat on the critical path of every winding's core loss (a fifth of a
 * two-inductor converter's corner). With the exponent fixed per core material, the power needs no
 * logarithm at all: split x into its binary exponent and a mantissa cell, and multiply tabulated powers.
 *   x = 2^e · m, m in [1, 2);  m = c_j·(1 + u), c_j the left edge of the cell of a 256-cell table
 *   holding m, 0 ≤ u < 1/256;  x^y = 2^(e·y) · c_j^y · (1 + u)^y,  (1 + u)^y by the binomial series
 *   to u⁶ (truncation below 1e−16 for |y| ≤ 4; exact at powers of two, where u = 0).
 * The tables 2^(e·y) and c_j^y are filled once per exponent with Math.pow of exact inputs. This is the
 * table-driven reduction of P. T. P. Tang ("Table-driven implementation of the logarithm function in
 * IEEE floating-point arithmetic", ACM Trans. Math. Software 16(4), 1990) applied to the power directly.
 * The result agrees with Math.pow to a few units in the last place (the test checks 1e−14 relative over
 * the normal range); anything else (0, subnormal, ∞, NaN, x < 0, or x or the result outside 2^±1000,
 * where a table entry would overflow or lose digits) takes the library path.
 *
 * Numbers travel through a typed array (POW_X → POW_RESULT), not as an argument or a return value: V8
 * boxes a number passed to or returned from a call it leaves out of line, and the corner loop must not
 * allocate. `pow` is the plain form for cold paths and tests.
 */

export const POW_X = 0;
export const POW_RESULT = 1;
/** Slots an io array for PowerLaw.into needs. */
export const POW_SLOTS = 2;

// x's exponent and top mantissa bits are read through an integer view of one double: one 8-byte store
// and one 4-byte load of its high word (element 1 on a little-endian machine; on a big-endian one the
// library path is taken throughout). The mantissa itself is x times a power of two from a table rather
// than a rebuilt double: a narrow store followed by a wide load of the same bytes stalls the processor.
const bits = new Float64Array(1);
const words = new Uint32Array(bits.buffer);
const LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/** Binary exponents of normal doubles. */
const E_MIN = -1022;
const E_MAX = 1023;
/** 2^−e for e = E_MIN … E_MAX (index e − E_MIN), exact (2^−1023 is a subnormal, still exact). */
const POW2_NEG = new Float64Array(E_MAX - E_MIN + 1);
for (let e = E_MIN; e <= E_MAX; e++) POW2_NEG[e - E_MIN] = 2 ** -e;

const CELL_BITS = 8;
const CELLS = 1 << CELL_BITS;
/** 1/c_j for the left edge of cell j, c_j = 1 + j/256 (rounded; c_j is taken to be exactly its inverse). */
const CELL_INV = new Float64Array(CELLS);
for (let j = 0; j < CELLS; j++) CELL_INV[j] = 1 / (1 + j / CELLS);
/**
 * x or x^y beyond 2^±1000 is left to the library (a table entry would overflow or lose digits, and near
 * the top of the range 2^−e·(1/c_j) would be subnormal).
 */
const TWO_POW_LIMIT = 1000;

const MIN_NORMAL = 2.2250738585072014e-308;

/** x^y for one exponent y, x > 0. */
export class PowerLaw {
  /** 2^(e·y), index e − E_MIN; 0 where e or e·y leaves ±TWO_POW_LIMIT. */
  private readonly twoPow = new Float64Array(E_MAX - E_MIN + 1);
  /** c_j^y = (1/c_j)^−y. */
  private readonly cellPow = new Float64Array(CELLS);
  /** Binomial coefficients of (1 + u)^y: y, y(y−1)/2!, … up to u⁶. */
  private readonly c1: number;
  private readonly c2: number;
  private readonly c3: number;
  private readonly c4: number;
  private readonly c5: number;
  private readonly c6: number;

  constructor(readonly exponent: number) {
    const y = exponent;
    // 2^e is exact, so each entry is Math.pow of exact inputs (within its own rounding)
    for (let e = E_MIN; e <= E_MAX; e++)
      this.twoPow[e - E_MIN] =
        Math.abs(e) <= TWO_POW_LIMIT && Math.abs(e * y) <= TWO_POW_LIMIT ? (2 ** e) ** y : 0;
    for (let j = 0; j < CELLS; j++) this.cellPow[j] = CELL_INV[j] ** -y;
    this.c1 = y;
    this.c2 = (this.c1 * (y - 1)) / 2;
    this.c3 = (this.c2 * (y - 2)) / 3;
    this.c4 = (this.c3 * (y - 3)) / 4;
    this.c5 = (this.c4 * (y - 4)) / 5;
    this.c6 = (this.c5 * (y - 5)) / 6;
  }

  /** io[POW_RESULT] = io[POW_X] ** exponent. */
  into(io: Float64Array): void {
    const x = io[POW_X];
    if (!(x >= MIN_NORMAL && x < Number.POSITIVE_INFINITY) || !LITTLE_ENDIAN) {
      io[POW_RESULT] = x ** this.exponent;
      return;
    }
    bits[0] = x;
    const hi = words[1];
    const i = (hi >>> 20) - 1023 - E_MIN;
    const j = (hi >>> (20 - CELL_BITS)) & (CELLS - 1);
    const scale = this.twoPow[i];
    if (!(scale > 0)) {
      io[POW_RESULT] = x ** this.exponent;
      return;
    }
    // 1 + u = x·2^−e/c_j (the power of two makes the first product exact)
    const u = x * (POW2_NEG[i] * CELL_INV[j]) - 1;
    const u2 = u * u;
    const series =
      1 + u * this.c1 + u2 * (this.c2 + u * this.c3) + u2 * u2 * (this.c4 + u * this.c5 + u2 * this.c6);
    io[POW_RESULT] = scale * this.cellPow[j] * series;
  }

  /** x ** exponent (cold paths and tests). */
  pow(x: number): number {
    plain[POW_X] = x;
    this.into(plain);
    return plain[POW_RESULT];
  }
}

const plain = new Float64Array(POW_SLOTS);

const laws = new Map<number, PowerLaw>();

/** The PowerLaw of one exponent, built once (about 2 300 Math.pow calls) and shared. */
export function powerLaw(exponent: number): PowerLaw {
  let law = laws.get(exponent);
  if (!law) {
    law = new PowerLaw(exponent);
    laws.set(exponent, law);
  }
  return law;
}
