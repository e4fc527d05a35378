import { requireOutcomeProportion, requireSensSpec, requireThreshold } from './require-binary-domain';

/** Net benefit at a threshold and the per-participant variances n·Var of its estimates. */
export interface NetBenefitVariance {
  /** NB = sens·phi − w(1 − spec)(1 − phi), w = t/(1 − t). */
  readonly netBenefit: number;
  /** sNB = NB/phi. */
  readonly standardisedNetBenefit: number;
  readonly netBenefitVariance: number;
  readonly standardisedVariance: number;
}

/**
 * Net benefit (Vickers & Elkin 2006) and the delta-method variances treating sens, spec and phi
 * as independent binomial proportions, w = t/(1 − t):
 *   n·Var(sNB) = sens(1 − sens)/phi + w²·spec(1 − spec)(1 − phi)/phi² + w²(1 − spec)²(1 − phi)/phi³
 *   n·Var(NB)  = sens(1 − sens)·phi + w²·spec(1 − spec)(1 − phi) + (sens + w(1 − spec))²·phi(1 − phi)
 * (Var(NB) ≠ phi²·Var(sNB) because phi is estimated.)
 * Domain: sens, spec, phi and t strictly in (0, 1); otherwise DomainError naming the field.
 * Source: VAL-BIN; METHODS 5.4 [DERIVED] (identical to the multinomial TP/FP derivation; Marsh,
 * Janes & Pepe, Biometrics 2020 give inference for NB). Exact.
 * @example netBenefitVariance(0.8, 0.7, 0.1, 0.1).standardisedVariance // 2.833333
 */
export function netBenefitVariance(
  sensitivity: number,
  specificity: number,
  outcomeProportion: number,
  threshold: number,
): NetBenefitVariance {
  requireSensSpec('sensitivity', sensitivity);
  requireSensSpec('specificity', specificity);
  requireOutcomeProportion('outcome proportion', outcomeProportion);
  requireThreshold('risk threshold', threshold);
  const w = threshold / (1 - threshold);
  const phi = outcomeProportion;
  const sens = sensitivity;
  const spec = specificity;
  const netBenefit = sens * phi - w * (1 - spec) * (1 - phi);
  const standardisedVariance =
    (sens * (1 - sens)) / phi +
    (w * w * spec * (1 - spec) * (1 - phi)) / (phi * phi) +
    (w * w * (1 - spec) * (1 - spec) * (1 - phi)) / (phi * phi * phi);
  const netBenefitVar =
    sens * (1 - sens) * phi + w * w * spec * (1 - spec) * (1 - phi) + (sens + w * (1 - spec)) ** 2 * phi * (1 - phi);
  return { netBenefit, standardisedNetBenefit: netBenefit / phi, netBenefitVariance: netBenefitVar, standardisedVariance };
}
