import { DomainError } from '../errors';
import { zForConfidence } from '../numerics/distributions';
import { requirePositive } from '../helpers/domain-guards';

/** Precision of the fixed-effect (common-effect) summary. */
export interface FixedEffectSummary {
  readonly k: number;
  /** SE of the summary, √(1/Σ(1/s_i²)). */
  readonly summarySe: number;
  readonly summaryCiWidth: number;
}

/**
 * Fixed-effect inverse-variance summary: SE = √(1 / Σ 1/s_i²), CI width 2·z·SE. It assumes one
 * true value shared by every site (no between-site heterogeneity); it is the random-effects
 * summary with τ = 0, written out on its own so the two can be checked against each other.
 * Domain: at least one site; every s_i finite and > 0; 0 < confidence < 1 (DomainError otherwise).
 * Accuracy: floating-point rounding only. Source: inverse-variance weighting (common practice).
 * @example fixedEffectSummary([0.3, 0.4]).summarySe // 0.24
 */
export function fixedEffectSummary(siteSes: readonly number[], confidence = 0.95): FixedEffectSummary {
  if (siteSes.length === 0) throw new DomainError('siteSes', '[]', 'at least one site');
  const z = zForConfidence(confidence);
  let precision = 0;
  siteSes.forEach((s, i) => {
    requirePositive(`siteSes[${i}]`, s);
    precision += 1 / (s * s); // inverse-variance weight 1/s_i² (common practice)
  });
  const summarySe = Math.sqrt(1 / precision);
  return { k: siteSes.length, summarySe, summaryCiWidth: 2 * z * summarySe };
}
