// The numbers the continuous criteria read, with every default already applied (see
// shared/engine/plan/population-inputs.ts for how a project population maps onto them).

/** Validation of an existing model in one target population [VAL-CONT]. */
export interface ContinuousValidationInputs {
  /** Anticipated R² of the model in the population, 0 < R² < 1. */
  readonly rSquared: number;
  /** Variance of the outcome in the population (squared outcome units), > 0. */
  readonly outcomeVariance: number;
  /** R² entering the CITL variance (usually equal to rSquared). */
  readonly rSquaredCitl: number;
  /** R² of the calibration-slope model (usually equal to rSquared). */
  readonly rSquaredSlope: number;
  /** Anticipated calibration slope β (1 = well calibrated), non-zero. */
  readonly slope: number;
  /** Confidence level of every interval, 0 < level < 1 (usually 0.95). */
  readonly confidence: number;
  /** Target CI width for R². */
  readonly r2Width: number;
  /** Target CI width for CITL, in outcome units. */
  readonly citlWidth: number;
  /** Target CI width for the calibration slope. */
  readonly slopeWidth: number;
  /** Target multiplicative margin of error for the residual SDs, > 1. */
  readonly residualSdMargin: number;
}

/** Which form of the development shrinkage criterion to use (see dev-shrinkage-criterion.ts). */
export type ShrinkageForm = 'adjusted-r2-link' | 'closed-form';

/** Development (local updating) of a linear-regression model [DEV-CONT]. */
export interface ContinuousDevelopmentInputs {
  /** Number of candidate predictor parameters P; absent when the user has not given it. */
  readonly predictorParameters: number | undefined;
  /** Anticipated adjusted R²; absent when the user has not given it. */
  readonly adjustedRSquared: number | undefined;
  /** Target expected shrinkage factor S (usually 0.9). */
  readonly targetShrinkage: number;
  /** Allowed difference between apparent and adjusted R² (usually 0.05). */
  readonly optimismMargin: number;
  /** Target multiplicative margin for the residual SD and for the mean outcome (usually 1.1). */
  readonly residualSdMargin: number;
  readonly confidence: number;
  readonly shrinkageForm: ShrinkageForm;
  /** Anticipated mean and SD of the outcome, for the intercept criterion. */
  readonly outcomeMean: number | undefined;
  readonly outcomeSd: number | undefined;
}
