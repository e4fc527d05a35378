import { normalQuantile } from '../numerics/distributions';
import { requireCount, requireFinite, requireOrdered } from './domain-guards';

/**
 * Wan et al. (2014) estimate of the SD from the quartiles q1, q3 and the sample size n:
 *   SD ≈ (q3 − q1) / η(n),  η(n) = 2Φ⁻¹((0.75n − 0.125)/(n + 0.25)).
 * Domain: finite q1 < q3, whole n ≥ 2 (η(1) = 0); otherwise a DomainError.
 * Source: WAN-2014 (assumes a normal outcome). Accuracy: that of Φ⁻¹ (~1e−15 relative).
 * @example wanSdFromIqr(20, 35, 100) // 11.283074…
 */
export function wanSdFromIqr(q1: number, q3: number, n: number): number {
  requireFinite('q1', q1);
  requireFinite('q3', q3);
  requireOrdered('q1', q1, 'q3', q3);
  requireCount('n', n, 2);
  return (q3 - q1) / (2 * normalQuantile((0.75 * n - 0.125) / (n + 0.25)));
}
