import { expect } from 'vitest';

/** Relative closeness: |actual − expected| ≤ relTol·|expected| (absolute when expected is 0). */
export function expectClose(actual: number, expected: number, relTol: number): void {
  const scale = expected === 0 ? 1 : Math.abs(expected);
  const err = Math.abs(actual - expected) / scale;
  expect(err, `${actual} should be within ${relTol} (relative) of ${expected}`).toBeLessThanOrEqual(relTol);
}
