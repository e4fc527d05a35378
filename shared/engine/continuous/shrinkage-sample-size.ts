import { requireCount, requireOpenUnit } from '../helpers/domain-guards';
import { smallestIntegerMeeting } from '../numerics/integer-search';
import { closedFormShrinkageN } from './closed-form-shrinkage';
import { expectedShrinkage, expectedShrinkageKernel } from './expected-shrinkage';
import type { SampleSize } from './sample-size';
import { closedFormSize, NOT_REACHED, searchedSize } from './sample-size';
import { MAX_SAMPLE_SIZE } from './sample-size-limit';

/**
 * Where the expected shrinkage S(n) of expectedShrinkage stops falling: the smallest n ≥ P + 2 with
 * S(n + 1) ≥ S(n). From there on S(n) rises towards 1, so a target is met for good only on
 * [branchStart, ∞). Integer search up to `upper`; returns `upper` if S falls all the way there.
 * Domain: whole P ≥ 3 (for P ≤ 2 S never falls below 1), 0 < R² < 1.
 * Source: shape of the DEV-CONT (RECON) criterion, METHODS.md 3.1; integer search per METHODS.md 1.4.
 * @example shrinkageBranchStart(25, 0.2, 2000) // 58
 */
export function shrinkageBranchStart(predictorParameters: number, adjustedRSquared: number, upper: number): number {
  const lowest = predictorParameters + 2;
  const rising = (n: number): boolean =>
    expectedShrinkage(n + 1, predictorParameters, adjustedRSquared) >=
    expectedShrinkage(n, predictorParameters, adjustedRSquared);
  return smallestIntegerMeeting(rising, lowest, Math.max(lowest, upper)).n ?? Math.max(lowest, upper);
}

/**
 * Smallest n from which the expected shrinkage S(n) (expectedShrinkage: adjusted-R² link, (P − 2)
 * form) stays at or above the target: n = 1 + max{n ≥ P + 2 : S(n) < S*}, or P + 2 when there is no
 * such n (always met; always so for P ≤ 2). This reproduces 918 for P = 25, R²_adj = 0.2, S* = 0.9.
 * Bracket: S(n) ≥ 1 − (P − 2)/(n·L), L = −ln(1 − R²_adj), because R²_app(n) > R²_adj; so every
 * n ≥ (P − 2)/((1 − S*)·L) meets the target. An estimate of the root of
 * n·L + n·ln((n − 1)/(n − P − 1)) = (P − 2)/(1 − S*) (a quadratic approximation refined by one
 * fixed-point step) is confirmed with two evaluations when it is right (about 99% of cases); otherwise the search starts just below it, and if the target already holds there it
 * restarts from where S(n) stops falling (shrinkageBranchStart), so the answer never lies on the
 * falling part near n = P + 2 where the apparent R² tends to 1.
 * Domain: whole P ≥ 1, 0 < R²_adj < 1, 0 < S* < 1; otherwise a DomainError. Exact (integer search).
 * Source: DEV-CONT criterion (i), RECON: reconstructed to reproduce the published total (METHODS.md 3.1).
 * @example adjustedR2LinkShrinkageSize(25, 0.2, 0.9).n // 918
 */
export function adjustedR2LinkShrinkageSize(
  predictorParameters: number,
  adjustedRSquared: number,
  targetShrinkage: number,
): SampleSize {
  requireCount('predictorParameters', predictorParameters, 1);
  requireOpenUnit('adjustedRSquared', adjustedRSquared);
  requireOpenUnit('targetShrinkage', targetShrinkage);
  const p = predictorParameters;
  const lowest = p + 2;
  if (lowest > MAX_SAMPLE_SIZE) return NOT_REACHED;
  if (p <= 2) return { n: lowest, status: 'always-met' };
  // Every n searched below lies in [P + 2, MAX_SAMPLE_SIZE], the kernel's domain.
  const meets = (n: number): boolean => expectedShrinkageKernel(n, p, adjustedRSquared) >= targetShrinkage;
  const logTerm = -Math.log1p(-adjustedRSquared);
  const required = (p - 2) / (1 - targetShrinkage);
  const upper = Math.min(MAX_SAMPLE_SIZE, Math.max(lowest, Math.ceil(required / logTerm)));
  if (!meets(upper)) return NOT_REACHED;
  // Estimate: h(n) = n·L + n·ln((n − 1)/(n − P − 1)) ≈ n·L + P + P(P + 2)/(2n) = K is a quadratic
  // in n; one fixed-point step on the exact h then refines its larger root.
  const excess = required - p;
  const discriminant = excess * excess - 2 * logTerm * p * (p + 2);
  let guess = discriminant > 0 ? (excess + Math.sqrt(discriminant)) / (2 * logTerm) : excess / logTerm;
  if (guess > p + 1) guess = (required - guess * Math.log((guess - 1) / (guess - p - 1))) / logTerm;
  // A candidate c with S(c − 1) < S* ≤ S(c) is the answer: S rose from c − 1 to c, so c lies past
  // the dip, where S keeps rising.
  const candidate = Number.isFinite(guess) ? Math.min(upper, Math.max(lowest, Math.ceil(guess))) : lowest;
  if (candidate > lowest && meets(candidate) && !meets(candidate - 1)) return { n: candidate, status: 'ok' };
  const start = Number.isFinite(guess) ? Math.min(upper, Math.max(lowest, Math.floor(guess) - 1)) : lowest;
  if (!meets(start)) return searchedSize(smallestIntegerMeeting(meets, start + 1, upper), lowest);
  const branch = shrinkageBranchStart(p, adjustedRSquared, upper);
  if (meets(branch)) return { n: lowest, status: 'always-met' };
  return searchedSize(smallestIntegerMeeting(meets, branch + 1, upper), lowest);
}

/**
 * Closed form of the shrinkage criterion, n = ⌈P/((S − 1)·ln(1 − R²/S))⌉ (guarded), at least P + 2.
 * Gives 995 for P = 25, R² = 0.2 (the alternative to the 918 of the adjusted-R² link).
 * Domain: whole P ≥ 1, 0 < R² < S < 1; otherwise a DomainError. Source: DEV-BIN-SURV.
 * @example closedFormShrinkageSize(25, 0.2, 0.9).n // 995
 */
export function closedFormShrinkageSize(
  predictorParameters: number,
  adjustedRSquared: number,
  targetShrinkage: number,
): SampleSize {
  return closedFormSize(closedFormShrinkageN(predictorParameters, adjustedRSquared, targetShrinkage), predictorParameters + 2);
}
