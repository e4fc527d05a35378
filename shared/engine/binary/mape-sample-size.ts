import { DomainError } from '../errors';
import { requireCount } from '../helpers/domain-guards';
import { ceilGuarded } from '../numerics/rounding';
import { requireOutcomeProportion } from './require-binary-domain';

/** Sample size for a target mean absolute prediction error, flagged as recalled from memory. */
export interface MapeSampleSize {
  readonly raw: number;
  readonly n: number;
  readonly provenance: string;
}

/**
 * Optional development check (not a default criterion): smallest n whose expected mean absolute
 * prediction error is at most `mape`, from the regression approximation
 *   ln MAPE = −0.508 + 0.259·ln(phi) + 0.504·ln(P) − 0.544·ln(n)
 * solved for n. FROM MEMORY: all four coefficients are recalled from Stat Methods Med Res
 * 2019;28(8):2455–2474 (doi:10.1177/0962280218784726) and have not been re-checked; the BMJ 2020
 * guide (DEV-BMJ) lists it as an extra step. Verify before relying on it.
 * Domain: 0 < phi < 1, whole P ≥ 1, 0 < mape < 1; otherwise DomainError.
 * @example mapeSampleSize(24, 0.174, 0.05).n // 801 (raw 800.19)
 */
export function mapeSampleSize(predictorParameters: number, outcomeProportion: number, mape: number): MapeSampleSize {
  requireCount('number of predictor parameters', predictorParameters, 1);
  requireOutcomeProportion('outcome proportion', outcomeProportion);
  if (!(mape > 0 && mape < 1))
    throw new DomainError(
      'target mean absolute prediction error',
      mape,
      'strictly between 0 and 1 (it is an error in predicted risk)',
    );
  const raw = Math.exp(
    (-0.508 + 0.259 * Math.log(outcomeProportion) + 0.504 * Math.log(predictorParameters) - Math.log(mape)) / 0.544,
  );
  return {
    raw,
    n: ceilGuarded(raw),
    provenance: 'from memory: coefficients recalled from Stat Methods Med Res 2019;28(8):2455–2474, not re-checked',
  };
}
