// Quantile and distribution functions, delegated to the maintained @stdlib packages
// (double-precision implementations tested by their authors against reference tables)
// rather than re-derived here. Inputs outside the domain throw: the engine never returns NaN.
import normalQuantileImpl from '@stdlib/stats-base-dists-normal-quantile';
import normalCdfImpl from '@stdlib/stats-base-dists-normal-cdf';
import tQuantileImpl from '@stdlib/stats-base-dists-t-quantile';
import chiSquareQuantileImpl from '@stdlib/stats-base-dists-chisquare-quantile';
import { DomainError } from '../errors';

function requireProbability(name: string, p: number): void {
  if (!(p > 0 && p < 1)) throw new DomainError(name, p, 'a probability strictly between 0 and 1');
}

/**
 * Standard normal quantile Φ⁻¹(p).
 * Domain: 0 < p < 1; outside it a DomainError is thrown.
 * Accuracy: about 1e-15 relative (stdlib's rational approximations).
 * @example normalQuantile(0.975) // 1.959963984540054
 */
export function normalQuantile(p: number): number {
  requireProbability('p', p);
  return normalQuantileImpl(p, 0, 1);
}

/**
 * Standard normal distribution function Φ(x). Defined for every finite x.
 * @example normalCdf(1.959963984540054) // 0.975
 */
export function normalCdf(x: number): number {
  if (!Number.isFinite(x)) throw new DomainError('x', x, 'a finite number');
  return normalCdfImpl(x, 0, 1);
}

/**
 * Student-t quantile with df degrees of freedom (df > 0, need not be an integer).
 * @example tQuantile(0.975, 10) // 2.228138851986274
 */
export function tQuantile(p: number, df: number): number {
  requireProbability('p', p);
  if (!(df > 0) || !Number.isFinite(df)) throw new DomainError('df', df, 'a positive finite number');
  return tQuantileImpl(p, df);
}

/**
 * Chi-square quantile with df degrees of freedom (df > 0).
 * @example chiSquareQuantile(0.975, 10) // 20.483177350807395
 */
export function chiSquareQuantile(p: number, df: number): number {
  requireProbability('p', p);
  if (!(df > 0) || !Number.isFinite(df)) throw new DomainError('df', df, 'a positive finite number');
  return chiSquareQuantileImpl(p, df);
}

/**
 * Two-sided critical value z for a confidence level (e.g. 0.95 → 1.959964).
 * Conventions: METHODS.md 1.6 (the exact quantile, not the rounded 1.96).
 */
export function zForConfidence(confidence: number): number {
  if (!(confidence > 0 && confidence < 1)) {
    throw new DomainError('confidence', confidence, 'a level strictly between 0 and 1');
  }
  return normalQuantile(1 - (1 - confidence) / 2);
}
