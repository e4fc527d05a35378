// Dresses a binary criterion's size as the CriterionResult every consumer reads, adding the
// expected number of events at that n (planners think in events).
import type { SampleSize } from '../continuous/sample-size';
import { BEYOND_LIMIT_REASON } from '../continuous/sample-size-limit';
import type { CriterionPurpose, CriterionResult, Intermediate, ReferenceKey } from '../types';
import type { BinaryCriterionId } from './binary-criterion-ids';

/** What a binary criterion says about itself, independent of the inputs. */
export interface BinaryCriterionText {
  readonly id: BinaryCriterionId;
  readonly label: string;
  readonly purpose: CriterionPurpose;
  readonly formula: string;
  readonly references: readonly ReferenceKey[];
}

/** A sized criterion; `outcomeProportion` gives the expected events n·phi as the last intermediate. */
export function binarySizedCriterion(
  text: BinaryCriterionText,
  target: string,
  size: SampleSize,
  intermediates: readonly Intermediate[],
  outcomeProportion: number,
): CriterionResult {
  const events = size.n === null ? [] : [{ name: 'expected events at n', value: size.n * outcomeProportion }];
  const base = { ...text, target, intermediates: [...intermediates, ...events], status: size.status, n: size.n };
  return size.status === 'not-converged' ? { ...base, reason: BEYOND_LIMIT_REASON } : base;
}

/** A criterion that cannot be computed: an input it needs is missing ('not-assessable') or a numerical step failed ('not-converged'). */
export function binaryUnsizedCriterion(
  text: BinaryCriterionText,
  target: string,
  status: 'not-assessable' | 'not-converged',
  reason: string,
  intermediates: readonly Intermediate[] = [],
): CriterionResult {
  return { ...text, target, intermediates, status, n: null, reason };
}
