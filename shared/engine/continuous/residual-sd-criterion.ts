// Validation criterion 4: the residual SDs of both calibration models estimated precisely [VAL-CONT].
import { formatSignificant } from '../../format/numbers';
import { NumberMemo } from '../helpers/number-memo';
import { multiplicativeMarginOfError } from '../numerics/mmoe';
import type { CriterionResult, Intermediate, PrecisionAtN } from '../types';
import type { CriterionText } from './criterion-result';
import { levelText, sizedCriterion } from './criterion-result';
import { residualSdSampleSize } from './residual-sd-sample-size';
import type { SampleSize } from './sample-size';

/** What criterion 4 reads (field names as in the validation and development inputs, which satisfy it). */
export interface ResidualSdTarget {
  readonly residualSdMargin: number;
  readonly confidence: number;
}

/** The two calibration models: Y − Ŷ = a + e (CITL, one coefficient) and Y = a + bŶ + e (slope, two). */
export type CalibrationModel = 'citl' | 'slope';

const COEFFICIENTS: Readonly<Record<CalibrationModel, number>> = { citl: 1, slope: 2 };

const TEXTS: Readonly<Record<CalibrationModel, CriterionText>> = {
  citl: {
    id: 'residual-sd-citl',
    label: 'Precise residual SD (CITL model)',
    purpose: 'validation',
    formula: 'n = df + 1, df = smallest df with max(√(χ²_{1−α/2,df}/df), √(df/χ²_{α/2,df})) ≤ m',
    references: ['VAL-CONT'],
  },
  slope: {
    id: 'residual-sd-slope',
    label: 'Precise residual SD (calibration-slope model)',
    purpose: 'validation',
    formula: 'n = df + 2, df = smallest df with max(√(χ²_{1−α/2,df}/df), √(df/χ²_{α/2,df})) ≤ m',
    references: ['VAL-CONT'],
  },
};

/** Target wording shared with the development residual-SD criterion. */
export function residualSdTargetText(t: ResidualSdTarget): string {
  return `${levelText(t.confidence)} CI for the residual SD within ×/÷ ${formatSignificant(t.residualSdMargin)}`;
}

// MMOE at the df a criterion settles on: the same few (df, level) pairs recur in every plan, and
// each costs two chi-square quantiles.
const marginsShown = new NumberMemo<number>();

/** MMOE at the chosen n, for the intermediates (the df that first meets the margin). */
export function residualSdIntermediates(n: number | null, coefficients: number, confidence: number): Intermediate[] {
  if (n === null) return [];
  const df = n - coefficients;
  let margin = marginsShown.get(df, confidence);
  if (margin === undefined) {
    margin = multiplicativeMarginOfError(df, confidence);
    marginsShown.set(df, confidence, margin);
  }
  return [
    { name: 'residual degrees of freedom', value: df },
    { name: 'multiplicative margin of error at that df', value: margin },
  ];
}

/**
 * The size of criterion 4 for one calibration model (the number only).
 * @example residualSdSize('citl', { residualSdMargin: 1.1, confidence: 0.95 }) // { n: 234, status: 'ok' }
 */
export function residualSdSize(model: CalibrationModel, t: ResidualSdTarget): SampleSize {
  return residualSdSampleSize(t.residualSdMargin, t.confidence, COEFFICIENTS[model]);
}

/**
 * Criterion 4 of VAL-CONT for one calibration model: 234 (CITL model) and 235 (slope model) at
 * margin 1.1 and 95%.
 * @example residualSdCriterion('slope', { residualSdMargin: 1.1, confidence: 0.95 }).n // 235
 */
export function residualSdCriterion(model: CalibrationModel, t: ResidualSdTarget): CriterionResult {
  const k = COEFFICIENTS[model];
  const size = residualSdSize(model, t);
  return sizedCriterion(TEXTS[model], residualSdTargetText(t), size, residualSdIntermediates(size.n, k, t.confidence));
}

/** Precision of a residual SD with df residual degrees of freedom, shared with development. */
export function residualSdPrecision(text: CriterionText, t: ResidualSdTarget, n: number, coefficients: number): PrecisionAtN {
  const base = {
    id: text.id,
    label: text.label,
    n,
    targetValue: t.residualSdMargin,
    scale: `multiplicative margin of the ${levelText(t.confidence)} CI for the SD`,
    se: null,
  };
  const df = n - coefficients;
  if (df < 1) {
    return { ...base, achieved: null, meets: false, reason: `a residual SD needs more than ${coefficients} participants` };
  }
  const achieved = multiplicativeMarginOfError(df, t.confidence);
  return { ...base, achieved, meets: achieved <= t.residualSdMargin };
}

/**
 * What a fixed n delivers for a calibration model's residual SD: the multiplicative margin MMOE(n − k).
 * @example residualSdPrecisionAtN('citl', { residualSdMargin: 1.1, confidence: 0.95 }, 234).achieved // 1.099848…
 */
export function residualSdPrecisionAtN(model: CalibrationModel, t: ResidualSdTarget, n: number): PrecisionAtN {
  return residualSdPrecision(TEXTS[model], t, n, COEFFICIENTS[model]);
}
