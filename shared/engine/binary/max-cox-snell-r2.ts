import { formatSignificant } from '../../format/numbers';
import { DomainError } from '../errors';
import { requireOutcomeProportion } from './require-binary-domain';

/**
 * Null-model log-likelihood per participant for a binary outcome with proportion phi:
 *   ln L_null / n = phi·ln(phi) + (1 − phi)·ln(1 − phi)
 * Domain: 0 < phi < 1; otherwise DomainError. Source: DEV-BIN-SURV (METHODS 4 (ii)). Exact.
 * @example nullLogLikelihoodPerParticipant(0.5) // −0.6931471805599453
 */
export function nullLogLikelihoodPerParticipant(outcomeProportion: number): number {
  requireOutcomeProportion('outcome proportion', outcomeProportion);
  const phi = outcomeProportion;
  return phi * Math.log(phi) + (1 - phi) * Math.log1p(-phi);
}

/**
 * Largest Cox–Snell R² a logistic model can reach at outcome proportion phi (that of a perfect model):
 *   max R²_CS = 1 − exp(2·ln L_null / n)
 * Domain: 0 < phi < 1; otherwise DomainError. Source: DEV-BIN-SURV (METHODS 4 (ii)); Nagelkerke
 * (Biometrika 1991). Exact. Values: phi 0.5 → 0.75, 0.1 → 0.478041, 0.01 → 0.105958.
 * @example maxCoxSnellR2(0.5) // 0.75
 */
export function maxCoxSnellR2(outcomeProportion: number): number {
  return -Math.expm1(2 * nullLogLikelihoodPerParticipant(outcomeProportion));
}

/** 0 < R²_CS < max R²_CS(phi): a larger anticipated Cox–Snell R² cannot occur at that outcome proportion. */
export function requireCoxSnellBelowMax(field: string, value: number, outcomeProportion: number): void {
  const max = maxCoxSnellR2(outcomeProportion);
  if (!(value > 0 && value < max)) {
    throw new DomainError(
      field,
      value,
      `greater than 0 and below ${formatSignificant(max)}: a Cox–Snell R² at or above its maximum ${formatSignificant(max)} for outcome proportion ${formatSignificant(outcomeProportion)} is impossible`,
    );
  }
}
