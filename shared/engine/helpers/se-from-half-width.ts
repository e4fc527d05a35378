import { criticalZ } from './critical-z';
import { requirePositive } from './domain-guards';

/**
 * Target standard error from a half-width (margin) δ of a symmetric Wald interval: SE* = δ / z.
 * Domain: δ > 0 and finite, 0 < confidence < 1; otherwise a DomainError.
 * Source: METHODS.md 1.3 (common practice). Accuracy: that of Φ⁻¹ (~1e−15).
 * @example seFromHalfWidth(0.0953102) // 0.0486285…
 */
export function seFromHalfWidth(halfWidth: number, confidence = 0.95): number {
  requirePositive('halfWidth', halfWidth);
  return halfWidth / criticalZ(confidence);
}
