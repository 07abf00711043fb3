/**
 * Candidate enumeration. The registry grows as topologies are added, so every count here is derived from
 * the registry itself rather than hard-coded.
 */
import { describe, expect, it } from 'vitest';
import { candidateId, frequencyLabels, logGrid, planStudy } from '../../src/study/enumerate.ts';
import { studyOptionsOrThrow } from '../../src/study/options.ts';
import { TOPOLOGIES } from '../../src/topologies/registry.ts';
import { expectClose } from '../support/expect-close.ts';
import { railSpec } from '../support/specs.ts';

describe('logGrid', () => {
  it('starts and ends exactly on the band edges', () => {
    const g = logGrid(100e3, 1e6, 32);
    expect(g).toHaveLength(32);
    expect(g[0]).toBe(100e3);
    expect(g[31]).toBe(1e6);
  });

  it('has a constant ratio between neighbours, (max/min)^(1/(n−1)) (definition of a log grid)', () => {
    const g = logGrid(200e3, 2.2e6, 17);
    const step = (2.2e6 / 200e3) ** (1 / 16);
    for (let i = 1; i < g.length; i++)
      expectClose(g[i] / g[i - 1], step, { rtol: 1e-12, what: `ratio ${i}` });
  });

  it('rejects fewer than two points and an empty or inverted band', () => {
    expect(() => logGrid(100e3, 1e6, 1)).toThrow(RangeError);
    expect(() => logGrid(1e6, 100e3, 4)).toThrow(RangeError);
    expect(() => logGrid(1e6, 1e6, 4)).toThrow(RangeError);
  });
});

describe('candidate ids', () => {
  it('are readable: topology@frequency/ripple/rectifier', () => {
    expect(candidateId('sepic-coupled', '400k', 0.3, 'sync')).toBe('sepic-coupled@400k/r0.3/sync');
  });

  it('use three significant digits and more only where the grid needs them to stay distinct', () => {
    expect(frequencyLabels(logGrid(100e3, 1e6, 4))).toEqual(['100k', '215k', '464k', '1M']);
    const fine = frequencyLabels(logGrid(100e3, 101e3, 50));
    expect(new Set(fine).size).toBe(50);
  });
});

describe('planStudy', () => {
  const spec = railSpec({ output: { voltageV: 12, polarity: 'either' } });
  const options = studyOptionsOrThrow(spec, { frequencyPoints: 5, ripples: [0.2, 0.4] });
  const plan = planStudy(spec, options);

  it('crosses every topology with every frequency, ripple ratio and offered rectifier', () => {
    const expected = [...TOPOLOGIES.values()].reduce((n, t) => n + 5 * 2 * t.rectifiers.length, 0);
    expect(plan.candidates).toHaveLength(expected);
    expect(plan.excluded).toEqual([]);
    for (const t of TOPOLOGIES.values()) {
      const mine = plan.candidates.filter((c) => c.topology === t.id);
      expect(new Set(mine.map((c) => c.rect))).toEqual(new Set(t.rectifiers));
      expect(new Set(mine.map((c) => c.fswHz)).size).toBe(5);
    }
  });

  it('gives every candidate a unique id', () => {
    expect(new Set(plan.candidates.map((c) => c.id)).size).toBe(plan.candidates.length);
  });

  it.each(['positive', 'negative'] as const)(
    'excludes topologies of the wrong sign for a %s-only rail, with the reason',
    (polarity) => {
      const only = railSpec({ output: { voltageV: 12, polarity } });
      const p = planStudy(only, studyOptionsOrThrow(only, { frequencyPoints: 2, ripples: [0.3] }));
      for (const t of TOPOLOGIES.values()) {
        const fits = polarity === 'positive' ? t.outputSign > 0 : t.outputSign < 0;
        const excluded = p.excluded.find((e) => e.topology === t.id);
        if (fits) {
          expect(excluded).toBeUndefined();
          expect(p.candidates.some((c) => c.topology === t.id)).toBe(true);
        } else {
          expect(excluded?.reason).toContain(`polarity is ${polarity} only`);
          expect(p.candidates.some((c) => c.topology === t.id)).toBe(false);
        }
      }
    },
  );
});
