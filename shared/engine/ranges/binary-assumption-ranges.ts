import type { BinaryPopulation, BinaryRangeKey, Project } from '../../model/project';
import type { AssumptionRange } from './assumption-ranges';
import { DEFAULT_SWEEP_POINTS } from './assumption-ranges';
import { binaryAssumptionLabel, binaryEffectiveBase, binaryRangedAssumptions, evaluateBinaryAt } from './binary-sweep';
import { asksForMore, sweepValues } from './sweep';

/** Low, base and high of one binary assumption, and the worst value across its range. */
export type BinaryAssumptionRange = Omit<AssumptionRange, 'key'> & { readonly key: BinaryRangeKey };

/**
 * One-at-a-time ranges of a binary population: for each assumption with a low/high range, the
 * plan at its ends and base value, and the worst case over `pointCount` evenly spaced values, both
 * ends and the base (the others held at their base values). No interior peak is known in closed
 * form for these criteria, so a peak between two grid values is found only to the grid's spacing.
 * Common practice (one-way sensitivity analysis).
 * @example binaryAssumptionRanges(population, project)[0].worst.value // the low end, for an outcome-proportion range
 */
export function binaryAssumptionRanges(
  population: BinaryPopulation,
  project: Pick<Project, 'updating'>,
  pointCount = DEFAULT_SWEEP_POINTS,
): BinaryAssumptionRange[] {
  return binaryRangedAssumptions(population).map(({ key, low, high }) => {
    const baseValue = binaryEffectiveBase(population, key);
    const base = baseValue === undefined ? null : evaluateBinaryAt(population, project, key, baseValue);
    const points = sweepValues(low, high, pointCount).map((value) => evaluateBinaryAt(population, project, key, value));
    const lowPoint = points[0] ?? evaluateBinaryAt(population, project, key, low);
    const highPoint = points.at(-1) ?? lowPoint;
    let worst = base !== null && asksForMore(base, lowPoint) ? base : lowPoint;
    for (const p of points) if (asksForMore(p, worst)) worst = p;
    return { key, label: binaryAssumptionLabel(key), low: lowPoint, base, high: highPoint, worst, points };
  });
}
