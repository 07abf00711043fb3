/** Per-topology sweeps and the knee, on hand-made points (definition of the knee in src/study/sweeps.ts). */
import { describe, expect, it } from 'vitest';
import { kneeIndex, sweepHighlights } from '../../src/study/sweeps.ts';
import type { SweepPoint } from '../../src/study/types.ts';
import { expectClose } from '../support/expect-close.ts';
import { syntheticStudy } from './synthetic.ts';

function point(fswHz: number, efficiency: number, volumeMm3: number): SweepPoint {
  return { fswHz, efficiency, volumeMm3, efficiencyId: `e${fswHz}`, volumeId: `v${fswHz}` };
}

describe('the knee of the efficiency–volume curve', () => {
  it('is the point farthest from the chord towards the ideal corner', () => {
    // Normalised: A (100 kHz) = (1, 0), B (400 kHz) = (0, 1), the 200 kHz point = (1/6, 1/6).
    // Chord x + y = 1, so its distance is |1/6 + 1/6 − 1| / √2 = √2 / 3 (plane geometry).
    const points = [point(100e3, 0.98, 1000), point(200e3, 0.975, 500), point(400e3, 0.95, 400)];
    const h = sweepHighlights(points)!;
    expect(h.bestEfficiency.fswHz).toBe(100e3);
    expect(h.smallestVolume.fswHz).toBe(400e3);
    expect(h.knee.fswHz).toBe(200e3);
    expectClose(h.knee.distance, Math.SQRT2 / 3, { rtol: 1e-12, what: 'knee distance' });
  });

  it('ignores points outside the two extremes', () => {
    const points = [
      point(50e3, 0.9, 5000),
      point(100e3, 0.98, 1000),
      point(200e3, 0.975, 500),
      point(400e3, 0.95, 400),
    ];
    expect(kneeIndex(points, 1, 3).i).toBe(2);
  });

  it('falls back to the lower-frequency end when the curve is a straight line', () => {
    const points = [point(100e3, 0.98, 1000), point(200e3, 0.97, 700), point(400e3, 0.96, 400)];
    const k = kneeIndex(points, 0, 2);
    expect(k.i).toBe(0);
    expectClose(k.d, 0, { atol: 1e-12, what: 'distance on a straight line' });
  });

  it('is the single frequency that is best at both when there is one', () => {
    const points = [point(100e3, 0.9, 1000), point(200e3, 0.98, 300), point(400e3, 0.95, 400)];
    expect(sweepHighlights(points)!.knee.fswHz).toBe(200e3);
  });
});

describe('the per-topology series', () => {
  it('keeps feasible candidates only and takes the best variant at each frequency', () => {
    const study = syntheticStudy([
      {
        topology: 'sepic',
        fswHz: 100e3,
        objectives: { parts: 10, lossW: 1, stress: 1, volumeMm3: 900 },
        efficiencyNom: 0.95,
      },
      {
        topology: 'sepic',
        fswHz: 100e3,
        objectives: { parts: 10, lossW: 1, stress: 1, volumeMm3: 700 },
        efficiencyNom: 0.93,
      },
      {
        topology: 'sepic',
        fswHz: 200e3,
        objectives: { parts: 10, lossW: 1, stress: 1 },
        reasons: [{ code: 'duty-above-max', message: 'too much duty' }],
      },
    ]);
    const s = study.sweeps.sepic!;
    expect(s).toHaveLength(1);
    expect(s[0].efficiency).toBe(0.95);
    expect(s[0].volumeMm3).toBe(700);
  });
});
