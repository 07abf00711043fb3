/**
 * The WaveSet writers of the corner loop against their definitions, segment by segment (fast against
 * slow obvious): combine (two- and three-interval paths), copy, shift, removeMean, setTriangle,
 * setTriangleIdle, setSegments, setGated, and chargeSwingInto against chargeSwing. The definitions are the
 * method comments in wave.ts; nothing here comes from outside the project except the arithmetic.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { ALL_SEGMENTS, newTriangle, WAVE_STRIDE, WaveSet } from '../../src/engine/wave.ts';

/** Offsets inside a component's slot block (wave.ts): [n, f0..f3, a0..a3, b0..b3, w0..w3]. */
const F = 1;
const A = 5;
const B = 9;
const W = 13;

const segment = fc.record({
  f: fc.double({ min: 0, max: 1, noNaN: true }),
  a: fc.double({ min: -5, max: 5, noNaN: true }),
  b: fc.double({ min: -5, max: 5, noNaN: true }),
  w: fc.oneof(fc.constant(0), fc.double({ min: -2, max: 2, noNaN: true })),
});

/** Fractions of one period: scaled to sum to 1 (equal shares when all are zero). */
function period<T extends { f: number }>(segs: T[]): T[] {
  const total = segs.reduce((sum, s) => sum + s.f, 0);
  return segs.map((s) => ({ ...s, f: total > 0 ? s.f / total : 1 / segs.length }));
}

/** Two sources on one time grid (a switching network's branches share it), two or three segments. */
const sources = fc.integer({ min: 2, max: 3 }).chain((n) =>
  fc.record({
    n: fc.constant(n),
    s1: fc.array(segment, { minLength: n, maxLength: n }).map(period),
    s2: fc.array(segment, { minLength: n, maxLength: n }).map(period),
  }),
);

function write(w: WaveSet, k: number, segs: { f: number; a: number; b: number; w: number }[], f?: number[]) {
  const o = k * WAVE_STRIDE;
  w.data[o] = segs.length;
  segs.forEach((s, j) => {
    w.data[o + F + j] = f ? f[j] : s.f;
    w.data[o + A + j] = s.a;
    w.data[o + B + j] = s.b;
    w.data[o + W + j] = s.w;
  });
}

function read(w: WaveSet, k: number) {
  const o = k * WAVE_STRIDE;
  const n = w.data[o];
  return Array.from({ length: n }, (_, j) => ({
    f: w.data[o + F + j],
    a: w.data[o + A + j],
    b: w.data[o + B + j],
    w: w.data[o + W + j],
  }));
}

const coefficient = fc.constantFrom(-1, 0, 1);
const mask = fc.integer({ min: 0, max: ALL_SEGMENTS });

describe('WaveSet writers', () => {
  it('combine: c1·k1 where keep1 has the bit, plus c2·k2 where keep2 has it, on k1’s times', () => {
    fc.assert(
      fc.property(sources, coefficient, mask, coefficient, mask, ({ n, s1, s2 }, c1, keep1, c2, keep2) => {
        const w = new WaveSet(3);
        const times = s1.map((s) => s.f);
        write(w, 0, s1);
        write(w, 1, s2, times);
        w.combine(2, 0, c1, keep1, 1, c2, keep2);
        const got = read(w, 2);
        expect(got.length).toBe(n);
        got.forEach((g, j) => {
          const x1 = (keep1 >> j) & 1 ? c1 : 0;
          const x2 = (keep2 >> j) & 1 ? c2 : 0;
          expect(g.f).toBe(s1[j].f);
          expect(g.a).toBe(x1 * s1[j].a + x2 * s2[j].a);
          expect(g.b).toBe(x1 * s1[j].b + x2 * s2[j].b);
          expect(g.w).toBe(x1 * s1[j].w + x2 * s2[j].w);
        });
      }),
    );
  });

  it('copy, shift and removeMean: same shape, constant added, average taken out', () => {
    fc.assert(
      fc.property(sources, fc.double({ min: -3, max: 3, noNaN: true }), ({ s1 }, i0) => {
        const w = new WaveSet(4);
        write(w, 0, s1);
        w.copy(1, 0);
        expect(read(w, 1)).toEqual(read(w, 0));
        w.copy(2, 0);
        w.shift(2, i0);
        read(w, 2).forEach((g, j) => {
          expect(g.a).toBe(s1[j].a + i0);
          expect(g.b).toBe(s1[j].b + i0);
          expect(g.w).toBe(s1[j].w);
        });
        w.copy(3, 0);
        w.removeMean(3);
        const mean = w.average(0);
        read(w, 3).forEach((g, j) => {
          expect(g.a).toBeCloseTo(s1[j].a - mean, 12);
          expect(g.b).toBeCloseTo(s1[j].b - mean, 12);
        });
        // rounding of sums of values up to ~7 A in magnitude
        expect(Math.abs(w.average(3))).toBeLessThan(1e-13 * 7 * 10);
      }),
    );
  });

  it('setTriangle and setTriangleIdle write the triangle their comments describe', () => {
    const w = new WaveSet(2);
    const t = newTriangle();
    t.duty = 0.3;
    t.lo = 1;
    t.hi = 2.5;
    t.bowRise = 0.01;
    t.bowFall = -0.02;
    w.setTriangle(0, t);
    expect(read(w, 0)).toEqual([
      { f: 0.3, a: 1, b: 2.5, w: 0.01 },
      { f: 1 - 0.3, a: 2.5, b: 1, w: -0.02 },
    ]);
    w.setTriangleIdle(1, t, { d0: 0.2, d1: 0.3, d2: 0.5 });
    expect(read(w, 1)).toEqual([
      { f: 0.2, a: 1, b: 2.5, w: 0 },
      { f: 0.3, a: 2.5, b: 1, w: 0 },
      { f: 0.5, a: 1, b: 1, w: 0 },
    ]);
    // the triangle's average is its midline: (lo + hi)/2 plus the bows' 2/3 share
    expect(w.average(0)).toBeCloseTo(1.75 + (2 / 3) * (0.3 * 0.01 + 0.7 * -0.02), 14);
  });

  it('setSegments copies n straight segments from typed arrays', () => {
    const w = new WaveSet(1);
    w.setSegments(
      0,
      3,
      new Float64Array([0.2, 0.5, 0.3]),
      new Float64Array([0, 1, 2]),
      new Float64Array([1, 2, 0]),
    );
    expect(read(w, 0)).toEqual([
      { f: 0.2, a: 0, b: 1, w: 0 },
      { f: 0.5, a: 1, b: 2, w: 0 },
      { f: 0.3, a: 2, b: 0, w: 0 },
    ]);
  });

  it('setGated keeps the segments whose kind is in the mask, signed, and zeroes the rest', () => {
    const w = new WaveSet(2);
    const f = new Float64Array([0.2, 0.5, 0.3]);
    const a = new Float64Array([0.5, 1, 2]);
    const b = new Float64Array([1, 2, 0.5]);
    // kinds 0, 1, 2 in order; mask 0b101 keeps kinds 0 and 2
    const kind = new Int8Array([0, 1, 2]);
    w.setBow(0, 1, 9); // a stale bow must be cleared
    w.setGated(0, 3, f, a, b, kind, 0b101, 1);
    expect(read(w, 0)).toEqual([
      { f: 0.2, a: 0.5, b: 1, w: 0 },
      { f: 0.5, a: 0, b: 0, w: 0 },
      { f: 0.3, a: 2, b: 0.5, w: 0 },
    ]);
    // kinds out of order (compacted intervals), negated
    w.setGated(1, 2, f, a, b, new Int8Array([2, 0]), 1 << 2, -1);
    expect(read(w, 1)).toEqual([
      { f: 0.2, a: -0.5, b: -1, w: 0 },
      { f: 0.5, a: 0, b: 0, w: 0 },
    ]);
  });

  it('chargeSwingInto writes what chargeSwing returns', () => {
    fc.assert(
      fc.property(sources, ({ s1 }) => {
        const w = new WaveSet(1);
        write(w, 0, s1);
        const out = new Float64Array(2);
        w.chargeSwingInto(0, out, 1);
        expect(out[1]).toBe(w.chargeSwing(0));
      }),
    );
  });
});
