/** C-statistic of one replicate with its Hanley–McNeil SE. */
export interface CStatisticEstimate {
  readonly c: number;
  readonly se: number;
}

/**
 * C-statistic (area under the ROC curve) by the Mann–Whitney statistic: the share of
 * (event, non-event) pairs in which the event has the higher LP, ties counting one half. Both
 * groups are sorted (native numeric sort of typed arrays, O(n log n)) and merged in one pass.
 * Writes the sorted values into `scratchEvents` and `scratchNonEvents` (each at least n long).
 * SE by Hanley & McNeil with the observed group sizes n₁ and n₀:
 *   SE² = [C(1 − C) + (n₁ − 1)(Q₁ − C²) + (n₀ − 1)(Q₂ − C²)] / (n₁·n₀),  Q₁ = C/(2 − C), Q₂ = 2C²/(1 + C).
 * Source: Hanley JA, McNeil BJ. The meaning and use of the area under a ROC curve. Radiology
 * 1982;143:29–36. Returns null without events or without non-events (not estimable).
 * @example mannWhitneyCStatistic(lp, y, 1500, scratchA, scratchB)?.c // ≈ 0.8 for phi 0.1 and C 0.8
 */
export function mannWhitneyCStatistic(
  lp: Float64Array,
  y: Uint8Array,
  n: number,
  scratchEvents: Float64Array,
  scratchNonEvents: Float64Array,
): CStatisticEstimate | null {
  let n1 = 0;
  let n0 = 0;
  for (let i = 0; i < n; i++) {
    if (y[i] === 1) scratchEvents[n1++] = lp[i]!;
    else scratchNonEvents[n0++] = lp[i]!;
  }
  if (n1 === 0 || n0 === 0) return null;
  const events = scratchEvents.subarray(0, n1).sort();
  const nonEvents = scratchNonEvents.subarray(0, n0).sort();
  let below = 0; // non-events with LP < the current event's LP
  let notAbove = 0; // non-events with LP ≤ the current event's LP
  let pairs = 0;
  for (let i = 0; i < n1; i++) {
    const e = events[i]!;
    while (below < n0 && nonEvents[below]! < e) below++;
    if (notAbove < below) notAbove = below;
    while (notAbove < n0 && nonEvents[notAbove]! <= e) notAbove++;
    pairs += below + (notAbove - below) / 2;
  }
  const c = pairs / (n1 * n0);
  const q1 = c / (2 - c);
  const q2 = (2 * c * c) / (1 + c);
  const variance = (c * (1 - c) + (n1 - 1) * (q1 - c * c) + (n0 - 1) * (q2 - c * c)) / (n1 * n0);
  return { c, se: Math.sqrt(Math.max(variance, 0)) };
}
