import type { CriterionStatus } from '../types';

/** What requiredSize reads of each criterion (a CriterionResult or a CriterionSize). */
export interface SizedLike {
  readonly id: string;
  readonly n: number | null;
  readonly status: CriterionStatus;
}

/** The n a set of criteria asks for, and the criterion that sets it. */
export interface RequiredSize {
  /** Largest n over the criteria that could be sized; null when one of them has no n (see binding). */
  readonly requiredN: number | null;
  /**
   * Id of the criterion that sets requiredN (the first in order on a tie), or of the first criterion
   * whose target could not be reached (then requiredN is null); null when nothing could be sized.
   */
  readonly binding: string | null;
}

/**
 * Final answer = max over the criteria, with the binding one named (METHODS.md 1.5). Criteria that
 * are not assessable (a missing input) are left out; a criterion that did not reach its target
 * below the limit makes the whole requirement unknown rather than silently smaller.
 * @example requiredSize([{ id: 'r2', n: 762, status: 'ok', … }, { id: 'citl', n: 308, status: 'ok', … }]) // { requiredN: 762, binding: 'r2' }
 */
export function requiredSize(criteria: readonly SizedLike[]): RequiredSize {
  const failed = criteria.find((c) => c.status === 'not-converged');
  if (failed !== undefined) return { requiredN: null, binding: failed.id };
  let best: SizedLike | null = null;
  for (const c of criteria) {
    if (c.n !== null && (c.status === 'ok' || c.status === 'always-met') && (best === null || c.n > (best.n ?? 0))) best = c;
  }
  return best === null ? { requiredN: null, binding: null } : { requiredN: best.n, binding: best.id };
}

/** The sizes a population plan states: the requirement and what sets it, by purpose. */
export interface PurposeSizes extends RequiredSize {
  readonly validationN: number | null;
  /** Null when the development minimums are not included (model updating off) or none could be sized. */
  readonly developmentN: number | null;
}

/**
 * requiredSize over all the criteria, over the validation criteria and, when `withDevelopment`,
 * over the development criteria (METHODS.md 1.5), for any outcome type.
 * @example purposeSizes(criteria, false).developmentN // null
 */
export function purposeSizes(
  criteria: readonly (SizedLike & { readonly purpose: 'validation' | 'development' })[],
  withDevelopment: boolean,
): PurposeSizes {
  const overall = requiredSize(criteria);
  return {
    ...overall,
    validationN: requiredSize(criteria.filter((c) => c.purpose === 'validation')).requiredN,
    developmentN: withDevelopment ? requiredSize(criteria.filter((c) => c.purpose === 'development')).requiredN : null,
  };
}
