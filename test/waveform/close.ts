import { expect } from 'vitest';

/** |actual − expected| ≤ rtol·|expected| + atol, with both numbers in the failure message. */
export function expectClose(
  actual: number,
  expected: number,
  tol: { rtol?: number; atol?: number },
  what = '',
): void {
  const bound = (tol.rtol ?? 0) * Math.abs(expected) + (tol.atol ?? 0);
  const err = Math.abs(actual - expected);
  expect(err <= bound, `${what}: actual ${actual}, expected ${expected}, |error| ${err} > ${bound}`).toBe(
    true,
  );
}
