/**
 * Objective values in words: formatting, and differences between two candidates phrased from the
 * subject's side ("3 more parts (13 vs 10)", "0.31 W less loss (1.04 W vs 1.35 W, −23 %)"). Every
 * sentence of the study's reasoning is built from these, so the numbers in the text are the data's.
 */
import type { Objectives } from '../engine/types.ts';
import type { ObjectiveDelta, ObjectiveKey } from './types.ts';

interface ObjectiveWords {
  /** Noun for "lowest … of the front". */
  noun: string;
  superlative: string;
  /** Format with `digits` significant digits (part counts ignore it). */
  format(value: number, digits?: number): string;
}

export const OBJECTIVE_WORDS: Readonly<Record<ObjectiveKey, ObjectiveWords>> = {
  parts: { noun: 'part count', superlative: 'fewest parts', format: (v) => `${Math.round(v)}` },
  lossW: { noun: 'loss', superlative: 'lowest loss', format: (v, digits = 3) => formatWatts(v, digits) },
  stress: {
    noun: 'semiconductor stress',
    superlative: 'lowest semiconductor stress',
    format: (v, digits = 3) => Number(v.toPrecision(digits)).toString(),
  },
  volumeMm3: {
    noun: 'volume',
    superlative: 'smallest volume',
    format: (v, digits = 3) =>
      `${Math.abs(v) >= 10 ** digits ? Math.round(v) : Number(v.toPrecision(digits))} mm³`,
  },
};

/**
 * Watts with an SI prefix (W, mW, µW) and `digits` significant digits, trailing zeros dropped: the same
 * text as formatSiShort for this range, without its general machinery (this runs for every candidate's
 * verdict, thousands of times per study).
 */
export function formatWatts(value: number, digits = 3): string {
  if (value === 0 || !Number.isFinite(value)) return `${value} W`;
  // Round first, so a carry (999.96 mW → 1.00 W) picks the prefix of the rounded value.
  const rounded = Number(value.toPrecision(digits));
  const a = Math.abs(rounded);
  const [scale, unit] =
    a >= 1e3
      ? [1e3, 'kW']
      : a >= 1
        ? [1, 'W']
        : a >= 1e-3
          ? [1e-3, 'mW']
          : a >= 1e-6
            ? [1e-6, 'µW']
            : [1e-9, 'nW'];
  return `${Number((rounded / scale).toPrecision(digits))} ${unit}`;
}

export function formatObjective(key: ObjectiveKey, value: number): string {
  return OBJECTIVE_WORDS[key].format(value);
}

export function objectiveDelta(key: ObjectiveKey, subject: Objectives, other: Objectives): ObjectiveDelta {
  const value = subject[key];
  const o = other[key];
  const delta = value - o;
  return { objective: key, value, other: o, delta, relative: o !== 0 ? delta / Math.abs(o) : 0 };
}

/** Signed percentage with two significant digits at least (so +0.012 % does not print as +0.0 %). */
export function formatRelative(relative: number): string {
  const p = relative * 100;
  const text = Math.abs(p) >= 10 ? p.toFixed(0) : Number(p.toPrecision(2)).toString();
  return `${p > 0 ? '+' : ''}${text} %`;
}

/** Two different values printed with the fewest digits (3 to 8) that still tell them apart. */
function formatPair(key: ObjectiveKey, a: number, b: number): [string, string] {
  const f = OBJECTIVE_WORDS[key].format;
  for (let digits = 3; digits < 8; digits++) {
    const pair: [string, string] = [f(a, digits), f(b, digits)];
    if (pair[0] !== pair[1] || a === b) return pair;
  }
  return [f(a, 8), f(b, 8)];
}

/**
 * Relative difference below which two continuous objectives are called "about the same" in words
 * (the ranking itself stays exact): estimates carry far more uncertainty than half a percent.
 */
export const PRACTICAL_TIE = 0.005;

/** One difference in words, from the subject's side. */
export function describeDelta(d: ObjectiveDelta): string {
  const f = (v: number) => formatObjective(d.objective, v);
  const [value, other] = formatPair(d.objective, d.value, d.other);
  const vs = `${value} vs ${other}`;
  if (d.delta === 0) return `same ${OBJECTIVE_WORDS[d.objective].noun} (${value})`;
  if (d.objective !== 'parts' && Math.abs(d.relative) < PRACTICAL_TIE) {
    return `about the same ${OBJECTIVE_WORDS[d.objective].noun} (${vs}, ${formatRelative(d.relative)})`;
  }
  const more = d.delta > 0;
  switch (d.objective) {
    case 'parts': {
      const n = Math.abs(Math.round(d.delta));
      return `${n} ${more ? 'more' : 'fewer'} part${n === 1 ? '' : 's'} (${vs})`;
    }
    case 'lossW':
      return `${f(Math.abs(d.delta))} ${more ? 'more' : 'less'} loss (${vs}, ${formatRelative(d.relative)})`;
    case 'stress':
      return `${more ? 'higher' : 'lower'} semiconductor stress (${vs}, ${formatRelative(d.relative)})`;
    case 'volumeMm3':
      return `${f(Math.abs(d.delta))} ${more ? 'more' : 'less'} volume (${vs}, ${formatRelative(d.relative)})`;
  }
}

/** Objective vector of the chosen objectives, in their order. */
export function objectiveVector(o: Objectives, keys: readonly ObjectiveKey[]): number[] {
  return keys.map((k) => o[k]);
}
