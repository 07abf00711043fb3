/**
 * WaveSet.stats, the one-pass average / RMS / max / min of the sizing and report loops, against the
 * separate methods it fuses (tested themselves against dense sampling in wave.test.ts): bit for bit.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { WAVE_STRIDE, WaveSet } from '../../src/engine/wave.ts';

const segment = fc.record({
  f: fc.oneof(fc.constant(0), fc.double({ min: 0.01, max: 1, noNaN: true })),
  a: fc.double({ min: -5, max: 5, noNaN: true }),
  b: fc.double({ min: -5, max: 5, noNaN: true }),
  w: fc.oneof(fc.constant(0), fc.double({ min: -2, max: 2, noNaN: true })),
});

describe('one-pass waveform statistics', () => {
  it('equal average(), rms(), max() and min() exactly, zero-length and bowed segments included', () => {
    fc.assert(
      fc.property(fc.array(segment, { minLength: 1, maxLength: 4 }), (segs) => {
        const w = new WaveSet(2);
        const k = 1;
        // slot layout [n, f0..f3, a0..a3, b0..b3, …] (wave.ts), component 1 of 2
        const o = k * WAVE_STRIDE;
        w.data[o] = segs.length;
        segs.forEach((s, j) => {
          w.data[o + 1 + j] = s.f;
          w.data[o + 5 + j] = s.a;
          w.data[o + 9 + j] = s.b;
          w.setBow(k, j, s.w);
        });
        const out = new Float64Array(4);
        w.stats(k, out);
        expect([...out]).toEqual([w.average(k), w.rms(k), w.max(k), w.min(k)]);
      }),
    );
  });
});
