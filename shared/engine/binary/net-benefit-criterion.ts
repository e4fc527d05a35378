// Validation criterion: net benefit (or standardised net benefit) at a risk threshold estimated
// precisely [VAL-BIN]; one criterion per threshold.
import { formatSignificant } from '../../format/numbers';
import { levelText } from '../continuous/criterion-result';
import { withinTarget } from '../continuous/precision-tolerance';
import { closedFormSize } from '../continuous/sample-size';
import { criticalZ } from '../helpers/critical-z';
import { requireCount } from '../helpers/domain-guards';
import { seFromCiWidth } from '../helpers/se-from-ci-width';
import type { CriterionResult, Intermediate, PrecisionAtN } from '../types';
import { netBenefitId } from './binary-criterion-ids';
import type { BinaryCriterionText } from './binary-criterion-result';
import { binarySizedCriterion, binaryUnsizedCriterion } from './binary-criterion-result';
import type { Calibration } from './lp-distribution';
import type { NetBenefitVariance } from './net-benefit-variance';
import { netBenefitVariance } from './net-benefit-variance';
import type { LpResolution } from './resolve-lp';
import { lpIntermediates } from './resolve-lp';
import { sensSpecFromLp } from './sens-spec-from-lp';

export interface NetBenefitInputs {
  readonly threshold: number;
  /** Anticipated sensitivity and specificity at the threshold; both or neither (then from the LP). */
  readonly sensitivity?: number | undefined;
  readonly specificity?: number | undefined;
  readonly lp: LpResolution;
  readonly calibration: Calibration;
  readonly outcomeProportion: number;
  /** Target CI width for NB, or for sNB = NB/phi when `standardised`. */
  readonly width: number;
  readonly standardised: boolean;
  readonly confidence: number;
}

/** Computed sensitivities or specificities this close to 0 or 1 make the criterion degenerate. */
const DEGENERATE = 1e-6;

function text(inputs: NetBenefitInputs, threshold: string): BinaryCriterionText {
  const which = inputs.standardised ? 'standardised net benefit' : 'net benefit';
  return {
    id: netBenefitId(inputs.threshold),
    label: `Precise ${which} at threshold ${threshold}`,
    purpose: 'validation',
    formula: inputs.standardised
      ? 'n = n·Var(sNB)/SE*², n·Var(sNB) = sens(1 − sens)/phi + w²spec(1 − spec)(1 − phi)/phi² + w²(1 − spec)²(1 − phi)/phi³, w = t/(1 − t)'
      : 'n = n·Var(NB)/SE*², n·Var(NB) = sens(1 − sens)phi + w²spec(1 − spec)(1 − phi) + (sens + w(1 − spec))²phi(1 − phi), w = t/(1 − t)',
    references: ['VAL-BIN', 'VICKERS-ELKIN-2006', 'MARSH-JANES-PEPE-2020'],
  };
}

interface Classification {
  readonly variance: NetBenefitVariance;
  readonly outcomeProportion: number;
  readonly intermediates: Intermediate[];
}

/** Sensitivity, specificity and the outcome proportion behind them: entered, or from the LP. */
function classification(
  inputs: NetBenefitInputs,
): Classification | { readonly status: 'not-assessable' | 'not-converged'; readonly reason: string } {
  if (inputs.sensitivity !== undefined && inputs.specificity !== undefined) {
    const variance = netBenefitVariance(inputs.sensitivity, inputs.specificity, inputs.outcomeProportion, inputs.threshold);
    return { variance, outcomeProportion: inputs.outcomeProportion, intermediates: [] };
  }
  const resolution = inputs.lp;
  if (resolution.kind === 'unavailable') {
    return {
      status: 'not-assessable',
      reason: 'needs sensitivity and specificity at the threshold, or the distribution of the linear predictor',
    };
  }
  if (resolution.kind === 'not-converged') return { status: 'not-converged', reason: resolution.reason };
  const computed = sensSpecFromLp(resolution.lp, inputs.calibration, inputs.threshold);
  const { sensitivity, specificity, outcomeProportion } = computed;
  if (!(sensitivity > DEGENERATE && sensitivity < 1 - DEGENERATE && specificity > DEGENERATE && specificity < 1 - DEGENERATE)) {
    return {
      status: 'not-assessable',
      reason: `at threshold ${formatSignificant(inputs.threshold)} the LP distribution gives sensitivity ${formatSignificant(sensitivity)} and specificity ${formatSignificant(specificity)}: almost nobody or almost everybody is above the threshold, so net benefit there cannot be estimated`,
    };
  }
  const variance = netBenefitVariance(sensitivity, specificity, outcomeProportion, inputs.threshold);
  const intermediates = [
    ...lpIntermediates(resolution),
    { name: 'sensitivity from the LP distribution', value: sensitivity },
    { name: 'specificity from the LP distribution', value: specificity },
    { name: 'outcome proportion implied by LP and calibration', value: outcomeProportion },
  ];
  return { variance, outcomeProportion, intermediates };
}

function targetText(inputs: NetBenefitInputs, threshold: string): string {
  const which = inputs.standardised ? 'standardised net benefit' : 'net benefit';
  return `${levelText(inputs.confidence)} CI width for the ${which} at threshold ${threshold} ≤ ${formatSignificant(inputs.width)}`;
}

/**
 * The net-benefit criterion at one threshold as a CriterionResult: n = ⌈n·Var / SE*²⌉ (guarded).
 * @example netBenefitCriterion({ threshold: 0.1, sensitivity: 0.8, specificity: 0.7, outcomeProportion: 0.1, standardised: true, width: 0.2, … }).n // 1089
 */
export function netBenefitCriterion(inputs: NetBenefitInputs): CriterionResult {
  const threshold = formatSignificant(inputs.threshold);
  const t = text(inputs, threshold);
  const target = targetText(inputs, threshold);
  const c = classification(inputs);
  if ('status' in c) return binaryUnsizedCriterion(t, target, c.status, c.reason);
  const targetSe = seFromCiWidth(inputs.width, inputs.confidence);
  const perParticipant = inputs.standardised ? c.variance.standardisedVariance : c.variance.netBenefitVariance;
  const intermediates = [
    ...c.intermediates,
    { name: 'net benefit', value: c.variance.netBenefit },
    { name: 'standardised net benefit', value: c.variance.standardisedNetBenefit },
    { name: inputs.standardised ? 'n·Var(sNB)' : 'n·Var(NB)', value: perParticipant },
    { name: 'target SE', value: targetSe },
  ];
  return binarySizedCriterion(
    t,
    target,
    closedFormSize(perParticipant / (targetSe * targetSe), 1),
    intermediates,
    inputs.outcomeProportion,
  );
}

/**
 * What a fixed n delivers for (standardised) net benefit at the threshold: SE = √(n·Var/n) and 2z·SE.
 * @example netBenefitPrecisionAtN({ threshold: 0.1, sensitivity: 0.8, specificity: 0.7, outcomeProportion: 0.1, standardised: true, … }, 1090).se // 0.050984
 */
export function netBenefitPrecisionAtN(inputs: NetBenefitInputs, n: number): PrecisionAtN {
  requireCount('n', n, 1);
  const t = text(inputs, formatSignificant(inputs.threshold));
  const base = { id: t.id, label: t.label, n, targetValue: inputs.width, scale: `${levelText(inputs.confidence)} CI width` };
  const c = classification(inputs);
  if ('status' in c) return { ...base, se: null, achieved: null, meets: null, reason: c.reason };
  const perParticipant = inputs.standardised ? c.variance.standardisedVariance : c.variance.netBenefitVariance;
  const se = Math.sqrt(perParticipant / n);
  const achieved = 2 * criticalZ(inputs.confidence) * se;
  return { ...base, se, achieved, meets: withinTarget(achieved, inputs.width) };
}
