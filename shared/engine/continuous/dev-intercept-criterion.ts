// Development criterion (iv): the mean outcome (intercept with centred predictors) estimated
// precisely [DEV-CONT].
import { formatPercent, formatSignificant } from '../../format/numbers';
import { requireCount, requireNonZero, requireOpenUnit, requirePositive } from '../helpers/domain-guards';
import { criticalZ } from '../helpers/critical-z';
import type { CriterionResult, PrecisionAtN } from '../types';
import type { ContinuousDevelopmentInputs } from './continuous-inputs';
import { criticalT } from './critical-t';
import type { CriterionText } from './criterion-result';
import { levelText, notAssessableCriterion, sizedCriterion } from './criterion-result';
import { developmentCore } from './development-inputs-check';
import type { SampleSize } from './sample-size';
import { NOT_REACHED, searchedSize } from './sample-size';
import { MAX_SAMPLE_SIZE } from './sample-size-limit';
import { smallestFromEstimate } from './smallest-from-estimate';

const TEXT: CriterionText = {
  id: 'dev-intercept',
  label: 'Precise mean outcome (development intercept)',
  purpose: 'development',
  formula: 'smallest n with t_{1−α/2, n−P−1}·σ_res/√n ≤ (m − 1)·|mean|, σ²_res = SD²(1 − R²_adj)',
  references: ['DEV-CONT'],
};

/**
 * Everything the intercept criterion reads (field names as in ContinuousDevelopmentInputs, which
 * satisfies it once P, R²_adj, the mean and the SD are known).
 */
export interface InterceptTarget {
  readonly predictorParameters: number;
  readonly adjustedRSquared: number;
  readonly outcomeMean: number;
  readonly outcomeSd: number;
  /** Margin factor m: the CI half-width may be (m − 1)·|mean| (1.1 → within 10% of the mean). */
  readonly residualSdMargin: number;
  readonly confidence: number;
}

function requireInterceptDomain(t: InterceptTarget): void {
  requireCount('predictorParameters', t.predictorParameters, 1);
  requireOpenUnit('adjustedRSquared', t.adjustedRSquared);
  requireNonZero('outcomeMean', t.outcomeMean);
  requirePositive('outcomeSd', t.outcomeSd);
  requirePositive('residualSdMargin − 1', t.residualSdMargin - 1);
  requireOpenUnit('confidence', t.confidence);
}

/** σ_res = SD·√(1 − R²_adj). */
const residualSdOf = (t: InterceptTarget): number => t.outcomeSd * Math.sqrt(1 - t.adjustedRSquared);
/** The allowed CI half-width (m − 1)·|mean|. */
const allowedOf = (t: InterceptTarget): number => (t.residualSdMargin - 1) * Math.abs(t.outcomeMean);

/** CI half-width for the intercept at n: t_{1−α/2, n−P−1}·σ_res/√n. */
function halfWidthAt(t: InterceptTarget, residualSd: number, n: number): number {
  return (criticalT(t.confidence, n - t.predictorParameters - 1) * residualSd) / Math.sqrt(n);
}

/**
 * Smallest n ≥ P + 2 whose CI for the mean outcome (SE = σ_res/√n, Student-t with n − P − 1 df)
 * has half-width ≤ (m − 1)·|mean|. The half-width falls with n, so an integer search is exact. It
 * searches above (z·σ_res/((m − 1)|mean|))², which t > z makes a lower bound, from an estimate
 * (first-order expansion of t) that it confirms or corrects (smallestFromEstimate).
 * Domain: whole P ≥ 1, 0 < R²_adj < 1, mean ≠ 0, SD > 0, m > 1, 0 < level < 1; otherwise a DomainError.
 * Source: DEV-CONT criterion (iv) (METHODS.md 3.4 [DERIVED]: the margin as a fraction of the mean).
 * @example interceptSampleSize({ predictorParameters: 25, adjustedRSquared: 0.2, outcomeMean: 1.9, outcomeSd: 0.6, residualSdMargin: 1.1, confidence: 0.95 }).n // 38
 */
export function interceptSampleSize(t: InterceptTarget): SampleSize {
  requireInterceptDomain(t);
  const residualSd = residualSdOf(t);
  const allowed = allowedOf(t);
  const lowest = t.predictorParameters + 2;
  const ratio = residualSd / allowed;
  const z = criticalZ(t.confidence);
  const lower = Math.max(lowest, Math.floor(z * ratio * z * ratio));
  if (!(lower <= MAX_SAMPLE_SIZE)) return NOT_REACHED;
  const meets = (n: number): boolean => halfWidthAt(t, residualSd, n) <= allowed;
  // Estimate: fixed-point steps of n = (t·σ_res/margin)² with the first-order expansion
  // t ≈ z(1 + (1 + z²)/(4ν)), ν = n − P − 1 (A&S 26.7.5); the search then checks it exactly.
  const firstOrder = (1 + z * z) / 4;
  let estimate = lower;
  for (let i = 0; i < 3; i++) {
    const tq = z * (1 + firstOrder / Math.max(1, estimate - t.predictorParameters - 1)) * ratio;
    estimate = Math.max(lower, tq * tq);
  }
  return searchedSize(smallestFromEstimate(meets, estimate, lower, MAX_SAMPLE_SIZE), lowest);
}

function targetText(inputs: ContinuousDevelopmentInputs): string {
  const mean = inputs.outcomeMean === undefined ? 'the mean' : formatSignificant(inputs.outcomeMean);
  return `${levelText(inputs.confidence)} CI for the mean outcome within ±${formatPercent(inputs.residualSdMargin - 1)} of ${mean}`;
}

function interceptTarget(inputs: ContinuousDevelopmentInputs): InterceptTarget | string {
  const core = developmentCore(inputs);
  if (typeof core === 'string') return core;
  const { outcomeMean, outcomeSd } = core;
  if (outcomeMean === undefined || outcomeSd === undefined) {
    return 'needs the anticipated outcome mean and SD (anticipated.outcomeMean, anticipated.outcomeSd)';
  }
  if (outcomeMean === 0) return 'the anticipated outcome mean is 0, so a margin relative to the mean is undefined';
  return core as InterceptTarget; // the mean and SD were just checked
}

/**
 * The size of criterion (iv) (the number only), or why it cannot be assessed.
 * @example devInterceptSize(lungExample) // { n: 38, status: 'ok' }
 */
export function devInterceptSize(inputs: ContinuousDevelopmentInputs): SampleSize | string {
  const t = interceptTarget(inputs);
  return typeof t === 'string' ? t : interceptSampleSize(t);
}

/**
 * Criterion (iv) of DEV-CONT as a CriterionResult; not assessable without P, R²_adj, the outcome
 * mean and SD, or when the mean is 0.
 * @example devInterceptCriterion({ predictorParameters: 25, adjustedRSquared: 0.2, outcomeMean: 1.9, outcomeSd: 0.6, … }).n // 38
 */
export function devInterceptCriterion(inputs: ContinuousDevelopmentInputs): CriterionResult {
  const t = interceptTarget(inputs);
  if (typeof t === 'string') return notAssessableCriterion(TEXT, targetText(inputs), t);
  const size = interceptSampleSize(t);
  const intermediates = [
    { name: 'residual SD σ_res', value: residualSdOf(t) },
    { name: 'allowed half-width (m − 1)·|mean|', value: allowedOf(t) },
  ];
  const note =
    size.status === 'always-met' ? 'the mean is estimated within the margin at every admissible n (P + 2 and above)' : undefined;
  return sizedCriterion(TEXT, targetText(inputs), size, intermediates, note);
}

/**
 * Width of the CI for the mean outcome at a fixed n; for n = 918 in the published lung-function
 * example the interval is 1.9 ± 0.0348 (1.865 to 1.935).
 * @example devInterceptPrecisionAtN({ predictorParameters: 25, adjustedRSquared: 0.2, outcomeMean: 1.9, outcomeSd: 0.6, … }, 918).achieved // 0.069526…
 */
export function devInterceptPrecisionAtN(inputs: ContinuousDevelopmentInputs, n: number): PrecisionAtN {
  const t = interceptTarget(inputs);
  const scale = `${levelText(inputs.confidence)} CI width for the mean outcome (outcome units)`;
  if (typeof t === 'string') {
    const targetValue = inputs.outcomeMean === undefined ? 0 : 2 * (inputs.residualSdMargin - 1) * Math.abs(inputs.outcomeMean);
    return { id: TEXT.id, label: TEXT.label, n, se: null, achieved: null, targetValue, scale, meets: null, reason: t };
  }
  requireInterceptDomain(t);
  const residualSd = residualSdOf(t);
  const allowed = allowedOf(t);
  const base = { id: TEXT.id, label: TEXT.label, n, targetValue: 2 * allowed, scale };
  if (n < t.predictorParameters + 2) {
    return {
      ...base,
      se: null,
      achieved: null,
      meets: false,
      reason: `a model with P = ${t.predictorParameters} needs at least P + 2 participants`,
    };
  }
  const half = halfWidthAt(t, residualSd, n);
  return { ...base, se: residualSd / Math.sqrt(n), achieved: 2 * half, meets: half <= allowed };
}
