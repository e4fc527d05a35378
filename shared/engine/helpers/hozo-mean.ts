import { requireMinMedianMax } from './require-min-median-max';

/**
 * Hozo et al. (2005) estimate of the mean from the minimum a, the median m and the maximum b:
 *   mean ≈ (a + 2m + b) / 4.
 * Domain: finite a ≤ m ≤ b with a < b; otherwise a DomainError.
 * Source: HOZO-2005. Exact arithmetic up to rounding; the estimate itself is rough (no
 * distributional assumption).
 * @example hozoMean(0, 5, 10) // 5
 */
export function hozoMean(min: number, median: number, max: number): number {
  requireMinMedianMax(min, median, max);
  return (min + 2 * median + max) / 4;
}
