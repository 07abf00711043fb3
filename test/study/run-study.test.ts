/**
 * The study end to end with the engine: worker threads give the same answer as one thread, the front is
 * consistent with a brute-force dominance scan, and the demo specs run.
 */
import { readdirSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { loadSpecFile, loadTechnology } from '../../src/spec/load.ts';
import type { RailSpec } from '../../src/spec/rail-spec.ts';
import { dominatesOn } from '../../src/study/normalise.ts';
import { runStudyParallel } from '../../src/study/parallel.ts';
import { runStudy } from '../../src/study/run-study.ts';

const SPEC_DIR = new URL('../../data/specs/', import.meta.url);

function demo(name: string): RailSpec {
  const r = loadSpecFile(fileURLToPath(new URL(name, SPEC_DIR)));
  if (!r.ok) throw new Error(r.issues.map((i) => i.message).join('\n'));
  return r.spec;
}

const marine = demo('marine-lifepo4-12v.yaml');
const tech = loadTechnology(marine.technology);

describe('runStudy on the marine demo spec (default options)', () => {
  const study = runStudy(marine, tech);

  it('yields a non-empty front and a recommendation from it', () => {
    expect(study.front.length).toBeGreaterThan(0);
    expect(study.front).toContain(study.summary.recommended);
  });

  it('puts on the front exactly the feasible candidates no feasible candidate dominates (O(n²) scan)', () => {
    const keys = study.options.objectives;
    const feasible = study.candidates.filter((c) => c.feasible);
    const slow = feasible
      .filter((c) => !feasible.some((o) => dominatesOn(o.objectives, c.objectives, keys)))
      .map((c) => c.id);
    expect(study.front).toEqual(slow);
  });

  it('gives every candidate a verdict of the right kind, dominated ones naming a front member', () => {
    const front = new Set(study.front);
    for (const c of study.candidates) {
      const kind = !c.feasible ? 'infeasible' : front.has(c.id) ? 'front' : 'dominated';
      expect(c.verdict.kind).toBe(kind);
      if (c.verdict.kind === 'dominated') expect(front.has(c.verdict.by)).toBe(true);
    }
  });

  it('reports per-topology sweeps with the knee between the two extremes', () => {
    for (const [topology, h] of Object.entries(study.highlights)) {
      const lo = Math.min(h.bestEfficiency.fswHz, h.smallestVolume.fswHz);
      const hi = Math.max(h.bestEfficiency.fswHz, h.smallestVolume.fswHz);
      expect(h.knee.fswHz, topology).toBeGreaterThanOrEqual(lo);
      expect(h.knee.fswHz, topology).toBeLessThanOrEqual(hi);
    }
  });

  it('carries the engine cautions onto the candidates', () => {
    expect(study.candidates.some((c) => c.cautions.some((k) => k.code === 'resonant-overshoot'))).toBe(true);
  });
});

describe('worker threads', () => {
  it('give a study identical to the single-thread path', async () => {
    const input = { frequencyPoints: 4, ripples: [0.3, 0.6] };
    const serial = runStudy(marine, tech, input);
    let last = 0;
    const parallel = await runStudyParallel(marine, tech, input, {
      threshold: 1,
      threads: 2,
      onProgress: (done) => {
        last = done;
      },
    });
    expect(parallel).toStrictEqual(serial);
    expect(last).toBe(serial.candidates.length);
  });
});

describe('every demo spec', () => {
  const files = readdirSync(SPEC_DIR).filter((f) => f.endsWith('.yaml'));

  it.each(files)('%s runs and accounts for every topology', (file) => {
    const spec = demo(file);
    const study = runStudy(spec, loadTechnology(spec.technology), { frequencyPoints: 6 });
    const studied = new Set(study.candidates.map((c) => c.topology));
    for (const e of study.excluded) expect(studied.has(e.topology)).toBe(false);
    expect(study.summary.text.length).toBeGreaterThan(0);
    if (study.front.length === 0) expect(study.summary.infeasibleTopologies.length).toBe(studied.size);
  });
});
