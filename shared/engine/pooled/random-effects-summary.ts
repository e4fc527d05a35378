import { DomainError } from '../errors';
import { zForConfidence } from '../numerics/distributions';
import { requirePositive } from '../helpers/domain-guards';
import { requireNonNegative } from './require-input';

/** Precision of the random-effects summary of one measure across K sites. */
export interface RandomEffectsSummary {
  readonly k: number;
  readonly tau: number;
  /** Inverse-variance weights w_i = 1/(s_i² + τ²), one per site, in input order. */
  readonly weights: readonly number[];
  /** Σ w_i. */
  readonly totalWeight: number;
  /** SE of the summary, 1/√Σw_i. */
  readonly summarySe: number;
  readonly confidence: number;
  /** Two-sided normal critical value used for the summary CI. */
  readonly z: number;
  /** Width of the summary CI, 2·z·SE. */
  readonly summaryCiWidth: number;
}

/**
 * Random-effects summary precision for planning: w_i = 1/(s_i² + τ²), SE = 1/√Σw_i, CI width
 * 2·z·SE. τ is the anticipated between-site SD, taken as known: the analysis will estimate τ and
 * its CI will usually be somewhat wider than planned (the estimation of τ is not accounted for).
 * With τ = 0 this is the fixed-effect (common-effect) inverse-variance summary.
 * Domain: at least one site; every s_i finite and > 0; τ finite and ≥ 0; 0 < confidence < 1.
 * Outside it a DomainError names the field. Accuracy: floating-point rounding only (closed form).
 * Source: inverse-variance random-effects weights (DerSimonian & Laird, Control Clin Trials 1986,
 * doi:10.1016/0197-2456(86)90046-2; J R Stat Soc A 2009, doi:10.1111/j.1467-985X.2008.00552.x).
 * @example randomEffectsSummary([0.1, 0.1, 0.1, 0.1], 0.1).summarySe // 0.0707107 (1/√200)
 */
export function randomEffectsSummary(siteSes: readonly number[], tau: number, confidence = 0.95): RandomEffectsSummary {
  if (siteSes.length === 0) throw new DomainError('siteSes', '[]', 'at least one site');
  requireNonNegative('tau', tau);
  const z = zForConfidence(confidence);
  const tau2 = tau * tau;
  const weights = siteSes.map((s, i) => {
    requirePositive(`siteSes[${i}]`, s);
    return 1 / (s * s + tau2); // DerSimonian–Laird 1986: random-effects weight 1/(s_i² + τ²)
  });
  let totalWeight = 0;
  for (const w of weights) totalWeight += w;
  const summarySe = 1 / Math.sqrt(totalWeight); // SE of the weighted mean = 1/√Σw
  return { k: siteSes.length, tau, weights, totalWeight, summarySe, confidence, z, summaryCiWidth: 2 * z * summarySe };
}
