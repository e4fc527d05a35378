// How a project population maps onto the numbers the continuous criteria read, with the
// documented defaults: R² for the CITL and slope models default to the anticipated R², the
// calibration slope to 1; the development margin for the residual SD and the mean outcome is the
// population's residual-SD margin factor.
import type { ContinuousDevelopmentInputs, ContinuousValidationInputs } from '../continuous/continuous-inputs';
import type { ContinuousPopulation, Updating } from '../../model/project';

/** The validation inputs of one population. @example validationInputsOf(population).slope // 1 when not given */
export function validationInputsOf(population: ContinuousPopulation): ContinuousValidationInputs {
  const a = population.anticipated;
  const p = population.precision;
  return {
    rSquared: a.rSquared,
    outcomeVariance: a.outcomeVariance,
    rSquaredCitl: a.rSquaredCitl ?? a.rSquared,
    rSquaredSlope: a.rSquaredSlope ?? a.rSquared,
    slope: a.slope ?? 1,
    confidence: p.confidence,
    r2Width: p.rSquared.width,
    citlWidth: p.citl.width,
    slopeWidth: p.slope.width,
    residualSdMargin: p.residualSd.marginFactor,
  };
}

/** The development inputs of one population under the project's updating settings. */
export function developmentInputsOf(population: ContinuousPopulation, updating: Updating): ContinuousDevelopmentInputs {
  return {
    predictorParameters: updating.predictorParameters,
    adjustedRSquared: updating.anticipatedAdjustedRSquared,
    targetShrinkage: updating.targetShrinkage,
    optimismMargin: updating.optimismMargin,
    residualSdMargin: population.precision.residualSd.marginFactor,
    confidence: population.precision.confidence,
    shrinkageForm: updating.shrinkageForm,
    outcomeMean: population.anticipated.outcomeMean,
    outcomeSd: population.anticipated.outcomeSd,
  };
}
