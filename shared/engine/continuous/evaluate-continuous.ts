// Every continuous criterion for one target population, in the order the reports list them.
import type { CriterionResult, PrecisionAtN } from '../types';
import { citlCriterion, citlPrecisionAtN } from './citl-criterion';
import type { ContinuousDevelopmentInputs, ContinuousValidationInputs } from './continuous-inputs';
import { devInterceptCriterion, devInterceptPrecisionAtN } from './dev-intercept-criterion';
import { devOptimismCriterion, devOptimismPrecisionAtN } from './dev-optimism-criterion';
import { devResidualSdCriterion, devResidualSdPrecisionAtN } from './dev-residual-sd-criterion';
import { devShrinkageCriterion, devShrinkagePrecisionAtN } from './dev-shrinkage-criterion';
import { r2Criterion, r2PrecisionAtN } from './r2-criterion';
import { residualSdCriterion, residualSdPrecisionAtN } from './residual-sd-criterion';
import { slopeCriterion, slopePrecisionAtN } from './slope-criterion';

/**
 * The five validation criteria of VAL-CONT: r2, citl, slope, residual-sd-citl, residual-sd-slope.
 * Inputs outside their domain throw a DomainError naming the field (the zod edge normally stops
 * them first). @example evaluateContinuousValidation(inputs).map((c) => c.n) // [762, 308, 98, 234, 235]
 */
export function evaluateContinuousValidation(inputs: ContinuousValidationInputs): CriterionResult[] {
  return [
    r2Criterion(inputs),
    citlCriterion(inputs),
    slopeCriterion(inputs),
    residualSdCriterion('citl', inputs),
    residualSdCriterion('slope', inputs),
  ];
}

/**
 * The four development criteria of DEV-CONT: dev-shrinkage, dev-optimism, dev-residual-sd,
 * dev-intercept (the last not assessable without the outcome mean and SD).
 * @example evaluateContinuousDevelopment(lungExample).map((c) => c.n) // [918, 401, 259, 38]
 */
export function evaluateContinuousDevelopment(inputs: ContinuousDevelopmentInputs): CriterionResult[] {
  return [
    devShrinkageCriterion(inputs),
    devOptimismCriterion(inputs),
    devResidualSdCriterion(inputs),
    devInterceptCriterion(inputs),
  ];
}

/**
 * What a fixed n delivers for each validation measure, in the same order as the criteria.
 * @example validationPrecisionAtN(inputs, 200)[0].se // 0.049133 for R² 0.5
 */
export function validationPrecisionAtN(inputs: ContinuousValidationInputs, n: number): PrecisionAtN[] {
  return [
    r2PrecisionAtN(inputs, n),
    citlPrecisionAtN(inputs, n),
    slopePrecisionAtN(inputs, n),
    residualSdPrecisionAtN('citl', inputs, n),
    residualSdPrecisionAtN('slope', inputs, n),
  ];
}

/**
 * What a fixed n delivers for each development measure, in the same order as the criteria.
 * @example developmentPrecisionAtN(lungExample, 500)[1].achieved // 0.04008 (expected optimism)
 */
export function developmentPrecisionAtN(inputs: ContinuousDevelopmentInputs, n: number): PrecisionAtN[] {
  return [
    devShrinkagePrecisionAtN(inputs, n),
    devOptimismPrecisionAtN(inputs, n),
    devResidualSdPrecisionAtN(inputs, n),
    devInterceptPrecisionAtN(inputs, n),
  ];
}
