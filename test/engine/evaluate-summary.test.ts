/**
 * The study's summary path (evaluateCandidateSummary: no corner records, one reused design per topology
 * and rectifier) against the full evaluation it abbreviates: every field identical, whatever order the
 * candidates come in. And a reset part is a blank part.
 */
import { describe, expect, it } from 'vitest';
import { blankPart, resetPart } from '../../src/engine/design.ts';
import { evaluateCandidate, evaluateCandidateSummary } from '../../src/engine/evaluate.ts';
import type { CandidateParams } from '../../src/engine/types.ts';
import { loadTechnology } from '../../src/spec/load.ts';
import { TOPOLOGIES } from '../../src/topologies/registry.ts';
import { railSpec } from '../support/specs.ts';

const tech = loadTechnology('default');
const ideal = loadTechnology('ideal');

function candidates(): CandidateParams[] {
  const out: CandidateParams[] = [];
  for (const t of TOPOLOGIES.values())
    for (const rect of t.rectifiers)
      for (const fswHz of [150e3, 900e3])
        for (const ripple of [0.2, 0.6]) out.push({ topology: t.id, fswHz, ripple, rect });
  return out;
}

describe('candidate summary', () => {
  it('equals the full evaluation without corners and part list, for every topology', () => {
    // interleave two specs and two technologies so every reused design is overwritten by a different one
    const specs = [railSpec(), railSpec({ vin: [6, 9, 30], vout: 5, iout: 3, imin: 0.05 })];
    const list = candidates();
    list.forEach((params, i) => {
      const spec = specs[i % 2];
      const t = i % 3 === 0 ? ideal : tech;
      const { corners: _c, parts: _p, ...full } = evaluateCandidate(spec, params, t, {}, { partList: false });
      expect(evaluateCandidateSummary(spec, params, t)).toStrictEqual(full);
    });
  });

  it('leaves no pin behind on the reused design', () => {
    const spec = railSpec();
    const params: CandidateParams = { topology: 'sepic', fswHz: 300e3, ripple: 0.3, rect: 'diode' };
    const pinned = evaluateCandidateSummary(spec, params, tech, { L1: 47e-6, 'Cout.esr': 0.02 });
    const { corners: _c, parts: _p, ...plain } = evaluateCandidate(spec, params, tech);
    expect(evaluateCandidateSummary(spec, params, tech)).toStrictEqual(plain);
    expect(pinned.objectives).not.toEqual(plain.objectives);
  });
});

describe('resetPart', () => {
  it('returns a sized, pinned part to exactly its blank state', () => {
    const info = { name: 'Q1', role: 'switch' as const, duty: 'main switch' };
    const p = blankPart(info);
    for (const key of Object.keys(p) as (keyof typeof p)[])
      if (typeof p[key] === 'number' && key !== 'roleCode')
        (p as unknown as Record<string, number>)[key] = 3.5;
    p.pinned = new Set(['ronOhm']);
    resetPart(p);
    expect(p).toStrictEqual(blankPart(info));
  });
});
