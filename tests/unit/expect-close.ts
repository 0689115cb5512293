import { expect } from 'vitest';

/**
 * Relative closeness, the one tolerance check of the unit tests: |actual − expected| ≤ tolerance
 * times |expected| (times 1 when expected is 0). `absoluteBelow` makes the tolerance absolute for
 * expected values smaller than it, where a relative one would ask for more digits than there are.
 * `what` names the value in the failure. A missing actual (null, undefined) fails.
 */
export function expectClose(
  actual: number | null | undefined,
  expected: number,
  tolerance: number,
  { what = '', absoluteBelow = 0 }: { what?: string; absoluteBelow?: number } = {},
): void {
  expect(typeof actual, `${what} is a number`.trim()).toBe('number');
  const scale = Math.max(Math.abs(expected), absoluteBelow) || 1;
  const error = Math.abs((actual as number) - expected) / scale;
  expect(error, `${what} ${actual} should be within ${tolerance} (relative) of ${expected}`.trim()).toBeLessThanOrEqual(tolerance);
}
