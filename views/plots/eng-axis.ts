/**
 * Linear axes in engineering units with ONE prefix per axis: the title carries the unit ("Time (µs)",
 * "Ripple (mV)") and the ticks are plain numbers in it ("0  0.5  1  1.5"), which reads faster on a
 * waveform than a prefix on every tick ("500 ns  1 µs"). Ticks come from d3-scale (1-2-5 steps).
 */
import { scaleLinear } from 'd3-scale';
import { MAX_PREFIX_EXPONENT, MIN_PREFIX_EXPONENT, PREFIX_SYMBOLS } from '../../src/units/prefixes.ts';
import type { Axis } from './axes.tsx';

export interface UnitScale {
  /** Value in SI ÷ factor = number shown. */
  factor: number;
  /** Prefixed unit shown in the title ('µs', 'mV', 'A'). */
  symbol: string;
}

/** Prefix (a multiple of 10³) that shows the largest magnitude as 1…999; 0 or nothing finite → no prefix. */
export function unitScale(maxAbs: number, unit: string): UnitScale {
  if (!Number.isFinite(maxAbs) || maxAbs <= 0) return { factor: 1, symbol: unit };
  // A hair above the boundary so 1000 ns reads 1 µs, not 1000 ns, despite float rounding.
  const exponent = Math.floor(Math.log10(maxAbs * (1 + 1e-9)) / 3) * 3;
  const e = Math.min(MAX_PREFIX_EXPONENT, Math.max(MIN_PREFIX_EXPONENT, exponent));
  return { factor: 10 ** e, symbol: `${PREFIX_SYMBOLS[e]}${unit}` };
}

/** Decimals that show every tick of step `step` exactly (0.25 → 2, 5 → 0). */
export function decimalsFor(step: number): number {
  if (!(step > 0) || !Number.isFinite(step)) return 0;
  for (let d = 0; d < 9; d++) {
    const scaled = step * 10 ** d;
    if (Math.abs(scaled - Math.round(scaled)) < 1e-6 * scaled) return d;
  }
  return 9;
}

export interface EngineeringAxis extends Axis {
  scale: UnitScale;
}

/**
 * Axis over `domain` (SI) mapped to `range` (px): ticks at round values in the chosen prefix, labels with
 * as many decimals as the tick step needs, title "quantity (prefixed unit)".
 */
export function engineeringAxis(
  domain: [number, number],
  range: [number, number],
  options: { unit: string; quantity: string; count?: number },
): EngineeringAxis {
  const s = scaleLinear().domain(domain).range(range);
  const ticks = s.ticks(options.count ?? 6);
  const maxAbs = Math.max(...ticks.map(Math.abs), 0) || Math.max(Math.abs(domain[0]), Math.abs(domain[1]));
  const scale = unitScale(maxAbs, options.unit);
  const step = ticks.length > 1 ? (ticks[1] - ticks[0]) / scale.factor : 1;
  const decimals = decimalsFor(step);
  const label = (v: number) => {
    const text = (v / scale.factor).toFixed(decimals);
    return /^-0(\.0*)?$/.test(text) ? text.slice(1) : text;
  };
  return { at: (v) => s(v), ticks, label, title: `${options.quantity} (${scale.symbol})`, scale };
}

/** Domain of some series with 6 % headroom each side; a flat series gets a ±5 % (or ±1 unit-less) window. */
export function seriesDomain(
  series: readonly ArrayLike<number>[],
  include: readonly number[] = [],
): [number, number] {
  let lo = Number.POSITIVE_INFINITY;
  let hi = Number.NEGATIVE_INFINITY;
  const take = (v: number) => {
    if (!Number.isFinite(v)) return;
    if (v < lo) lo = v;
    if (v > hi) hi = v;
  };
  for (const s of series) for (let i = 0; i < s.length; i++) take(s[i]);
  for (const v of include) take(v);
  if (lo > hi) return [0, 1];
  if (hi - lo <= 1e-12 * Math.max(Math.abs(lo), Math.abs(hi))) {
    const d = lo === 0 ? 1 : Math.abs(lo) * 0.05;
    return [lo - d, hi + d];
  }
  const pad = (hi - lo) * 0.06;
  return [lo - pad, hi + pad];
}
