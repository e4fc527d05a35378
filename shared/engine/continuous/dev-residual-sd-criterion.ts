// Development criterion (iii): the residual SD estimated precisely, n = df* + P + 1 [DEV-CONT].
import type { CriterionResult, PrecisionAtN } from '../types';
import type { ContinuousDevelopmentInputs } from './continuous-inputs';
import type { CriterionText } from './criterion-result';
import { notAssessableCriterion, sizedCriterion } from './criterion-result';
import { developmentCore } from './development-inputs-check';
import { residualSdIntermediates, residualSdPrecision, residualSdTargetText } from './residual-sd-criterion';
import { residualSdSampleSize } from './residual-sd-sample-size';
import type { SampleSize } from './sample-size';

const TEXT: CriterionText = {
  id: 'dev-residual-sd',
  label: 'Precise residual SD (development)',
  purpose: 'development',
  formula: 'n = df + P + 1, df = smallest df with max(√(χ²_{1−α/2,df}/df), √(df/χ²_{α/2,df})) ≤ m',
  references: ['DEV-CONT'],
};

/**
 * The size of criterion (iii) (the number only), or why it cannot be assessed.
 * @example devResidualSdSize(lungExample) // { n: 259, status: 'ok' }
 */
export function devResidualSdSize(inputs: ContinuousDevelopmentInputs): SampleSize | string {
  const core = developmentCore(inputs);
  if (typeof core === 'string') return core;
  return residualSdSampleSize(inputs.residualSdMargin, inputs.confidence, core.predictorParameters + 1);
}

/**
 * Criterion (iii) of DEV-CONT: residual df = n − P − 1 must reach the df where MMOE ≤ m, hence
 * 234 + P at margin 1.1 and 95% (259 for P = 25). Not assessable without P.
 * @example devResidualSdCriterion({ predictorParameters: 25, residualSdMargin: 1.1, confidence: 0.95, … }).n // 259
 */
export function devResidualSdCriterion(inputs: ContinuousDevelopmentInputs): CriterionResult {
  const size = devResidualSdSize(inputs);
  if (typeof size === 'string') return notAssessableCriterion(TEXT, residualSdTargetText(inputs), size);
  const k = (inputs.predictorParameters ?? 0) + 1;
  return sizedCriterion(TEXT, residualSdTargetText(inputs), size, residualSdIntermediates(size.n, k, inputs.confidence));
}

/**
 * MMOE of the residual SD at a fixed n (df = n − P − 1); n = 500, P = 25 → 1.06799.
 * @example devResidualSdPrecisionAtN({ predictorParameters: 25, residualSdMargin: 1.1, confidence: 0.95, … }, 500).achieved // 1.067990…
 */
export function devResidualSdPrecisionAtN(inputs: ContinuousDevelopmentInputs, n: number): PrecisionAtN {
  const core = developmentCore(inputs);
  if (typeof core === 'string') {
    return {
      id: TEXT.id,
      label: TEXT.label,
      n,
      se: null,
      achieved: null,
      targetValue: inputs.residualSdMargin,
      scale: 'multiplicative margin',
      meets: null,
      reason: core,
    };
  }
  return residualSdPrecision(TEXT, inputs, n, core.predictorParameters + 1);
}
