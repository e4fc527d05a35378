import { expit } from '../binary/logistic';
import { openUniform } from './random-stream';
import type { RandomStream } from './random-stream';
import { fillStandardNormals } from './standard-normals';

/** Draws per refill of the normal buffer. */
export const BINARY_BLOCK = 1024;

/**
 * Simulates observations from..from + count − 1 of a binary replicate: LP = μ + σ·z (z standard
 * normal), Y = 1 with probability expit(α + β·LP) (a 53-bit uniform below the probability), and
 * stores LP and Y at those positions of `lp` and `y` (expit from the binary engine, which stays
 * accurate in both tails). Returns the number of events and the sum of the
 * model's predicted risks expit(LP) over the new observations (for O and E).
 * Source of the model: [VAL-BIN] (Stat Med 2021;40(19):4230–4251, doi:10.1002/sim.9025).
 * @example simulateBinaryObservations(stream, scratch, lp, y, 0, 1500, -2.777, 1.288, 0, 1) // { events ≈ 150, … }
 */
export function simulateBinaryObservations(
  stream: RandomStream,
  normals: Float64Array,
  lp: Float64Array,
  y: Uint8Array,
  from: number,
  count: number,
  lpMean: number,
  lpSd: number,
  intercept: number,
  slope: number,
): { readonly events: number; readonly predictedRisk: number } {
  let events = 0;
  let predictedRisk = 0;
  let at = from;
  const end = from + count;
  while (at < end) {
    const block = Math.min(end - at, BINARY_BLOCK);
    fillStandardNormals(stream, normals, block);
    for (let j = 0; j < block; j++, at++) {
      const x = lpMean + lpSd * normals[j]!;
      const predicted = expit(x);
      const event = openUniform(stream) < expit(intercept + slope * x) ? 1 : 0;
      lp[at] = x;
      y[at] = event;
      events += event;
      predictedRisk += predicted;
    }
  }
  return { events, predictedRisk };
}
