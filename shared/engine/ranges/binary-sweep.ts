// One-at-a-time sweeps over the anticipated values of a binary-outcome population: which values
// have a range, what each is when not varied, and the plan with one of them replaced.
import { binarySizes } from '../plan/plan-binary';
import { requiredSize } from '../plan/required-size';
import { BINARY_FIELDS } from '../../model/population-fields';
import { BINARY_RANGE_KEYS } from '../../model/project';
import type { BinaryPopulation, BinaryRangeKey, Project } from '../../model/project';
import type { SweepPoint } from './sweep';

/** One binary assumption with a low/high range. */
export interface BinaryRangedAssumption {
  readonly key: BinaryRangeKey;
  readonly low: number;
  readonly high: number;
}

/** The field's label as the editor shows it, e.g. "Anticipated outcome proportion". */
export function binaryAssumptionLabel(key: BinaryRangeKey): string {
  return BINARY_FIELDS.find((f) => f.rangeKey === key)?.label ?? key;
}

/**
 * The value an anticipated quantity takes when it is not varied: the stated value, or its
 * documented default (calibration intercept 0, slope 1). Undefined for the C-statistic and the
 * linear-predictor mean and SD when they are not given.
 * @example binaryEffectiveBase(population, 'calibrationSlope') // 1 when not given
 */
export function binaryEffectiveBase(population: BinaryPopulation, key: BinaryRangeKey): number | undefined {
  const a = population.anticipated;
  if (key === 'calibrationIntercept') return a.calibrationIntercept ?? 0;
  if (key === 'calibrationSlope') return a.calibrationSlope ?? 1;
  return a[key];
}

/**
 * The ranged assumptions in the schema's order. The schema has checked both ends of each range
 * against every rule (between fields too); each domain is an interval, so the values between are
 * admissible as well.
 */
export function binaryRangedAssumptions(population: BinaryPopulation): BinaryRangedAssumption[] {
  return BINARY_RANGE_KEYS.flatMap((key) => {
    const range = population.ranges[key];
    return range === undefined ? [] : [{ key, low: range.low, high: range.high }];
  });
}

/**
 * The plan with one anticipated value replaced, the others at their base values (the LP is
 * refitted when the outcome proportion or C moves and the LP is not given).
 * @example evaluateBinaryAt(population, project, 'outcomeProportion', 0.05).requiredN // larger than at 0.1
 */
export function evaluateBinaryAt(
  population: BinaryPopulation,
  project: Pick<Project, 'updating'>,
  key: BinaryRangeKey,
  value: number,
): SweepPoint {
  const varied: BinaryPopulation = { ...population, anticipated: { ...population.anticipated, [key]: value } };
  const criteria = binarySizes(varied, project);
  const { requiredN, binding } = requiredSize(criteria);
  return { value, requiredN, binding, criteria: criteria.map((c) => ({ id: c.id, n: c.n })) };
}
