import type { NormalQuadratureRule } from '../numerics/gauss-hermite';
import type { Calibration, NormalLp } from './lp-distribution';
import { lpLogisticMoments } from './lp-logistic-moments';
import { lpQuadratureRule } from './lp-quadrature-rule';

/**
 * Outcome proportion implied by a normal LP and the calibration model:
 * phi = E[expit(intercept + slope·LP)], LP ~ N(mean, sd²)  (METHODS 5.2 [DERIVED]; [VAL-BIN]).
 * Domain: finite mean, sd > 0, finite calibration (validated by the caller).
 * Accuracy: that of the quadrature rule (lpQuadratureRule: about 1e−12).
 * @example lpOutcomeProportion({ mean: -2.776998, sd: 1.288257 }, { intercept: 0, slope: 1 }) // 0.1000000
 */
export function lpOutcomeProportion(
  lp: NormalLp,
  calibration: Calibration,
  rule: NormalQuadratureRule = lpQuadratureRule(lp, calibration),
): number {
  return lpLogisticMoments(lp, calibration, rule).outcomeProportion;
}
