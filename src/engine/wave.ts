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
 * A segment may also bow: a constant second derivative (a capacitor's ripple voltage ramping across a
 * tightly coupled winding) makes it a parabola, stored as its midpoint's departure w from the chord.
 * Over a segment x ∈ [0,1]: p(x) = a + (b−a)·x + 4w·x(1−x); mean (a+b)/2 + 2w/3, mean square
 * (a²+ab+b²)/3 + 2w(a+b)/3 + 8w²/15 (exact integrals of the parabola).
 *
 * Storage is one flat Float64Array so the corner evaluation allocates nothing: a block of segment slots
 * per component, then five per-component arrays (peak and DC voltage, switching edges) as views into
 * the same buffer. Topologies write those views directly (`w.vPeakV[Q1] = …`): an element store passes
 * no floating-point argument through a call, and such an argument costs an allocation whenever the JIT
 * leaves the call out of line (V8 boxes it), which a setter method with many call sites risks.
 */

export const MAX_SEGMENTS = 4;
/** Segment slots per component: [n, f0..f3, a0..a3, b0..b3, w0..w3]. */
export const WAVE_STRIDE = 1 + 4 * MAX_SEGMENTS;
const F = 1;
const A = 1 + MAX_SEGMENTS;
const B = 1 + 2 * MAX_SEGMENTS;
/** Bow of each segment: midpoint minus the chord's midpoint (0 for straight segments). */
const W = 1 + 3 * MAX_SEGMENTS;

/** A segment's mean square is (a² + ab + b² + 2w(a + b))/3 + 8w²/15, computed with these factors. */
const THIRD = 1 / 3;
const EIGHT_FIFTEENTHS = 8 / 15;

/** `keep` masks of WaveSet.combine: bit j keeps segment j. */
export const SEGMENT_0 = 1;
export const SEGMENT_1 = 2;
export const SEGMENT_2 = 4;
export const ALL_SEGMENTS = (1 << MAX_SEGMENTS) - 1;

/** A set of per-component piecewise-linear current waveforms plus each part's peak and DC voltage. */
export class WaveSet {
  /** Segment blocks of every component, then the five per-component arrays below (one buffer). */
  readonly data: Float64Array;
  /** Peak voltage magnitude across each part (V). */
  readonly vPeakV: Float64Array;
  /** DC voltage across each part (V; a capacitor's bias). */
  readonly vDcV: Float64Array;
  /**
   * Switching edges of each hard-switched part: current at turn-on and at turn-off (A) and the voltage
   * magnitude it switches (V); zero for parts that do not switch at this operating point.
   */
  readonly iOnA: Float64Array;
  readonly iOffA: Float64Array;
  readonly vSwV: Float64Array;

  constructor(readonly count: number) {
    const segments = count * WAVE_STRIDE;
    this.data = new Float64Array(segments + 5 * count);
    this.vPeakV = this.data.subarray(segments, segments + count);
    this.vDcV = this.data.subarray(segments + count, segments + 2 * count);
    this.iOnA = this.data.subarray(segments + 2 * count, segments + 3 * count);
    this.iOffA = this.data.subarray(segments + 3 * count, segments + 4 * count);
    this.vSwV = this.data.subarray(segments + 4 * count, segments + 5 * count);
  }

  /** Every waveform, voltage and edge back to zero. */
  reset(): void {
    this.data.fill(0);
  }

  clear(k: number): void {
    this.data.fill(0, k * WAVE_STRIDE, (k + 1) * WAVE_STRIDE);
    this.vPeakV[k] = 0;
    this.vDcV[k] = 0;
    this.iOnA[k] = 0;
    this.iOffA[k] = 0;
    this.vSwV[k] = 0;
  }

  /**
   * Set a two-segment waveform: fraction d with values a0→b0, then 1−d with a1→b1; w0 and w1 bow the
   * segments (see setBow), straight by default.
   */
  set2(k: number, d: number, a0: number, b0: number, a1: number, b1: number, w0 = 0, w1 = 0): void {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    w[o] = 2;
    w[o + W] = w0;
    w[o + W + 1] = w1;
    w[o + F] = d;
    w[o + F + 1] = 1 - d;
    w[o + A] = a0;
    w[o + A + 1] = a1;
    w[o + B] = b0;
    w[o + B + 1] = b1;
  }

  /** Bow segment j of component k: its midpoint lies `bow` above the straight chord from a to b. */
  setBow(k: number, j: number, bow: number): void {
    this.data[k * WAVE_STRIDE + W + j] = bow;
  }
  bow(k: number, j: number): number {
    return this.data[k * WAVE_STRIDE + W + j];
  }

  /**
   * Component dst carries c1·(current of k1) in the segments whose bit is set in keep1, plus
   * c2·(current of k2) in those set in keep2, and nothing elsewhere; segment times come from k1 (k1 and
   * k2 must share them: branches of one switching network), bows combine like the currents. c1 and c2
   * are small integers (±1, 0), so the corner loop passes no floating-point arguments here: a call the
   * JIT leaves out of line costs no allocation. `shift` then adds a constant.
   */
  combine(dst: number, k1: number, c1: number, keep1: number, k2: number, c2: number, keep2: number): void {
    const w = this.data;
    const o = dst * WAVE_STRIDE;
    const o1 = k1 * WAVE_STRIDE;
    const o2 = k2 * WAVE_STRIDE;
    const n = w[o1];
    w[o] = n;
    if (n === 2) {
      // the usual two intervals, unrolled
      const x10 = keep1 & 1 ? c1 : 0;
      const x20 = keep2 & 1 ? c2 : 0;
      const x11 = keep1 & 2 ? c1 : 0;
      const x21 = keep2 & 2 ? c2 : 0;
      w[o + F] = w[o1 + F];
      w[o + F + 1] = w[o1 + F + 1];
      w[o + A] = x10 * w[o1 + A] + x20 * w[o2 + A];
      w[o + B] = x10 * w[o1 + B] + x20 * w[o2 + B];
      w[o + W] = x10 * w[o1 + W] + x20 * w[o2 + W];
      w[o + A + 1] = x11 * w[o1 + A + 1] + x21 * w[o2 + A + 1];
      w[o + B + 1] = x11 * w[o1 + B + 1] + x21 * w[o2 + B + 1];
      w[o + W + 1] = x11 * w[o1 + W + 1] + x21 * w[o2 + W + 1];
      return;
    }
    for (let j = 0; j < n; j++) {
      const x1 = (keep1 >> j) & 1 ? c1 : 0;
      const x2 = (keep2 >> j) & 1 ? c2 : 0;
      w[o + F + j] = w[o1 + F + j];
      w[o + A + j] = x1 * w[o1 + A + j] + x2 * w[o2 + A + j];
      w[o + B + j] = x1 * w[o1 + B + j] + x2 * w[o2 + B + j];
      w[o + W + j] = x1 * w[o1 + W + j] + x2 * w[o2 + W + j];
    }
  }

  /** Component dst as component src (its segments and bows; not its voltages or edges). */
  copy(dst: number, src: number): void {
    this.combine(dst, src, 1, ALL_SEGMENTS, src, 0, 0);
  }

  /** Add the constant i (A) to every segment of component k. */
  shift(k: number, i: number): void {
    const w = this.data;
    const o = k * WAVE_STRIDE;
    for (let j = 0; j < w[o]; j++) {
      w[o + A + j] += i;
      w[o + B + j] += i;
    }
  }

  /**
   * A winding's triangle: from t.lo up to t.hi over the fraction t.duty, back to t.lo over the rest,
   * each segment bowed by t.bowRise and t.bowFall. The numbers come in an object (a module-level
   * Triangle the caller fills), not as arguments: V8 boxes every number passed to a call it leaves out
   * of line, and this is the corner loop.
   */
  setTriangle(k: number, t: Triangle): void {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    w[o] = 2;
    w[o + F] = t.duty;
    w[o + F + 1] = 1 - t.duty;
    w[o + A] = t.lo;
    w[o + B] = t.hi;
    w[o + A + 1] = t.hi;
    w[o + B + 1] = t.lo;
    w[o + W] = t.bowRise;
    w[o + W + 1] = t.bowFall;
  }

  /**
   * A discontinuous triangle: t.lo up to t.hi over f.d0, back to t.lo over f.d1, flat at t.lo over f.d2
   * (straight segments; t.duty and the bows are not used).
   */
  setTriangleIdle(k: number, t: Triangle, f: Fractions3): void {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    w[o] = 3;
    w[o + F] = f.d0;
    w[o + F + 1] = f.d1;
    w[o + F + 2] = f.d2;
    w[o + A] = t.lo;
    w[o + B] = t.hi;
    w[o + A + 1] = t.hi;
    w[o + B + 1] = t.lo;
    w[o + A + 2] = t.lo;
    w[o + B + 2] = t.lo;
    w[o + W] = 0;
    w[o + W + 1] = 0;
    w[o + W + 2] = 0;
  }

  /** n segments from typed arrays: fractions f, start values a, end values b (straight segments). */
  setSegments(k: number, n: number, f: Float64Array, a: Float64Array, b: Float64Array): void {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    w[o] = n;
    for (let j = 0; j < n; j++) {
      w[o + F + j] = f[j];
      w[o + A + j] = a[j];
      w[o + B + j] = b[j];
      w[o + W + j] = 0;
    }
  }

  /**
   * n straight segments gated by kind: segment j carries sign·(a[j] → b[j]) when bit kind[j] of `mask`
   * is set, and nothing otherwise (a branch that conducts the stored current in some intervals only);
   * fractions f. sign is ±1. One pass, no floating-point argument (see combine).
   */
  setGated(
    k: number,
    n: number,
    f: Float64Array,
    a: Float64Array,
    b: Float64Array,
    kind: Int8Array,
    mask: number,
    sign: number,
  ): void {
    const o = k * WAVE_STRIDE;
    const w = this.data;
    w[o] = n;
    for (let j = 0; j < n; j++) {
      const x = (mask >> kind[j]) & 1 ? sign : 0;
      w[o + F + j] = f[j];
      w[o + A + j] = x * a[j];
      w[o + B + j] = x * b[j];
      w[o + W + j] = 0;
    }
  }

  /**
   * Take component k's average out of it: what a capacitor carries of a current whose DC flows
   * elsewhere (the same sum as average(), computed here so no number crosses a call).
   */
  removeMean(k: number): void {
    const o = k * WAVE_STRIDE;
    const d = this.data;
    const n = d[o];
    let mean = 0;
    for (let j = 0; j < n; j++)
      mean += d[o + F + j] * (0.5 * (d[o + A + j] + d[o + B + j]) + (2 / 3) * d[o + W + j]);
    for (let j = 0; j < n; j++) {
      d[o + A + j] -= mean;
      d[o + B + j] -= mean;
    }
  }

  /** A constant current (DC through the whole period). */
  setDc(k: number, i: number): void {
    this.set2(k, 0.5, i, i, i, i);
  }

  iOn(k: number): number {
    return this.iOnA[k];
  }
  iOff(k: number): number {
    return this.iOffA[k];
  }
  vSw(k: number): number {
    return this.vSwV[k];
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
    return this.vPeakV[k];
  }
  vDc(k: number): number {
    return this.vDcV[k];
  }

  /** Average over the period: Σ f·((a+b)/2 + 2w/3). */
  average(k: number): number {
    const o = k * WAVE_STRIDE;
    const d = this.data;
    let s = 0;
    for (let j = 0; j < d[o]; j++)
      s += d[o + F + j] * (0.5 * (d[o + A + j] + d[o + B + j]) + (2 / 3) * d[o + W + j]);
    return s;
  }

  /** RMS over the period: a segment's mean square is (a² + ab + b²)/3 + 2w(a+b)/3 + 8w²/15. */
  rms(k: number): number {
    const o = k * WAVE_STRIDE;
    const d = this.data;
    let s = 0;
    for (let j = 0; j < d[o]; j++) {
      const a = d[o + A + j];
      const b = d[o + B + j];
      const w = d[o + W + j];
      s += d[o + F + j] * ((a * a + a * b + b * b + 2 * w * (a + b)) * THIRD + w * w * EIGHT_FIFTEENTHS);
    }
    return Math.sqrt(s);
  }

  /**
   * Mean square of the segment means, Σ f·m²: the part of I²R loss that an averaged model with
   * resistive drops carries; rms² minus this is the ripple part.
   */
  meanSquareOfMeans(k: number): number {
    const o = k * WAVE_STRIDE;
    const d = this.data;
    let s = 0;
    for (let j = 0; j < d[o]; j++) {
      const m = 0.5 * (d[o + A + j] + d[o + B + j]) + (2 / 3) * d[o + W + j];
      s += d[o + F + j] * m * m;
    }
    return s;
  }

  /**
   * average, rms, max and min of component k in one pass, into out[0..3] (no allocation, no boxed
   * returns): the same sums and comparisons as average(), rms(), max() and min(), so the same numbers.
   */
  stats(k: number, out: Float64Array): void {
    const o = k * WAVE_STRIDE;
    const d = this.data;
    let avg = 0;
    let ms = 0;
    let mx = Number.NEGATIVE_INFINITY;
    let mn = Number.POSITIVE_INFINITY;
    for (let j = 0; j < d[o]; j++) {
      const f = d[o + F + j];
      const a = d[o + A + j];
      const b = d[o + B + j];
      const w = d[o + W + j];
      avg += f * (0.5 * (a + b) + (2 / 3) * w);
      ms += f * ((a * a + a * b + b * b + 2 * w * (a + b)) * THIRD + w * w * EIGHT_FIFTEENTHS);
      if (f <= 0) continue;
      mx = Math.max(mx, a, b);
      mn = Math.min(mn, a, b);
      if (w !== 0) {
        // the vertex of a bowed segment (see extreme); negating a, b, w leaves x unchanged
        const x = 0.5 * ((b - a) / (4 * w) + 1);
        if (x > 0 && x < 1) {
          const v = a + (b - a) * x + 4 * w * x * (1 - x);
          mx = Math.max(mx, v);
          mn = Math.min(mn, v);
        }
      }
    }
    out[0] = avg;
    out[1] = Math.sqrt(ms);
    out[2] = mx;
    out[3] = mn;
  }

  max(k: number): number {
    return this.extreme(k, 1);
  }

  min(k: number): number {
    return -this.extreme(k, -1);
  }

  /** Largest value of sign·i over the period (segment ends, and a bowed segment's vertex). */
  private extreme(k: number, sign: number): number {
    const o = k * WAVE_STRIDE;
    const d = this.data;
    let m = Number.NEGATIVE_INFINITY;
    for (let j = 0; j < d[o]; j++) {
      if (d[o + F + j] <= 0) continue;
      const a = sign * d[o + A + j];
      const b = sign * d[o + B + j];
      const w = sign * d[o + W + j];
      m = Math.max(m, a, b);
      if (w !== 0) {
        // p'(x) = (b − a) + 4w(1 − 2x) = 0
        const x = 0.5 * ((b - a) / (4 * w) + 1);
        if (x > 0 && x < 1) m = Math.max(m, a + (b - a) * x + 4 * w * x * (1 - x));
      }
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
    this.chargeSwingInto(k, swingOut, 0);
    return swingOut[0];
  }

  /** chargeSwing written to out[i] (the corner loop's form: a returned number would be boxed). */
  chargeSwingInto(k: number, out: Float64Array, i: number): void {
    const o = k * WAVE_STRIDE;
    const d = this.data;
    // the average, as average() sums it (inlined: no number crosses a call here)
    let mean = 0;
    for (let j = 0; j < d[o]; j++)
      mean += d[o + F + j] * (0.5 * (d[o + A + j] + d[o + B + j]) + (2 / 3) * d[o + W + j]);
    // The charge of a segment up to fraction x of it (period units) is f·∫₀ˣ (a + c1·t + c2·t²) dt
    // = f·x·(a + x·(c1/2 + x·c2/3)), written out below at each use.
    let q = 0;
    let qMax = 0;
    let qMin = 0;
    for (let j = 0; j < d[o]; j++) {
      const f = d[o + F + j];
      if (f <= 0) continue;
      const a = d[o + A + j] - mean;
      const b = d[o + B + j] - mean;
      const w = d[o + W + j];
      // p(x) − mean = −4w·x² + (b − a + 4w)·x + a; its running integral is a cubic whose extremes
      // lie where p crosses the mean inside the segment
      const c2 = -4 * w;
      const c1 = b - a + 4 * w;
      if (Math.abs(c2) <= 1e-12 * (Math.abs(c1) + Math.abs(a))) {
        // straight (or negligibly bowed) segment: one crossing of the mean where a and b differ in sign
        if (a * b < 0) {
          const x = a / (a - b);
          const qx = q + f * x * (a + x * (c1 / 2));
          if (qx > qMax) qMax = qx;
          if (qx < qMin) qMin = qx;
        }
      } else {
        const disc = c1 * c1 - 4 * c2 * a;
        if (disc >= 0) {
          // cancellation-free roots of c2·x² + c1·x + a
          const r = Math.sqrt(disc);
          const h = -0.5 * (c1 + (c1 >= 0 ? r : -r));
          const x1 = h / c2;
          const x2 = h !== 0 ? a / h : -1;
          if (x1 > 0 && x1 < 1) {
            const qx = q + f * x1 * (a + x1 * (c1 / 2 + (x1 * c2) / 3));
            if (qx > qMax) qMax = qx;
            if (qx < qMin) qMin = qx;
          }
          if (x2 > 0 && x2 < 1) {
            const qx = q + f * x2 * (a + x2 * (c1 / 2 + (x2 * c2) / 3));
            if (qx > qMax) qMax = qx;
            if (qx < qMin) qMin = qx;
          }
        }
      }
      q += f * (a + c1 / 2 + c2 / 3); // the whole segment (x = 1)
      if (q > qMax) qMax = q;
      if (q < qMin) qMin = q;
    }
    out[i] = qMax - qMin;
  }
}

/** chargeSwing's result slot. */
const swingOut = new Float64Array(1);

/** A winding's current over one period, for WaveSet.setTriangle (A; fractions of the period). */
export interface Triangle {
  duty: number;
  lo: number;
  hi: number;
  bowRise: number;
  bowFall: number;
}

export function newTriangle(): Triangle {
  return { duty: 0, lo: 0, hi: 0, bowRise: 0, bowFall: 0 };
}

export interface Fractions3 {
  d0: number;
  d1: number;
  d2: number;
}
