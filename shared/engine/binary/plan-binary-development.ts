// The development (model-updating) minimums for a binary outcome on their own.
import type { BinaryDevelopmentInputs } from './binary-development-inputs';
import { developmentOptimismCriterion } from './development-optimism-criterion';
import { developmentShrinkageCriterion } from './development-shrinkage-criterion';
import { overallRiskCriterion } from './overall-risk-criterion';
import type { PlanTotals } from './plan-totals';
import { planTotals } from './plan-totals';

/**
 * Criteria (i)–(iii) of DEV-BIN-SURV (METHODS 4): n = max(n1, n2, n3), E = n·phi, EPP = E/P.
 * Domain: as requireDevelopmentInputs; otherwise a DomainError naming the field.
 * @example planBinaryDevelopment({ predictorParameters: 24, coxSnellR2: 0.288, outcomeProportion: 0.174, targetShrinkage: 0.9, optimismMargin: 0.05, riskMargin: 0.05, confidence: 0.95 }).n // 662
 */
export function planBinaryDevelopment(inputs: BinaryDevelopmentInputs): PlanTotals {
  const criteria = [developmentShrinkageCriterion(inputs), developmentOptimismCriterion(inputs), overallRiskCriterion(inputs)];
  return planTotals(criteria, inputs.outcomeProportion, inputs.predictorParameters);
}
