// Development criterion (ii): small optimism, |apparent − adjusted R²| ≤ δ [DEV-CONT].
import { formatSignificant } from '../../format/numbers';
import { requireCount, requireOpenUnit } from '../helpers/domain-guards';
import type { CriterionResult, PrecisionAtN } from '../types';
import type { ContinuousDevelopmentInputs } from './continuous-inputs';
import type { CriterionText } from './criterion-result';
import { notAssessableCriterion, sizedCriterion } from './criterion-result';
import { developmentCore } from './development-inputs-check';
import { meetsRequirement } from './precision-tolerance';
import type { SampleSize } from './sample-size';
import { closedFormSize } from './sample-size';

const TEXT: CriterionText = {
  id: 'dev-optimism',
  label: 'Small optimism in R² (development)',
  purpose: 'development',
  formula: 'n = 1 + P(1 − R²_adj)/δ, from R²_app − R²_adj = P(1 − R²_adj)/(n − 1)',
  references: ['DEV-CONT'],
};

/**
 * Smallest n with expected optimism R²_app − R²_adj = P(1 − R²_adj)/(n − 1) ≤ δ:
 *   n = ⌈1 + P(1 − R²_adj)/δ⌉ (guarded), at least P + 2.
 * Domain: whole P ≥ 1, 0 < R²_adj < 1, 0 < δ < 1; otherwise a DomainError.
 * Source: DEV-CONT criterion (ii) (METHODS.md 3.2 [DERIVED]). Exact closed form.
 * @example optimismSampleSize(25, 0.2, 0.05).n // 401
 */
export function optimismSampleSize(predictorParameters: number, adjustedRSquared: number, optimismMargin: number): SampleSize {
  requireCount('predictorParameters', predictorParameters, 1);
  requireOpenUnit('adjustedRSquared', adjustedRSquared);
  requireOpenUnit('optimismMargin', optimismMargin);
  return closedFormSize(optimismRequirement(predictorParameters, adjustedRSquared, optimismMargin), predictorParameters + 2);
}

/** The unrounded n of criterion (ii), 1 + P(1 − R²_adj)/δ (inputs already checked). */
function optimismRequirement(predictorParameters: number, adjustedRSquared: number, optimismMargin: number): number {
  return 1 + (predictorParameters * (1 - adjustedRSquared)) / optimismMargin;
}

/**
 * The size of criterion (ii) (the number only), or why it cannot be assessed.
 * @example devOptimismSize(lungExample) // { n: 401, status: 'ok' }
 */
export function devOptimismSize(inputs: ContinuousDevelopmentInputs): SampleSize | string {
  const core = developmentCore(inputs);
  if (typeof core === 'string') return core;
  return optimismSampleSize(core.predictorParameters, core.adjustedRSquared, inputs.optimismMargin);
}

function targetText(inputs: ContinuousDevelopmentInputs): string {
  return `apparent − adjusted R² ≤ ${formatSignificant(inputs.optimismMargin)}`;
}

/**
 * Criterion (ii) of DEV-CONT as a CriterionResult; not assessable without P and R²_adj.
 * @example devOptimismCriterion({ predictorParameters: 25, adjustedRSquared: 0.2, optimismMargin: 0.05, … }).n // 401
 */
export function devOptimismCriterion(inputs: ContinuousDevelopmentInputs): CriterionResult {
  const size = devOptimismSize(inputs);
  if (typeof size === 'string') return notAssessableCriterion(TEXT, targetText(inputs), size);
  const note =
    size.status === 'always-met' ? 'the optimism is within the margin at every admissible n (P + 2 and above)' : undefined;
  return sizedCriterion(TEXT, targetText(inputs), size, [], note);
}

/**
 * Expected optimism P(1 − R²_adj)/(n − 1) at a fixed n; n = 500, P = 25, R²_adj = 0.2 → 0.04008.
 * @example devOptimismPrecisionAtN({ predictorParameters: 25, adjustedRSquared: 0.2, optimismMargin: 0.05, … }, 500).achieved // 0.040080…
 */
export function devOptimismPrecisionAtN(inputs: ContinuousDevelopmentInputs, n: number): PrecisionAtN {
  const base = {
    id: TEXT.id,
    label: TEXT.label,
    n,
    targetValue: inputs.optimismMargin,
    scale: 'expected apparent − adjusted R²',
    se: null,
  };
  const core = developmentCore(inputs);
  if (typeof core === 'string') return { ...base, achieved: null, meets: null, reason: core };
  const p = core.predictorParameters;
  if (n < p + 2)
    return { ...base, achieved: null, meets: false, reason: `a model with P = ${p} needs at least P + 2 participants` };
  const achieved = (p * (1 - core.adjustedRSquared)) / (n - 1);
  return { ...base, achieved, meets: meetsRequirement(n, optimismRequirement(p, core.adjustedRSquared, inputs.optimismMargin)) };
}
