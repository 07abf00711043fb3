import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import {
  crowdingDistance,
  dominates,
  epsilonGroups,
  ParetoInputError,
  sortNonDominated,
  sortNonDominatedBrute,
} from '../../src/study/pareto.ts';
import { lexicographicOrder, objectiveOrders } from '../../src/study/pareto-order.ts';
import {
  comparatorArgsort,
  radixArgsort,
  SMALL_N,
  sortByIntKey,
  sortObjective,
} from '../../src/study/pareto-radix.ts';
import { type RankMethod, rankPoints } from '../../src/study/pareto-rank.ts';
import { rankSorted3, rankSorted3Flat } from '../../src/study/pareto-staircase.ts';

/** Crowding sums the same terms in the same order in both sorters; allow rounding only (named tolerance). */
const CROWDING_RTOL = 1e-12;

function expectSameAsBrute(points: number[][]): void {
  const fast = sortNonDominated(points);
  const slow = sortNonDominatedBrute(points);
  expect(Array.from(fast.rank)).toEqual(Array.from(slow.rank));
  expect(fast.fronts).toEqual(slow.fronts);
  for (let i = 0; i < points.length; i++) {
    const a = fast.crowding[i];
    const b = slow.crowding[i];
    if (b === Number.POSITIVE_INFINITY) expect(a).toBe(b);
    else expect(Math.abs(a - b)).toBeLessThanOrEqual(CROWDING_RTOL * Math.max(1, Math.abs(b)));
  }
}

/** Deterministic uniform [0, 1) generator (mulberry32, common practice) for large generated sets. */
function mulberry32(seed: number): () => number {
  let s = seed >>> 0;
  return () => {
    s = (s + 0x6d2b79f5) | 0;
    let t = Math.imul(s ^ (s >>> 15), 1 | s);
    t = (t + Math.imul(t ^ (t >>> 7), 61 | t)) ^ t;
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

function rankWith(points: number[][], method: RankMethod): number[] {
  const m = points[0].length;
  return Array.from(rankPoints(Float64Array.from(points.flat()), points.length, m, method));
}

/** n points of m small integer objectives: few distinct values force ties and duplicates. */
const smallIntPoints = (m: number, levels: number, maxN = 200) =>
  fc.array(fc.array(fc.integer({ min: 0, max: levels - 1 }), { minLength: m, maxLength: m }), {
    minLength: 1,
    maxLength: maxN,
  });

describe('sortNonDominated agrees with the O(n² m) reference', () => {
  for (const m of [1, 2, 3, 4]) {
    it(`ranks, fronts and crowding match on random small-integer sets with ${m} objective(s)`, () => {
      fc.assert(
        fc.property(smallIntPoints(m, 5), (pts) => expectSameAsBrute(pts)),
        { numRuns: 500 },
      );
    });
  }

  it('matches on sets with many distinct values (doubles, including -0)', () => {
    const doubles = fc.double({ min: -1e6, max: 1e6, noNaN: true, noDefaultInfinity: true });
    for (const m of [2, 3, 4]) {
      fc.assert(
        fc.property(
          fc.array(fc.array(doubles, { minLength: m, maxLength: m }), { minLength: 1, maxLength: 150 }),
          (pts) => expectSameAsBrute(pts),
        ),
        { numRuns: 200 },
      );
    }
  });

  it('gives the same ranks from the divide-and-conquer kernel on three objectives', () => {
    fc.assert(
      fc.property(smallIntPoints(3, 6), (pts) => {
        expect(rankWith(pts, 'divide')).toEqual(Array.from(sortNonDominatedBrute(pts).rank));
      }),
      { numRuns: 400 },
    );
  });

  it('gives the same ranks from the treap staircase kernel on three objectives', () => {
    fc.assert(
      fc.property(smallIntPoints(3, 6), (pts) => {
        expect(rankWith(pts, 'treap')).toEqual(Array.from(sortNonDominatedBrute(pts).rank));
      }),
      { numRuns: 400 },
    );
  });

  it('matches on sets of up to 700 points, where the divide-and-conquer recursion goes deeper', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 2, max: 4 }).chain((m) => smallIntPoints(m, 12, 700)),
        fc.constantFrom<RankMethod>('auto', 'divide'),
        (pts, method) => {
          expectSameAsBrute(pts);
          if (pts[0].length >= 3)
            expect(rankWith(pts, method)).toEqual(Array.from(sortNonDominated(pts).rank));
        },
      ),
      { numRuns: 40 },
    );
  });

  it(`matches on sets larger than ${SMALL_N} points, where the radix sorts take over`, () => {
    // levels 0 = continuous values (every objective distinct: no tie pass), 3 and 60 = heavy ties and
    // duplicates (counting-sort passes, duplicate merge); the reference is O(n²), so a few runs only
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2 ** 31 - 1 }),
        fc.integer({ min: 2, max: 4 }),
        fc.constantFrom(0, 3, 60),
        (seed, m, levels) => {
          const rnd = mulberry32(seed);
          const pts = Array.from({ length: SMALL_N + 300 }, () =>
            Array.from({ length: m }, () => (levels === 0 ? rnd() - 0.5 : Math.floor(rnd() * levels))),
          );
          expectSameAsBrute(pts);
        },
      ),
      { numRuns: 5 },
    );
  });
});

describe('radix argsort', () => {
  it('orders like the comparator sort, ties by index, -0 equal to +0', () => {
    const value = fc.oneof(
      fc.double({ noNaN: true, noDefaultInfinity: true }),
      fc.constantFrom(0, -0, 1, -1, 5e-324, -5e-324, Number.MAX_VALUE, -Number.MAX_VALUE),
      fc.integer({ min: -3, max: 3 }),
    );
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 3 }),
        fc.array(value, { minLength: 1, maxLength: 900 }),
        (m, flat) => {
          const n = Math.floor(flat.length / m);
          const cols = Array.from({ length: m }, (_, k) =>
            Float64Array.from({ length: n }, (_, i) => flat[i * m + k]),
          );
          expect(Array.from(radixArgsort(cols, n))).toEqual(Array.from(comparatorArgsort(cols, n)));
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('per-objective orders (shared by ranking and crowding)', () => {
  /** n × m values from a generator; `level` 0 = continuous, else integers below it (ties). */
  function flatPoints(seed: number, n: number, levels: number[]): Float64Array {
    const rnd = mulberry32(seed);
    const m = levels.length;
    const out = new Float64Array(n * m);
    for (let i = 0; i < n; i++) {
      for (let k = 0; k < m; k++)
        out[i * m + k] = levels[k] === 0 ? rnd() - 0.5 : Math.floor(rnd() * levels[k]);
    }
    return out;
  }

  it('sorts each objective like the comparator sort, with dense ranks, radix path included', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 2 ** 31 - 1 }),
        fc.constantFrom(100, SMALL_N + 50),
        fc.constantFrom(0, 2, 50),
        (seed, n, levels) => {
          const values = flatPoints(seed, n, [levels, 0]);
          for (let i = 0; i < n; i += 7) if (values[2 * i] === 0) values[2 * i] = -0; // -0 ties +0
          const col = Float64Array.from({ length: n }, (_, i) => values[2 * i]);
          const sorted = sortObjective(values, n, 2, 0);
          const expected = comparatorArgsort([col], n);
          expect(Array.from(sorted.order)).toEqual(Array.from(expected));
          // dense rank = number of distinct values below, by direct count on the comparator's order
          let d = 0;
          for (let i = 0; i < n; i++) {
            if (i > 0 && col[expected[i]] !== col[expected[i - 1]]) d++;
            expect(sorted.dense[expected[i]]).toBe(d);
          }
          expect(sorted.distinct).toBe(d + 1);
        },
      ),
      { numRuns: 30 },
    );
  });

  it('gives the lexicographic order by each of its three routes (all distinct, few ties, many ties)', () => {
    const n = SMALL_N + 100;
    const cases: number[][] = [
      [3, 0, 2], // objective 1 all distinct: LSD starts there
      [0, 3, 2], // objective 0 continuous: its order as is, the rare exact ties sorted by run
      [5, 4, 3], // many ties everywhere: counting-sort passes
    ];
    for (const levels of cases) {
      for (const seed of [1, 2, 3]) {
        const values = flatPoints(seed, n, levels);
        // plant ties in objective 0 for the few-ties route (1 in 100 positions, under 1/64)
        if (levels[0] === 0) for (let i = 1; i < n; i += 100) values[i * 3] = values[(i - 1) * 3];
        const cols = [0, 1, 2].map((k) => Float64Array.from({ length: n }, (_, i) => values[i * 3 + k]));
        const lex = lexicographicOrder(objectiveOrders(values, n, 3), n);
        expect(Array.from(lex)).toEqual(Array.from(comparatorArgsort(cols, n)));
      }
    }
  });

  it('sorts by an integer key stably with more than 65 536 buckets (radix passes)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 69_999 }), { minLength: 1, maxLength: 3000 }),
        (keys) => {
          const n = keys.length;
          const key = Int32Array.from(keys);
          const start = Int32Array.from({ length: n }, (_, i) => n - 1 - i); // a non-identity input order
          const got = sortByIntKey(start, key, 70_000, n);
          const expected = Array.from(start).sort((a, b) => key[a] - key[b] || b - a); // stable: input order
          expect(Array.from(got)).toEqual(expected);
        },
      ),
      { numRuns: 100 },
    );
  });
});

describe('ranks', () => {
  it('keeps points tied on every objective on one rank', () => {
    const r = sortNonDominated([
      [1, 2, 3],
      [1, 2, 3],
      [1, 2, 3],
      [2, 3, 4],
    ]);
    expect(Array.from(r.rank)).toEqual([1, 1, 1, 2]);
  });

  it('lets a point tied on some objectives and better on one dominate (weak dominance)', () => {
    const r = sortNonDominated([
      [1, 3, 5],
      [1, 2, 5],
      [0, 2, 5],
    ]);
    expect(Array.from(r.rank)).toEqual([3, 2, 1]);
  });

  it('treats -0 and +0 as the same value', () => {
    expect(
      Array.from(
        sortNonDominated([
          [-0, 1],
          [0, 1],
        ]).rank,
      ),
    ).toEqual([1, 1]);
  });

  it('handles the degenerate sets: none, one point, all equal, a chain, an antichain', () => {
    expect(sortNonDominated([]).fronts).toEqual([]);
    expect(Array.from(sortNonDominated([[3, 1, 4, 1]]).rank)).toEqual([1]);
    expect(Array.from(sortNonDominated(Array.from({ length: 5 }, () => [2, 2])).rank)).toEqual([
      1, 1, 1, 1, 1,
    ]);
    const chain = Array.from({ length: 50 }, (_, i) => [49 - i, 49 - i, 49 - i]);
    expect(Array.from(sortNonDominated(chain).rank)).toEqual(chain.map((_, i) => 50 - i));
    const antichain = Array.from({ length: 50 }, (_, i) => [i, 49 - i, (i * 7) % 50]);
    expect(sortNonDominated(antichain).fronts).toEqual([antichain.map((_, i) => i)]);
  });

  it('accepts a flat Float64Array with m given and ranks it like the vectors', () => {
    const pts = [
      [3, 1],
      [1, 3],
      [2, 2],
      [3, 3],
    ];
    expect(Array.from(sortNonDominated(Float64Array.from(pts.flat()), 2).rank)).toEqual([1, 1, 1, 2]);
    expect(() => sortNonDominated(new Float64Array(5), 2)).toThrow(RangeError);
    expect(() => sortNonDominated(new Float64Array(4))).toThrow(RangeError);
    expect(() => sortNonDominated([[1, 2], [3]])).toThrow(RangeError);
  });

  it('switches from flat staircases to the treap when an adversarial order shifts too much', () => {
    // an antichain inserted at the front of its staircase each time: every insertion shifts all entries
    // (kernel columns are dense ranks: objective 2 descends, objectives 1 and 3 ascend along the sweep)
    const u = 400;
    const cols = [0, 1, 2].map((k) => Int32Array.from({ length: u }, (_, j) => (k === 1 ? u - 1 - j : j)));
    expect(rankSorted3Flat(cols, u, 1000)).toBeUndefined();
    expect(Array.from(rankSorted3(cols, u, 1000))).toEqual(new Array(u).fill(0));
  });
});

describe('input checks', () => {
  it('rejects NaN and infinite objectives with the point and objective named', () => {
    for (const bad of [Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY]) {
      const pts = [
        [1, 2, 3],
        [4, 5, bad],
      ];
      try {
        sortNonDominated(pts);
        expect.unreachable('should have thrown');
      } catch (e) {
        expect(e).toBeInstanceOf(ParetoInputError);
        expect((e as ParetoInputError).index).toBe(1);
        expect((e as ParetoInputError).objective).toBe(2);
      }
      expect(() => sortNonDominated(Float64Array.from(pts.flat()), 3)).toThrow(ParetoInputError);
      expect(() => dominates([1, 1], [bad, 1])).toThrow(ParetoInputError);
    }
  });
});

describe('dominates', () => {
  it('needs no worse on every objective and better on one', () => {
    expect(dominates([1, 2], [1, 3])).toBe(true);
    expect(dominates([1, 3], [1, 2])).toBe(false);
    expect(dominates([1, 2], [1, 2])).toBe(false);
    expect(dominates([0, 3], [1, 2])).toBe(false);
    expect(dominates([0], [1])).toBe(true);
    expect(() => dominates([1, 2], [1])).toThrow(RangeError);
  });
});

describe('crowding distance', () => {
  // Definition: Deb, Pratap, Agarwal & Meyarivan, "A fast and elitist multiobjective genetic algorithm:
  // NSGA-II", IEEE Trans. Evolutionary Computation, 2002, section III-B. Values below worked by hand.
  it('follows the NSGA-II definition on a hand-worked front', () => {
    // front A(0,6) B(1,3) C(3,2) D(4,0); ranges 4 and 6; E(5,7) dominated, alone in rank 2
    const r = sortNonDominated([
      [0, 6],
      [1, 3],
      [3, 2],
      [4, 0],
      [5, 7],
    ]);
    expect(Array.from(r.rank)).toEqual([1, 1, 1, 1, 2]);
    expect(r.crowding[0]).toBe(Number.POSITIVE_INFINITY); // A: boundary
    expect(r.crowding[3]).toBe(Number.POSITIVE_INFINITY); // D: boundary
    // B: (3 − 0)/4 on objective 1 + (6 − 2)/6 on objective 2 = 0.75 + 0.6667
    expect(r.crowding[1]).toBeCloseTo(0.75 + 4 / 6, 12);
    // C: (4 − 1)/4 + (3 − 0)/6 = 0.75 + 0.5
    expect(r.crowding[2]).toBeCloseTo(1.25, 12);
    expect(r.crowding[4]).toBe(Number.POSITIVE_INFINITY); // a rank of one point is all boundary
  });

  it('lets an objective with zero range in the rank add nothing, boundaries included', () => {
    const c = crowdingDistance([
      [7, 0, 4],
      [7, 1, 2],
      [7, 3, 0],
    ]);
    // objective 1 has range 0; the middle point gets (3 − 0)/3 + (4 − 0)/4 = 2
    expect(Array.from(c)).toEqual([Number.POSITIVE_INFINITY, 2, Number.POSITIVE_INFINITY]);
    expect(
      Array.from(
        crowdingDistance([
          [1, 1],
          [1, 1],
          [1, 1],
        ]),
      ),
    ).toEqual([0, 0, 0]);
  });

  it('computes within each group of equal rank labels', () => {
    const pts = [
      [0, 2],
      [1, 1],
      [2, 0],
      [5, 5],
      [6, 4],
      [7, 3],
    ];
    const c = crowdingDistance(pts, [1, 1, 1, 2, 2, 2]);
    expect(Array.from(c)).toEqual([Infinity, 2, Infinity, Infinity, 2, Infinity]);
    expect(Array.from(crowdingDistance(Float64Array.from(pts.flat()), [1, 1, 1, 2, 2, 2], 2))).toEqual(
      Array.from(c),
    );
  });
});

describe('epsilonGroups', () => {
  const pts = [
    [10, 1.0, 3],
    [10, 1.004, 3.01], // within 1 % of point 0
    [10, 1.0, 3], // identical to 0 but another key
    [10, 1.2, 3], // 20 % off on objective 1
    [10, 1.0099, 3], // within 1 % of point 1 and of point 0
  ];
  const keys = ['sepic|diode|0.3', 'sepic|diode|0.3', 'cuk|diode|0.3', 'sepic|diode|0.3', 'sepic|diode|0.3'];

  it('collapses same-key points within the relative tolerance onto the first of their group', () => {
    expect(epsilonGroups(pts, keys, 0.01)).toEqual([0, 0, 2, 3, 0]);
  });

  it('keeps every point its own representative at eps = 0 unless identical', () => {
    expect(epsilonGroups(pts, keys, 0)).toEqual([0, 1, 2, 3, 4]);
    expect(
      epsilonGroups(
        [
          [1, 2],
          [1, 2],
        ],
        ['a', 'a'],
        0,
      ),
    ).toEqual([0, 0]);
  });

  it('compares with the representative, so groups do not chain', () => {
    // 1.00 → 1.009 (0.9 %) joins; 1.018 is 1.8 % from the representative 1.00: a new group
    expect(epsilonGroups([[1.0], [1.009], [1.018]], ['k', 'k', 'k'], 0.01)).toEqual([0, 0, 2]);
  });

  it('matches a zero objective only with zero', () => {
    expect(epsilonGroups([[0], [1e-300], [0]], ['k', 'k', 'k'], 0.5)).toEqual([0, 1, 0]);
  });

  it('rejects a bad tolerance or a key count that does not match', () => {
    expect(() => epsilonGroups(pts, keys, -0.1)).toThrow(RangeError);
    expect(() => epsilonGroups(pts, keys, Number.NaN)).toThrow(RangeError);
    expect(() => epsilonGroups(pts, keys.slice(1), 0.01)).toThrow(RangeError);
  });
});
