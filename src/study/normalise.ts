/**
 * Normalisation over the front: each chosen objective is mapped by (x − min) / scale, where min and
 * scale are the front's minimum and range on that objective. Used for neighbour distances, the nearest
 * dominator and the recommendation score, so one candidate's trade of "1 part" against "0.1 W" is
 * measured against how much the front itself spreads on each.
 */
import type { Objectives } from '../engine/types.ts';
import type { ObjectiveKey } from './types.ts';

export interface FrontScale {
  keys: readonly ObjectiveKey[];
  min: number[];
  /** Front range per objective; when the front does not spread on an objective, |min| (or 1 for 0). */
  scale: number[];
}

export function frontScale(front: readonly Objectives[], keys: readonly ObjectiveKey[]): FrontScale {
  const min = keys.map((k) => Math.min(...front.map((o) => o[k])));
  const max = keys.map((k) => Math.max(...front.map((o) => o[k])));
  const scale = keys.map((_, j) => max[j] - min[j] || Math.abs(min[j]) || 1);
  return { keys, min, scale };
}

export function normalised(o: Objectives, s: FrontScale): number[] {
  return s.keys.map((k, j) => (o[k] - s.min[j]) / s.scale[j]);
}

/** Euclidean distance in normalised objective space. */
export function normalisedDistance(a: Objectives, b: Objectives, s: FrontScale): number {
  let sum = 0;
  s.keys.forEach((k, j) => {
    const d = (a[k] - b[k]) / s.scale[j];
    sum += d * d;
  });
  return Math.sqrt(sum);
}

/** True iff a dominates b on the keys (minimisation): ≤ on every key, < on at least one. */
export function dominatesOn(a: Objectives, b: Objectives, keys: readonly ObjectiveKey[]): boolean {
  let strict = false;
  for (const k of keys) {
    if (a[k] > b[k]) return false;
    if (a[k] < b[k]) strict = true;
  }
  return strict;
}
