/**
 * The piecewise waveform store against a slow obvious reference: the same waveform sampled densely
 * (200 000 points a period) and summed; sampling a jump costs about jump/N, hence the 1e-4 tolerances.
 * Segments are straight or bowed (parabolic).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { WaveSet } from '../../src/engine/wave.ts';
import { expectClose } from '../support/expect-close.ts';

interface Seg {
  f: number;
  a: number;
  b: number;
  w: number;
}

const N = 200_000;

function sample(segs: Seg[]): Float64Array {
  const out = new Float64Array(N);
  let t0 = 0;
  let j = 0;
  for (let i = 0; i < N; i++) {
    const t = (i + 0.5) / N;
    while (j < segs.length - 1 && t >= t0 + segs[j].f) {
      t0 += segs[j].f;
      j++;
    }
    const s = segs[j];
    const x = (t - t0) / s.f;
    out[i] = s.a + (s.b - s.a) * x + 4 * s.w * x * (1 - x);
  }
  return out;
}

const segments = fc
  .array(
    fc.record({
      f: fc.double({ min: 0.05, max: 1, noNaN: true }),
      a: fc.double({ min: -5, max: 5, noNaN: true }),
      b: fc.double({ min: -5, max: 5, noNaN: true }),
      w: fc.oneof(fc.constant(0), fc.double({ min: -2, max: 2, noNaN: true })),
    }),
    { minLength: 2, maxLength: 4 },
  )
  .map((list) => {
    const total = list.reduce((s, x) => s + x.f, 0);
    return list.map((x) => ({ ...x, f: x.f / total }));
  });

function load(segs: Seg[]): WaveSet {
  const w = new WaveSet(1);
  w.data[0] = segs.length;
  segs.forEach((s, j) => {
    w.data[1 + j] = s.f;
    w.data[5 + j] = s.a;
    w.data[9 + j] = s.b;
    w.setBow(0, j, s.w);
  });
  return w;
}

describe('piecewise waveform statistics', () => {
  it('match dense sampling for straight and bowed segments (average, RMS, extremes, charge swing)', () => {
    fc.assert(
      fc.property(segments, (segs) => {
        const w = load(segs);
        const x = sample(segs);
        let sum = 0;
        let sq = 0;
        let mx = -Infinity;
        let mn = Infinity;
        for (const v of x) {
          sum += v;
          sq += v * v;
          mx = Math.max(mx, v);
          mn = Math.min(mn, v);
        }
        // the extremes of a segment may sit exactly at its ends, between two samples
        for (const seg of segs) {
          mx = Math.max(mx, seg.a, seg.b);
          mn = Math.min(mn, seg.a, seg.b);
        }
        const mean = sum / N;
        let q = 0;
        let qMax = 0;
        let qMin = 0;
        for (const v of x) {
          q += (v - mean) / N;
          qMax = Math.max(qMax, q);
          qMin = Math.min(qMin, q);
        }
        const scale = 1 + Math.max(...segs.map((s) => Math.abs(s.a) + Math.abs(s.b) + Math.abs(s.w)));
        expectClose(w.average(0), mean, { atol: 1e-4 * scale, what: 'average' });
        expectClose(w.rms(0), Math.sqrt(sq / N), { atol: 1e-4 * scale, what: 'rms' });
        expectClose(w.max(0), mx, { atol: 1e-4 * scale, what: 'max' });
        expectClose(w.min(0), mn, { atol: 1e-4 * scale, what: 'min' });
        expectClose(w.chargeSwing(0), qMax - qMin, { atol: 1e-4 * scale, what: 'charge swing' });
      }),
      { numRuns: 60 },
    );
  });

  it('gives the textbook triangle: RMS of a zero-mean triangle of peak-to-peak Δ is Δ/√12', () => {
    const w = new WaveSet(1);
    w.set2(0, 0.3, -1, 1, 1, -1);
    expectClose(w.rms(0), 2 / Math.sqrt(12), { rtol: 1e-12, what: 'triangle rms' });
    // charge swing of a triangle current: Δ·T/8 (common practice: ΔV = ΔI/(8·f·C) of a buck output)
    expectClose(w.chargeSwing(0), 2 / 8, { rtol: 1e-12, what: 'triangle charge' });
    expect(w.average(0)).toBeCloseTo(0, 12);
  });
});
