/**
 * Eigenvalues of a small real non-symmetric matrix: balancing, reduction to upper Hessenberg form by
 * stabilised elimination, then the Francis double-shift QR iteration (the EISPACK routines balanc,
 * elmhes and hqr; Wilkinson & Reinsch, Handbook for Automatic Computation, vol. II: Linear Algebra,
 * Springer 1971). Circuit matrices mix 1/L ≈ 1e5 and R/L ≈ 1e3 with ESR poles near 1e8 s⁻¹: balancing
 * first keeps the small eigenvalues accurate.
 */
import { SimulationError } from './errors.ts';

export interface Complex {
  re: number;
  im: number;
}

/** Rows as arrays, 1-based like the published algorithm (row 0 and column 0 unused). */
type Mat = number[][];

function toMat(a: ArrayLike<number>, n: number): Mat {
  const m: Mat = [new Array<number>(n + 1).fill(0)];
  for (let i = 0; i < n; i++) {
    const row = new Array<number>(n + 1).fill(0);
    for (let j = 0; j < n; j++) row[j + 1] = a[i * n + j];
    m.push(row);
  }
  return m;
}

/** Similarity scaling by powers of 2 so each row and column have comparable norms (exact in floating point). */
function balance(a: Mat, n: number): void {
  const radix = 2;
  const sq = radix * radix;
  let done = false;
  while (!done) {
    done = true;
    for (let i = 1; i <= n; i++) {
      let r = 0;
      let c = 0;
      for (let j = 1; j <= n; j++) {
        if (j === i) continue;
        c += Math.abs(a[j][i]);
        r += Math.abs(a[i][j]);
      }
      if (c === 0 || r === 0) continue;
      let g = r / radix;
      let f = 1;
      const s = c + r;
      while (c < g) {
        f *= radix;
        c *= sq;
      }
      g = r * radix;
      while (c > g) {
        f /= radix;
        c /= sq;
      }
      if ((c + r) / f < 0.95 * s) {
        done = false;
        g = 1 / f;
        for (let j = 1; j <= n; j++) a[i][j] *= g;
        for (let j = 1; j <= n; j++) a[j][i] *= f;
      }
    }
  }
}

/** Upper Hessenberg form by Gaussian elimination with pivoting (a similarity transform). */
function hessenberg(a: Mat, n: number): void {
  for (let m = 2; m < n; m++) {
    let x = 0;
    let i = m;
    for (let j = m; j <= n; j++) {
      if (Math.abs(a[j][m - 1]) > Math.abs(x)) {
        x = a[j][m - 1];
        i = j;
      }
    }
    if (i !== m) {
      for (let j = m - 1; j <= n; j++) [a[i][j], a[m][j]] = [a[m][j], a[i][j]];
      for (let j = 1; j <= n; j++) [a[j][i], a[j][m]] = [a[j][m], a[j][i]];
    }
    if (x === 0) continue;
    for (i = m + 1; i <= n; i++) {
      let y = a[i][m - 1];
      if (y === 0) continue;
      y /= x;
      a[i][m - 1] = 0;
      for (let j = m; j <= n; j++) a[i][j] -= y * a[m][j];
      for (let j = 1; j <= n; j++) a[j][m] += y * a[j][i];
    }
  }
}

const sign = (a: number, b: number) => (b >= 0 ? Math.abs(a) : -Math.abs(a));

/** Francis double-shift QR on an upper Hessenberg matrix (destroys it). */
function hqr(a: Mat, n: number): Complex[] {
  const wr = new Array<number>(n + 1).fill(0);
  const wi = new Array<number>(n + 1).fill(0);
  let anorm = 0;
  for (let i = 1; i <= n; i++) for (let j = Math.max(i - 1, 1); j <= n; j++) anorm += Math.abs(a[i][j]);
  let nn = n;
  let t = 0;
  let p = 0;
  let q = 0;
  let r = 0;
  let s = 0;
  let w = 0;
  let x = 0;
  let y = 0;
  let z = 0;
  while (nn >= 1) {
    let its = 0;
    let l: number;
    do {
      for (l = nn; l >= 2; l--) {
        s = Math.abs(a[l - 1][l - 1]) + Math.abs(a[l][l]);
        if (s === 0) s = anorm;
        if (Math.abs(a[l][l - 1]) + s === s) {
          a[l][l - 1] = 0;
          break;
        }
      }
      x = a[nn][nn];
      if (l === nn) {
        wr[nn] = x + t;
        wi[nn--] = 0;
      } else {
        y = a[nn - 1][nn - 1];
        w = a[nn][nn - 1] * a[nn - 1][nn];
        if (l === nn - 1) {
          p = 0.5 * (y - x);
          q = p * p + w;
          z = Math.sqrt(Math.abs(q));
          x += t;
          if (q >= 0) {
            z = p + sign(z, p);
            wr[nn - 1] = wr[nn] = x + z;
            if (z !== 0) wr[nn] = x - w / z;
            wi[nn - 1] = wi[nn] = 0;
          } else {
            wr[nn - 1] = wr[nn] = x + p;
            wi[nn] = z;
            wi[nn - 1] = -z;
          }
          nn -= 2;
        } else {
          if (its === 60) {
            throw new SimulationError(
              'ill-conditioned',
              'simulation could not settle: eigenvalue iteration did not converge',
            );
          }
          if (its === 10 || its === 20 || its === 40) {
            // exceptional shift
            t += x;
            for (let i = 1; i <= nn; i++) a[i][i] -= x;
            s = Math.abs(a[nn][nn - 1]) + Math.abs(a[nn - 1][nn - 2]);
            y = x = 0.75 * s;
            w = -0.4375 * s * s;
          }
          ++its;
          let m: number;
          for (m = nn - 2; m >= l; m--) {
            z = a[m][m];
            r = x - z;
            s = y - z;
            p = (r * s - w) / a[m + 1][m] + a[m][m + 1];
            q = a[m + 1][m + 1] - z - r - s;
            r = a[m + 2][m + 1];
            s = Math.abs(p) + Math.abs(q) + Math.abs(r);
            p /= s;
            q /= s;
            r /= s;
            if (m === l) break;
            const u = Math.abs(a[m][m - 1]) * (Math.abs(q) + Math.abs(r));
            const v = Math.abs(p) * (Math.abs(a[m - 1][m - 1]) + Math.abs(z) + Math.abs(a[m + 1][m + 1]));
            if (u + v === v) break;
          }
          for (let i = m + 2; i <= nn; i++) {
            a[i][i - 2] = 0;
            if (i !== m + 2) a[i][i - 3] = 0;
          }
          for (let k = m; k <= nn - 1; k++) {
            if (k !== m) {
              p = a[k][k - 1];
              q = a[k + 1][k - 1];
              r = 0;
              if (k !== nn - 1) r = a[k + 2][k - 1];
              x = Math.abs(p) + Math.abs(q) + Math.abs(r);
              if (x !== 0) {
                p /= x;
                q /= x;
                r /= x;
              }
            }
            s = sign(Math.sqrt(p * p + q * q + r * r), p);
            if (s === 0) continue;
            if (k === m) {
              if (l !== m) a[k][k - 1] = -a[k][k - 1];
            } else a[k][k - 1] = -s * x;
            p += s;
            x = p / s;
            y = q / s;
            z = r / s;
            q /= p;
            r /= p;
            for (let j = k; j <= nn; j++) {
              p = a[k][j] + q * a[k + 1][j];
              if (k !== nn - 1) {
                p += r * a[k + 2][j];
                a[k + 2][j] -= p * z;
              }
              a[k + 1][j] -= p * y;
              a[k][j] -= p * x;
            }
            const mmin = Math.min(nn, k + 3);
            for (let i = l; i <= mmin; i++) {
              p = x * a[i][k] + y * a[i][k + 1];
              if (k !== nn - 1) {
                p += z * a[i][k + 2];
                a[i][k + 2] -= p * r;
              }
              a[i][k + 1] -= p * q;
              a[i][k] -= p;
            }
          }
        }
      }
    } while (l < nn - 1);
  }
  const out: Complex[] = [];
  for (let i = 1; i <= n; i++) out.push({ re: wr[i], im: wi[i] });
  return out;
}

/** Eigenvalues of the real n×n matrix `a` (row-major), in no particular order; conjugate pairs adjacent. */
export function eigenvalues(a: ArrayLike<number>, n: number): Complex[] {
  if (n === 0) return [];
  for (let i = 0; i < n * n; i++) {
    if (!Number.isFinite(a[i])) {
      throw new SimulationError(
        'ill-conditioned',
        'simulation could not settle: a matrix entry is not finite',
      );
    }
  }
  const m = toMat(a, n);
  balance(m, n);
  hessenberg(m, n);
  return hqr(m, n);
}
