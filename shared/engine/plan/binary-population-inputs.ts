// How a binary-outcome population of a project maps onto the engine's BinaryPopulationInput and
// BinaryPlanOptions: the O/E target in whichever convention the file states, and the development
// minimums from the project's updating settings (predictor parameters shared with continuous
// outcomes, the anticipated Cox–Snell R², target shrinkage, allowed optimism and risk margin).
import { BINARY_DEVELOPMENT_DEFAULTS } from '../binary/binary-development-inputs';
import type { BinaryPlanOptions, BinaryPopulationInput } from '../binary/binary-population-input';
import type { OeTarget } from '../binary/oe-criterion';
import { DomainError } from '../errors';
import type { DevelopmentTargets } from '../binary/development-not-assessable';
import type { BinaryPopulation, OeTargetSettings, Updating } from '../../model/project';

const NEEDS_P = 'the number of predictor parameters (updating.predictorParameters)';
const NEEDS_R2 = 'the anticipated Cox–Snell R² (updating.anticipatedCoxSnellR2)';

/** The O/E target as the engine reads it (the schema guarantees that one convention is complete). */
export function oeTargetOf(oe: OeTargetSettings): OeTarget {
  if (oe.width !== undefined) return { width: oe.width };
  if (oe.lower !== undefined && oe.upper !== undefined) return { lower: oe.lower, upper: oe.upper };
  throw new DomainError('precision.oe', JSON.stringify(oe), 'a total CI width, or both the lower and the upper CI limit');
}

/**
 * The engine input of one binary population.
 * @example binaryInputOf(population).precision.oe // { width: 0.2 } when the file states no O/E target
 */
export function binaryInputOf(population: BinaryPopulation): BinaryPopulationInput {
  const a = population.anticipated;
  const p = population.precision;
  return {
    anticipated: {
      outcomeProportion: a.outcomeProportion,
      cStatistic: a.cStatistic,
      lpMean: a.lpMean,
      lpSd: a.lpSd,
      calibrationIntercept: a.calibrationIntercept,
      calibrationSlope: a.calibrationSlope,
      thresholds: a.thresholds,
    },
    precision: {
      confidence: p.confidence,
      oe: oeTargetOf(p.oe),
      slope: { width: p.slope.width },
      cStatistic: { width: p.cStatistic.width },
      netBenefit: { width: p.netBenefit.width, standardised: p.netBenefit.standardised },
    },
  };
}

/** What the updating settings give the binary planner. */
export interface BinaryDevelopmentChoice {
  /** The engine options (development included only when updating is on and P and R²_CS are known). */
  readonly options: BinaryPlanOptions;
  /** When updating is on but an input is missing: why the development minimums cannot be sized. */
  readonly missing: string | null;
  readonly targets: DevelopmentTargets;
}

/**
 * The engine options of one binary population under the project's updating settings, with the
 * population's available n when it states one.
 */
export function binaryOptionsOf(population: BinaryPopulation, updating: Updating): BinaryDevelopmentChoice {
  const availableN = population.recruitment.availableN;
  const targets: DevelopmentTargets = {
    targetShrinkage: updating.targetShrinkage,
    optimismMargin: updating.optimismMargin,
    riskMargin: updating.riskMargin ?? BINARY_DEVELOPMENT_DEFAULTS.riskMargin,
    confidence: population.precision.confidence,
  };
  const base: BinaryPlanOptions = availableN === undefined ? {} : { availableN };
  if (!updating.enabled) return { options: base, missing: null, targets };
  const p = updating.predictorParameters;
  const r2 = updating.anticipatedCoxSnellR2;
  if (p === undefined || r2 === undefined) {
    const needs = p === undefined && r2 === undefined ? `${NEEDS_P} and ${NEEDS_R2}` : p === undefined ? NEEDS_P : NEEDS_R2;
    return { options: base, missing: `needs ${needs}`, targets };
  }
  return {
    options: {
      ...base,
      development: {
        predictorParameters: p,
        coxSnellR2: r2,
        targetShrinkage: targets.targetShrinkage,
        optimismMargin: targets.optimismMargin,
        riskMargin: targets.riskMargin,
      },
    },
    missing: null,
    targets,
  };
}
