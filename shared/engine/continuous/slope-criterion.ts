// Validation criterion 3: the calibration slope estimated precisely [VAL-CONT].
import { formatSignificant } from '../../format/numbers';
import { requireCount, requireNonZero, requireOpenUnit, requirePositiveOrInfinite } from '../helpers/domain-guards';
import { criticalZ } from '../helpers/critical-z';
import { seFromCiWidth } from '../helpers/se-from-ci-width';
import type { CriterionResult, PrecisionAtN } from '../types';
import type { CriterionText } from './criterion-result';
import { levelText, sizedCriterion } from './criterion-result';
import { meetsRequirement } from './precision-tolerance';
import type { SampleSize } from './sample-size';
import { closedFormSize } from './sample-size';

/** What criterion 3 reads (field names as in ContinuousValidationInputs, which satisfies it). */
export interface SlopeTarget {
  readonly rSquaredSlope: number;
  readonly slope: number;
  readonly slopeWidth: number;
  readonly confidence: number;
}

/** Intercept and slope leave n − 2 residual degrees of freedom: at least 3 participants. */
const SLOPE_LOWEST_N = 3;

const TEXT: CriterionText = {
  id: 'slope',
  label: 'Precise calibration slope',
  purpose: 'validation',
  formula: 'n = β²(1 − R²) / (SE*²·R²) + 1, SE* = W / (2z)',
  references: ['VAL-CONT'],
};

/**
 * Smallest n with SE(b̂) ≤ SE*, where SE(b̂)² = β²(1 − R²)/(R²(n − 1)) for the OLS slope of Y on Ŷ:
 *   n = ⌈β²(1 − R²)/(SE*²·R²) + 1⌉ (guarded ceiling), at least 3.
 * Domain: 0 < R² < 1, β ≠ 0 finite, SE* > 0 finite; otherwise a DomainError.
 * Source: VAL-CONT criterion 3 (METHODS.md 2.3 [DERIVED]). Exact closed form.
 * @example slopeSampleSize(0.8, 1, 0.051).n // 98
 */
export function slopeSampleSize(rSquaredSlope: number, slope: number, targetSe: number): SampleSize {
  requireOpenUnit('rSquaredSlope', rSquaredSlope);
  requireNonZero('slope', slope);
  requirePositiveOrInfinite('targetSe', targetSe);
  return closedFormSize(slopeRequirement(rSquaredSlope, slope, targetSe), SLOPE_LOWEST_N);
}

/** The unrounded n of criterion 3, β²(1 − R²)/(SE*²·R²) + 1 (inputs already checked). */
function slopeRequirement(rSquaredSlope: number, slope: number, targetSe: number): number {
  return (slope * slope * (1 - rSquaredSlope)) / (targetSe * targetSe * rSquaredSlope) + 1;
}

/**
 * SE of the calibration slope at n: √(β²(1 − R²)/(R²(n − 1))). Domain as slopeSampleSize, whole n ≥ 2.
 * Source: VAL-CONT (METHODS.md 2.3). @example slopeStandardError(0.8, 1, 98) // 0.050767…
 */
export function slopeStandardError(rSquaredSlope: number, slope: number, n: number): number {
  requireOpenUnit('rSquaredSlope', rSquaredSlope);
  requireNonZero('slope', slope);
  requireCount('n', n, 2);
  return Math.sqrt((slope * slope * (1 - rSquaredSlope)) / (rSquaredSlope * (n - 1)));
}

/**
 * The size of criterion 3 for a target (the number only; slopeCriterion adds the words).
 * @example slopeSize({ rSquaredSlope: 0.8, slope: 1, slopeWidth: 0.2, confidence: 0.95 }) // { n: 98, status: 'ok' }
 */
export function slopeSize(t: SlopeTarget): SampleSize {
  return slopeSampleSize(t.rSquaredSlope, t.slope, seFromCiWidth(t.slopeWidth, t.confidence));
}

function targetText(t: SlopeTarget): string {
  return `${levelText(t.confidence)} CI width for the calibration slope ≤ ${formatSignificant(t.slopeWidth)}`;
}

/**
 * Criterion 3 of VAL-CONT as a CriterionResult.
 * @example slopeCriterion({ rSquaredSlope: 0.8, slope: 1, slopeWidth: 0.2, confidence: 0.95 }).n // 98
 */
export function slopeCriterion(t: SlopeTarget): CriterionResult {
  const targetSe = seFromCiWidth(t.slopeWidth, t.confidence);
  const intermediates = [
    { name: 'target SE(slope)', value: targetSe },
    { name: 'unrounded n', value: slopeRequirement(t.rSquaredSlope, t.slope, targetSe) },
  ];
  return sizedCriterion(TEXT, targetText(t), slopeSize(t), intermediates);
}

/**
 * What a fixed n delivers for the calibration slope: its SE and the CI width 2z·SE.
 * @example slopePrecisionAtN({ rSquaredSlope: 0.8, slope: 1, slopeWidth: 0.2, confidence: 0.95 }, 98).se // 0.050767…
 */
export function slopePrecisionAtN(t: SlopeTarget, n: number): PrecisionAtN {
  const base = { id: TEXT.id, label: TEXT.label, n, targetValue: t.slopeWidth, scale: `${levelText(t.confidence)} CI width` };
  if (n < SLOPE_LOWEST_N) {
    return { ...base, se: null, achieved: null, meets: false, reason: 'the calibration slope needs at least 3 participants' };
  }
  const se = slopeStandardError(t.rSquaredSlope, t.slope, n);
  const achieved = 2 * criticalZ(t.confidence) * se;
  const targetSe = seFromCiWidth(t.slopeWidth, t.confidence);
  return { ...base, se, achieved, meets: meetsRequirement(n, slopeRequirement(t.rSquaredSlope, t.slope, targetSe)) };
}
