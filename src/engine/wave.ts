/**
 * Piecewise-linear periodic waveforms, the common language of every CCM/DCM closed form here.
 *
 * Between switching edges every inductor current is a straight line (capacitor voltages are taken
 * as constant over a period: the small-ripple approximation of Erickson & Maksimović, Fundamentals of
 * Power Electronics, 2nd ed., Springer 2001, ch. 2). Every other branch current is then a linear
 * combination of inductor currents and the load current, so it is also piecewise linear: a list of
 * segments, each with a fraction of the period and its start and end value. From that list the
 * average, RMS, extremes and the charge a capacitor must absorb follow exactly.
 *
 * Storage is a flat Float64Array so the corner evaluation allocates nothing.
 */

export const MAX_SEGMENTS = 4;
/** Slots per component: [n, f0..f3, a0..a3, b0..b3, vPeak, vDc, iOn, iOff, vSw]. */
export const WAVE_STRIDE = 6 + 3 * MAX_SEGMENTS;
const F = 1;
const A = 1 + MAX_SEGMENTS;
const B = 1 + 2 * MAX_SEGMENTS;
const VPEAK = 1 + 3 * MAX_SEGMENTS;
const VDC = VPEAK + 1;
const ION = VPEAK + 2;
const IOFF = VPEAK + 3;
const VSW = VPEAK + 4;

/** A set of per-component piecewise-linear current waveforms plus each part's peak and DC voltage. */
export class WaveSet {
  readonly data: Float64Array;
  constructor(readonly count: number) {
    this.data = new Float64Array(count * WAVE_STRIDE);
  }

  clear(k: number): void {
    this.data.fill(0, k * WAVE_STRIDE, (k + 1) * WAVE_STRIDE);
  }

  /** Set a two-segment waveform: fraction d with values a0→b0, then 1−d with a1→b1. */
  set2(k: number, d: number, a0: number, b0: number, a1: number, b1: number): void {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    w[o] = 2;
    w[o + F] = d;
    w[o + F + 1] = 1 - d;
    w[o + A] = a0;
    w[o + A + 1] = a1;
    w[o + B] = b0;
    w[o + B + 1] = b1;
  }

  /** Set a three-segment waveform. */
  set3(
    k: number,
    f: Fractions3,
    a0: number,
    b0: number,
    a1: number,
    b1: number,
    a2: number,
    b2: number,
  ): void {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    w[o] = 3;
    w[o + F] = f.d0;
    w[o + F + 1] = f.d1;
    w[o + F + 2] = f.d2;
    w[o + A] = a0;
    w[o + A + 1] = a1;
    w[o + A + 2] = a2;
    w[o + B] = b0;
    w[o + B + 1] = b1;
    w[o + B + 2] = b2;
  }

  /** A constant current (DC through the whole period). */
  setDc(k: number, i: number): void {
    this.set2(k, 0.5, i, i, i, i);
  }

  setVoltage(k: number, vPeakV: number, vDcV: number): void {
    const o = k * WAVE_STRIDE;
    this.data[o + VPEAK] = Math.abs(vPeakV);
    this.data[o + VDC] = vDcV;
  }

  /**
   * Switching edges of a hard-switched part: current at turn-on and at turn-off (A) and the voltage
   * it switches (V). Zero for parts that do not switch at this operating point.
   */
  setEdges(k: number, iOnA: number, iOffA: number, vSwV: number): void {
    const o = k * WAVE_STRIDE;
    this.data[o + ION] = iOnA;
    this.data[o + IOFF] = iOffA;
    this.data[o + VSW] = Math.abs(vSwV);
  }
  iOn(k: number): number {
    return this.data[k * WAVE_STRIDE + ION];
  }
  iOff(k: number): number {
    return this.data[k * WAVE_STRIDE + IOFF];
  }
  vSw(k: number): number {
    return this.data[k * WAVE_STRIDE + VSW];
  }

  segments(k: number): number {
    return this.data[k * WAVE_STRIDE];
  }
  fraction(k: number, j: number): number {
    return this.data[k * WAVE_STRIDE + F + j];
  }
  start(k: number, j: number): number {
    return this.data[k * WAVE_STRIDE + A + j];
  }
  end(k: number, j: number): number {
    return this.data[k * WAVE_STRIDE + B + j];
  }
  vPeak(k: number): number {
    return this.data[k * WAVE_STRIDE + VPEAK];
  }
  vDc(k: number): number {
    return this.data[k * WAVE_STRIDE + VDC];
  }

  /** Average over the period: Σ f·(a+b)/2. */
  average(k: number): number {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    let s = 0;
    for (let j = 0; j < w[o]; j++) s += w[o + F + j] * 0.5 * (w[o + A + j] + w[o + B + j]);
    return s;
  }

  /** RMS over the period: the mean square of a line from a to b is (a² + ab + b²)/3. */
  rms(k: number): number {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    let s = 0;
    for (let j = 0; j < w[o]; j++) {
      const a = w[o + A + j];
      const b = w[o + B + j];
      s += (w[o + F + j] * (a * a + a * b + b * b)) / 3;
    }
    return Math.sqrt(s);
  }

  /**
   * Mean square of the segment means, Σ f·((a+b)/2)²: the part of I²R loss that an averaged model
   * with resistive drops carries; rms² minus this is the ripple part Σ f·(b−a)²/12.
   */
  meanSquareOfMeans(k: number): number {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    let s = 0;
    for (let j = 0; j < w[o]; j++) {
      const m = 0.5 * (w[o + A + j] + w[o + B + j]);
      s += w[o + F + j] * m * m;
    }
    return s;
  }

  max(k: number): number {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    let m = Number.NEGATIVE_INFINITY;
    for (let j = 0; j < w[o]; j++) {
      if (w[o + F + j] <= 0) continue;
      m = Math.max(m, w[o + A + j], w[o + B + j]);
    }
    return m;
  }

  min(k: number): number {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    let m = Number.POSITIVE_INFINITY;
    for (let j = 0; j < w[o]; j++) {
      if (w[o + F + j] <= 0) continue;
      m = Math.min(m, w[o + A + j], w[o + B + j]);
    }
    return m;
  }

  /**
   * Charge swing of a capacitor carrying this current minus its average, as a fraction of one period
   * (multiply by T = 1/fsw to get coulombs): max − min of the running integral of (i − ī).
   * The running integral of a line is a parabola, so its extremes are at segment ends or where the
   * current crosses its average inside a segment.
   */
  chargeSwing(k: number): number {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    const mean = this.average(k);
    let q = 0;
    let qMax = 0;
    let qMin = 0;
    for (let j = 0; j < w[o]; j++) {
      const f = w[o + F + j];
      if (f <= 0) continue;
      const a = w[o + A + j] - mean;
      const b = w[o + B + j] - mean;
      if (a * b < 0) {
        // zero crossing at x = a/(a−b) of the segment: the parabola's vertex
        const x = a / (a - b);
        const qx = q + f * x * (a + (b - a) * x * 0.5);
        if (qx > qMax) qMax = qx;
        if (qx < qMin) qMin = qx;
      }
      q += f * 0.5 * (a + b);
      if (q > qMax) qMax = q;
      if (q < qMin) qMin = q;
    }
    return qMax - qMin;
  }
}

export interface Fractions3 {
  d0: number;
  d1: number;
  d2: number;
}
