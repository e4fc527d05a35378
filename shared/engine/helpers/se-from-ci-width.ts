import { criticalZ } from './critical-z';
import { requirePositive } from './domain-guards';

/**
 * Target standard error from the total width W of a symmetric Wald confidence interval:
 *   SE* = W / (2z),  z = Φ⁻¹(1 − (1 − confidence)/2).
 * Domain: W > 0 and finite, 0 < confidence < 1; otherwise a DomainError. A huge W at a tiny level
 * can make SE* overflow to +Infinity: no precision is demanded, and the criteria treat it so.
 * Source: METHODS.md 1.1 (common practice for Wald intervals). Accuracy: that of Φ⁻¹ (~1e−15).
 * @example seFromCiWidth(0.1) // 0.0255106…
 */
export function seFromCiWidth(width: number, confidence = 0.95): number {
  requirePositive('width', width);
  return width / (2 * criticalZ(confidence));
}
