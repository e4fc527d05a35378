import { expect } from 'vitest';

/**
 * The one numeric comparison helper: passes when |actual − expected| ≤ tolerance, and on failure
 * prints the label, the value, the expected value and the tolerance.
 */
export function expectClose(actual: number, expected: number, tolerance: number, label: string): void {
  const diff = Math.abs(actual - expected);
  expect(
    Number.isFinite(actual) && diff <= tolerance,
    `${label}: got ${actual}, expected ${expected} ± ${tolerance} (difference ${diff})`,
  ).toBe(true);
}
