/**
 * Signal naming and the shaping of sampled waveforms for display: the waveform engine's outputs
 * `i(X)`, `v(X)`, `node(n)` become `X.i`, `X.v`, `n.v`; `sw.v` names the main switch node whatever the
 * topology calls it. Long transients are thinned to a point budget keeping each bucket's minimum and
 * maximum in the order they occur, so the envelope (peaks, ringing) survives; metrics are taken before.
 */
import type { SignalMetrics } from './types.ts';

/** `i(L1)` → `L1.i`, `v(Cs)` → `Cs.v`, `node(out)` → `out.v`. */
export function signalName(engineName: string): string | undefined {
  const m = /^(i|v|node)\((.+)\)$/.exec(engineName);
  if (!m) return undefined;
  return m[1] === 'i' ? `${m[2]}.i` : `${m[2]}.v`;
}

/** Renames every engine output; node voltages never overwrite an element voltage of the same name. */
export function renameSignals(
  raw: Record<string, Float64Array>,
  switchNode: string,
): Record<string, Float64Array> {
  const out: Record<string, Float64Array> = {};
  const nodes: [string, Float64Array][] = [];
  for (const [name, y] of Object.entries(raw)) {
    const renamed = signalName(name);
    if (!renamed) continue;
    if (name.startsWith('node(')) nodes.push([renamed, y]);
    else out[renamed] = y;
  }
  for (const [name, y] of nodes) if (!(name in out)) out[name] = y;
  const sw = raw[`node(${switchNode})`];
  if (!('sw.v' in out) && sw) out['sw.v'] = sw;
  return out;
}

/**
 * Average (trapezoidal), RMS (exact for piecewise-linear samples), min and max over the samples.
 * Repeated times at a configuration change add nothing to the integrals.
 */
export function metricsOf(timeS: Float64Array, y: Float64Array): SignalMetrics {
  let area = 0;
  let sq = 0;
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < y.length; i++) {
    if (y[i] < min) min = y[i];
    if (y[i] > max) max = y[i];
    if (i === 0) continue;
    const dt = timeS[i] - timeS[i - 1];
    area += 0.5 * dt * (y[i] + y[i - 1]);
    sq += (dt * (y[i - 1] * y[i - 1] + y[i - 1] * y[i] + y[i] * y[i])) / 3;
  }
  const span = timeS[timeS.length - 1] - timeS[0];
  if (!(span > 0)) return { avg: y[0] ?? 0, rms: Math.abs(y[0] ?? 0), min, max };
  return { avg: area / span, rms: Math.sqrt(Math.max(0, sq / span)), min, max };
}

/**
 * Average of y over each window [t0 + k·T, t0 + (k+1)·T) that the samples cover completely, by the
 * trapezoidal rule (the switching-period average, Erickson & Maksimović ch. 7, "averaged" waveforms).
 */
export function periodAverages(timeS: Float64Array, y: Float64Array, periodS: number, t0 = 0): Float64Array {
  const n = timeS.length;
  const count = Math.max(0, Math.floor((timeS[n - 1] - t0) / periodS + 1e-9));
  const avg = new Float64Array(count);
  let i = 0;
  while (i < n - 1 && timeS[i + 1] <= t0) i++;
  for (let k = 0; k < count; k++) {
    const a = t0 + k * periodS;
    const b = a + periodS;
    let area = 0;
    for (; i < n - 1 && timeS[i] < b; i++) {
      const ta = Math.max(timeS[i], a);
      const tb = Math.min(timeS[i + 1], b);
      if (!(tb > ta)) continue;
      const span = timeS[i + 1] - timeS[i];
      const ya = y[i] + ((y[i + 1] - y[i]) * (ta - timeS[i])) / span;
      const yb = y[i] + ((y[i + 1] - y[i]) * (tb - timeS[i])) / span;
      area += 0.5 * (ya + yb) * (tb - ta);
      if (timeS[i + 1] > b) break;
    }
    avg[k] = area / periodS;
  }
  return avg;
}

/** Waveforms as plain arrays, thinned to about `maxPoints` samples (see header). */
export function thin(
  timeS: Float64Array,
  signals: Record<string, Float64Array>,
  maxPoints: number,
): { timeS: number[]; signals: Record<string, number[]> } {
  const n = timeS.length;
  const names = Object.keys(signals);
  if (n <= maxPoints) {
    return {
      timeS: Array.from(timeS),
      signals: Object.fromEntries(names.map((k) => [k, Array.from(signals[k])])),
    };
  }
  const buckets = Math.max(1, Math.floor(maxPoints / 2));
  const size = n / buckets;
  const t: number[] = [];
  const out: Record<string, number[]> = Object.fromEntries(names.map((k) => [k, [] as number[]]));
  for (let b = 0; b < buckets; b++) {
    const from = Math.floor(b * size);
    const to = Math.min(n, Math.floor((b + 1) * size));
    if (to <= from) continue;
    t.push(timeS[from], timeS[to - 1]);
    for (const k of names) {
      const y = signals[k];
      let iMin = from;
      let iMax = from;
      for (let i = from + 1; i < to; i++) {
        if (y[i] < y[iMin]) iMin = i;
        if (y[i] > y[iMax]) iMax = i;
      }
      const first = Math.min(iMin, iMax);
      const second = Math.max(iMin, iMax);
      out[k].push(y[first], y[second]);
    }
  }
  return { timeS: t, signals: out };
}
