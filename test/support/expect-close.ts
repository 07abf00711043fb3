/** Relative-tolerance comparison that names what is compared (python-control style). */
import { expect } from 'vitest';

export function expectClose(
  actual: number,
  expected: number,
  opts: { rtol?: number; atol?: number; what?: string } = {},
): void {
  const rtol = opts.rtol ?? 1e-9;
  const atol = opts.atol ?? 0;
  const tol = Math.max(atol, rtol * Math.abs(expected));
  const ok = Number.isFinite(actual) && Math.abs(actual - expected) <= tol;
  expect(
    ok,
    `${opts.what ?? 'value'}: got ${actual}, expected ${expected} ± ${tol} (rtol ${rtol}, atol ${atol})`,
  ).toBe(true);
}
