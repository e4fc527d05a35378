import { DomainError } from '../errors';
import { wanSdFromIqr } from './wan-sd-from-iqr';
import { wanSdFromRange } from './wan-sd-from-range';

/**
 * Wan et al. (2014) estimate of the SD from the five-number summary (min a, q1, q3, max b) and n:
 *   SD ≈ (b − a)/(2ξ(n)) + (q3 − q1)/(2η(n)),  the mean of the range and IQR estimates.
 * Domain: a ≤ q1 < q3 ≤ b with a < b, whole n ≥ 2; otherwise a DomainError.
 * Source: WAN-2014. Accuracy: that of Φ⁻¹ (~1e−15 relative).
 * @example wanSdFromFiveNumbers(10, 20, 35, 50, 100) // 9.643793…
 */
export function wanSdFromFiveNumbers(min: number, q1: number, q3: number, max: number, n: number): number {
  const fromRange = wanSdFromRange(min, max, n);
  const fromIqr = wanSdFromIqr(q1, q3, n);
  if (q1 < min) throw new DomainError('q1', q1, `a number at least min (${min})`);
  if (q3 > max) throw new DomainError('q3', q3, `a number at most max (${max})`);
  return (fromRange + fromIqr) / 2;
}
