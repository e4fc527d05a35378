// Validation criterion: the calibration slope estimated precisely [VAL-BIN].
import { formatSignificant } from '../../format/numbers';
import { levelText } from '../continuous/criterion-result';
import { withinTarget } from '../continuous/precision-tolerance';
import type { SampleSize } from '../continuous/sample-size';
import { closedFormSize } from '../continuous/sample-size';
import { criticalZ } from '../helpers/critical-z';
import { requireCount, requirePositive } from '../helpers/domain-guards';
import { seFromCiWidth } from '../helpers/se-from-ci-width';
import type { CriterionResult, Intermediate, PrecisionAtN } from '../types';
import type { BinaryCriterionText } from './binary-criterion-result';
import { binarySizedCriterion, binaryUnsizedCriterion } from './binary-criterion-result';
import type { CalibrationSlopeInformation } from './calibration-slope-information';
import { calibrationSlopeInformation } from './calibration-slope-information';
import type { Calibration, NormalLp } from './lp-distribution';
import { LP_GAUSS_HERMITE_NODES, lpQuadratureRule } from './lp-quadrature-rule';
import type { LpResolution } from './resolve-lp';
import { lpIntermediates } from './resolve-lp';

export interface CalibrationSlopeInputs {
  readonly lp: LpResolution;
  readonly calibration: Calibration;
  readonly width: number;
  readonly confidence: number;
  /** The anticipated outcome proportion, for the expected events at n. */
  readonly outcomeProportion: number;
  /** Gauss–Hermite nodes for narrow LPs (default 200; see lpQuadratureRule). */
  readonly hermiteNodes?: number;
}

const TEXT: BinaryCriterionText = {
  id: 'slope',
  label: 'Precise calibration slope',
  purpose: 'validation',
  formula:
    'n = [I⁻¹]₂₂ / SE*², I = E[w·(1, LP)ᵀ(1, LP)], w = p(1 − p), p = expit(α + β·LP), expectations over the LP distribution by Gauss–Hermite quadrature',
  references: ['VAL-BIN', 'EVAL-BMJ'],
};

/** The information, or why it cannot be trusted (quadrature nodes that failed to converge). */
function information(lp: NormalLp, calibration: Calibration, hermiteNodes: number): CalibrationSlopeInformation | string {
  const rule = lpQuadratureRule(lp, calibration, hermiteNodes);
  if (!rule.converged) return `the ${hermiteNodes}-node Gauss–Hermite rule did not converge`;
  return calibrationSlopeInformation(lp, calibration, rule);
}

/**
 * Smallest n with SE(β̂) ≤ SE*, given n·Var(β̂) = [I⁻¹]₂₂ from calibrationSlopeInformation:
 * n = ⌈[I⁻¹]₂₂ / SE*²⌉ (guarded ceiling; METHODS 5.2 [DERIVED]).
 * Domain: [I⁻¹]₂₂ > 0 and SE* > 0, finite; otherwise DomainError. Exact.
 * @example calibrationSlopeSampleSize(11.15849, 0.051).n // 4291
 */
export function calibrationSlopeSampleSize(slopeVariance: number, targetSe: number): SampleSize {
  requirePositive('n·Var(calibration slope)', slopeVariance);
  requirePositive('target SE of the calibration slope', targetSe);
  return closedFormSize(slopeVariance / (targetSe * targetSe), 1);
}

function targetText(inputs: CalibrationSlopeInputs): string {
  return `${levelText(inputs.confidence)} CI width for the calibration slope ≤ ${formatSignificant(inputs.width)}`;
}

function informationIntermediates(
  inputs: CalibrationSlopeInputs,
  info: CalibrationSlopeInformation,
  nodes: number,
): Intermediate[] {
  return [
    ...lpIntermediates(inputs.lp),
    { name: 'calibration intercept α', value: inputs.calibration.intercept },
    { name: 'calibration slope β', value: inputs.calibration.slope },
    { name: 'outcome proportion implied by LP and calibration', value: info.outcomeProportion },
    { name: 'information E(w)', value: info.i00 },
    { name: 'information E(w·LP)', value: info.i01 },
    { name: 'information E(w·LP²)', value: info.i11 },
    { name: 'n·Var(slope) = [I⁻¹]₂₂', value: info.slopeVariance },
    { name: 'quadrature nodes', value: nodes },
  ];
}

/**
 * The calibration-slope criterion as a CriterionResult. Not assessable without an LP distribution;
 * not converged when the LP fit or the quadrature failed (the reason says which).
 * @example calibrationSlopeCriterion({ lp: resolveLp({ outcomeProportion: 0.1, cStatistic: 0.8 }), calibration: WELL_CALIBRATED, width: 0.2, confidence: 0.95, outcomeProportion: 0.1 }).n // 4287
 */
export function calibrationSlopeCriterion(inputs: CalibrationSlopeInputs): CriterionResult {
  const target = targetText(inputs);
  const resolution = inputs.lp;
  if (resolution.kind === 'unavailable') return binaryUnsizedCriterion(TEXT, target, 'not-assessable', resolution.reason);
  if (resolution.kind === 'not-converged') return binaryUnsizedCriterion(TEXT, target, 'not-converged', resolution.reason);
  const nodes = inputs.hermiteNodes ?? LP_GAUSS_HERMITE_NODES;
  const info = information(resolution.lp, inputs.calibration, nodes);
  if (typeof info === 'string') return binaryUnsizedCriterion(TEXT, target, 'not-converged', info, lpIntermediates(resolution));
  const targetSe = seFromCiWidth(inputs.width, inputs.confidence);
  const size = calibrationSlopeSampleSize(info.slopeVariance, targetSe);
  const ruleSize = lpQuadratureRule(resolution.lp, inputs.calibration, nodes).nodes.length;
  const intermediates = [...informationIntermediates(inputs, info, ruleSize), { name: 'target SE(slope)', value: targetSe }];
  return binarySizedCriterion(TEXT, target, size, intermediates, inputs.outcomeProportion);
}

/**
 * What a fixed n delivers for the calibration slope: SE = √([I⁻¹]₂₂/n) and the CI width 2z·SE.
 * @example calibrationSlopePrecisionAtN({ lp: resolveLp({ outcomeProportion: 0.1, cStatistic: 0.8 }), … }, 1500).se // 0.086250
 */
export function calibrationSlopePrecisionAtN(inputs: CalibrationSlopeInputs, n: number): PrecisionAtN {
  requireCount('n', n, 1);
  const base = {
    id: TEXT.id,
    label: TEXT.label,
    n,
    targetValue: inputs.width,
    scale: `${levelText(inputs.confidence)} CI width`,
  };
  const resolution = inputs.lp;
  if (resolution.kind === 'unavailable' || resolution.kind === 'not-converged') {
    return { ...base, se: null, achieved: null, meets: null, reason: resolution.reason };
  }
  const info = information(resolution.lp, inputs.calibration, inputs.hermiteNodes ?? LP_GAUSS_HERMITE_NODES);
  if (typeof info === 'string') return { ...base, se: null, achieved: null, meets: null, reason: info };
  const se = Math.sqrt(info.slopeVariance / n);
  const achieved = 2 * criticalZ(inputs.confidence) * se;
  return { ...base, se, achieved, meets: withinTarget(achieved, inputs.width) };
}
