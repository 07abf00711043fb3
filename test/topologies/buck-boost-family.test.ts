/**
 * The closed-form CCM duty of the buck-boost family (inverting buck-boost, Ćuk, Zeta) against the
 * volt-second balance it solves, written out term by term as in the module header, and against the
 * ideal relation M = D/(1−D) (Erickson & Maksimović, Fundamentals of Power Electronics, 2nd ed.,
 * Springer 2001, ch. 2).
 */
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { newCcmDuty, solveCcmDuty } from '../../src/topologies/buck-boost-family.ts';

/** The duty problem with its inputs filled (the solver reads them from the object it writes to). */
function problem(
  vin: number,
  vo: number,
  vf: number,
  rr: number,
  rq: number,
  r1: number,
  r2: number,
  rb: number,
  iout: number,
) {
  const x = newCcmDuty();
  x.vinV = vin;
  x.voV = vo;
  x.vfV = vf;
  x.rrOhm = rr;
  x.rqOhm = rq;
  x.r1Ohm = r1;
  x.r2Ohm = r2;
  x.rBothOhm = rb;
  x.ioutA = iout;
  return x;
}

/** Residual of the header's balance D/(1−D) = (Vo + Vf + rr·Isw + R2·IL2 + Rb·Isw)/(Vin − R1·IL1 − (Rq + Rb)·Isw). */
function balanceResidual(
  d: number,
  vin: number,
  vo: number,
  vf: number,
  rr: number,
  rq: number,
  r1: number,
  r2: number,
  rb: number,
  iout: number,
): number {
  const isw = iout / (1 - d);
  const il1 = isw - iout;
  const lhs = (d / (1 - d)) * (vin - r1 * il1 - (rq + rb) * isw);
  const rhs = vo + vf + rr * isw + r2 * iout + rb * isw;
  return (lhs - rhs) / rhs;
}

describe('buck-boost family CCM duty (closed form)', () => {
  it('is D = Vo/(Vin + Vo) without drops', () => {
    const out = problem(12, 5, 0, 0, 0, 0, 0, 0, 2);
    solveCcmDuty(out);
    expect(out.converged).toBe(true);
    expect(out.duty).toBeCloseTo(5 / 17, 14);
  });

  it('satisfies the volt-second balance with every drop present', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 3, max: 60, noNaN: true }),
        fc.double({ min: 1, max: 60, noNaN: true }),
        fc.double({ min: 0, max: 0.8, noNaN: true }),
        fc.double({ min: 0, max: 0.05, noNaN: true }),
        fc.double({ min: 0, max: 0.05, noNaN: true }),
        fc.double({ min: 0, max: 0.05, noNaN: true }),
        fc.double({ min: 0, max: 0.05, noNaN: true }),
        fc.double({ min: 0, max: 0.05, noNaN: true }),
        fc.double({ min: 0.01, max: 5, noNaN: true }),
        (vin, vo, vf, rr, rq, r1, r2, rb, iout) => {
          const out = problem(vin, vo, vf, rr, rq, r1, r2, rb, iout);
          solveCcmDuty(out);
          if (!out.converged) return; // past the loss-limited peak ratio: checked below
          expect(out.duty).toBeGreaterThan(0);
          expect(out.duty).toBeLessThan(0.999);
          expect(Math.abs(balanceResidual(out.duty, vin, vo, vf, rr, rq, r1, r2, rb, iout))).toBeLessThan(
            1e-9,
          );
          // drops only ever ask for more duty than the ideal relation
          expect(out.duty).toBeGreaterThanOrEqual(vo / (vin + vo) - 1e-12);
        },
      ),
      { numRuns: 500 },
    );
  });

  it('takes the lower of the two balance roots (the one reached from the ideal duty)', () => {
    const out = problem(5, 12, 0.4, 0.02, 0.05, 0.03, 0.02, 0, 3);
    solveCcmDuty(out);
    expect(out.converged).toBe(true);
    // the same balance by plain fixed-point iteration from the ideal duty (slow reference)
    let d = 12 / 17;
    for (let i = 0; i < 10_000; i++) {
      const isw = 3 / (1 - d);
      const x = (12 + 0.4 + isw * 0.02 + 3 * 0.02) / (5 - (isw - 3) * 0.03 - isw * 0.05);
      d = x / (1 + x);
    }
    expect(out.duty).toBeCloseTo(d, 12);
  });

  it('reports no solution when the drops cap the conversion ratio below the one asked', () => {
    // 1 Ω in the switch path at 5 A from 5 V cannot make 48 V
    const out = problem(5, 48, 0.4, 0.05, 1, 0.1, 0.05, 0, 5);
    out.converged = true;
    solveCcmDuty(out);
    expect(out.converged).toBe(false);
    expect(out.duty).toBeLessThan(1);
  });
});
