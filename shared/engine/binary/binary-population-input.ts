// What the engine needs to plan one binary-outcome population, in plain words. The project-file
// schema mirrors these interfaces (zod applies the defaults; the engine receives complete values).
import type { OeTarget } from './oe-criterion';

/** A risk threshold for net benefit, with the anticipated classification there if known. */
export interface NetBenefitThresholdInput {
  readonly threshold: number;
  /** Sensitivity and specificity at the threshold: both or neither (then computed from the LP). */
  readonly sensitivity?: number | undefined;
  readonly specificity?: number | undefined;
}

/** What is anticipated about the model in the target population. */
export interface BinaryAnticipated {
  /** Proportion of participants with the outcome. */
  readonly outcomeProportion: number;
  /** C-statistic (area under the ROC curve). */
  readonly cStatistic?: number | undefined;
  /** Mean and SD of the model's linear predictor (log-odds); both or neither. */
  readonly lpMean?: number | undefined;
  readonly lpSd?: number | undefined;
  /** Calibration model logit P(Y = 1) = intercept + slope·LP; defaults 0 and 1 (well calibrated). */
  readonly calibrationIntercept?: number | undefined;
  readonly calibrationSlope?: number | undefined;
  /** Risk thresholds for net benefit; one criterion per threshold. */
  readonly thresholds?: readonly NetBenefitThresholdInput[] | undefined;
}

/** How precisely each measure should be estimated. */
export interface BinaryPrecision {
  readonly confidence: number;
  /** O/E: a total CI width around 1, or CI limits. */
  readonly oe: OeTarget;
  readonly slope: { readonly width: number };
  readonly cStatistic: { readonly width: number };
  /** CI width for net benefit, or for standardised net benefit (NB/phi) when `standardised`. */
  readonly netBenefit: { readonly width: number; readonly standardised: boolean };
}

export interface BinaryPopulationInput {
  readonly anticipated: BinaryAnticipated;
  readonly precision: BinaryPrecision;
}

/** Development (model-updating) minimums, when the model will be re-estimated. */
export interface BinaryDevelopmentOptions {
  readonly predictorParameters: number;
  /** Anticipated optimism-adjusted Cox–Snell R² (see the cox-snell-from-* helpers). */
  readonly coxSnellR2: number;
  readonly targetShrinkage?: number | undefined;
  readonly optimismMargin?: number | undefined;
  readonly riskMargin?: number | undefined;
}

export interface BinaryPlanOptions {
  readonly development?: BinaryDevelopmentOptions | undefined;
  /** An already available n: the plan then also reports what that n delivers. */
  readonly availableN?: number | undefined;
  /** Gauss–Hermite nodes for narrow LP distributions (default 200; see lpQuadratureRule). */
  readonly hermiteNodes?: number | undefined;
}

/**
 * Default precision targets: O/E CI width 0.2, calibration slope 0.2, C-statistic 0.1, standardised
 * net benefit 0.2, at 95% confidence. These are conventions these authors commonly use, recalled
 * from memory (METHODS 5, flag 9.8), not rules: the project states its own.
 */
export const DEFAULT_BINARY_PRECISION: BinaryPrecision = {
  confidence: 0.95,
  oe: { width: 0.2 },
  slope: { width: 0.2 },
  cStatistic: { width: 0.1 },
  netBenefit: { width: 0.2, standardised: true },
};
