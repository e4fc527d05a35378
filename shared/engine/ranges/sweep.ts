import { populationSizes } from '../plan/population-sizes';
import { requiredSize } from '../plan/required-size';
import { continuousAnticipatedSchema } from '../../model/project';
import type { ContinuousAnticipatedKey, ContinuousPopulation, Project } from '../../model/project';

/** The plan at one value of one assumption, the others at their base values. */
export interface SweepPoint {
  readonly value: number;
  readonly requiredN: number | null;
  readonly binding: string | null;
  /** Each criterion's n at this value (null when not assessable or not reached). */
  readonly criteria: readonly { readonly id: string; readonly n: number | null }[];
}

/** One assumption with a low/high range. */
export interface RangedAssumption {
  readonly key: ContinuousAnticipatedKey;
  readonly low: number;
  readonly high: number;
}

/**
 * The assumptions of a population that have a low/high range, in the schema's field order. The
 * schema has already checked that every value in each range is admissible.
 */
export function rangedAssumptions(population: ContinuousPopulation): RangedAssumption[] {
  const order = Object.keys(continuousAnticipatedSchema.shape);
  return (Object.entries(population.ranges) as [ContinuousAnticipatedKey, { low: number; high: number }][])
    .map(([key, r]) => ({ key, low: r.low, high: r.high }))
    .sort((a, b) => order.indexOf(a.key) - order.indexOf(b.key));
}

/**
 * `count` evenly spaced values from low to high, both ends included (one value when low = high).
 * Interior values are rounded to 12 significant digits so that 0.3 + 0.03·i reads 0.33, not
 * 0.32999999999999996; the ends are exact.
 * @example sweepValues(0.3, 0.48, 25)[4] // 0.33
 */
export function sweepValues(low: number, high: number, count: number): number[] {
  if (!(count >= 2) || low === high) return [low];
  return Array.from({ length: count }, (_, i) => {
    if (i === 0) return low;
    if (i === count - 1) return high;
    return Number((low + ((high - low) * i) / (count - 1)).toPrecision(12));
  });
}

/**
 * Plans the population with one anticipated value replaced (defaults that follow it, such as the
 * CITL R² following the anticipated R², follow it here too).
 */
export function evaluateAt(
  population: ContinuousPopulation,
  project: Pick<Project, 'updating'>,
  key: ContinuousAnticipatedKey,
  value: number,
): SweepPoint {
  const varied: ContinuousPopulation = { ...population, anticipated: { ...population.anticipated, [key]: value } };
  const criteria = populationSizes(varied, project);
  const { requiredN, binding } = requiredSize(criteria);
  return { value, requiredN, binding, criteria: criteria.map((c) => ({ id: c.id, n: c.n })) };
}

/** True when `a` asks for more than `b`: an unreachable target (null n with a binding) beats any number. */
export function asksForMore(a: SweepPoint, b: SweepPoint): boolean {
  const aUnbounded = a.requiredN === null && a.binding !== null;
  const bUnbounded = b.requiredN === null && b.binding !== null;
  if (aUnbounded || bUnbounded) return aUnbounded && !bUnbounded;
  return (a.requiredN ?? -1) > (b.requiredN ?? -1);
}
