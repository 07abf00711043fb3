/**
 * Small dense linear algebra on row-major Float64Array matrices (n ≤ ~20): products, LU with partial
 * pivoting and solves. Deliberately plain loops: at these sizes they beat anything clever.
 */
import { SimulationError } from './errors.ts';

export function identity(n: number): Float64Array {
  const m = new Float64Array(n * n);
  for (let i = 0; i < n; i++) m[i * n + i] = 1;
  return m;
}

/** (rows×inner) · (inner×cols). */
export function matMul(
  a: Float64Array,
  b: Float64Array,
  rows: number,
  inner: number,
  cols: number,
): Float64Array {
  const out = new Float64Array(rows * cols);
  for (let i = 0; i < rows; i++) {
    const ro = i * cols;
    for (let k = 0; k < inner; k++) {
      const aik = a[i * inner + k];
      if (aik === 0) continue;
      const bo = k * cols;
      for (let j = 0; j < cols; j++) out[ro + j] += aik * b[bo + j];
    }
  }
  return out;
}

/** y = M·x for M (rows×cols). */
export function matVec(m: Float64Array, x: Float64Array, rows: number, cols: number): Float64Array {
  const y = new Float64Array(rows);
  for (let i = 0; i < rows; i++) {
    let s = 0;
    const o = i * cols;
    for (let j = 0; j < cols; j++) s += m[o + j] * x[j];
    y[i] = s;
  }
  return y;
}

/** Largest column sum of absolute values (the matrix 1-norm). */
export function norm1(m: Float64Array, n: number): number {
  let best = 0;
  for (let j = 0; j < n; j++) {
    let s = 0;
    for (let i = 0; i < n; i++) s += Math.abs(m[i * n + j]);
    if (s > best) best = s;
  }
  return best;
}

export function maxAbs(v: ArrayLike<number>): number {
  let m = 0;
  for (let i = 0; i < v.length; i++) m = Math.max(m, Math.abs(v[i]));
  return m;
}

export interface LuFactors {
  n: number;
  lu: Float64Array;
  piv: Int32Array;
  /** Smallest |pivot| over largest |pivot|: a cheap warning of near-singularity. */
  pivotRatio: number;
  /** Row (before pivoting) of the smallest pivot, to name what is singular. */
  weakestRow: number;
}

/** LU with partial pivoting of a copy of the n×n matrix. Never throws; check pivotRatio. */
export function luFactor(a: Float64Array, n: number): LuFactors {
  const lu = a.slice();
  const piv = new Int32Array(n);
  for (let i = 0; i < n; i++) piv[i] = i;
  let minPivot = Number.POSITIVE_INFINITY;
  let maxPivot = 0;
  let weakestRow = 0;
  for (let k = 0; k < n; k++) {
    let p = k;
    let best = Math.abs(lu[k * n + k]);
    for (let i = k + 1; i < n; i++) {
      const v = Math.abs(lu[i * n + k]);
      if (v > best) {
        best = v;
        p = i;
      }
    }
    if (p !== k) {
      for (let j = 0; j < n; j++) {
        const t = lu[k * n + j];
        lu[k * n + j] = lu[p * n + j];
        lu[p * n + j] = t;
      }
      const t = piv[k];
      piv[k] = piv[p];
      piv[p] = t;
    }
    if (best < minPivot) {
      minPivot = best;
      weakestRow = piv[k];
    }
    maxPivot = Math.max(maxPivot, best);
    if (best === 0) continue;
    const inv = 1 / lu[k * n + k];
    for (let i = k + 1; i < n; i++) {
      const f = lu[i * n + k] * inv;
      if (f === 0) continue;
      lu[i * n + k] = f;
      for (let j = k + 1; j < n; j++) lu[i * n + j] -= f * lu[k * n + j];
    }
  }
  const pivotRatio = n === 0 ? 1 : maxPivot === 0 ? 0 : minPivot / maxPivot;
  return { n, lu, piv, pivotRatio, weakestRow };
}

/** Solves A·X = B for B (n×cols), using the factors of A. */
export function luSolve(f: LuFactors, b: Float64Array, cols: number): Float64Array {
  const { n, lu, piv } = f;
  const x = new Float64Array(n * cols);
  for (let i = 0; i < n; i++) for (let j = 0; j < cols; j++) x[i * cols + j] = b[piv[i] * cols + j];
  for (let i = 0; i < n; i++) {
    for (let k = 0; k < i; k++) {
      const l = lu[i * n + k];
      if (l === 0) continue;
      for (let j = 0; j < cols; j++) x[i * cols + j] -= l * x[k * cols + j];
    }
  }
  for (let i = n - 1; i >= 0; i--) {
    for (let k = i + 1; k < n; k++) {
      const uik = lu[i * n + k];
      if (uik === 0) continue;
      for (let j = 0; j < cols; j++) x[i * cols + j] -= uik * x[k * cols + j];
    }
    const d = lu[i * n + i];
    for (let j = 0; j < cols; j++) x[i * cols + j] /= d;
  }
  return x;
}

/** Solves A·X = B and throws a SimulationError when A is singular to working precision. */
export function solveChecked(
  a: Float64Array,
  n: number,
  b: Float64Array,
  cols: number,
  what: string,
  minPivotRatio = 1e-14,
): Float64Array {
  const f = luFactor(a, n);
  if (!(f.pivotRatio > minPivotRatio)) {
    throw new SimulationError('ill-conditioned', `${what} is singular or ill-conditioned`, {
      pivotRatio: f.pivotRatio,
    });
  }
  return luSolve(f, b, cols);
}
