import { formatSignificant } from '../../format/numbers';
import type { ContinuousAnticipatedKey, ContinuousPopulation, Project } from '../../model/project';
import type { AssumptionRange } from './assumption-ranges';
import { assumptionRanges } from './assumption-ranges';
import { asksForMore } from './sweep';

/** The largest requirement across all ranges, and the assumption (and value) that produced it. */
export interface WorstCase {
  readonly requiredN: number | null;
  readonly binding: string | null;
  readonly key: ContinuousAnticipatedKey;
  readonly value: number;
  /** In words, e.g. "Anticipated R² at its low end 0.6". */
  readonly assumption: string;
}

/** What worstAcross reads of one assumption's range, whatever the outcome type. */
type RangeLike<K> = Pick<AssumptionRange, 'label' | 'low' | 'base' | 'high' | 'worst'> & { readonly key: K };

function describe(range: RangeLike<unknown>): string {
  const v = range.worst.value;
  const shown = Math.abs(v) < 1e-300 ? '≈ 0' : formatSignificant(v);
  if (v === range.low.value) return `${range.label} at its low end ${shown}`;
  if (v === range.high.value) return `${range.label} at its high end ${shown}`;
  if (range.base !== null && v === range.base.value) return `${range.label} at its base value ${shown}`;
  return `${range.label} at ${shown} within its range`;
}

/**
 * Worst case across the low/high ranges of a population: the maximum over assumptionRanges, with
 * the assumption that produced it named. Null when the population states no range.
 * @example worstCase(population, project)?.assumption // "Anticipated R² at 0.3333 within its range"
 */
export function worstCase(population: ContinuousPopulation, project: Pick<Project, 'updating'>): WorstCase | null {
  return worstAcross(assumptionRanges(population, project));
}

/**
 * The largest requirement over one-at-a-time ranges of any outcome type, with the assumption that
 * produced it named; null when there is no range.
 */
export function worstAcross<K>(ranges: readonly RangeLike<K>[]): (Omit<WorstCase, 'key'> & { readonly key: K }) | null {
  let worst: RangeLike<K> | null = null;
  for (const range of ranges) if (worst === null || asksForMore(range.worst, worst.worst)) worst = range;
  if (worst === null) return null;
  return {
    requiredN: worst.worst.requiredN,
    binding: worst.worst.binding,
    key: worst.key,
    value: worst.worst.value,
    assumption: describe(worst),
  };
}
