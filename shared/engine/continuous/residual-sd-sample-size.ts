import { requireCount } from '../helpers/domain-guards';
import { smallestDfForMargin } from '../numerics/mmoe';
import type { SampleSize } from './sample-size';
import { NOT_REACHED } from './sample-size';
import { MAX_SAMPLE_SIZE } from './sample-size-limit';

/**
 * Smallest n whose residual SD, estimated with df = n − k degrees of freedom (k fitted
 * coefficients), has a multiplicative margin of error MMOE(df) ≤ marginFactor: n = df* + k, where
 * df* is the smallest df meeting the margin (chi-square interval for σ).
 * k = 1 for the intercept-only CITL model, 2 for the calibration-slope model, P + 1 in development.
 * Domain: marginFactor > 1, 0 < confidence < 1, whole k ≥ 1; otherwise a DomainError.
 * Source: VAL-CONT criterion 4 and DEV-CONT criterion iii (METHODS.md 2.4, 3.3). Exact.
 * @example residualSdSampleSize(1.1, 0.95, 1).n // 234
 */
export function residualSdSampleSize(marginFactor: number, confidence: number, fittedCoefficients: number): SampleSize {
  requireCount('fittedCoefficients', fittedCoefficients, 1);
  const df = smallestDfForMargin(marginFactor, confidence);
  if (!df.converged || df.n === null) return NOT_REACHED;
  const n = df.n + fittedCoefficients;
  return n <= MAX_SAMPLE_SIZE ? { n, status: 'ok' } : NOT_REACHED;
}
