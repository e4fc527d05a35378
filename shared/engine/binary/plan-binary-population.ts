// The binary-outcome plan for one target population: every criterion, the required n (the
// largest), the criterion that binds, and the expected events at that n.
import { formatCount, formatSignificant } from '../../format/numbers';
import type { CriterionResult, PrecisionAtN } from '../types';
import type { BinaryDevelopmentInputs } from './binary-development-inputs';
import { BINARY_DEVELOPMENT_DEFAULTS } from './binary-development-inputs';
import type { BinaryPlanOptions, BinaryPopulationInput } from './binary-population-input';
import type { CalibrationSlopeInputs } from './calibration-slope-criterion';
import { calibrationSlopeCriterion, calibrationSlopePrecisionAtN } from './calibration-slope-criterion';
import type { CStatisticInputs } from './c-statistic-criterion';
import { cStatisticCriterion, cStatisticPrecisionAtN } from './c-statistic-criterion';
import { developmentOptimismPrecisionAtN } from './development-optimism-criterion';
import { developmentShrinkagePrecisionAtN } from './development-shrinkage-criterion';
import type { Calibration } from './lp-distribution';
import { lpOutcomeProportion } from './lp-outcome-proportion';
import type { NetBenefitInputs } from './net-benefit-criterion';
import { netBenefitCriterion, netBenefitPrecisionAtN } from './net-benefit-criterion';
import type { OeInputs } from './oe-criterion';
import { oeCriterion, oePrecisionAtN } from './oe-criterion';
import { overallRiskPrecisionAtN } from './overall-risk-criterion';
import { planBinaryDevelopment } from './plan-binary-development';
import type { PlanTotals } from './plan-totals';
import { planTotals } from './plan-totals';
import type { LpResolution } from './resolve-lp';
import { resolveLp } from './resolve-lp';
import { validateBinaryPopulationInput } from './validate-binary-population-input';

/** The LP distribution behind the slope, C-statistic and net-benefit criteria. */
export interface LpSummary {
  readonly mean: number;
  readonly sd: number;
  readonly source: 'given' | 'fitted';
  /** E[expit(α + β·LP)]: the outcome proportion the LP and the calibration imply. */
  readonly impliedOutcomeProportion: number;
}

/** The totals (events per parameter only when the development minimums are included), plus the audit trail. */
export interface BinaryPopulationPlan extends PlanTotals {
  readonly lp: LpSummary | null;
  /** What options.availableN delivers for each measure, in the order of the criteria. */
  readonly precisionAtN: readonly PrecisionAtN[] | null;
  readonly warnings: readonly string[];
}

/** Fewer expected events than this draw a warning (METHODS 7b). */
export const FEW_EVENTS = 100;

/** Every criterion's inputs, derived once from the population input. */
interface CriterionInputs {
  readonly oe: OeInputs;
  readonly slope: CalibrationSlopeInputs;
  readonly cStatistic: CStatisticInputs;
  readonly netBenefit: readonly NetBenefitInputs[];
  readonly development: BinaryDevelopmentInputs | null;
}

function criterionInputs(input: BinaryPopulationInput, options: BinaryPlanOptions, lp: LpResolution): CriterionInputs {
  const a = input.anticipated;
  const p = input.precision;
  const { confidence } = p;
  const outcomeProportion = a.outcomeProportion;
  const calibration: Calibration = { intercept: a.calibrationIntercept ?? 0, slope: a.calibrationSlope ?? 1 };
  const d = options.development;
  return {
    oe: { outcomeProportion, target: p.oe, confidence },
    slope: { lp, calibration, width: p.slope.width, confidence, outcomeProportion, hermiteNodes: options.hermiteNodes },
    cStatistic: { cStatistic: a.cStatistic, lp, calibration, outcomeProportion, width: p.cStatistic.width, confidence },
    netBenefit: (a.thresholds ?? []).map((t) => ({
      threshold: t.threshold,
      sensitivity: t.sensitivity,
      specificity: t.specificity,
      lp,
      calibration,
      outcomeProportion,
      width: p.netBenefit.width,
      standardised: p.netBenefit.standardised,
      confidence,
    })),
    development:
      d === undefined
        ? null
        : {
            predictorParameters: d.predictorParameters,
            coxSnellR2: d.coxSnellR2,
            outcomeProportion,
            targetShrinkage: d.targetShrinkage ?? BINARY_DEVELOPMENT_DEFAULTS.targetShrinkage,
            optimismMargin: d.optimismMargin ?? BINARY_DEVELOPMENT_DEFAULTS.optimismMargin,
            riskMargin: d.riskMargin ?? BINARY_DEVELOPMENT_DEFAULTS.riskMargin,
            confidence,
          },
  };
}

function allCriteria(inputs: CriterionInputs): CriterionResult[] {
  const dev = inputs.development;
  return [
    oeCriterion(inputs.oe),
    calibrationSlopeCriterion(inputs.slope),
    cStatisticCriterion(inputs.cStatistic),
    ...inputs.netBenefit.map(netBenefitCriterion),
    ...(dev === null ? [] : planBinaryDevelopment(dev).criteria),
  ];
}

function allPrecisionAtN(inputs: CriterionInputs, n: number): PrecisionAtN[] {
  const dev = inputs.development;
  return [
    oePrecisionAtN(inputs.oe, n),
    calibrationSlopePrecisionAtN(inputs.slope, n),
    cStatisticPrecisionAtN(inputs.cStatistic, n),
    ...inputs.netBenefit.map((t) => netBenefitPrecisionAtN(t, n)),
    ...(dev === null
      ? []
      : [developmentShrinkagePrecisionAtN(dev, n), developmentOptimismPrecisionAtN(dev, n), overallRiskPrecisionAtN(dev, n)]),
  ];
}

function lpSummary(lp: LpResolution, calibration: Calibration): LpSummary | null {
  if (lp.kind !== 'given' && lp.kind !== 'fitted') return null;
  return { mean: lp.lp.mean, sd: lp.lp.sd, source: lp.kind, impliedOutcomeProportion: lpOutcomeProportion(lp.lp, calibration) };
}

function planWarnings(
  input: BinaryPopulationInput,
  criteria: readonly CriterionResult[],
  n: number | null,
  lp: LpSummary | null,
): string[] {
  const warnings: string[] = [];
  const phi = input.anticipated.outcomeProportion;
  for (const c of criteria) {
    if (c.status === 'not-converged')
      warnings.push(`${c.label}: ${c.reason ?? 'not converged'}; the required n cannot be stated until this is resolved`);
  }
  if (n !== null && n * phi < FEW_EVENTS) {
    warnings.push(
      `only ${formatSignificant(n * phi)} events are expected at n = ${formatCount(n)}; with fewer than ${FEW_EVENTS} events the large-sample formulas behind these criteria may be optimistic`,
    );
  }
  if (lp !== null && lp.source === 'given' && Math.abs(lp.impliedOutcomeProportion - phi) > 0.1 * phi) {
    warnings.push(
      `the given LP distribution and calibration imply an outcome proportion of ${formatSignificant(lp.impliedOutcomeProportion)}, not the anticipated ${formatSignificant(phi)}; the slope and net-benefit criteria use the implied one`,
    );
  }
  return warnings;
}

/**
 * Plans one binary-outcome population: O/E, calibration slope, C-statistic and net benefit at each
 * threshold (VAL-BIN; METHODS 5), plus the development minimums when options.development is given
 * (DEV-BIN-SURV; METHODS 4). The required n is the largest over the sized criteria (METHODS 1.5);
 * it is withheld (null) when any criterion failed numerically, since the minimum is then unknown.
 * Criteria lacking an input are reported as not-assessable and do not count.
 * Domain: every field as in validateBinaryPopulationInput; otherwise a DomainError naming it.
 * @example planBinaryPopulation({ anticipated: { outcomeProportion: 0.1, cStatistic: 0.8 }, precision: DEFAULT_BINARY_PRECISION }).bindingId // 'slope'
 */
export function planBinaryPopulation(input: BinaryPopulationInput, options: BinaryPlanOptions = {}): BinaryPopulationPlan {
  validateBinaryPopulationInput(input, options);
  const lp = resolveLp(input.anticipated);
  const inputs = criterionInputs(input, options, lp);
  const criteria = allCriteria(inputs);
  const summary = lpSummary(lp, inputs.slope.calibration);
  const totals = planTotals(criteria, input.anticipated.outcomeProportion, inputs.development?.predictorParameters ?? null);
  return {
    ...totals,
    lp: summary,
    precisionAtN: options.availableN === undefined ? null : allPrecisionAtN(inputs, options.availableN),
    warnings: planWarnings(input, criteria, totals.n, summary),
  };
}

/**
 * What a fixed, already available n delivers for each measure of planBinaryPopulation (SE and CI
 * width, or the development quantities), in the same order as its criteria.
 * @example binaryPrecisionAtN({ anticipated: { outcomeProportion: 0.1, cStatistic: 0.8 }, precision: DEFAULT_BINARY_PRECISION }, 1500)[1].se // 0.086250
 */
export function binaryPrecisionAtN(input: BinaryPopulationInput, n: number, options: BinaryPlanOptions = {}): PrecisionAtN[] {
  validateBinaryPopulationInput(input, { ...options, availableN: n });
  return allPrecisionAtN(criterionInputs(input, options, resolveLp(input.anticipated)), n);
}
