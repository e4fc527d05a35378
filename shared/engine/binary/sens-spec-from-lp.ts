import { NORMAL_RANGE, normalLogisticPartials } from './gauss-legendre-panels';
import { logit } from './logistic';
import type { Calibration, NormalLp } from './lp-distribution';
import { requireThreshold } from './require-binary-domain';

/** Classification at a risk threshold implied by the LP distribution and the calibration. */
export interface SensSpecFromLp {
  readonly sensitivity: number;
  readonly specificity: number;
  /** E[expit(α + β·LP)]: the outcome proportion consistent with sensitivity and specificity. */
  readonly outcomeProportion: number;
}

/**
 * Sensitivity and specificity of "predicted risk expit(LP) ≥ t" when LP ~ N(mean, sd²) and the
 * true risk is p(x) = expit(α + β·x):
 *   sens = ∫_{expit(x) ≥ t} f(x)·p(x) dx / phi,  spec = ∫_{expit(x) < t} f(x)·(1 − p(x)) dx / (1 − phi)
 * (METHODS 5.4 [DERIVED]; VAL-BIN). Integrated on the standard-normal scale z = (x − mean)/sd
 * split exactly at z_t = (logit t − mean)/sd, each side by composite Gauss–Legendre over [−9, 9].
 * Domain: 0 < t < 1, sd > 0, finite mean and calibration; otherwise DomainError.
 * Accuracy: about 1e−12. (The scipy reference in METHODS 5.4 masks an 80001-point grid at the
 * threshold and so is off by up to 1e−4: it prints sens 0.729859 where adaptive quadrature gives
 * 0.729951.)
 * @example sensSpecFromLp({ mean: -2.7769973, sd: 1.2882557 }, { intercept: 0, slope: 1 }, 0.1).sensitivity // 0.729951
 */
export function sensSpecFromLp(lp: NormalLp, calibration: Calibration, threshold: number): SensSpecFromLp {
  requireThreshold('risk threshold', threshold);
  const a = calibration.intercept + calibration.slope * lp.mean;
  const b = calibration.slope * lp.sd;
  const cut = Math.min(NORMAL_RANGE, Math.max(-NORMAL_RANGE, (logit(threshold) - lp.mean) / lp.sd));
  const treated = normalLogisticPartials(a, b, cut, NORMAL_RANGE);
  const untreated = normalLogisticPartials(a, b, -NORMAL_RANGE, cut);
  const phi = treated.events + untreated.events;
  const notPhi = treated.nonEvents + untreated.nonEvents;
  return {
    sensitivity: treated.events / phi,
    specificity: untreated.nonEvents / notPhi,
    outcomeProportion: phi / (phi + notPhi),
  };
}
