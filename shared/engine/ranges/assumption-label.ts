import { CONTINUOUS_FIELDS } from '../../model/population-fields';
import type { ContinuousAnticipatedKey, ContinuousPopulation } from '../../model/project';

/** The field's label as the editor shows it, e.g. "Anticipated R²". */
export function assumptionLabel(key: ContinuousAnticipatedKey): string {
  return CONTINUOUS_FIELDS.find((f) => f.rangeKey === key)?.label ?? key;
}

/**
 * The value an anticipated quantity takes in the plan when it is not varied: the stated value, or
 * its documented default (R² for the CITL and slope models follow the anticipated R²; the slope is
 * 1). Undefined for the outcome mean and SD when they are not given.
 */
export function effectiveBase(population: ContinuousPopulation, key: ContinuousAnticipatedKey): number | undefined {
  const a = population.anticipated;
  switch (key) {
    case 'rSquaredCitl':
      return a.rSquaredCitl ?? a.rSquared;
    case 'rSquaredSlope':
      return a.rSquaredSlope ?? a.rSquared;
    case 'slope':
      return a.slope ?? 1;
    default:
      return a[key];
  }
}
