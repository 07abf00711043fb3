/**
 * What a step or start-up transient shows: overshoot of the switching-period average (so the switching
 * ripple does not count as overshoot), settling of the output, and instantaneous peaks (what the parts
 * must be rated for).
 */
import { periodAverages } from './signals.ts';

/** Settling band: out.v stays within this fraction of its final change (2 %, common practice). */
export const SETTLING_BAND = 0.02;
/** A change smaller than this fraction of the signal's size has no meaningful overshoot ratio. */
const MIN_CHANGE = 1e-3;

export interface TransientFeatures {
  overshoot: Record<string, number>;
  peaks: Record<string, number>;
  settlingTimeS?: number;
}

/**
 * `initial` and `final` are the periodic steady-state averages before and after; the transient starts at
 * `atS` (0 for a start-up). Overshoot = max over the periods from atS on of (avg − initial)/(final − initial).
 */
export function transientFeatures(
  timeS: Float64Array,
  signals: Record<string, Float64Array>,
  names: string[],
  periodS: number,
  atS: number,
  initial: Record<string, number>,
  final: Record<string, number>,
): TransientFeatures {
  const k0 = Math.floor(atS / periodS + 1e-9);
  const overshoot: Record<string, number> = {};
  const peaks: Record<string, number> = {};
  let settlingTimeS: number | undefined;
  let from = 0;
  while (from < timeS.length && timeS[from] < atS) from++;
  for (const name of names) {
    const y = signals[name];
    if (!y) continue;
    let peak = 0;
    for (let i = from; i < y.length; i++) if (Math.abs(y[i]) > Math.abs(peak)) peak = y[i];
    peaks[name] = peak;
    const change = final[name] - initial[name];
    if (!(Math.abs(change) > MIN_CHANGE * Math.max(Math.abs(final[name]), Math.abs(initial[name])))) continue;
    const avg = periodAverages(timeS, y, periodS);
    let ratio = Number.NEGATIVE_INFINITY;
    for (let k = k0; k < avg.length; k++) ratio = Math.max(ratio, (avg[k] - initial[name]) / change);
    if (Number.isFinite(ratio)) overshoot[name] = ratio;
    if (name !== 'out.v') continue;
    let lastOutside = -1;
    for (let k = k0; k < avg.length; k++) {
      if (Math.abs(avg[k] - final[name]) > SETTLING_BAND * Math.abs(change)) lastOutside = k;
    }
    if (lastOutside < avg.length - 1) settlingTimeS = Math.max(0, (lastOutside + 1) * periodS - atS);
  }
  return { overshoot, peaks, ...(settlingTimeS === undefined ? {} : { settlingTimeS }) };
}
