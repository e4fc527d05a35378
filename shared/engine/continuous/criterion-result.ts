// Builds the CriterionResult every consumer reads (table, report, command line) from a criterion's
// fixed text and its computed size, so each criterion file only states its own maths and words.
import { formatPercent } from '../../format/numbers';
import { NumberMemo } from '../helpers/number-memo';
import type { CriterionPurpose, CriterionResult, Intermediate, ReferenceKey } from '../types';
import type { ContinuousCriterionId } from './criterion-ids';
import type { SampleSize } from './sample-size';
import { BEYOND_LIMIT_REASON } from './sample-size-limit';

/** The fixed text of any criterion, whatever its outcome type. */
export interface CriterionTextOf<Id extends string> {
  readonly id: Id;
  readonly label: string;
  readonly purpose: CriterionPurpose;
  readonly formula: string;
  readonly references: readonly ReferenceKey[];
}

/** What a continuous criterion says about itself, independent of the inputs. */
export type CriterionText = CriterionTextOf<ContinuousCriterionId>;

const levels = new NumberMemo<string>();

/** A confidence level as people write it: 0.95 → "95%", 0.999 → "99.9%" (remembered per level). */
export function levelText(confidence: number): string {
  let text = levels.get(confidence);
  if (text === undefined) {
    text = formatPercent(confidence, 4);
    levels.set(confidence, 0, text);
  }
  return text;
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
  const reason = size.status === 'not-converged' ? BEYOND_LIMIT_REASON : note;
  // A quantity that overflowed a double (a target SE of +Infinity) is not shown as a number.
  const shown = intermediates.every((i) => Number.isFinite(i.value))
    ? intermediates
    : intermediates.filter((i) => Number.isFinite(i.value));
  return criterionResult(text, target, size.status, size.n, shown, reason);
}

/**
 * Every result is built by this one literal, so all share one object shape (the engine builds
 * hundreds of thousands of them in a sweep); `reason` is present but undefined when there is none.
 * Exported so that every engine (continuous, binary, …) dresses its sizes the same way.
 */
export function criterionResult(
  text: CriterionTextOf<string>,
  target: string,
  status: CriterionResult['status'],
  n: number | null,
  intermediates: readonly Intermediate[],
  reason: string | undefined,
): CriterionResult {
  return {
    id: text.id,
    label: text.label,
    purpose: text.purpose,
    status,
    n,
    reason,
    target,
    formula: text.formula,
    references: text.references,
    intermediates,
  };
}

/** A criterion that cannot be computed because an input it needs is missing or unusable. */
export function notAssessableCriterion(text: CriterionText, target: string, reason: string): CriterionResult {
  return criterionResult(text, target, 'not-assessable', null, [], reason);
}
