import type { BinaryPopulation, BinaryRangeKey, Project } from '../../model/project';
import { DEFAULT_SWEEP_POINTS } from './assumption-ranges';
import { binaryAssumptionLabel, binaryEffectiveBase, binaryRangedAssumptions, evaluateBinaryAt } from './binary-sweep';
import type { SensitivityCurve } from './sensitivity-curves';
import { sweepValues } from './sweep';

/** Required n across the range of one binary assumption. */
export type BinarySensitivityCurve = Omit<SensitivityCurve, 'key'> & { readonly key: BinaryRangeKey };

/**
 * One curve per binary assumption with a range and a base value: `pointCount` evenly spaced
 * values from low to high, the others at their base values.
 * @example binarySensitivityCurves(population, project)[0].points.length // 25
 */
export function binarySensitivityCurves(
  population: BinaryPopulation,
  project: Pick<Project, 'updating'>,
  pointCount = DEFAULT_SWEEP_POINTS,
): BinarySensitivityCurve[] {
  return binaryRangedAssumptions(population).flatMap(({ key, low, high }) => {
    const base = binaryEffectiveBase(population, key);
    if (base === undefined) return [];
    const points = sweepValues(low, high, pointCount).map((value) => {
      const p = evaluateBinaryAt(population, project, key, value);
      return { value, n: p.requiredN, binding: p.binding };
    });
    const baseN = evaluateBinaryAt(population, project, key, base).requiredN;
    return [{ key, label: binaryAssumptionLabel(key), low, high, base, baseN, points }];
  });
}
