/**
 * The iGSE triangle form against the general piecewise-linear sum it is derived from (fast against slow
 * obvious). iGSE: Venkatachalam, Sullivan, Abdallah & Tacca, "Accurate prediction of ferrite core loss
 * with nonsinusoidal waveforms using only Steinmetz parameters", IEEE COMPEL 2002: for piecewise-linear
 * flux Pv = ki·ΔB^(β−α)·Σⱼ fⱼ·|ΔBⱼ·fsw/fⱼ|^α; with two segments of ±ΔB this is
 * ki·fsw^α·ΔB^β·(f₀^(1−α) + f₁^(1−α)) (derived here, exact up to rounding).
 */
import fc from 'fast-check';
import { describe, it } from 'vitest';
import { igseKi, igseLossDensity, igseTriangleLossDensity } from '../../src/parts/inductor.ts';
import type { CoreMaterial } from '../../src/parts/technology.ts';
import { expectClose } from '../support/expect-close.ts';

/** Rounding of a handful of log/exp evaluations: far below any engineering tolerance. */
const RTOL_ROUNDING = 1e-13;

const material = fc.record({
  name: fc.constant('test ferrite'),
  k: fc.double({ min: 0.1, max: 100, noNaN: true }),
  // 1.5 exactly takes the square-root path of the triangle form
  alpha: fc.oneof(fc.constant(1.5), fc.double({ min: 1.05, max: 1.9, noNaN: true })),
  beta: fc.double({ min: 2, max: 3, noNaN: true }),
  bMaxT: fc.constant(0.3),
});

describe('iGSE core loss of a triangular flux', () => {
  it('equals the general two-segment sum, for any material, swing, duty and frequency', () => {
    fc.assert(
      fc.property(
        material,
        fc.double({ min: 1e-4, max: 0.5, noNaN: true }),
        fc.double({ min: 0.01, max: 0.99, noNaN: true }),
        fc.double({ min: 2e4, max: 3e6, noNaN: true }),
        (m: CoreMaterial, dB, duty, fsw) => {
          const slow = igseLossDensity(m, fsw, dB, 2, [duty, 1 - duty], [dB, -dB]);
          // call twice: the second call takes the cached ki·fsw^α and fraction term
          igseTriangleLossDensity(m, fsw, dB, duty, 1 - duty);
          const fast = igseTriangleLossDensity(m, fsw, dB, duty, 1 - duty);
          expectClose(fast, slow, { rtol: RTOL_ROUNDING, what: 'Pv (W/m³)' });
        },
      ),
    );
  });

  it('does not reuse cached terms across materials, frequencies or duties', () => {
    const a: CoreMaterial = { name: 'a', k: 2, alpha: 1.4, beta: 2.5, bMaxT: 0.3 };
    const b: CoreMaterial = { ...a, name: 'b', alpha: 1.6 };
    const cases: [CoreMaterial, number, number][] = [
      [a, 200e3, 0.3],
      [a, 400e3, 0.3],
      [b, 400e3, 0.3],
      [b, 400e3, 0.6],
      [a, 200e3, 0.3],
    ];
    for (const [m, fsw, duty] of cases) {
      const slow = igseLossDensity(m, fsw, 0.1, 2, [duty, 1 - duty], [0.1, -0.1]);
      expectClose(igseTriangleLossDensity(m, fsw, 0.1, duty, 1 - duty), slow, {
        rtol: RTOL_ROUNDING,
        what: `${m.name} at ${fsw} Hz, D = ${duty}`,
      });
    }
  });

  it('general piecewise sum equals the published iGSE sum written with **, for α = 1.5 and any other α', () => {
    // Venkatachalam et al. 2002: Pv = ki·ΔB^(β−α)·Σⱼ fⱼ·|ΔBⱼ·fsw/fⱼ|^α, evaluated term by term here; the
    // engine takes a square root for α = 1.5 and exp/log otherwise
    fc.assert(
      fc.property(
        material,
        fc.array(fc.double({ min: 0.05, max: 1, noNaN: true }), { minLength: 3, maxLength: 4 }),
        fc.array(fc.double({ min: -0.2, max: 0.2, noNaN: true }), { minLength: 3, maxLength: 4 }),
        fc.double({ min: 2e4, max: 3e6, noNaN: true }),
        (m: CoreMaterial, weights, swings, fsw) => {
          const n = Math.min(weights.length, swings.length);
          const total = weights.slice(0, n).reduce((a, b) => a + b, 0);
          const f = weights.slice(0, n).map((x) => x / total);
          // a closed flux loop: the last swing returns what the others moved
          const dB = swings.slice(0, n);
          dB[n - 1] = -dB.slice(0, n - 1).reduce((a, b) => a + b, 0);
          let b = 0;
          let hi = 0;
          let lo = 0;
          for (const x of dB) {
            b += x;
            hi = Math.max(hi, b);
            lo = Math.min(lo, b);
          }
          const pp = hi - lo;
          if (!(pp > 1e-6)) return;
          let sum = 0;
          for (let j = 0; j < n; j++) sum += f[j] * Math.abs((dB[j] * fsw) / f[j]) ** m.alpha;
          const expected = igseKi(m) * pp ** (m.beta - m.alpha) * sum;
          expectClose(igseLossDensity(m, fsw, pp, n, f, dB), expected, {
            rtol: RTOL_ROUNDING,
            what: 'Pv (W/m³)',
          });
        },
      ),
    );
  });
});
