import { normalQuantile } from '../numerics/distributions';
import { requireCount, requireFinite, requireOrdered } from './domain-guards';

/**
 * Wan et al. (2014) estimate of the SD from the minimum a, the maximum b and the sample size n:
 *   SD ≈ (b − a) / ξ(n),  ξ(n) = 2Φ⁻¹((n − 0.375)/(n + 0.25)).
 * Domain: finite a < b, whole n ≥ 2 (ξ(1) = 0); otherwise a DomainError.
 * Source: WAN-2014 (assumes a normal outcome). Accuracy: that of Φ⁻¹ (~1e−15 relative).
 * @example wanSdFromRange(10, 50, 100) // 8.004513…
 */
export function wanSdFromRange(min: number, max: number, n: number): number {
  requireFinite('min', min);
  requireFinite('max', max);
  requireOrdered('min', min, 'max', max);
  requireCount('n', n, 2);
  return (max - min) / (2 * normalQuantile((n - 0.375) / (n + 0.25)));
}
