// The measures that can be pooled across sites, each with what one site delivers at n from the
// engine's inverse of its site-specific criterion (a PrecisionAtN, whose SE is what is pooled).
// Binary measures (O/E on the log scale, the C-statistic, the calibration slope on the log-odds
// scale) join by adding an entry, or a branch in `prepare`, that gives their PrecisionAtN at n.
import { citlPrecisionAtN } from '../engine/continuous/citl-criterion';
import { r2PrecisionAtN } from '../engine/continuous/r2-criterion';
import { slopePrecisionAtN } from '../engine/continuous/slope-criterion';
import { DomainError } from '../engine/errors';
import { smallestIntegerMeeting } from '../engine/numerics/integer-search';
import { isContinuousPopulation } from '../engine/plan/plan-project';
import { validationInputsOf } from '../engine/plan/population-inputs';
import type { SeAtN } from '../engine/pooled';
import type { PrecisionAtN, ReferenceKey } from '../engine/types';
import type { Population, PooledMeasureKey } from '../model/project';

export interface PooledMeasureSpec {
  /** Key in the plan's pooled settings (as in each population's precision targets). */
  readonly key: PooledMeasureKey;
  /** Id of the site-specific criterion of the same measure. */
  readonly criterionId: string;
  /** Name in running text, e.g. "calibration slope". */
  readonly name: string;
  /** The scale the SEs and widths are on, in words. */
  readonly scale: string;
  /** Source of the per-site SE formula. */
  readonly references: readonly ReferenceKey[];
  /**
   * What one site delivers at n (se null where the formula is not usable), its inputs read once;
   * null for a population whose outcome type the measure has no SE for.
   */
  readonly prepare: (population: Population) => ((n: number) => PrecisionAtN) | null;
}

/** The continuous measures, in the order the reports list them. */
export const POOLED_MEASURES: readonly PooledMeasureSpec[] = [
  {
    key: 'slope',
    criterionId: 'slope',
    name: 'calibration slope',
    scale: 'the slope scale',
    references: ['VAL-CONT'],
    prepare: (population) => {
      if (!isContinuousPopulation(population)) return null;
      const inputs = validationInputsOf(population);
      return (n) => slopePrecisionAtN(inputs, n);
    },
  },
  {
    key: 'citl',
    criterionId: 'citl',
    name: 'calibration-in-the-large (CITL)',
    scale: 'outcome units',
    references: ['VAL-CONT'],
    prepare: (population) => {
      if (!isContinuousPopulation(population)) return null;
      const inputs = validationInputsOf(population);
      return (n) => citlPrecisionAtN(inputs, n);
    },
  },
  {
    key: 'rSquared',
    criterionId: 'r2',
    name: 'R²',
    scale: 'the R² scale',
    references: ['VAL-CONT', 'WISHART-1931', 'OLKIN-FINN-1995'],
    prepare: (population) => {
      if (!isContinuousPopulation(population)) return null;
      const inputs = validationInputsOf(population);
      return (n) => r2PrecisionAtN(inputs, n);
    },
  },
];

/** The per-site SE function the pooled engine reads: the SE at n, or a DomainError naming the site and why. */
export function seAtNOf(atN: (n: number) => PrecisionAtN, site: string, measure: string): SeAtN {
  return (n) => {
    const precision = atN(n);
    if (precision.se === null || !(Number.isFinite(precision.se) && precision.se > 0)) {
      throw new DomainError(`${site}: SE of the ${measure} at n`, n, precision.reason ?? 'an n at which the SE can be computed');
    }
    return precision.se;
  };
}

/** Largest n searched for the first n at which a site's SE formula is usable. */
const LOWEST_N_SEARCHED = 10_000;

/**
 * The smallest n at which the per-site SE can be computed (e.g. 7 for R², where the large-sample
 * formula starts to behave like an SE), found by an integer search over [1, 10,000] on "the SE is
 * given"; null when no n up to 10,000 gives one (the reason is then the precision's own).
 * @example lowestUsableN(POOLED_MEASURES[2].prepare(population)) // 7
 */
export function lowestUsableN(atN: (n: number) => PrecisionAtN): number | null {
  return smallestIntegerMeeting((n) => atN(n).se !== null, 1, LOWEST_N_SEARCHED).n;
}
