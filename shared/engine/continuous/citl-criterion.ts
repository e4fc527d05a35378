// Validation criterion 2: calibration-in-the-large estimated precisely [VAL-CONT].
import { formatSignificant } from '../../format/numbers';
import { DomainError } from '../errors';
import { requirePositiveOrInfinite } from '../helpers/domain-guards';
import { criticalZ } from '../helpers/critical-z';
import { seFromCiWidth } from '../helpers/se-from-ci-width';
import type { CriterionResult, PrecisionAtN } from '../types';
import { citlResidualVariance } from './citl-residual-variance';
import type { CriterionText } from './criterion-result';
import { levelText, sizedCriterion } from './criterion-result';
import { meetsRequirement } from './precision-tolerance';
import type { SampleSize } from './sample-size';
import { closedFormSize, NOT_REACHED } from './sample-size';

/** What criterion 2 reads (field names as in ContinuousValidationInputs, which satisfies it). */
export interface CitlTarget {
  readonly outcomeVariance: number;
  readonly rSquaredCitl: number;
  readonly slope: number;
  /** Target CI width in outcome units. */
  readonly citlWidth: number;
  readonly confidence: number;
}

/** A mean and its SD need at least two participants. */
const CITL_LOWEST_N = 2;

const TEXT: CriterionText = {
  id: 'citl',
  label: 'Precise calibration-in-the-large',
  purpose: 'validation',
  formula: 'n = σ²_CITL / SE*², σ²_CITL = (β − 1)²·R²·var(Y)/β² + var(Y)(1 − R²), SE* = W / (2z)',
  references: ['VAL-CONT'],
};

/**
 * Smallest n with SE(CITL) = σ_CITL/√n ≤ SE*: n = ⌈σ²_CITL / SE*²⌉ (guarded ceiling), at least 2.
 * Domain: σ²_CITL ≥ 0 (positive in theory; 0 only by underflow), SE* > 0, finite; otherwise a DomainError.
 * Source: VAL-CONT criterion 2 (METHODS.md 2.2). Exact closed form.
 * @example citlSampleSize(20, 1 / (2 * 1.959963984540054)).n // 308
 */
export function citlSampleSize(residualVariance: number, targetSe: number): SampleSize {
  if (!(residualVariance >= 0) || !Number.isFinite(residualVariance)) {
    throw new DomainError('σ²_CITL', residualVariance, 'a finite number of at least 0 (0 only by underflow)');
  }
  requirePositiveOrInfinite('targetSe', targetSe);
  return closedFormSize(residualVariance / (targetSe * targetSe), CITL_LOWEST_N);
}

/**
 * σ²_CITL, or null when it overflows a double (outcome variances near 1e308): reported as out of
 * reach rather than computed with Infinity.
 */
function citlVarianceOrOverflow(t: CitlTarget): number | null {
  try {
    return citlResidualVariance(t.outcomeVariance, t.rSquaredCitl, t.slope);
  } catch (error) {
    if (
      error instanceof DomainError &&
      error.field === 'outcomeVariance' &&
      Number.isFinite(t.outcomeVariance) &&
      t.outcomeVariance > 0
    ) {
      return null;
    }
    throw error;
  }
}

/**
 * The size of criterion 2 for a target (the number only; citlCriterion adds the words).
 * @example citlSize({ outcomeVariance: 100, rSquaredCitl: 0.8, slope: 1, citlWidth: 1, confidence: 0.95 }) // { n: 308, status: 'ok' }
 */
export function citlSize(t: CitlTarget): SampleSize {
  const variance = citlVarianceOrOverflow(t);
  return variance === null ? NOT_REACHED : citlSampleSize(variance, seFromCiWidth(t.citlWidth, t.confidence));
}

function targetText(t: CitlTarget): string {
  return `${levelText(t.confidence)} CI width for CITL ≤ ${formatSignificant(t.citlWidth)} (outcome units)`;
}

/**
 * Criterion 2 of VAL-CONT as a CriterionResult, with σ²_CITL among the intermediates.
 * @example citlCriterion({ outcomeVariance: 100, rSquaredCitl: 0.8, slope: 1, citlWidth: 1, confidence: 0.95 }).n // 308
 */
export function citlCriterion(t: CitlTarget): CriterionResult {
  const targetSe = seFromCiWidth(t.citlWidth, t.confidence);
  const variance = citlVarianceOrOverflow(t);
  if (variance === null) return sizedCriterion(TEXT, targetText(t), NOT_REACHED, []);
  const size = citlSampleSize(variance, targetSe);
  const intermediates = [
    { name: 'σ²_CITL = var(Y − Ŷ)', value: variance },
    { name: 'target SE(CITL)', value: targetSe },
    { name: 'unrounded n', value: variance / (targetSe * targetSe) },
  ];
  return sizedCriterion(TEXT, targetText(t), size, intermediates);
}

/**
 * What a fixed n delivers for CITL: SE = σ_CITL/√n and the CI width 2z·SE (outcome units).
 * @example citlPrecisionAtN({ outcomeVariance: 100, rSquaredCitl: 0.8, slope: 1, citlWidth: 1, confidence: 0.95 }, 308).meets // true
 */
export function citlPrecisionAtN(t: CitlTarget, n: number): PrecisionAtN {
  const variance = citlVarianceOrOverflow(t);
  const base = {
    id: TEXT.id,
    label: TEXT.label,
    n,
    targetValue: t.citlWidth,
    scale: `${levelText(t.confidence)} CI width (outcome units)`,
  };
  if (n < CITL_LOWEST_N) {
    return { ...base, se: null, achieved: null, meets: false, reason: 'CITL needs at least 2 participants' };
  }
  if (variance === null) return { ...base, se: null, achieved: null, meets: false, reason: 'var(Y − Ŷ) is too large to compute' };
  const se = Math.sqrt(variance / n);
  const achieved = 2 * criticalZ(t.confidence) * se;
  const targetSe = seFromCiWidth(t.citlWidth, t.confidence);
  return { ...base, se, achieved, meets: meetsRequirement(n, variance / (targetSe * targetSe)) };
}
