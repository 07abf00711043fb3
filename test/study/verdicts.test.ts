/**
 * Ranking, verdicts and the recommendation on the worked case of synthetic.ts, where every answer follows
 * by hand from the definitions (weak Pareto dominance, common practice; the normalisation and score rules
 * documented in src/study/normalise.ts and src/study/summary.ts).
 */
import { describe, expect, it } from 'vitest';
import { expectClose } from '../support/expect-close.ts';
import { syntheticStudy, WORKED } from './synthetic.ts';

const A = 'sepic@100k/r0.3/sync';
const B = 'sepic-coupled@200k/r0.3/sync';
const F = 'zeta@300k/r0.3/sync';
const C = 'sepic@400k/r0.3/sync';
const D = 'zeta@500k/r0.3/sync';

describe('ranking and verdicts on the worked case', () => {
  const study = syntheticStudy(WORKED);
  const byId = new Map(study.candidates.map((c) => [c.id, c]));

  it('puts exactly the three non-dominated feasible candidates on the front', () => {
    expect(study.front).toEqual([A, B, F]);
    expect(byId.get(C)!.rank).toBe(2);
  });

  it('ranks only feasible candidates: an infeasible one has no rank even with the best numbers', () => {
    const d = byId.get(D)!;
    expect(d.feasible).toBe(false);
    expect(d.rank).toBeNull();
    expect(d.crowding).toBeNull();
  });

  it('says what each front member is best at, with its value', () => {
    const a = byId.get(A)!.verdict;
    const b = byId.get(B)!.verdict;
    expect(a.kind).toBe('front');
    if (a.kind !== 'front' || b.kind !== 'front') return;
    expect(a.bestAt).toEqual(['parts', 'stress']);
    expect(a.text).toContain('fewest parts (10)');
    expect(b.bestAt).toEqual(['lossW', 'stress']);
    expect(b.text).toContain('lowest loss (1.5 W)');
  });

  it('compares a front member with its nearest neighbour first, with both values', () => {
    // Normalised distances from A: to F √(0.5² + 0.8²) ≈ 0.94, to B √(1² + 1²) ≈ 1.41.
    const a = byId.get(A)!.verdict;
    if (a.kind !== 'front') throw new Error('A should be on the front');
    expect(a.trades.map((t) => t.neighbour)).toEqual([F, B]);
    expect(a.trades[0].givesUp.map((d) => d.objective)).toEqual(['lossW']);
    expect(a.trades[0].gains.map((d) => d.objective)).toEqual(['parts']);
    expect(a.text).toContain(
      `against ${F}: 400 mW more loss (2 W vs 1.6 W, +25 %), in exchange for 1 fewer part (10 vs 11)`,
    );
  });

  it('names the nearest dominating front member and the margin on every objective', () => {
    // C − A normalised: (1, 1, 0.1), distance 1.42; C − F: (0.5, 1.8, 0.1), 1.87; C − B: (0, 2, 0.1), 2.00.
    const c = byId.get(C)!.verdict;
    if (c.kind !== 'dominated') throw new Error('C should be dominated');
    expect(c.by).toBe(A);
    expect(c.dominatorCount).toBe(3);
    expect(c.margins.map((m) => m.delta)).toEqual([2, 0.5, 1]);
    expect(c.text).toBe(
      `dominated (rank 2) by ${A} (and by 2 other front members), which has 2 fewer parts (10 vs 12), 500 mW less loss (2 W vs 2.5 W, -20 %), lower semiconductor stress (10 vs 11, -9.1 %)`,
    );
  });

  it('lists every broken limit of an infeasible candidate with its numbers', () => {
    const d = byId.get(D)!.verdict;
    expect(d.kind).toBe('infeasible');
    expect(d.text).toContain('duty 92.1 % above the 88.0 % allowed');
  });

  it('recommends the front member with the lowest weighted normalised score', () => {
    // Equal weights: A (0 + 1 + 0)/3 = 0.333, B (1 + 0 + 0)/3 = 0.333, F (0.5 + 0.2 + 0)/3 = 0.233.
    expect(study.summary.recommended).toBe(F);
    expectClose(study.summary.score!, 0.7 / 3, { rtol: 1e-12, what: 'score of F' });
    const vsSepic = study.summary.comparisons.find((c) => c.topology === 'sepic')!;
    expect(vsSepic.id).toBe(A);
    expect(vsSepic.text).toContain('400 mW less loss (1.6 W vs 2 W, -20 %)');
    expect(vsSepic.text).toContain('at the cost of 1 more part (11 vs 10)');
    expect(study.summary.comparisons.map((c) => c.id)).toEqual([A, B]);
  });

  it('follows the weights: loss only picks the lowest loss, parts only the fewest parts', () => {
    expect(syntheticStudy(WORKED, { weights: [0, 1, 0] }).summary.recommended).toBe(B);
    expect(syntheticStudy(WORKED, { weights: [1, 0, 0] }).summary.recommended).toBe(A);
  });

  it('re-ranks on the chosen objectives: on loss alone only the lowest-loss candidate is on the front', () => {
    const lossOnly = syntheticStudy(WORKED, { objectives: ['lossW'] });
    expect(lossOnly.front).toEqual([B]);
    expect(lossOnly.candidates.find((c) => c.id === F)!.rank).toBe(2);
  });

  it('reports candidates tied on every objective as equal, and keeps both on the front', () => {
    const tied = syntheticStudy([
      ...WORKED.slice(0, 3),
      { topology: 'sepic-damped', fswHz: 600e3, objectives: { parts: 10, lossW: 2.0, stress: 10 } },
    ]);
    expect(tied.front).toContain('sepic-damped@600k/r0.3/sync');
    expect(tied.candidates[0].verdict.text).toContain(
      'equal on every chosen objective to sepic-damped@600k/r0.3/sync',
    );
  });

  it('collapses near-identical candidates of a topology onto one representative with ε-grouping', () => {
    const near = syntheticStudy(
      [
        ...WORKED.slice(0, 3),
        { topology: 'sepic', fswHz: 110e3, objectives: { parts: 10, lossW: 2.01, stress: 10 } },
      ],
      { epsilon: 0.01 },
    );
    const copy = near.candidates.find((c) => c.id === 'sepic@110k/r0.3/sync')!;
    expect(copy.representative).toBe(A);
    expect(near.candidates.find((c) => c.id === F)!.representative).toBe(F);
  });
});

describe('a study with nothing feasible', () => {
  it('is a valid result that says why for each topology', () => {
    const study = syntheticStudy([WORKED[4]]);
    expect(study.front).toEqual([]);
    expect(study.summary.recommended).toBeNull();
    expect(study.summary.infeasibleTopologies).toHaveLength(1);
    expect(study.summary.text).toContain('zeta: none of 1 candidates is feasible: duty-above-max in 1');
  });
});
