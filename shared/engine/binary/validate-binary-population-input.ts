// Refuses a binary-population input outside its domain before any maths runs. Every message names
// the field as the project file does, the value, the allowed range and why.
import { formatSignificant } from '../../format/numbers';
import { MAX_SAMPLE_SIZE } from '../continuous/sample-size-limit';
import { DomainError } from '../errors';
import { requireCount, requirePositive } from '../helpers/domain-guards';
import { GAUSS_HERMITE_MAX_NODES } from '../numerics/gauss-hermite';
import { BINARY_DEVELOPMENT_DEFAULTS } from './binary-development-inputs';
import type { BinaryPlanOptions, BinaryPopulationInput } from './binary-population-input';
import { MAX_C_FOR_FIT } from './fit-normal-lp';
import { requireCoxSnellBelowMax } from './max-cox-snell-r2';
import { requireCStatistic, requireOutcomeProportion, requireSensSpec, requireThreshold } from './require-binary-domain';

/** Limits on the LP description, beyond which predicted risks are all but 0 or 1. */
export const LP_MEAN_LIMIT = 30;
export const LP_SD_RANGE = { min: 0.01, max: 10 } as const;
export const CALIBRATION_INTERCEPT_LIMIT = 10;
export const CALIBRATION_SLOPE_MAX = 10;

function requireBoth(first: string, a: number | undefined, second: string, b: number | undefined): void {
  if ((a === undefined) !== (b === undefined)) {
    const missing = a === undefined ? first : second;
    throw new DomainError(
      missing,
      'missing',
      `given together with ${a === undefined ? second : first} (one without the other is not enough)`,
    );
  }
}

function validateLp(input: BinaryPopulationInput): void {
  const a = input.anticipated;
  requireBoth('anticipated.lpMean', a.lpMean, 'anticipated.lpSd', a.lpSd);
  if (a.lpMean !== undefined && !(Math.abs(a.lpMean) <= LP_MEAN_LIMIT)) {
    throw new DomainError(
      'anticipated.lpMean',
      a.lpMean,
      `between −${LP_MEAN_LIMIT} and ${LP_MEAN_LIMIT} (a mean log-odds beyond that gives almost everyone a risk of essentially 0 or 1)`,
    );
  }
  if (a.lpSd !== undefined && !(a.lpSd >= LP_SD_RANGE.min && a.lpSd <= LP_SD_RANGE.max)) {
    throw new DomainError(
      'anticipated.lpSd',
      a.lpSd,
      `from ${LP_SD_RANGE.min} to ${LP_SD_RANGE.max} (below ${LP_SD_RANGE.min} the model gives everyone nearly the same risk and its calibration slope cannot be estimated; above ${LP_SD_RANGE.max} nearly all risks are 0 or 1)`,
    );
  }
  if (a.cStatistic !== undefined) {
    requireCStatistic('anticipated.cStatistic', a.cStatistic);
    if (a.lpMean === undefined && !(a.cStatistic < MAX_C_FOR_FIT)) {
      throw new DomainError(
        'anticipated.cStatistic',
        a.cStatistic,
        `below ${formatSignificant(MAX_C_FOR_FIT)} when the LP distribution is derived from it (the two equations become ill-conditioned); give the LP mean and SD instead`,
      );
    }
  }
  const intercept = a.calibrationIntercept ?? 0;
  if (!(Math.abs(intercept) <= CALIBRATION_INTERCEPT_LIMIT)) {
    throw new DomainError(
      'anticipated.calibrationIntercept',
      intercept,
      `between −${CALIBRATION_INTERCEPT_LIMIT} and ${CALIBRATION_INTERCEPT_LIMIT} (log-odds; beyond that the model is not worth validating)`,
    );
  }
  const slope = a.calibrationSlope ?? 1;
  if (!(slope > 0 && slope <= CALIBRATION_SLOPE_MAX)) {
    throw new DomainError(
      'anticipated.calibrationSlope',
      slope,
      `greater than 0 and at most ${CALIBRATION_SLOPE_MAX} (a slope of 0 or less means the model ranks risks the wrong way round or not at all)`,
    );
  }
}

function validateThresholds(input: BinaryPopulationInput): void {
  const seen = new Set<number>();
  (input.anticipated.thresholds ?? []).forEach((t, i) => {
    const field = `anticipated.thresholds[${i}]`;
    requireThreshold(`${field}.threshold`, t.threshold);
    if (seen.has(t.threshold))
      throw new DomainError(
        `${field}.threshold`,
        t.threshold,
        'a threshold not listed before (each threshold gives one criterion)',
      );
    seen.add(t.threshold);
    requireBoth(`${field}.sensitivity`, t.sensitivity, `${field}.specificity`, t.specificity);
    if (t.sensitivity !== undefined) requireSensSpec(`${field}.sensitivity`, t.sensitivity);
    if (t.specificity !== undefined) requireSensSpec(`${field}.specificity`, t.specificity);
  });
}

function validatePrecision(input: BinaryPopulationInput): void {
  const p = input.precision;
  if (!(p.confidence > 0 && p.confidence < 1)) {
    throw new DomainError('precision.confidence', p.confidence, 'strictly between 0 and 1 (a confidence level is a probability)');
  }
  if ('width' in p.oe) {
    requirePositive('precision.oe.width', p.oe.width);
  } else {
    if (!(p.oe.lower > 0) || !Number.isFinite(p.oe.lower)) {
      throw new DomainError('precision.oe.lower', p.oe.lower, 'a finite number greater than 0 (O/E is a ratio of event counts)');
    }
    if (!(p.oe.upper > p.oe.lower) || !Number.isFinite(p.oe.upper)) {
      throw new DomainError(
        'precision.oe.upper',
        p.oe.upper,
        `a finite number greater than the lower limit ${formatSignificant(p.oe.lower)}`,
      );
    }
  }
  requirePositive('precision.slope.width', p.slope.width);
  requirePositive('precision.cStatistic.width', p.cStatistic.width);
  requirePositive('precision.netBenefit.width', p.netBenefit.width);
}

function validateDevelopment(options: BinaryPlanOptions, outcomeProportion: number): void {
  const d = options.development;
  if (d === undefined) return;
  requireCount('development.predictorParameters', d.predictorParameters, 1);
  requireCoxSnellBelowMax('development.coxSnellR2', d.coxSnellR2, outcomeProportion);
  const s = d.targetShrinkage ?? BINARY_DEVELOPMENT_DEFAULTS.targetShrinkage;
  if (!(s > d.coxSnellR2 && s < 1)) {
    throw new DomainError(
      'development.targetShrinkage',
      s,
      `above the anticipated Cox–Snell R² ${formatSignificant(d.coxSnellR2)} and below 1 (the shrinkage formula takes ln(1 − R²_CS/S); a shrinkage of 1 needs infinite n)`,
    );
  }
  const delta = d.optimismMargin ?? BINARY_DEVELOPMENT_DEFAULTS.optimismMargin;
  if (!(delta > 0 && delta < 1))
    throw new DomainError('development.optimismMargin', delta, 'strictly between 0 and 1 (Nagelkerke R² lies in [0, 1])');
  const margin = d.riskMargin ?? BINARY_DEVELOPMENT_DEFAULTS.riskMargin;
  if (!(margin > 0 && margin < 0.5)) {
    throw new DomainError(
      'development.riskMargin',
      margin,
      'greater than 0 and below 0.5 (a risk lies in [0, 1], so a margin of 0.5 says nothing)',
    );
  }
}

/**
 * Throws a DomainError for the first field outside its domain (METHODS 7b); returns normally when
 * the input can be planned.
 */
export function validateBinaryPopulationInput(input: BinaryPopulationInput, options: BinaryPlanOptions = {}): void {
  requireOutcomeProportion('anticipated.outcomeProportion', input.anticipated.outcomeProportion);
  validateLp(input);
  validateThresholds(input);
  validatePrecision(input);
  validateDevelopment(options, input.anticipated.outcomeProportion);
  if (options.availableN !== undefined) {
    requireCount('availableN', options.availableN, 1);
    if (options.availableN > MAX_SAMPLE_SIZE)
      throw new DomainError('availableN', options.availableN, `at most ${MAX_SAMPLE_SIZE}`);
  }
  if (options.hermiteNodes !== undefined) {
    if (!Number.isInteger(options.hermiteNodes) || options.hermiteNodes < 2 || options.hermiteNodes > GAUSS_HERMITE_MAX_NODES) {
      throw new DomainError('hermiteNodes', options.hermiteNodes, `a whole number from 2 to ${GAUSS_HERMITE_MAX_NODES}`);
    }
  }
}
