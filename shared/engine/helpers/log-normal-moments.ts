import { requireFinite, requirePositive } from './domain-guards';
import type { LogNormalParameters } from './log-normal-from-quartiles';

/** Mean, variance and SD of a log-normal outcome on its original scale. */
export interface OriginalScaleMoments {
  readonly mean: number;
  readonly variance: number;
  readonly sd: number;
}

/**
 * Original-scale moments of Y when ln(Y) ~ N(μ, σ²):
 *   mean = e^{μ + σ²/2},  var = (e^{σ²} − 1)·e^{2μ + σ²}.
 * Domain: finite μ, σ > 0, and moments that fit in a double (σ² + 2μ below ~709); otherwise a
 * DomainError rather than Infinity. Common practice (log-normal moments). Accuracy ~1e−15 relative
 * (expm1 keeps e^{σ²} − 1 accurate for small σ).
 * @example logNormalMoments({ mu: Math.log(4), sigma: 1.027662 }) // { mean: 6.78245…, sd: 9.28750… }
 */
export function logNormalMoments({ mu, sigma }: LogNormalParameters): OriginalScaleMoments {
  requireFinite('mu', mu);
  requirePositive('sigma', sigma);
  const s2 = sigma * sigma;
  const mean = Math.exp(mu + s2 / 2);
  const variance = Math.expm1(s2) * Math.exp(2 * mu + s2);
  requirePositive('original-scale variance', variance);
  requirePositive('original-scale mean', mean);
  return { mean, variance, sd: Math.sqrt(variance) };
}
