import { SUM_U, SUM_UU, SUM_UY, SUM_Y, SUM_YY } from './accumulate-continuous-sums';
import type { SdIntervalFactors } from './sd-interval-factors';
import type { ReplicateOutcome } from './types';

/** Order of the continuous measures in a ReplicateOutcome. */
export const CONTINUOUS_MEASURE = {
  rSquared: 0,
  citl: 1,
  slope: 2,
  outcomeSd: 3,
  citlResidualSd: 4,
  slopeResidualSd: 5,
} as const;
export const CONTINUOUS_MEASURE_COUNT = 6;

/** Quantities fixed for a whole simulation (they depend on n and the confidence level only). */
export interface ContinuousIntervalConstants {
  /** Two-sided normal critical value for the Wald intervals. */
  readonly z: number;
  /** z / √(n − 3): half-width of the Fisher-z interval on the atanh(r) scale. */
  readonly fisherHalfWidth: number;
  /** Chi-square factors for SDs with n − 1 degrees of freedom (outcome SD, CITL-model residual SD). */
  readonly sdN1: SdIntervalFactors;
  /** Chi-square factors for SDs with n − 2 degrees of freedom (slope-model residual SD). */
  readonly sdN2: SdIntervalFactors;
}

function setMeasure(
  out: ReplicateOutcome,
  index: number,
  estimable: boolean,
  estimate: number,
  lower: number,
  upper: number,
  size: number,
): void {
  out.estimable[index] = estimable ? 1 : 0;
  out.estimate[index] = estimate;
  out.lower[index] = lower;
  out.upper[index] = upper;
  out.size[index] = size;
}

function setWald(out: ReplicateOutcome, index: number, estimate: number, se: number, z: number): void {
  setMeasure(out, index, se > 0, estimate, estimate - z * se, estimate + z * se, 2 * z * se);
}

function setSd(out: ReplicateOutcome, index: number, sd: number, factors: SdIntervalFactors): void {
  setMeasure(out, index, sd > 0 && Number.isFinite(sd), sd, sd * factors.lower, sd * factors.upper, factors.margin);
}

/**
 * Fits the calibration models of one continuous replicate from its running sums (u = Ŷ − m,
 * y = Y − E(Y); `citl` is the true CITL, added back because the sums are centred) and writes the
 * six measures into `out` at the CONTINUOUS_MEASURE slots:
 * - CITL: mean(Y − Ŷ), SE = SD(Y − Ŷ)/√n, Wald interval ± z·SE (Y − Ŷ = CITL + ε, slope fixed at 1).
 * - Calibration slope: OLS b = S_uy/S_uu, SE = √(s²/S_uu) with s² = RSS/(n − 2), Wald ± z·SE.
 * - R² of Y on Ŷ: r² = S_uy²/(S_uu·S_yy); interval from Fisher's z, tanh(atanh r ± z/√(n − 3)),
 *   squared (a limit pair straddling 0 gives [0, max²]). Fisher-z is used rather than a Wald
 *   interval on the closed form's asymptotic SE because it keeps the limits inside [0, 1] and
 *   holds its coverage at moderate n; its width at the anticipated R² is close to 2·z·SE(R²).
 * - SDs of Y (df n − 1), of Y − Ŷ (df n − 1) and the slope model's residual SD (df n − 2):
 *   chi-square intervals (sdIntervalFactors); their size is the multiplicative margin.
 * Interval sizes are widths (upper − lower) except the SDs' margin factors.
 * Sources: Fisher RA, On the "probable error" of a coefficient of correlation deduced from a small
 * sample, Metron 1921;1:3–32 (the z-transformation; common practice); OLS and Wald intervals are
 * common practice; the measures are those of [VAL-CONT] (Stat Med
 * 2021;40(1):133–146, doi:10.1002/sim.8766).
 * Degenerate samples (no spread in Ŷ, a perfect fit) have probability 0; they are marked not
 * estimable rather than producing NaN.
 */
export function fitContinuousCalibration(
  sums: Float64Array,
  n: number,
  citl: number,
  constants: ContinuousIntervalConstants,
  out: ReplicateOutcome,
): void {
  const su = sums[SUM_U]!;
  const sy = sums[SUM_Y]!;
  const suu = sums[SUM_UU]!;
  const syy = sums[SUM_YY]!;
  const suy = sums[SUM_UY]!;
  const sxx = suu - (su * su) / n;
  const syyCentred = syy - (sy * sy) / n;
  const sxy = suy - (su * sy) / n;
  const { z } = constants;

  // Calibration-in-the-large: the mean of Y − Ŷ and the SD of the differences.
  const sumDifference = sy - su;
  const sdd = syy - 2 * suy + suu - (sumDifference * sumDifference) / n;
  const differenceSd = Math.sqrt(Math.max(sdd, 0) / (n - 1));
  const citlEstimate = citl + sumDifference / n;
  setWald(out, CONTINUOUS_MEASURE.citl, citlEstimate, differenceSd / Math.sqrt(n), z);

  // Calibration slope by OLS, and the residual SD of that model.
  const b = sxx > 0 ? sxy / sxx : 0;
  const rss = syyCentred - b * sxy;
  const residualSd = Math.sqrt(Math.max(rss, 0) / (n - 2));
  setWald(out, CONTINUOUS_MEASURE.slope, b, sxx > 0 ? residualSd / Math.sqrt(sxx) : 0, z);

  // R² of Y on Ŷ with a Fisher-z interval.
  const product = sxx * syyCentred;
  const r = product > 0 ? sxy / Math.sqrt(product) : 0;
  const rOk = product > 0 && Math.abs(r) < 1;
  const centre = rOk ? Math.atanh(r) : 0;
  const low = Math.tanh(centre - constants.fisherHalfWidth);
  const high = Math.tanh(centre + constants.fisherHalfWidth);
  const lower = low >= 0 ? low * low : high <= 0 ? high * high : 0;
  const upper = Math.max(low * low, high * high);
  setMeasure(out, CONTINUOUS_MEASURE.rSquared, rOk, r * r, lower, upper, upper - lower);

  setSd(out, CONTINUOUS_MEASURE.outcomeSd, Math.sqrt(Math.max(syyCentred, 0) / (n - 1)), constants.sdN1);
  setSd(out, CONTINUOUS_MEASURE.citlResidualSd, differenceSd, constants.sdN1);
  setSd(out, CONTINUOUS_MEASURE.slopeResidualSd, residualSd, constants.sdN2);
}
