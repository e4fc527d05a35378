// Builds the CriterionResult every consumer reads (table, report, command line) from a criterion's
// fixed text and its computed size, so each criterion file only states its own maths and words.
import { formatPercent } from '../../format/numbers';
import type { CriterionPurpose, CriterionResult, Intermediate, ReferenceKey } from '../types';
import type { ContinuousCriterionId } from './criterion-ids';
import type { SampleSize } from './sample-size';
import { BEYOND_LIMIT_REASON } from './sample-size-limit';

/** What a criterion says about itself, independent of the inputs. */
export interface CriterionText {
  readonly id: ContinuousCriterionId;
  readonly label: string;
  readonly purpose: CriterionPurpose;
  readonly formula: string;
  readonly references: readonly ReferenceKey[];
}

/** A confidence level as people write it: 0.95 → "95%", 0.999 → "99.9%". */
export function levelText(confidence: number): string {
  return formatPercent(confidence, 4);
}

/**
 * A sized criterion. `note` is attached as the reason when the target holds at every admissible n
 * (say why), and a failed search always carries the reason it failed.
 */
export function sizedCriterion(
  text: CriterionText,
  target: string,
  size: SampleSize,
  intermediates: readonly Intermediate[],
  note?: string,
): CriterionResult {
  const base = { ...text, target, intermediates, status: size.status, n: size.n };
  if (size.status === 'not-converged') return { ...base, reason: BEYOND_LIMIT_REASON };
  return note === undefined ? base : { ...base, reason: note };
}

/** A criterion that cannot be computed because an input it needs is missing or unusable. */
export function notAssessableCriterion(text: CriterionText, target: string, reason: string): CriterionResult {
  return { ...text, target, intermediates: [], status: 'not-assessable', n: null, reason };
}
