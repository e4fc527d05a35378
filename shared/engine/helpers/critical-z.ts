import { zForConfidence } from '../numerics/distributions';
import { NumberMemo } from './number-memo';

const remembered = new NumberMemo<number>();

/**
 * Two-sided normal critical value z = Φ⁻¹(1 − (1 − confidence)/2), remembered per level: planning
 * evaluates the same few levels thousands of times and the quantile is the costliest step of the
 * closed-form criteria. Domain: 0 < confidence < 1; otherwise a DomainError (from zForConfidence).
 * Source: METHODS.md 1.6 (the exact quantile, not 1.96). Accuracy: that of Φ⁻¹ (~1e−15).
 * @example criticalZ(0.95) // 1.959963984540054
 */
export function criticalZ(confidence: number): number {
  let z = remembered.get(confidence);
  if (z === undefined) {
    z = zForConfidence(confidence);
    remembered.set(confidence, 0, z);
  }
  return z;
}
