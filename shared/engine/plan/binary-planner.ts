import { binarySensitivityCurves } from '../ranges/binary-sensitivity-curves';
import { binaryWorstCase } from '../ranges/binary-worst-case';
import { planBinary } from './plan-binary';

/**
 * The binary engine as one object, shaped like continuousPlanner: the plan of a binary
 * population, its worst case across the assumption ranges and its sensitivity curves.
 */
export const binaryPlanner = {
  plan: planBinary,
  worstCase: binaryWorstCase,
  sensitivity: binarySensitivityCurves,
} as const;
