/**
 * Sampled waveforms as plain data: time, states and every output, plus average / RMS / extremes.
 */
import type { CompiledCircuit } from './state-space.ts';

export interface SignalMetrics {
  avg: number;
  rms: number;
  min: number;
  max: number;
}

export interface Waveforms {
  /** Sample times (s), non-decreasing; a time appears twice at a configuration change (before, after). */
  timeS: Float64Array;
  /** State trajectories by element name: inductor current (A), capacitor inner voltage (V). */
  states: Record<string, Float64Array>;
  /** Outputs by name: `i(X)` (A, a→b), `v(X)` (V, a−b) for each element, `node(n)` (V to ground). */
  signals: Record<string, Float64Array>;
}

/** A growable column of samples. */
class Column {
  data = new Float64Array(256);
  push(v: number, at: number): void {
    if (at === this.data.length) {
      const bigger = new Float64Array(2 * at);
      bigger.set(this.data);
      this.data = bigger;
    }
    this.data[at] = v;
  }
}

/** Collects samples; outputs are y = C_mask·x + D_mask·u at each sample. */
export class WaveformRecorder {
  private readonly t = new Column();
  private readonly x: Column[];
  private readonly y: Column[];
  private readonly outputs: Int32Array;
  private count = 0;

  constructor(
    private readonly circuit: CompiledCircuit,
    outputNames?: string[],
  ) {
    this.outputs = Int32Array.from(
      (outputNames ?? circuit.outputNames).map((name) => circuit.outputIndex(name)),
    );
    this.x = circuit.stateNames.map(() => new Column());
    this.y = Array.from(this.outputs, () => new Column());
  }

  push(tS: number, x: Float64Array, mask: number, u: Float64Array): void {
    const { n, m, c, d } = this.circuit.configuration(mask);
    const at = this.count++;
    this.t.push(tS, at);
    for (let i = 0; i < n; i++) this.x[i].push(x[i], at);
    for (let o = 0; o < this.outputs.length; o++) {
      const k = this.outputs[o];
      let s = 0;
      for (let j = 0; j < n; j++) s += c[k * n + j] * x[j];
      for (let j = 0; j < m; j++) s += d[k * m + j] * u[j];
      this.y[o].push(s, at);
    }
  }

  get length(): number {
    return this.count;
  }

  result(): Waveforms {
    const states: Record<string, Float64Array> = {};
    this.circuit.stateNames.forEach((name, i) => {
      states[name] = this.x[i].data.slice(0, this.count);
    });
    const signals: Record<string, Float64Array> = {};
    this.outputs.forEach((k, o) => {
      signals[this.circuit.outputNames[k]] = this.y[o].data.slice(0, this.count);
    });
    return { timeS: this.t.data.slice(0, this.count), states, signals };
  }
}

/**
 * Average and RMS over [t0, tN] by the trapezoidal rule on the samples (exact for piecewise-linear
 * waveforms; repeated times at discontinuities add nothing), min and max of the samples.
 */
export function summarize(timeS: Float64Array, y: Float64Array): SignalMetrics {
  let area = 0;
  let sq = 0;
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = 0; i < y.length; i++) {
    min = Math.min(min, y[i]);
    max = Math.max(max, y[i]);
    if (i === 0) continue;
    const dt = timeS[i] - timeS[i - 1];
    area += 0.5 * dt * (y[i] + y[i - 1]);
    // ∫ y² over a linear piece: dt·(a² + a·b + b²)/3
    sq += (dt * (y[i - 1] * y[i - 1] + y[i - 1] * y[i] + y[i] * y[i])) / 3;
  }
  const span = timeS[timeS.length - 1] - timeS[0];
  if (!(span > 0)) return { avg: y[0] ?? 0, rms: Math.abs(y[0] ?? 0), min, max };
  return { avg: area / span, rms: Math.sqrt(Math.max(0, sq / span)), min, max };
}
