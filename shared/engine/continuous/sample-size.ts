import { ceilGuarded } from '../numerics/rounding';
import type { IntegerSearchResult } from '../numerics/integer-search';
import { MAX_SAMPLE_SIZE } from './sample-size-limit';

/**
 * A criterion's minimum n before it is dressed as a CriterionResult.
 * ok: n is the smallest integer meeting the target; always-met: the target holds at every
 * admissible n and n is the smallest admissible; not-converged: no n up to MAX_SAMPLE_SIZE (n null).
 */
export interface SampleSize {
  readonly n: number | null;
  readonly status: 'ok' | 'always-met' | 'not-converged';
}

export const NOT_REACHED: SampleSize = { n: null, status: 'not-converged' };

/**
 * Smallest admissible integer at least `raw` for a closed-form criterion, with the floating guard
 * of METHODS.md 1.4 (ceil(raw − 1e−9)). Below `lowest` the target holds at every admissible n.
 * A raw value that is not finite or exceeds MAX_SAMPLE_SIZE is reported as not reached.
 */
export function closedFormSize(raw: number, lowest: number): SampleSize {
  if (!(raw <= MAX_SAMPLE_SIZE)) return NOT_REACHED;
  const n = ceilGuarded(raw);
  return n <= lowest ? { n: lowest, status: 'always-met' } : { n, status: 'ok' };
}

/** Dresses an integer search that started at the smallest admissible n `lowest`. */
export function searchedSize(result: IntegerSearchResult, lowest: number): SampleSize {
  if (!result.converged || result.n === null) return NOT_REACHED;
  return { n: result.n, status: result.n === lowest ? 'always-met' : 'ok' };
}
