import { normalQuantile } from '../numerics/distributions';
import { requireFinite, requireOrdered } from './domain-guards';

/**
 * SD of a normal outcome from its quartiles: SD = (q3 − q1) / (2Φ⁻¹(0.75)) = IQR / 1.34898.
 * Domain: finite q1 < q3; otherwise a DomainError. Assumes normality (for a skewed outcome use
 * logNormalFromQuartiles). Common practice (the normal IQR is 1.34898 SD). Accuracy ~1e−15 relative.
 * @example sdFromIqr(10, 20) // 7.413011…
 */
export function sdFromIqr(q1: number, q3: number): number {
  requireFinite('q1', q1);
  requireFinite('q3', q3);
  requireOrdered('q1', q1, 'q3', q3);
  return (q3 - q1) / (2 * normalQuantile(0.75));
}
