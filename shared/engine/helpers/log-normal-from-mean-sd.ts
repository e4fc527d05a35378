import { requirePositive } from './domain-guards';
import type { LogNormalParameters } from './log-normal-from-quartiles';

/**
 * Log-normal parameters that reproduce an original-scale mean and SD:
 *   σ² = ln(1 + SD²/mean²),  μ = ln(mean) − σ²/2.
 * Domain: mean > 0, SD > 0, both finite; otherwise a DomainError. METHODS.md 7 [DERIVED] (inverts
 * the log-normal moments). Accuracy ~1e−15 relative (log1p keeps small SD/mean accurate).
 * @example logNormalFromMeanSd(6.782451, 9.287506) // { mu: 1.386294…, sigma: 1.027662… }
 */
export function logNormalFromMeanSd(mean: number, sd: number): LogNormalParameters {
  requirePositive('mean', mean);
  requirePositive('sd', sd);
  const ratio = sd / mean;
  const s2 = Math.log1p(ratio * ratio);
  requirePositive('log-scale variance', s2);
  return { mu: Math.log(mean) - s2 / 2, sigma: Math.sqrt(s2) };
}
