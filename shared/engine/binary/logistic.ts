// The logistic function and its relatives, written to stay finite and accurate in both tails.
import { DomainError } from '../errors';

/**
 * expit(x) = 1/(1 + e^(−x)), the inverse of the logit; the branch keeps e^(·) from overflowing.
 * Domain: every finite x (result in [0, 1]; it rounds to 0 or 1 beyond |x| ≈ 745 / 37).
 * Source: common practice.
 * @example expit(0) // 0.5
 */
export function expit(x: number): number {
  if (x >= 0) return 1 / (1 + Math.exp(-x));
  const e = Math.exp(x);
  return e / (1 + e);
}

/**
 * ln expit(x) = −ln(1 + e^(−x)), without forming expit (so ln 0 never occurs).
 * Domain: every finite x. Accuracy: full double precision (log1p).
 * Source: common practice.
 * @example logExpit(0) // −0.6931471805599453
 */
export function logExpit(x: number): number {
  return x >= 0 ? -Math.log1p(Math.exp(-x)) : x - Math.log1p(Math.exp(x));
}

/**
 * logit(p) = ln(p/(1 − p)). Domain: 0 < p < 1; outside it a DomainError is thrown.
 * Source: common practice.
 * @example logit(0.5) // 0
 */
export function logit(p: number): number {
  if (!(p > 0 && p < 1))
    throw new DomainError('p', p, 'a probability strictly between 0 and 1 (the log-odds of 0 or 1 is infinite)');
  return Math.log(p / (1 - p));
}
