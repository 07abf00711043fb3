import fc from 'fast-check';
import { expm as mathExpm, matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { identity, luFactor, luSolve, matMul } from '../../src/waveform/dense.ts';
import { expm, stepMaps } from '../../src/waveform/expm.ts';
import { expectClose } from './close.ts';

const toRows = (a: Float64Array, n: number) =>
  Array.from({ length: n }, (_, i) => Array.from(a.subarray(i * n, (i + 1) * n)));

/** Reference: mathjs's expm (its own Padé implementation). Agreement to 1e-9 relative to ‖exp(A)‖. */
const RTOL_VS_MATHJS = 1e-9;

function compareWithMathjs(a: Float64Array, n: number): void {
  const ours = expm(a, n);
  const ref = (mathExpm(matrix(toRows(a, n))).toArray() as number[][]).flat();
  const scale = Math.max(...ref.map(Math.abs));
  ref.forEach((r, i) => {
    expectClose(ours[i], r, { atol: RTOL_VS_MATHJS * scale }, `entry ${i}`);
  });
}

describe('expm', () => {
  it('matches mathjs on random matrices across every Padé degree and with scaling', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 8 }),
        fc.double({ min: -6, max: 1.5, noNaN: true }),
        fc.array(fc.double({ min: -1, max: 1, noNaN: true }), { minLength: 64, maxLength: 64 }),
        (n, log10Norm, entries) => {
          const a = Float64Array.from(entries.slice(0, n * n)).map((v) => v * 10 ** log10Norm);
          compareWithMathjs(a, n);
        },
      ),
      { numRuns: 150 },
    );
  });

  it('gives the rotation matrix for a lossless oscillator (exp of [[0, ω], [−ω, 0]]·t; common practice)', () => {
    const wt = 37.3; // many turns: exercises scaling and squaring
    const e = expm(Float64Array.from([0, wt, -wt, 0]), 2);
    expectClose(e[0], Math.cos(wt), { atol: 1e-12 }, 'cos');
    expectClose(e[1], Math.sin(wt), { atol: 1e-12 }, 'sin');
  });

  it('decays a stiff mode to zero without overflow (eigenvalue −1e5 over one step)', () => {
    const e = expm(Float64Array.from([-1e5, 0, 1, -1]), 2);
    expect(e.every(Number.isFinite)).toBe(true);
    expectClose(e[0], 0, { atol: 1e-300 }, 'stiff mode');
    // 17 squarings amplify roundoff: 1e-10 relative is what double precision gives here.
    expectClose(e[3], Math.exp(-1), { rtol: 1e-10 }, 'slow mode');
  });
});

describe('stepMaps', () => {
  it('gives Γ = A⁻¹(Φ − I)B for an invertible A (Van Loan 1978; closed form, common practice)', () => {
    const n = 3;
    const m = 2;
    const a = Float64Array.from([-2, 1, 0, -1, -3, 0.5, 0.2, 0, -0.7]);
    const b = Float64Array.from([1, 0, 0, 2, -1, 0.5]);
    const h = 0.8;
    const { phi, gamma } = stepMaps(a, b, n, m, h);
    const phiRef = expm(
      a.map((v) => v * h),
      n,
    );
    const phiMinusI = phiRef.map((v, i) => v - identity(n)[i]);
    const ref = luSolve(luFactor(a, n), matMul(phiMinusI, b, n, n, m), m);
    phi.forEach((v, i) => {
      expectClose(v, phiRef[i], { rtol: 1e-13, atol: 1e-15 }, `Φ ${i}`);
    });
    gamma.forEach((v, i) => {
      expectClose(v, ref[i], { rtol: 1e-12, atol: 1e-14 }, `Γ ${i}`);
    });
  });

  it('integrates a pure integrator exactly (A = 0 ⇒ Γ = h·B)', () => {
    const { phi, gamma } = stepMaps(new Float64Array(1), Float64Array.from([3]), 1, 1, 2.5);
    expect(phi[0]).toBe(1);
    expectClose(gamma[0], 7.5, { rtol: 1e-15 }, 'h·B');
  });
});
