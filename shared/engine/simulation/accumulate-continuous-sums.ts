import { fillStandardNormals } from './standard-normals';
import type { RandomStream } from './random-stream';

/** Slots of the running sums of one continuous replicate (u = Ŷ − m, y = Y − E(Y)). */
export const SUM_U = 0;
export const SUM_UU = 1;
export const SUM_Y = 2;
export const SUM_YY = 3;
export const SUM_UY = 4;
export const CONTINUOUS_SUM_SLOTS = 5;

/** Observations drawn per refill of the normal buffer (two normals each). */
export const CONTINUOUS_BLOCK = 1024;

/**
 * Simulates `count` observations u = σ_Ŷ·z₁, y = β·u + σ_e·z₂ (z₁, z₂ independent standard
 * normals; see continuousGeneratingModel for why this gives the anticipated R², slope and CITL)
 * and adds Σu, Σu², Σy, Σy², Σuy into `sums`. No array of size n is needed: the calibration
 * models are fitted from these five sums. The values are centred (Ŷ − m and Y − E(Y)), so the
 * sums stay small and the one-pass formulas lose no precision.
 * `normals` is scratch space of at least 2·CONTINUOUS_BLOCK doubles, reused across calls.
 * Common practice (sufficient statistics of simple linear regression).
 * @example accumulateContinuousSums(stream, scratch, sums, 308, 2, 4.47, 1) // sums now cover 308 draws
 */
export function accumulateContinuousSums(
  stream: RandomStream,
  normals: Float64Array,
  sums: Float64Array,
  count: number,
  predictionSd: number,
  errorSd: number,
  slope: number,
): void {
  let su = 0;
  let suu = 0;
  let sy = 0;
  let syy = 0;
  let suy = 0;
  let left = count;
  while (left > 0) {
    const block = left < CONTINUOUS_BLOCK ? left : CONTINUOUS_BLOCK;
    const draws = 2 * block;
    fillStandardNormals(stream, normals, draws);
    for (let j = 0; j < draws; j += 2) {
      const u = predictionSd * normals[j]!;
      const y = slope * u + errorSd * normals[j + 1]!;
      su += u;
      suu += u * u;
      sy += y;
      syy += y * y;
      suy += u * y;
    }
    left -= block;
  }
  sums[SUM_U] = sums[SUM_U]! + su;
  sums[SUM_UU] = sums[SUM_UU]! + suu;
  sums[SUM_Y] = sums[SUM_Y]! + sy;
  sums[SUM_YY] = sums[SUM_YY]! + syy;
  sums[SUM_UY] = sums[SUM_UY]! + suy;
}
