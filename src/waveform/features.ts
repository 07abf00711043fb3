/**
 * Features of an averaged small-signal model: its poles (lightly damped pairs are the resonances a loop
 * must respect) and the zeros of one transfer function (a right-half-plane zero limits the loop bandwidth).
 *
 * Zeros of H(s) = c·(sI − A)⁻¹·b + e are the eigenvalues of its zero dynamics (see findZeros). A direct
 * generalized-eigenvalue route (the pencil [[A, b], [c, e]] − s·diag(I, 0)) was tried first: its infinite
 * eigenvalues form a Jordan block whose roundoff (ε^(1/r)) lands spurious zeros near 1 MHz.
 */

import type { AveragedModel } from './averaged.ts';
import { norm1 } from './dense.ts';
import { type Complex, eigenvalues } from './eigen.ts';
import { SimulationError } from './errors.ts';

export interface Pole {
  re: number;
  im: number;
  /** Natural frequency |s|/2π (Hz). */
  freqHz: number;
  /** Damping ratio ζ = −Re(s)/|s| (1 for a real stable pole). */
  zeta: number;
}

export interface Resonance {
  freqHz: number;
  zeta: number;
  /** Quality factor 1/(2ζ). */
  q: number;
}

function describe(s: Complex): Pole {
  const mag = Math.hypot(s.re, s.im);
  return { re: s.re, im: s.im, freqHz: mag / (2 * Math.PI), zeta: mag > 0 ? -s.re / mag : 1 };
}

/** Poles of the averaged model: the eigenvalues of A. */
export function findPoles(model: AveragedModel): Pole[] {
  return eigenvalues(model.a, model.n).map(describe);
}

/**
 * Lightly damped pole pairs (ζ below `maxZeta`, default 0.5, i.e. Q above 1: a peak in the response —
 * common practice for calling a pair resonant), one entry per pair, by increasing frequency.
 */
export function findResonances(model: AveragedModel, maxZeta = 0.5): Resonance[] {
  return findPoles(model)
    .filter((p) => p.im > 0 && p.zeta < maxZeta)
    .map((p) => ({ freqHz: p.freqHz, zeta: p.zeta, q: 1 / (2 * Math.max(p.zeta, 1e-12)) }))
    .sort((x, y) => x.freqHz - y.freqHz);
}

/** The input column b and feed-through e of `input` ('duty' or a source name) to output row k. */
function inputOf(model: AveragedModel, input: string, k: number): { b: Float64Array; e: number } {
  const { n, m } = model;
  if (input === 'duty') return { b: model.bd, e: model.ed[k] };
  const col = model.inputNames.indexOf(input);
  if (col < 0) throw new SimulationError('invalid-netlist', `no input named '${input}'`);
  return { b: Float64Array.from({ length: n }, (_, i) => model.b[i * m + col]), e: model.d[k * m + col] };
}

/** Significance of a Markov parameter against the next one: a zero beyond this multiple of ‖A‖ is dropped. */
const FAR_ZERO_FACTOR = 1e3;

function dot(x: ArrayLike<number>, y: ArrayLike<number>): number {
  let s = 0;
  for (let i = 0; i < x.length; i++) s += x[i] * y[i];
  return s;
}

/** rowᵀ·A (a row vector times A). */
function rowTimes(row: Float64Array, a: Float64Array, n: number): Float64Array {
  const out = new Float64Array(n);
  for (let j = 0; j < n; j++) for (let i = 0; i < n; i++) out[j] += row[i] * a[i * n + j];
  return out;
}

/** Orthonormal basis (as columns) of the complement of the span of `rows`, by twice-repeated Gram–Schmidt. */
function complementBasis(rows: Float64Array[], n: number): Float64Array[] {
  const basis: Float64Array[] = [];
  const project = (v: Float64Array, against: Float64Array[]) => {
    for (let pass = 0; pass < 2; pass++) {
      for (const q of against) {
        const k = dot(v, q);
        for (let i = 0; i < n; i++) v[i] -= k * q[i];
      }
    }
    return Math.sqrt(dot(v, v));
  };
  const q: Float64Array[] = [];
  for (const r of rows) {
    const v = r.slice();
    const len = project(v, q);
    if (len > 0) q.push(v.map((x) => x / len));
  }
  const candidates = Array.from({ length: n }, (_, i) => {
    const v = new Float64Array(n);
    v[i] = 1;
    return { v, len: project(v.slice(), q) };
  }).sort((x, y) => y.len - x.len);
  for (const { v } of candidates) {
    if (basis.length + q.length >= n) break;
    const w = v.slice();
    const len = project(w, [...q, ...basis]);
    if (len > 1e-6) basis.push(w.map((x) => x / len));
  }
  return basis;
}

/**
 * Finite zeros of the transfer function from `input` ('duty' or a source) to `output`. With Markov
 * parameters h₀ = e, h_k = c·A^(k−1)·b and r the relative degree (the first significant h), the zeros are
 * the eigenvalues of the zero dynamics (Isidori, Nonlinear Control Systems, 3rd ed., Springer 1995, §4.3,
 * linear case): r = 0: A − b·c/e; r ≥ 1: K = A − b·(c·A^r)/h_r restricted to the null space of
 * [c; c·A; …; c·A^(r−1)], which K leaves invariant. An h_k is taken as zero when the zero it would place
 * lies beyond FAR_ZERO_FACTOR·‖A‖ (far above every natural frequency of the model: no loop sees it).
 */
export function findZeros(model: AveragedModel, input: string, output: string): Pole[] {
  const { n, a } = model;
  const k = model.outputNames.indexOf(output);
  if (k < 0) throw new SimulationError('invalid-netlist', `no output named '${output}'`);
  const { b, e } = inputOf(model, input, k);
  const c = model.c.slice(k * n, (k + 1) * n);
  const wRef = Math.max(norm1(a, n), 1e-300);
  // h[j] = c·A^(j−1)·b for j ≥ 1, h[0] = e; rows[j] = c·A^j
  const h = [e];
  const rows: Float64Array[] = [c];
  for (let j = 1; j <= n; j++) {
    h.push(dot(rows[j - 1], b));
    rows.push(rowTimes(rows[j - 1], a, n));
  }
  let r = -1;
  for (let j = 0; j <= n; j++) {
    if (h[j] === 0) continue;
    const next = j < n ? Math.abs(h[j + 1]) : 0;
    if (Math.abs(h[j]) * FAR_ZERO_FACTOR * wRef >= next) {
      r = j;
      break;
    }
  }
  if (r < 0) return [];
  const kMat = new Float64Array(n * n);
  const tail = r === 0 ? c : rows[r];
  for (let i = 0; i < n; i++)
    for (let j = 0; j < n; j++) kMat[i * n + j] = a[i * n + j] - (b[i] * tail[j]) / h[r];
  if (r === 0) return eigenvalues(kMat, n).map(describe);
  const z = complementBasis(rows.slice(0, r), n);
  const m = z.length;
  const reduced = new Float64Array(m * m);
  for (let p = 0; p < m; p++) {
    for (let q = 0; q < m; q++) {
      let s = 0;
      for (let i = 0; i < n; i++) {
        let ki = 0;
        for (let j = 0; j < n; j++) ki += kMat[i * n + j] * z[q][j];
        s += z[p][i] * ki;
      }
      reduced[p * m + q] = s;
    }
  }
  return eigenvalues(reduced, m).map(describe);
}

/**
 * The lowest right-half-plane zero of a transfer function (real, or the lower pair of a complex pair),
 * or undefined. Zeros with Re(s) below 1e-6·|s| are taken as on the axis, not in the right half plane.
 */
export function findRhpZero(model: AveragedModel, input: string, output: string): Pole | undefined {
  const rhp = findZeros(model, input, output).filter(
    (z) => z.re > 1e-6 * Math.hypot(z.re, z.im) && z.im >= 0,
  );
  return rhp.sort((x, y) => x.freqHz - y.freqHz)[0];
}
