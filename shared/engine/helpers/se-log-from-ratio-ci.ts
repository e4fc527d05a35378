import { criticalZ } from './critical-z';
import { requireOrdered, requirePositive } from './domain-guards';

/**
 * Target SE on the log scale for a ratio measure (O/E, a residual SD) whose CI has total width W
 * centred at 1: e^{zs} − e^{−zs} = W gives s = asinh(W/2)/z.
 * Domain: W > 0 finite, 0 < confidence < 1; otherwise a DomainError.
 * Source: METHODS.md 1.2 (common practice: ratio measures are handled on the log scale).
 * Accuracy ~1e−15 relative.
 * @example seLogFromRatioCiWidth(0.2) // 0.050937…
 */
export function seLogFromRatioCiWidth(width: number, confidence = 0.95): number {
  requirePositive('width', width);
  return Math.asinh(width / 2) / criticalZ(confidence);
}

/**
 * Target SE on the log scale for a ratio measure from the CI limits (L, U) the user accepts:
 * s = (ln U − ln L)/(2z). Domain: 0 < L < U finite; otherwise a DomainError.
 * Source: METHODS.md 1.2 (common practice). Accuracy ~1e−15 relative.
 * @example seLogFromRatioLimits(0.9, 1.1) // 0.051192…
 */
export function seLogFromRatioLimits(lower: number, upper: number, confidence = 0.95): number {
  requirePositive('lower', lower);
  requirePositive('upper', upper);
  requireOrdered('lower', lower, 'upper', upper);
  return (Math.log(upper) - Math.log(lower)) / (2 * criticalZ(confidence));
}
