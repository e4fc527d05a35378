import { requireMinMedianMax } from './require-min-median-max';

/**
 * Hozo et al. (2005) estimate of the variance from the minimum a, the median m and the maximum b:
 *   var ≈ [ (a − 2m + b)²/4 + (b − a)² ] / 12.
 * Domain: finite a ≤ m ≤ b with a < b; otherwise a DomainError.
 * Source: HOZO-2005. Exact arithmetic up to rounding.
 * @example Math.sqrt(hozoVariance(0, 4, 10)) // 2.901149…
 */
export function hozoVariance(min: number, median: number, max: number): number {
  requireMinMedianMax(min, median, max);
  return ((min - 2 * median + max) ** 2 / 4 + (max - min) ** 2) / 12;
}
