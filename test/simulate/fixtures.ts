/** Shared inputs of the simulation tests: the marine demo rail (polarity relaxed so the inverting stages run too). */
import { readFileSync } from 'node:fs';
import type { TopologyId } from '../../src/engine/types.ts';
import { loadSpecText } from '../../src/spec/load.ts';
import type { RailSpec } from '../../src/spec/rail-spec.ts';

export const DEMO_SPEC_PATH = 'data/specs/marine-lifepo4-12v.yaml';

export function marineSpec(): RailSpec {
  const r = loadSpecText(readFileSync(new URL(`../../${DEMO_SPEC_PATH}`, import.meta.url), 'utf8'));
  if (!r.ok) throw new Error('marine spec does not load');
  return { ...r.spec, output: { ...r.spec.output, polarity: 'either' } };
}

export const ALL_IDS: TopologyId[] = [
  'sepic',
  'sepic-coupled',
  'sepic-damped',
  'inverting-buck-boost',
  'cuk',
  'zeta',
  'four-switch-buck-boost',
  'boost-then-buck',
  'buck-then-boost',
];
