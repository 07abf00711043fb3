/**
 * Matrix exponential by Padé approximation with scaling and squaring (Higham, "The scaling and squaring
 * method for the matrix exponential revisited", SIAM J. Matrix Anal. Appl. 26(4), 2005): pick the lowest
 * Padé degree m ∈ {3, 5, 7, 9, 13} whose θ_m bounds the 1-norm, else scale A by 2^−s into θ_13 and square
 * s times. Backward error ≤ unit roundoff for every degree.
 */
import { luFactor, luSolve, norm1 } from './dense.ts';
import { SimulationError } from './errors.ts';

// Padé numerator coefficients b_k and norm bounds θ_m (Higham 2005, Table 2.3 and eq. 2.5).
const PADE: Record<number, number[]> = {
  3: [120, 60, 12, 1],
  5: [30240, 15120, 3360, 420, 30, 1],
  7: [17297280, 8648640, 1995840, 277200, 25200, 1512, 56, 1],
  9: [17643225600, 8821612800, 2075673600, 302702400, 30270240, 2162160, 110880, 3960, 90, 1],
  13: [
    64764752532480000, 32382376266240000, 7771770303897600, 1187353796428800, 129060195264000, 10559470521600,
    670442572800, 33522128640, 1323241920, 40840800, 960960, 16380, 182, 1,
  ],
};
const THETA: [number, number][] = [
  [3, 1.495585217958292e-2],
  [5, 2.53939833006323e-1],
  [7, 9.504178996162932e-1],
  [9, 2.097847961257068],
];
const THETA_13 = 5.371920351148152;

function addScaled(acc: Float64Array, m: Float64Array, s: number): void {
  for (let i = 0; i < acc.length; i++) acc[i] += s * m[i];
}

/** out = a·b for n×n matrices; out must not alias a or b. */
function mulInto(out: Float64Array, a: Float64Array, b: Float64Array, n: number): void {
  for (let i = 0; i < n; i++) {
    const io = i * n;
    for (let j = 0; j < n; j++) {
      let s = 0;
      for (let k = 0; k < n; k++) s += a[io + k] * b[k * n + j];
      out[io + j] = s;
    }
  }
}

/** U and V of the degree-m Padé approximant r_m = (V − U)⁻¹(V + U): U holds the odd powers, V the even. */
function padeUV(a: Float64Array, n: number, m: number): { u: Float64Array; v: Float64Array } {
  const b = PADE[m];
  const nn = n * n;
  const a2 = new Float64Array(nn);
  mulInto(a2, a, a, n);
  const w = new Float64Array(nn);
  const v = new Float64Array(nn);
  const u = new Float64Array(nn);
  if (m === 13) {
    const a4 = new Float64Array(nn);
    const a6 = new Float64Array(nn);
    mulInto(a4, a2, a2, n);
    mulInto(a6, a4, a2, n);
    const t = new Float64Array(nn);
    for (let i = 0; i < nn; i++) t[i] = b[13] * a6[i] + b[11] * a4[i] + b[9] * a2[i];
    mulInto(w, a6, t, n);
    for (let i = 0; i < nn; i++) w[i] += b[7] * a6[i] + b[5] * a4[i] + b[3] * a2[i];
    for (let i = 0; i < nn; i++) t[i] = b[12] * a6[i] + b[10] * a4[i] + b[8] * a2[i];
    mulInto(v, a6, t, n);
    for (let i = 0; i < nn; i++) v[i] += b[6] * a6[i] + b[4] * a4[i] + b[2] * a2[i];
  } else {
    // Accumulate the even powers A^2, A^4, ..., A^(m−1) into W (odd part) and V (even part).
    let p = a2;
    for (let k = 1; 2 * k <= m - 1; k++) {
      addScaled(w, p, b[2 * k + 1]);
      addScaled(v, p, b[2 * k]);
      if (2 * k + 2 <= m - 1) {
        const next = new Float64Array(nn);
        mulInto(next, p, a2, n);
        p = next;
      }
    }
  }
  for (let i = 0; i < n; i++) {
    w[i * n + i] += b[1];
    v[i * n + i] += b[0];
  }
  mulInto(u, a, w, n);
  return { u, v };
}

/** exp(A) of an n×n row-major matrix. */
export function expm(a: Float64Array, n: number): Float64Array {
  if (n === 0) return new Float64Array(0);
  const nrm = norm1(a, n);
  if (!Number.isFinite(nrm)) {
    throw new SimulationError('ill-conditioned', 'matrix exponential of a non-finite matrix', { norm: nrm });
  }
  let degree = 13;
  let s = 0;
  const fit = THETA.find(([, theta]) => nrm <= theta);
  if (fit) degree = fit[0];
  else s = Math.max(0, Math.ceil(Math.log2(nrm / THETA_13)));
  const scale = 2 ** -s;
  const scaled = s === 0 ? a : a.map((x) => x * scale);
  const { u, v } = padeUV(scaled, n, degree);
  const p = new Float64Array(n * n); // V − U
  const q = new Float64Array(n * n); // V + U
  for (let i = 0; i < n * n; i++) {
    p[i] = v[i] - u[i];
    q[i] = v[i] + u[i];
  }
  let r: Float64Array = luSolve(luFactor(p, n), q, n);
  let spare: Float64Array = p;
  for (let k = 0; k < s; k++) {
    mulInto(spare, r, r, n);
    const t = r;
    r = spare;
    spare = t;
  }
  return r;
}

/** The exact one-step maps of ẋ = A·x + B·u with u constant over h: x(h) = Φ·x(0) + Γ·u. */
export interface StepMaps {
  /** Φ = exp(A·h), n×n. */
  phi: Float64Array;
  /** Γ = ∫₀ʰ exp(A·τ) dτ · B, n×m. */
  gamma: Float64Array;
}

/**
 * Φ and Γ together from one exponential of the augmented matrix [[A, B], [0, 0]]·h, whose top-left block
 * is exp(A·h) and top-right block is ∫₀ʰ exp(A·τ)dτ·B (Van Loan, "Computing integrals involving the
 * matrix exponential", IEEE Trans. Automatic Control 23(3), 1978). Needs no inverse of A, so it holds for
 * singular A (integrators) too.
 */
export function stepMaps(a: Float64Array, b: Float64Array, n: number, m: number, h: number): StepMaps {
  const k = n + m;
  const aug = new Float64Array(k * k);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) aug[i * k + j] = a[i * n + j] * h;
    for (let j = 0; j < m; j++) aug[i * k + n + j] = b[i * m + j] * h;
  }
  const e = expm(aug, k);
  const phi = new Float64Array(n * n);
  const gamma = new Float64Array(n * m);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) phi[i * n + j] = e[i * k + j];
    for (let j = 0; j < m; j++) gamma[i * m + j] = e[i * k + n + j];
  }
  return { phi, gamma };
}
