/**
 * Weighted sum of stored waveforms on their common time grid, for the capacitors of a cascade: the
 * bus capacitor carries the first stage's output current minus the second stage's input current, the
 * input and output capacitors the AC part of one stage current (Kirchhoff's current law at each node).
 *
 * Both stages are clocked in phase from one oscillator (common practice for a cascade: no beat
 * between two free-running clocks), so every stage waveform shares the period and starts at t = 0.
 * The sum of two piecewise-linear waveforms is piecewise linear on the union of their switching
 * edges. That union has at most four segments except when both stages of a buck-then-boost are
 * discontinuous (light load); then the shortest segment is merged into its shorter neighbour keeping
 * the segment charge (so the average, and the charge balance, stay exact; RMS and ripple become a
 * close estimate at a corner where they are small). The stage waveforms summed here are straight
 * segments (a plain buck or boost has no bowed currents); a bowed source would be read by its chords.
 */

import type { WaveSet } from '../engine/wave.ts';
import * as wave from '../engine/wave.ts';

// Read once into module constants: compiled to CommonJS (as tsx runs the engine) every read of an
// imported binding is a property getter, which the loops below would otherwise pay on every call.
const MAX_SEGMENTS = wave.MAX_SEGMENTS;
const WAVE_STRIDE = wave.WAVE_STRIDE;

// Offsets inside one component's slot block, as documented in wave.ts: [n, f0..f3, a0..a3, b0..b3, ...].
const F = 1;
const A = 1 + MAX_SEGMENTS;
const B = 1 + 2 * MAX_SEGMENTS;
const EDGE_EPS = 1e-12;

const grid = new Float64Array(2 * MAX_SEGMENTS + 2);
const segF = new Float64Array(2 * MAX_SEGMENTS + 1);
const segA = new Float64Array(2 * MAX_SEGMENTS + 1);
const segB = new Float64Array(2 * MAX_SEGMENTS + 1);

/**
 * Write into slot `dst` the current ga·wave(ka) + gb·wave(kb) (kb < 0: only the first term). With
 * `acOnly` the average is removed (a capacitor's current: its DC part flows elsewhere). Leaves the
 * voltage and edge fields of `dst` alone. Allocates nothing.
 */
export function sumWaves(
  w: WaveSet,
  dst: number,
  ka: number,
  ga: number,
  kb: number,
  gb: number,
  acOnly: boolean,
): void {
  // union of the switching edges of both waveforms
  let n = 0;
  grid[n++] = 0;
  n = addEdges(w, ka, n);
  if (kb >= 0) n = addEdges(w, kb, n);
  grid[n++] = 1;
  sortGrid(n);
  // Each stored wave is read at both ends of every grid interval, on the segment that contains the
  // interval's midpoint. The midpoints increase, so the segment search resumes where it stopped (it
  // finds the same segment, with the same running start time, as a search from t = 0 would).
  const d = w.data;
  const oa = ka * WAVE_STRIDE;
  const ob = kb >= 0 ? kb * WAVE_STRIDE : 0;
  const na = d[oa];
  const nb = kb >= 0 ? d[ob] : 0;
  let ja = 0;
  let sa = 0;
  let jb = 0;
  let sb = 0;
  let segs = 0;
  for (let i = 1; i < n; i++) {
    const t0 = grid[i - 1];
    const t1 = grid[i];
    if (t1 - t0 <= EDGE_EPS) continue;
    const mid = 0.5 * (t0 + t1);
    while (ja < na) {
      const f = d[oa + F + ja];
      if (f > 0 && (mid < sa + f || ja === na - 1)) break;
      sa += f;
      ja++;
    }
    let a0 = 0;
    let a1 = 0;
    if (ja < na) {
      const f = d[oa + F + ja];
      const s = d[oa + A + ja];
      const e = d[oa + B + ja];
      a0 = s + (e - s) * Math.min(1, Math.max(0, (t0 - sa) / f));
      a1 = s + (e - s) * Math.min(1, Math.max(0, (t1 - sa) / f));
    }
    segF[segs] = t1 - t0;
    if (kb >= 0) {
      while (jb < nb) {
        const f = d[ob + F + jb];
        if (f > 0 && (mid < sb + f || jb === nb - 1)) break;
        sb += f;
        jb++;
      }
      let b0 = 0;
      let b1 = 0;
      if (jb < nb) {
        const f = d[ob + F + jb];
        const s = d[ob + A + jb];
        const e = d[ob + B + jb];
        b0 = s + (e - s) * Math.min(1, Math.max(0, (t0 - sb) / f));
        b1 = s + (e - s) * Math.min(1, Math.max(0, (t1 - sb) / f));
      }
      segA[segs] = ga * a0 + gb * b0;
      segB[segs] = ga * a1 + gb * b1;
    } else {
      // `+ 0` as the two-wave form adds: a −0 becomes +0 exactly as before
      segA[segs] = ga * a0 + 0;
      segB[segs] = ga * a1 + 0;
    }
    segs++;
  }
  while (segs > MAX_SEGMENTS) segs = mergeShortest(segs);

  let mean = 0;
  if (acOnly) for (let j = 0; j < segs; j++) mean += segF[j] * 0.5 * (segA[j] + segB[j]);
  for (let j = 0; j < segs; j++) {
    segA[j] -= mean;
    segB[j] -= mean;
  }
  w.setSegments(dst, segs, segF, segA, segB);
}

/** Insertion sort of the first n grid times (n ≤ 10; a subarray view would allocate). */
function sortGrid(n: number): void {
  for (let i = 1; i < n; i++) {
    const t = grid[i];
    let j = i - 1;
    while (j >= 0 && grid[j] > t) {
      grid[j + 1] = grid[j];
      j--;
    }
    grid[j + 1] = t;
  }
}

function addEdges(w: WaveSet, k: number, n0: number): number {
  let n = n0;
  let t = 0;
  const segs = w.segments(k);
  for (let j = 0; j < segs - 1; j++) {
    t += w.fraction(k, j);
    if (t > EDGE_EPS && t < 1 - EDGE_EPS) grid[n++] = t;
  }
  return n;
}

/** Merge the shortest segment into its shorter neighbour, keeping the pair's charge; returns the new count. */
function mergeShortest(segs: number): number {
  let j = 0;
  for (let i = 1; i < segs; i++) if (segF[i] < segF[j]) j = i;
  let i = j;
  if (j === segs - 1) i = j - 1;
  else if (j > 0 && segF[j - 1] < segF[j + 1]) i = j - 1;
  // pair (i, i+1) becomes one line from the first start to the second end, shifted to keep the charge
  const f = segF[i] + segF[i + 1];
  const q = segF[i] * 0.5 * (segA[i] + segB[i]) + segF[i + 1] * 0.5 * (segA[i + 1] + segB[i + 1]);
  const shift = q / f - 0.5 * (segA[i] + segB[i + 1]);
  segF[i] = f;
  segA[i] += shift;
  segB[i] = segB[i + 1] + shift;
  for (let m = i + 1; m < segs - 1; m++) {
    segF[m] = segF[m + 1];
    segA[m] = segA[m + 1];
    segB[m] = segB[m + 1];
  }
  return segs - 1;
}
