import { DomainError } from '../errors';
import type { NormalQuadratureRule } from '../numerics/gauss-hermite';
import type { Calibration, NormalLp } from './lp-distribution';
import type { LpLogisticMoments } from './lp-logistic-moments';
import { lpLogisticMoments } from './lp-logistic-moments';
import { lpQuadratureRule } from './lp-quadrature-rule';

/** Per-participant Fisher information of the calibration model, and what follows from it. */
export interface CalibrationSlopeInformation extends LpLogisticMoments {
  /** [I⁻¹]₂₂ = E(w)/(E(w)E(w·LP²) − E(w·LP)²): n·Var(slope estimate). */
  readonly slopeVariance: number;
}

/**
 * Fisher information of logit P(Y = 1) = α + β·LP per participant, averaged over LP ~ N(mean, sd²):
 *   I = [[E(w), E(w·LP)], [E(w·LP), E(w·LP²)]],  w = p(1 − p),  p = expit(α + β·LP)
 *   n·Var(β̂) = [I⁻¹]₂₂ = E(w) / (E(w)·E(w·LP²) − E(w·LP)²)
 * (METHODS 5.2 [DERIVED]; [VAL-BIN] evaluate the same matrix by averaging over simulated LPs).
 * Expectations by Gauss–Hermite (or composite Gauss–Legendre for wide LPs; see lpQuadratureRule).
 * Domain: finite mean, sd > 0, finite calibration; a numerically singular I (an LP with almost no
 * spread) raises a DomainError.
 * Accuracy: relative error ≤ 2e−10 (lpQuadratureRule accuracy study).
 * @example calibrationSlopeInformation({ mean: -2.776998, sd: 1.288257 }, { intercept: 0, slope: 1 }).slopeVariance // 11.15849
 */
export function calibrationSlopeInformation(
  lp: NormalLp,
  calibration: Calibration,
  rule: NormalQuadratureRule = lpQuadratureRule(lp, calibration),
): CalibrationSlopeInformation {
  const { outcomeProportion, i00, i01, i11 } = lpLogisticMoments(lp, calibration, rule);
  const det = i00 * i11 - i01 * i01;
  if (!(det > 1e-12 * i00 * i11) || !Number.isFinite(det)) {
    throw new DomainError(
      'linear predictor SD',
      lp.sd,
      'a spread large enough for the calibration slope to be estimable (the information matrix is singular)',
    );
  }
  return { i00, i01, i11, slopeVariance: i00 / det, outcomeProportion };
}
