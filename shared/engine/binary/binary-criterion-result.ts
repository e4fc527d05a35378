// Dresses a binary criterion's size as the CriterionResult every consumer reads, adding the
// expected number of events at that n (planners think in events).
import type { SampleSize } from '../continuous/sample-size';
import { BEYOND_LIMIT_REASON } from '../continuous/sample-size-limit';
import { criterionResult, type CriterionTextOf } from '../continuous/criterion-result';
import type { CriterionResult, Intermediate } from '../types';
import type { BinaryCriterionId } from './binary-criterion-ids';

/** What a binary criterion says about itself, independent of the inputs. */
export type BinaryCriterionText = CriterionTextOf<BinaryCriterionId>;

// One builder for every engine, so all results share one object shape.
const result = criterionResult;

/**
 * A sized criterion; the expected events n·phi at its n are appended to `intermediates` (which the
 * caller hands over: it is not copied).
 */
export function binarySizedCriterion(
  text: BinaryCriterionText,
  target: string,
  size: SampleSize,
  intermediates: Intermediate[],
  outcomeProportion: number,
): CriterionResult {
  if (size.n !== null) intermediates.push({ name: 'expected events at n', value: size.n * outcomeProportion });
  return result(
    text,
    target,
    size.status,
    size.n,
    intermediates,
    size.status === 'not-converged' ? BEYOND_LIMIT_REASON : undefined,
  );
}

/** A criterion that cannot be computed: an input it needs is missing ('not-assessable') or a numerical step failed ('not-converged'). */
export function binaryUnsizedCriterion(
  text: BinaryCriterionText,
  target: string,
  status: 'not-assessable' | 'not-converged',
  reason: string,
  intermediates: readonly Intermediate[] = [],
): CriterionResult {
  return result(text, target, status, null, intermediates, reason);
}
