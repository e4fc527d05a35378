import { DomainError } from '../errors';
import { requireNonZero, requireOpenUnit, requirePositive } from '../helpers/domain-guards';

/**
 * Variance of Y − Ŷ in the validation population, which sets the precision of CITL (the mean of
 * Y − Ŷ). With Y = a + β·Ŷ + e and R² = corr(Y, Ŷ)², var(Ŷ) = R²·var(Y)/β² and var(e) = var(Y)(1 − R²):
 *   σ²_CITL = (β − 1)²·var(Ŷ) + var(Y)(1 − R²).
 * With β = 1 this is var(Y)(1 − R²).
 * Domain: var(Y) > 0 finite, 0 < R² < 1, β ≠ 0 finite, and a result that fits in a double;
 * otherwise a DomainError. (It is positive; subnormal inputs can underflow it to 0.)
 * Source: METHODS.md 2.2 [DERIVED] for VAL-CONT criterion 2. Accuracy: a few ulps.
 * @example citlResidualVariance(100, 0.8, 0.9) // 20.987654…
 */
export function citlResidualVariance(outcomeVariance: number, rSquared: number, slope: number): number {
  requirePositive('outcomeVariance', outcomeVariance);
  requireOpenUnit('rSquaredCitl', rSquared);
  requireNonZero('slope', slope);
  const predictionVariance = (rSquared * outcomeVariance) / (slope * slope);
  const variance = (slope - 1) ** 2 * predictionVariance + outcomeVariance * (1 - rSquared);
  if (!Number.isFinite(variance)) {
    throw new DomainError(
      'outcomeVariance',
      outcomeVariance,
      'a value for which var(Y − Ŷ) is finite (too large for this slope)',
    );
  }
  return variance;
}
