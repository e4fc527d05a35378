import type { ContinuousSimulationConfig } from './simulation-config';

/** Parameters that generate one continuous-outcome validation sample, and the true measures. */
export interface ContinuousGeneratingModel {
  /** SD of the model's prediction Ŷ in the population, √var(Ŷ). */
  readonly predictionSd: number;
  /** SD of the error e in Y = a + β·Ŷ + e. */
  readonly errorSd: number;
  readonly slope: number;
  readonly citl: number;
  readonly rSquared: number;
  /** SD of Y. */
  readonly outcomeSd: number;
  /** SD of Y − Ŷ: the residual SD of the calibration-in-the-large model, σ_CITL. */
  readonly citlResidualSd: number;
  /** Residual SD of the calibration-slope model, SD(e). */
  readonly slopeResidualSd: number;
}

/**
 * Translates anticipated values into a data-generating model. With
 *   Ŷ ~ N(m, var(Ŷ)),  Y = a + β·Ŷ + e,  e ~ N(0, σ²_e)  independent of Ŷ,
 * var(Y) = β²·var(Ŷ) + σ²_e and the R² of Y on Ŷ is β²·var(Ŷ)/var(Y). Requiring that R² and var(Y)
 * hold gives var(Ŷ) = R²·var(Y)/β² and σ²_e = var(Y)(1 − R²); the calibration slope is β and
 * CITL = E(Y − Ŷ) = a + (β − 1)m, so a = CITL − (β − 1)m. Then var(Y − Ŷ) = (β − 1)²var(Ŷ) + σ²_e,
 * the σ²_CITL of the closed form. These are the definitions of [VAL-CONT] as written out in the
 * project's methods reference, sections 2.2–2.3 (Stat Med 2021;40(1):133–146, doi:10.1002/sim.8766).
 * The mean m of Ŷ is immaterial: every estimator used (mean of Y − Ŷ, OLS slope, R², residual SDs)
 * is unchanged by shifting Ŷ and Y together, so the simulation takes m = 0 and a = CITL.
 * Domain: as validated by parseSimulationConfig (0 < R² < 1, var(Y) > 0, β ≠ 0).
 * @example continuousGeneratingModel({ rSquared: 0.8, outcomeVariance: 100, slope: 1, citl: 0 }).citlResidualSd // √20 = 4.4721
 */
export function continuousGeneratingModel(population: ContinuousSimulationConfig['population']): ContinuousGeneratingModel {
  const { rSquared, outcomeVariance, slope, citl } = population;
  const predictionVariance = (rSquared * outcomeVariance) / (slope * slope); // var(Ŷ) = R²·var(Y)/β² [VAL-CONT 2.2]
  const errorVariance = outcomeVariance * (1 - rSquared); // σ²_e = var(Y)(1 − R²)
  const citlVariance = (slope - 1) * (slope - 1) * predictionVariance + errorVariance; // σ²_CITL [VAL-CONT 2.2]
  return {
    predictionSd: Math.sqrt(predictionVariance),
    errorSd: Math.sqrt(errorVariance),
    slope,
    citl,
    rSquared,
    outcomeSd: Math.sqrt(outcomeVariance),
    citlResidualSd: Math.sqrt(citlVariance),
    slopeResidualSd: Math.sqrt(errorVariance),
  };
}
