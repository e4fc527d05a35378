import { WELL_CALIBRATED } from '../binary/lp-distribution';
import type { Calibration, NormalLp } from '../binary/lp-distribution';
import { lpCStatistic } from '../binary/lp-c-statistic';
import { lpOutcomeProportion } from '../binary/lp-outcome-proportion';
import type { BinarySimulationConfig } from './simulation-config';

/** Parameters that generate one binary-outcome validation sample, and the true measures. */
export interface BinaryGeneratingModel {
  readonly lp: NormalLp;
  readonly calibration: Calibration;
  /** P(Y = 1) in the population, E[expit(α + β·LP)]. */
  readonly outcomeProportion: number;
  /** Mean predicted risk, E[expit(LP)]. */
  readonly meanPredictedRisk: number;
  /** Population O/E = P(Y = 1) / E[expit(LP)] (1 when well calibrated). */
  readonly observedExpected: number;
  /** Population C-statistic of the LP for these outcomes. */
  readonly cStatistic: number;
}

/**
 * The binary validation model: LP ~ N(μ, σ²) is the model's linear predictor, and the outcome
 * follows the calibration model logit P(Y = 1 | LP) = α + β·LP, so the calibration slope is β and
 * the model is well calibrated when α = 0 and β = 1 ([VAL-BIN], Stat Med 2021;40(19):4230–4251,
 * doi:10.1002/sim.9025; methods reference section 5.2). The true O/E and C-statistic are the
 * binary engine's integrals over the LP distribution (lpOutcomeProportion, lpCStatistic), so the
 * simulation and the closed forms share one definition of the truth.
 * Domain: as validated by parseSimulationConfig (σ > 0, β > 0).
 * @example binaryGeneratingModel({ lpMean: -2.777, lpSd: 1.28826, calibrationIntercept: 0, calibrationSlope: 1 }).cStatistic // ≈ 0.800
 */
export function binaryGeneratingModel(population: BinarySimulationConfig['population']): BinaryGeneratingModel {
  const lp: NormalLp = { mean: population.lpMean, sd: population.lpSd };
  const calibration: Calibration = { intercept: population.calibrationIntercept, slope: population.calibrationSlope };
  const outcomeProportion = lpOutcomeProportion(lp, calibration);
  const meanPredictedRisk = lpOutcomeProportion(lp, WELL_CALIBRATED);
  return {
    lp,
    calibration,
    outcomeProportion,
    meanPredictedRisk,
    observedExpected: outcomeProportion / meanPredictedRisk,
    cStatistic: lpCStatistic(lp, calibration),
  };
}
