import { DomainError } from '../errors';
import { requireCount } from '../helpers/domain-guards';

/** Cox–Snell R² recovered from a reported model, before and after the expected shrinkage. */
export interface AdjustedCoxSnell {
  readonly apparent: number;
  /** Van Houwelingen–le Cessie heuristic shrinkage S_VH = 1 − P/LR. */
  readonly shrinkage: number;
  /** Optimism-adjusted R²_CS = S_VH · R²_CS,app: the value to anticipate for a new model. */
  readonly adjusted: number;
}

/**
 * Anticipated Cox–Snell R² from a reported likelihood-ratio chi-square of a model with P
 * parameters fitted to n participants:
 *   R²_CS,app = 1 − exp(−LR/n),  S_VH = 1 − P/LR,  R²_CS,adj = S_VH · R²_CS,app
 * Domain: LR > P (otherwise S_VH ≤ 0: the reported model is all optimism), whole n ≥ 1 and P ≥ 1;
 * otherwise DomainError. Source: DEV-BIN-SURV (METHODS 4); van Houwelingen & le Cessie, Stat Med 1990. Exact.
 * @example adjustedCoxSnellFromLikelihoodRatio(178.3375, 500, 10).adjusted // 0.283178
 */
export function adjustedCoxSnellFromLikelihoodRatio(
  likelihoodRatio: number,
  n: number,
  predictorParameters: number,
): AdjustedCoxSnell {
  requireCount('reported n', n, 1);
  requireCount('reported number of predictor parameters', predictorParameters, 1);
  if (!(likelihoodRatio > predictorParameters) || !Number.isFinite(likelihoodRatio)) {
    throw new DomainError(
      'reported likelihood-ratio statistic',
      likelihoodRatio,
      `a finite number above the number of parameters ${predictorParameters} (otherwise the expected shrinkage 1 − P/LR is not positive)`,
    );
  }
  const apparent = -Math.expm1(-likelihoodRatio / n);
  const shrinkage = 1 - predictorParameters / likelihoodRatio;
  return { apparent, shrinkage, adjusted: shrinkage * apparent };
}

/**
 * The same from a reported apparent Cox–Snell R² and its n: LR = −n·ln(1 − R²_CS,app).
 * Domain: 0 < R²_CS,app < 1 and as above. Source: DEV-BIN-SURV (METHODS 4). Exact.
 * @example adjustedCoxSnellFromApparent(0.3, 500, 10).adjusted // 0.283178
 */
export function adjustedCoxSnellFromApparent(apparentR2: number, n: number, predictorParameters: number): AdjustedCoxSnell {
  if (!(apparentR2 > 0 && apparentR2 < 1)) {
    throw new DomainError('reported apparent Cox–Snell R²', apparentR2, 'strictly between 0 and 1');
  }
  requireCount('reported n', n, 1);
  return adjustedCoxSnellFromLikelihoodRatio(-n * Math.log1p(-apparentR2), n, predictorParameters);
}
