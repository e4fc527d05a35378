// Validation criterion: the C-statistic estimated precisely (Newcombe's variance) [VAL-BIN].
import { formatSignificant } from '../../format/numbers';
import { levelText } from '../continuous/criterion-result';
import { withinTarget } from '../continuous/precision-tolerance';
import { criticalZ } from '../helpers/critical-z';
import { seFromCiWidth } from '../helpers/se-from-ci-width';
import type { CriterionResult, Intermediate, PrecisionAtN } from '../types';
import type { BinaryCriterionText } from './binary-criterion-result';
import { binarySizedCriterion, binaryUnsizedCriterion } from './binary-criterion-result';
import { lpCStatistic } from './lp-c-statistic';
import type { Calibration } from './lp-distribution';
import { C_STATISTIC_LOWEST_N, newcombeCStatisticSe, newcombeSampleSize } from './newcombe-c-statistic';
import type { LpResolution } from './resolve-lp';

export interface CStatisticInputs {
  /** The anticipated C-statistic; when absent it is computed from a given LP distribution. */
  readonly cStatistic?: number | undefined;
  readonly lp: LpResolution;
  readonly calibration: Calibration;
  readonly outcomeProportion: number;
  readonly width: number;
  readonly confidence: number;
}

const TEXT: BinaryCriterionText = {
  id: 'c-statistic',
  label: 'Precise C-statistic',
  purpose: 'validation',
  formula:
    'SE(C)² = C(1 − C)[1 + (n/2 − 1)(1 − C)/(2 − C) + (n/2 − 1)C/(1 + C)] / (n²·phi(1 − phi)) (Newcombe); n = smallest with SE(C) ≤ SE*, in closed form',
  references: ['VAL-BIN', 'NEWCOMBE-2006', 'HANLEY-MCNEIL-1982'],
};

/** The C-statistic to plan with and how it was obtained, or why there is none. */
function anticipatedC(inputs: CStatisticInputs): { readonly c: number; readonly intermediates: Intermediate[] } | string {
  if (inputs.cStatistic !== undefined) return { c: inputs.cStatistic, intermediates: [] };
  if (inputs.lp.kind !== 'given') return 'needs the anticipated C-statistic, or the mean and SD of the linear predictor';
  const c = lpCStatistic(inputs.lp.lp, inputs.calibration);
  if (!(c > 0.5 && c < 1))
    return `the given LP distribution implies a C-statistic of ${formatSignificant(c)}, which leaves nothing to estimate`;
  return { c, intermediates: [{ name: 'C-statistic implied by the LP distribution', value: c }] };
}

function targetText(inputs: CStatisticInputs): string {
  return `${levelText(inputs.confidence)} CI width for the C-statistic ≤ ${formatSignificant(inputs.width)}`;
}

/**
 * The C-statistic criterion as a CriterionResult.
 * @example cStatisticCriterion({ cStatistic: 0.8, lp: …, calibration: WELL_CALIBRATED, outcomeProportion: 0.1, width: 0.1, confidence: 0.95 }).n // 836
 */
export function cStatisticCriterion(inputs: CStatisticInputs): CriterionResult {
  const target = targetText(inputs);
  const anticipated = anticipatedC(inputs);
  if (typeof anticipated === 'string') return binaryUnsizedCriterion(TEXT, target, 'not-assessable', anticipated);
  const targetSe = seFromCiWidth(inputs.width, inputs.confidence);
  const size = newcombeSampleSize(anticipated.c, inputs.outcomeProportion, targetSe);
  const intermediates = [...anticipated.intermediates, { name: 'target SE(C)', value: targetSe }];
  return binarySizedCriterion(TEXT, target, size, intermediates, inputs.outcomeProportion);
}

/**
 * What a fixed n delivers for the C-statistic: Newcombe's SE and the CI width 2z·SE.
 * @example cStatisticPrecisionAtN({ cStatistic: 0.8, outcomeProportion: 0.1, … }, 1500).se // 0.019038
 */
export function cStatisticPrecisionAtN(inputs: CStatisticInputs, n: number): PrecisionAtN {
  const base = {
    id: TEXT.id,
    label: TEXT.label,
    n,
    targetValue: inputs.width,
    scale: `${levelText(inputs.confidence)} CI width`,
  };
  const anticipated = anticipatedC(inputs);
  if (typeof anticipated === 'string') return { ...base, se: null, achieved: null, meets: null, reason: anticipated };
  if (n < C_STATISTIC_LOWEST_N)
    return { ...base, se: null, achieved: null, meets: false, reason: 'a C-statistic needs at least 2 participants' };
  const se = newcombeCStatisticSe(anticipated.c, inputs.outcomeProportion, n);
  const achieved = 2 * criticalZ(inputs.confidence) * se;
  return { ...base, se, achieved, meets: withinTarget(achieved, inputs.width) };
}
