/** Differences between candidates in words: exact numbers, and practical ties named as such. */
import { describe, expect, it } from 'vitest';
import { loadSpecFile, loadTechnology } from '../../src/spec/load.ts';
import { describeDelta, objectiveDelta, PRACTICAL_TIE } from '../../src/study/objectives.ts';
import { runStudy } from '../../src/study/run-study.ts';

const o = (parts: number, lossW: number, stress: number, volumeMm3: number) => ({
  parts,
  lossW,
  stress,
  volumeMm3,
});

describe('objective differences in words', () => {
  it('states a real difference with both values and the relative change', () => {
    expect(describeDelta(objectiveDelta('lossW', o(10, 1.04, 5, 500), o(10, 1.35, 5, 500)))).toBe(
      '310 mW less loss (1.04 W vs 1.35 W, -23 %)',
    );
    expect(describeDelta(objectiveDelta('parts', o(13, 1, 5, 500), o(10, 1, 5, 500)))).toBe(
      '3 more parts (13 vs 10)',
    );
  });

  it(`calls differences below ${PRACTICAL_TIE * 100} % "about the same", keeping the numbers`, () => {
    const text = describeDelta(objectiveDelta('stress', o(10, 1, 5.6033, 500), o(10, 1, 5.603, 500)));
    expect(text).toMatch(/^about the same semiconductor stress \(5\.6033 vs 5\.603/);
  });

  it('never calls a part-count difference a tie', () => {
    expect(describeDelta(objectiveDelta('parts', o(201, 1, 5, 500), o(200, 1, 5, 500)))).toBe(
      '1 more part (201 vs 200)',
    );
  });
});

describe('front verdicts', () => {
  it('never trades a practical tie: "in exchange for about the same …" does not occur', () => {
    const loaded = loadSpecFile('data/specs/industrial-24v-negative-12v.yaml');
    if (!loaded.ok) throw new Error('demo spec invalid');
    const study = runStudy(loaded.spec, loadTechnology('default'));
    const front = study.candidates.filter((c) => c.verdict.kind === 'front');
    expect(front.length).toBeGreaterThan(1);
    const texts = front.map((c) => c.verdict.text);
    expect(texts.some((t) => t.includes('about the same'))).toBe(true); // the case arises on this rail
    for (const t of texts) expect(t).not.toMatch(/in exchange for about the same/);
  });
});
