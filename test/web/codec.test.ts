/**
 * The pure parts of the web layer: the spec in a URL round-trips exactly as typed, the view state
 * survives a URL, the table sorts stably, and plot axes get 1-2-5 ticks.
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import type { StudyCandidate } from '../../src/study/types.ts';
import { sortCandidates } from '../../src/web/candidate-sort.ts';
import { decodeSpec, demoFormValues, encodeSpec, formValuesFromQuery } from '../../src/web/spec-codec.ts';
import { FIELD_PATHS } from '../../src/web/spec-fields.ts';
import { viewFromQuery, viewParams } from '../../src/web/view-state.ts';
import { makeAxis } from '../../views/plots/axes.tsx';

describe('spec in the URL', () => {
  it('round-trips any typed form text, trimmed, blanks dropped', () => {
    const text = fc.string({ maxLength: 30 });
    fc.assert(
      fc.property(fc.dictionary(fc.constantFrom(...FIELD_PATHS), text), (values) => {
        const expected = Object.fromEntries(
          Object.entries(values)
            .map(([k, v]) => [k, v.trim()])
            .filter(([, v]) => v !== ''),
        );
        expect(decodeSpec(encodeSpec(values))).toEqual(expected);
      }),
    );
  });

  it('keeps the demo spec short enough for a link', () => {
    expect(encodeSpec(demoFormValues('marine-lifepo4-12v')).length).toBeLessThan(300);
  });

  it('reads plain query fields, a demo name, or the default demo', () => {
    expect(formValuesFromQuery({ 'input.min': ' 9 V ', junk: 'x' })).toEqual({ 'input.min': '9 V' });
    expect(formValuesFromQuery({ demo: 'usb-pd-bench-tool-12v' }).name).toContain('USB-PD');
    expect(formValuesFromQuery({})).toEqual(demoFormValues('marine-lifepo4-12v'));
  });
});

describe('view state', () => {
  it('survives a URL round trip, defaults left out', () => {
    const spec = { 'input.min': '10 V' };
    const view = viewFromQuery(spec, {
      x: 'parts',
      y: 'efficiency',
      sort: 'lossW',
      dir: 'desc',
      topo: 'zeta',
      verdict: 'front',
      fp: '7',
      rp: '0.2,0.4',
      obj: 'lossW,volumeMm3',
      'w.lossW': '2',
    });
    const again = viewFromQuery(spec, Object.fromEntries(viewParams(view)));
    expect(again).toEqual(view);
    expect(viewParams(viewFromQuery(spec, {})).toString()).toMatch(/^s=[\w-]+$/);
  });

  it('falls back to defaults for unknown axis, sort and verdict names', () => {
    const v = viewFromQuery({}, { x: 'evil', sort: 'nope', verdict: 'maybe' });
    expect([v.x, v.sort, v.verdict]).toEqual(['lossW', 'verdict', 'all']);
  });
});

describe('candidate table order', () => {
  const make = (id: string, lossW: number, rank: number | null): StudyCandidate =>
    ({
      id,
      topology: 'sepic',
      fswHz: 1e5,
      ripple: 0.3,
      rect: 'diode',
      feasible: rank !== null,
      objectives: { parts: 10, lossW, stress: 1, volumeMm3: 1 },
      efficiencyNom: 0.9,
      rank,
      crowding: 0,
      representative: null,
      verdict: { kind: rank === null ? 'infeasible' : rank === 1 ? 'front' : 'dominated' },
      reasons: [],
      cautions: [],
    }) as unknown as StudyCandidate;

  it('matches an obvious sort (by value, ties in study order) and keeps infeasible rows after feasible ones', () => {
    fc.assert(
      fc.property(
        fc.array(fc.record({ loss: fc.integer({ min: 0, max: 5 }), feasible: fc.boolean() }), {
          maxLength: 30,
        }),
        fc.constantFrom('asc', 'desc'),
        (rows, dir) => {
          const cands = rows.map((r, i) => make(`c${i}`, r.loss, r.feasible ? 1 : null));
          const got = sortCandidates(cands, 'lossW', dir as 'asc' | 'desc', {
            topology: 'all',
            verdict: 'all',
          }).map((c) => c.id);
          // Feasible rows first, then infeasible; each group by value in the chosen direction, ties in study order.
          const slow: StudyCandidate[] = [];
          for (const group of [cands.filter((c) => c.feasible), cands.filter((c) => !c.feasible)]) {
            const values = [...new Set(group.map((c) => c.objectives.lossW))].sort((a, b) =>
              dir === 'asc' ? a - b : b - a,
            );
            for (const v of values) slow.push(...group.filter((c) => c.objectives.lossW === v));
          }
          expect(got).toEqual(slow.map((c) => c.id));
        },
      ),
    );
  });

  it('filters by verdict', () => {
    const got = sortCandidates([make('a', 1, 1), make('b', 1, 2), make('c', 1, null)], 'id', 'asc', {
      topology: 'all',
      verdict: 'dominated',
    });
    expect(got.map((c) => c.id)).toEqual(['b']);
  });
});

describe('plot axes', () => {
  it('puts 1-2-5 ticks on a log frequency axis from 100 kHz to 1 MHz (common practice for log scales)', () => {
    const axis = makeAxis([100e3, 1e6], [0, 300], { log: true, unit: 'Hz', title: 'f', count: 4 });
    expect(axis.ticks).toEqual([100e3, 200e3, 500e3, 1e6]);
    expect(axis.ticks.map(axis.label)).toEqual(['100 kHz', '200 kHz', '500 kHz', '1 MHz']);
  });

  it('puts round linear ticks with SI prefixes on a loss axis', () => {
    const axis = makeAxis([0.3, 2.1], [0, 500], { unit: 'W', title: 'loss', count: 6 });
    expect(axis.ticks.map(axis.label)).toEqual([
      '400 mW',
      '600 mW',
      '800 mW',
      '1 W',
      '1.2 W',
      '1.4 W',
      '1.6 W',
      '1.8 W',
      '2 W',
    ]);
  });
});
