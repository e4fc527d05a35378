import type { ContinuousAnticipatedKey, ContinuousPopulation, Project } from '../../model/project';
import { assumptionLabel, effectiveBase } from './assumption-label';
import { DEFAULT_SWEEP_POINTS } from './assumption-ranges';
import { evaluateAt, rangedAssumptions, sweepValues } from './sweep';

/** Required n as a function of one assumption across its range: the data behind one curve. */
export interface SensitivityCurve {
  readonly key: ContinuousAnticipatedKey;
  readonly label: string;
  readonly low: number;
  readonly high: number;
  readonly base: number;
  readonly baseN: number | null;
  readonly points: readonly { readonly value: number; readonly n: number | null; readonly binding: string | null }[];
}

/**
 * One curve per assumption with a range and a base value (an outcome mean or SD range
 * without a stated base value has no curve; its worst case is still in assumptionRanges):
 * `pointCount` evenly spaced values from low to high, the others at their base values.
 * @example sensitivityCurves(population, project)[0].points.length // 25
 */
export function sensitivityCurves(
  population: ContinuousPopulation,
  project: Pick<Project, 'updating'>,
  pointCount = DEFAULT_SWEEP_POINTS,
): SensitivityCurve[] {
  const curves: SensitivityCurve[] = [];
  for (const { key, low, high } of rangedAssumptions(population)) {
    const base = effectiveBase(population, key);
    if (base === undefined) continue;
    const points = sweepValues(low, high, pointCount).map((value) => {
      const p = evaluateAt(population, project, key, value);
      return { value, n: p.requiredN, binding: p.binding };
    });
    curves.push({
      key,
      label: assumptionLabel(key),
      low,
      high,
      base,
      baseN: evaluateAt(population, project, key, base).requiredN,
      points,
    });
  }
  return curves;
}
