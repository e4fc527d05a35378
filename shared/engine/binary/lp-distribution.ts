// The anticipated distribution of the model's linear predictor (log-odds scale) in the target
// population, and the anticipated calibration of the model there.

/** LP ~ N(mean, sd²) on the log-odds scale. */
export interface NormalLp {
  readonly mean: number;
  readonly sd: number;
}

/**
 * Calibration model logit P(Y = 1) = intercept + slope·LP ([VAL-BIN]); intercept 0 and
 * slope 1 mean the model is well calibrated.
 */
export interface Calibration {
  readonly intercept: number;
  readonly slope: number;
}

export const WELL_CALIBRATED: Calibration = { intercept: 0, slope: 1 };
