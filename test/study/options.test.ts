/** Study options: defaults and every bad-input message naming its option. */
import { describe, expect, it } from 'vitest';
import { countCandidates } from '../../src/study/enumerate.ts';
import { DEFAULT_OBJECTIVES, resolveStudyOptions } from '../../src/study/options.ts';
import { railSpec } from '../support/specs.ts';

const spec = railSpec();

function issues(input: Parameters<typeof resolveStudyOptions>[1]) {
  const r = resolveStudyOptions(spec, input);
  return r.ok ? [] : r.issues;
}

describe('study options', () => {
  it('defaults to parts, loss and stress, 32 frequencies over the spec band, four ripple ratios, equal weights', () => {
    const r = resolveStudyOptions(spec);
    expect(r.ok).toBe(true);
    if (!r.ok) return;
    expect(r.options.objectives).toEqual([...DEFAULT_OBJECTIVES]);
    expect(r.options.frequencyPoints).toBe(32);
    expect(r.options.band).toEqual({ minHz: 100e3, maxHz: 1e6 });
    expect(r.options.ripples).toEqual([0.2, 0.3, 0.4, 0.6]);
    expect(r.options.weights).toEqual([1, 1, 1]);
  });

  it('names the option of each problem and collects them all', () => {
    const found = issues({
      objectives: ['parts', 'cost'],
      frequencyPoints: 1,
      ripples: [0],
      band: { minHz: 1e6, maxHz: 1e5 },
    });
    expect(found.map((i) => i.option)).toEqual(['objectives', 'frequencyPoints', 'band', 'ripples']);
    expect(found[0].message).toContain('unknown objective "cost"');
  });

  it('rejects an empty band and weights that do not match the objectives', () => {
    expect(issues({ band: { minHz: 2e5, maxHz: 2e5 } })[0].message).toContain('empty');
    expect(issues({ weights: [1, 1] })[0].option).toBe('weights');
    expect(issues({ weights: [0, 0, 0] })[0].option).toBe('weights');
  });

  it('caps the sweep size, naming the count and the cap', () => {
    const count = countCandidates(spec, { frequencyPoints: 32, ripples: [0.2, 0.3, 0.4, 0.6] });
    const found = issues({ maxCandidates: count - 1 });
    expect(found[0].option).toBe('maxCandidates');
    expect(found[0].message).toContain(`${count} candidates, above the cap of ${count - 1}`);
    expect(issues({ maxCandidates: count })).toEqual([]);
  });
});
