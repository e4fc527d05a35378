/**
 * Relative slack when an achieved precision is compared with its target in "precision at a fixed n".
 * Closed-form criteria round up with ceil(raw − 1e−9) (METHODS.md 1.4); without matching slack the
 * inverse could call the computed n short by floating error alone. Searched criteria compare with
 * the very predicate their search used and need no slack.
 */
export const PRECISION_TOLERANCE = 1e-9;

/** True when an achieved width, SE or margin is no larger than the target (up to the slack). */
export function withinTarget(achieved: number, target: number): boolean {
  return achieved <= target * (1 + PRECISION_TOLERANCE);
}

/** True when an achieved factor (a shrinkage factor) is no smaller than the target (up to the slack). */
export function atLeastTarget(achieved: number, target: number): boolean {
  return achieved >= target * (1 - PRECISION_TOLERANCE);
}
