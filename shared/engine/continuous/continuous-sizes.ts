// The numbers alone: every criterion's n for one population without the words (labels, targets,
// formulas, intermediates). The same per-criterion functions the full results are built from, for
// the callers that evaluate many scenarios — assumption sweeps and the engine benchmark.
import type { CriterionPurpose, CriterionStatus } from '../types';
import { citlSize } from './citl-criterion';
import type { ContinuousDevelopmentInputs, ContinuousValidationInputs } from './continuous-inputs';
import type { ContinuousCriterionId } from './criterion-ids';
import { devInterceptSize } from './dev-intercept-criterion';
import { devOptimismSize } from './dev-optimism-criterion';
import { devResidualSdSize } from './dev-residual-sd-criterion';
import { devShrinkageSize } from './dev-shrinkage-criterion';
import { r2Size } from './r2-criterion';
import { residualSdSize } from './residual-sd-criterion';
import type { SampleSize } from './sample-size';
import { slopeSize } from './slope-criterion';

/** One criterion's n and status, as in its CriterionResult. */
export interface CriterionSize {
  readonly id: ContinuousCriterionId;
  readonly purpose: CriterionPurpose;
  readonly n: number | null;
  readonly status: CriterionStatus;
}

function sized(id: ContinuousCriterionId, purpose: CriterionPurpose, size: SampleSize | string): CriterionSize {
  return typeof size === 'string'
    ? { id, purpose, n: null, status: 'not-assessable' }
    : { id, purpose, n: size.n, status: size.status };
}

/**
 * n of the five validation criteria, in the order of evaluateContinuousValidation (which gives
 * the same n and status with the words added).
 * @example validationSizes(inputs).map((c) => c.n) // [762, 308, 98, 234, 235]
 */
export function validationSizes(inputs: ContinuousValidationInputs): CriterionSize[] {
  return [
    sized('r2', 'validation', r2Size(inputs)),
    sized('citl', 'validation', citlSize(inputs)),
    sized('slope', 'validation', slopeSize(inputs)),
    sized('residual-sd-citl', 'validation', residualSdSize('citl', inputs)),
    sized('residual-sd-slope', 'validation', residualSdSize('slope', inputs)),
  ];
}

/**
 * n of the four development criteria, in the order of evaluateContinuousDevelopment.
 * @example developmentSizes(lungExample).map((c) => c.n) // [918, 401, 259, 38]
 */
export function developmentSizes(inputs: ContinuousDevelopmentInputs): CriterionSize[] {
  return [
    sized('dev-shrinkage', 'development', devShrinkageSize(inputs)),
    sized('dev-optimism', 'development', devOptimismSize(inputs)),
    sized('dev-residual-sd', 'development', devResidualSdSize(inputs)),
    sized('dev-intercept', 'development', devInterceptSize(inputs)),
  ];
}
