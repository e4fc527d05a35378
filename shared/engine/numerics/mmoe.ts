// The multiplicative margin of error of a confidence interval for a standard deviation, and the
// smallest residual degrees of freedom that bring it within a target. Used by the validation
// criteria for the residual SDs of both calibration models and by the development criterion for the
// residual SD, so it lives with the numerics rather than with either.
import { DomainError } from '../errors';
import { NumberMemo } from '../helpers/number-memo';
import { chiSquareQuantile } from './distributions';
import type { IntegerSearchResult } from './integer-search';
import { smallestIntegerMeeting } from './integer-search';

function requireConfidence(confidence: number): void {
  if (!(confidence > 0 && confidence < 1)) {
    throw new DomainError('confidence', confidence, 'a level strictly between 0 and 1');
  }
}

/**
 * Multiplicative margin of error of the confidence interval for σ estimated with df degrees of
 * freedom: the interval is [σ̂·√(df/χ²_{1−α/2,df}), σ̂·√(df/χ²_{α/2,df})], and the margin is the
 * larger of the two factors that separate σ̂ from the limits:
 *   MMOE(df) = max( √(χ²_{1−α/2,df}/df), √(df/χ²_{α/2,df}) ),  α = 1 − confidence.
 * Domain: df > 0 (need not be an integer) and 0 < confidence < 1; otherwise a DomainError.
 * Source: VAL-CONT (criterion for the residual variance) and DEV-CONT (criterion iii); the chi-square
 * interval for a variance is common practice.
 * Accuracy: that of the chi-square quantiles (about 1e−12 relative), enough to separate df 232
 * (1.100084) from df 233 (1.099848).
 * @example multiplicativeMarginOfError(233) // 1.0998480…
 */
export function multiplicativeMarginOfError(df: number, confidence = 0.95): number {
  if (!(df > 0) || !Number.isFinite(df)) throw new DomainError('df', df, 'a positive finite number');
  requireConfidence(confidence);
  const alpha = 1 - confidence;
  const upper = chiSquareQuantile(1 - alpha / 2, df);
  const lower = chiSquareQuantile(alpha / 2, df);
  return Math.max(Math.sqrt(upper / df), Math.sqrt(df / lower));
}

/** Degrees of freedom above this are not searched: a study that large is not a plan. */
export const MMOE_MAX_DF = 100_000_000;

// Remembered searches, keyed by (margin, confidence).
const remembered = new NumberMemo<IntegerSearchResult>();

/**
 * Smallest integer df ≥ 1 with MMOE(df) ≤ marginFactor at the given confidence level. MMOE falls
 * steadily with df, so an integer search (doubling bracket, then bisection) is exact. The result
 * depends on (marginFactor, confidence) only, so it is remembered: planning many scenarios with
 * the same targets costs one search. When even df = MMOE_MAX_DF misses the target, n is null and
 * converged is false.
 * Domain: 1 < marginFactor (finite), 0 < confidence < 1; otherwise a DomainError.
 * Source: VAL-CONT and DEV-CONT (margin 1.1 gives df 233); integer search per METHODS.md 1.4.
 * @example smallestDfForMargin(1.1).n // 233
 */
export function smallestDfForMargin(marginFactor: number, confidence = 0.95): IntegerSearchResult {
  if (!(marginFactor > 1) || !Number.isFinite(marginFactor)) {
    throw new DomainError('marginFactor', marginFactor, 'a finite number greater than 1');
  }
  requireConfidence(confidence);
  const known = remembered.get(marginFactor, confidence);
  if (known !== undefined) return known;
  const result = smallestIntegerMeeting((df) => multiplicativeMarginOfError(df, confidence) <= marginFactor, 1, MMOE_MAX_DF);
  remembered.set(marginFactor, confidence, result);
  return result;
}
