import { formatDecimal } from '../../format/numbers';
import { zForConfidence } from '../numerics/distributions';
import { accumulateContinuousSums, CONTINUOUS_BLOCK, CONTINUOUS_SUM_SLOTS } from './accumulate-continuous-sums';
import { continuousGeneratingModel } from './continuous-generating-model';
import { CONTINUOUS_MEASURE, CONTINUOUS_MEASURE_COUNT, fitContinuousCalibration } from './fit-continuous-calibration';
import type { ContinuousIntervalConstants } from './fit-continuous-calibration';
import { sdIntervalFactors } from './sd-interval-factors';
import type { ContinuousSimulationConfig } from './simulation-config';
import type { MeasureDefinition, SimulationDesign } from './types';

/**
 * The continuous-outcome validation study as a simulation design: each replicate draws n pairs
 * (Ŷ, Y) from continuousGeneratingModel, accumulates five sums, and fits the calibration models
 * (fitContinuousCalibration). Measures, in order: R², CITL, calibration slope, SD of Y, residual
 * SD of the CITL model (of Y − Ŷ), residual SD of the calibration-slope model.
 * Targets: CI widths for R², CITL and slope; the margin factor for the three SDs.
 * Source of the measures and targets: [VAL-CONT] (Stat Med 2021;40(1):133–146, doi:10.1002/sim.8766).
 * @example createContinuousDesign(parseSimulationConfig(config)).measures.length // 6
 */
export function createContinuousDesign(config: ContinuousSimulationConfig): SimulationDesign {
  const { n, targets } = config;
  const model = continuousGeneratingModel(config.population);
  const z = zForConfidence(targets.confidence);
  const constants: ContinuousIntervalConstants = {
    z,
    fisherHalfWidth: z / Math.sqrt(n - 3),
    sdN1: sdIntervalFactors(n - 1, targets.confidence),
    sdN2: sdIntervalFactors(n - 2, targets.confidence),
  };
  const wald = `Wald, z = ${formatDecimal(z, 4)}`;
  const byIndex: MeasureDefinition[] = new Array<MeasureDefinition>(CONTINUOUS_MEASURE_COUNT);
  byIndex[CONTINUOUS_MEASURE.rSquared] = {
    id: 'r-squared',
    label: 'R²',
    trueValue: model.rSquared,
    scale: 'ci-width',
    targetValue: targets.rSquared.width,
    interval: 'Fisher z on r, squared',
  };
  byIndex[CONTINUOUS_MEASURE.citl] = {
    id: 'citl',
    label: 'calibration-in-the-large',
    trueValue: model.citl,
    scale: 'ci-width',
    targetValue: targets.citl.width,
    interval: wald,
  };
  byIndex[CONTINUOUS_MEASURE.slope] = {
    id: 'slope',
    label: 'calibration slope',
    trueValue: model.slope,
    scale: 'ci-width',
    targetValue: targets.slope.width,
    interval: wald,
  };
  const margin = targets.residualSd.marginFactor;
  byIndex[CONTINUOUS_MEASURE.outcomeSd] = {
    id: 'outcome-sd',
    label: 'SD of the outcome',
    trueValue: model.outcomeSd,
    scale: 'margin-factor',
    targetValue: margin,
    interval: 'chi-square, df = n − 1',
  };
  byIndex[CONTINUOUS_MEASURE.citlResidualSd] = {
    id: 'citl-residual-sd',
    label: 'residual SD of the calibration-in-the-large model',
    trueValue: model.citlResidualSd,
    scale: 'margin-factor',
    targetValue: margin,
    interval: 'chi-square, df = n − 1',
  };
  byIndex[CONTINUOUS_MEASURE.slopeResidualSd] = {
    id: 'slope-residual-sd',
    label: 'residual SD of the calibration-slope model',
    trueValue: model.slopeResidualSd,
    scale: 'margin-factor',
    targetValue: margin,
    interval: 'chi-square, df = n − 2',
  };

  const sums = new Float64Array(CONTINUOUS_SUM_SLOTS);
  const normals = new Float64Array(2 * CONTINUOUS_BLOCK);
  return {
    n,
    measures: byIndex,
    workPerObservation: 1,
    begin: () => sums.fill(0),
    simulate: (stream, count) =>
      accumulateContinuousSums(stream, normals, sums, count, model.predictionSd, model.errorSd, model.slope),
    finish: (out) => fitContinuousCalibration(sums, n, model.citl, constants, out),
  };
}
