import { DomainError } from '../errors';
import { requireCount, requireOpenUnit } from '../helpers/domain-guards';
import { brent } from '../numerics/brent';

function requireBelowShrinkage(adjustedRSquared: number, shrinkage: number): void {
  if (!(adjustedRSquared < shrinkage)) {
    throw new DomainError(
      'adjustedRSquared',
      adjustedRSquared,
      `a value below the shrinkage factor (${shrinkage}) for the closed form`,
    );
  }
}

/**
 * Raw (unrounded) n of the closed-form shrinkage criterion used for binary and time-to-event models:
 *   n = P / ((S − 1)·ln(1 − R²/S)).
 * For P = 25, R² = 0.2, S = 0.9 it gives 994.77 (→ 995), not the published 918 for a continuous
 * outcome; kept as the alternative form (METHODS.md 3.1 flag).
 * Domain: whole P ≥ 1, 0 < R² < S < 1; otherwise a DomainError (the log needs R² < S, METHODS.md 7b).
 * Source: DEV-BIN-SURV (criterion i). Accuracy: ~1e−15 relative.
 * @example closedFormShrinkageN(25, 0.2, 0.9) // 994.769786…
 */
export function closedFormShrinkageN(predictorParameters: number, adjustedRSquared: number, shrinkage: number): number {
  requireCount('predictorParameters', predictorParameters, 1);
  requireOpenUnit('adjustedRSquared', adjustedRSquared);
  requireOpenUnit('targetShrinkage', shrinkage);
  requireBelowShrinkage(adjustedRSquared, shrinkage);
  return predictorParameters / ((shrinkage - 1) * (Math.log(shrinkage - adjustedRSquared) - Math.log(shrinkage)));
}

/**
 * The shrinkage factor the closed form expects at a fixed n: the S in (R², 1) solving
 * n = P/((S − 1)·ln(1 − R²/S)) (the right side rises from 0 to ∞ as S goes from R² to 1), found by
 * Brent's method on [R² + 1e−12·(1 − R²), 1 − 1e−15·(1 − R²)]. When the root lies below that bracket
 * (R² near 1 at a small n) its lower end is returned, which is within 1e−12·(1 − R²) of the root.
 * Returns null only if Brent does not converge within 200 iterations.
 * Domain: whole P ≥ 1, 0 < R² < 1, whole n ≥ 1; otherwise a DomainError.
 * Source: DEV-BIN-SURV (the inverse of criterion i). Accuracy: |ΔS| < 1e−13.
 * @example closedFormShrinkageAtN(400, 24, 0.288) // 0.854111…
 */
export function closedFormShrinkageAtN(n: number, predictorParameters: number, adjustedRSquared: number): number | null {
  requireCount('predictorParameters', predictorParameters, 1);
  requireOpenUnit('adjustedRSquared', adjustedRSquared);
  requireCount('n', n, 1);
  const gap = 1 - adjustedRSquared;
  const f = (s: number): number => n * (s - 1) * (Math.log(s - adjustedRSquared) - Math.log(s)) - predictorParameters;
  const lower = adjustedRSquared + gap * 1e-12;
  if (f(lower) <= 0) return lower;
  const root = brent(f, lower, 1 - gap * 1e-15, 1e-14, 200);
  return root.converged ? root.root : null;
}
