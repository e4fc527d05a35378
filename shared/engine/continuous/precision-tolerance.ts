/**
 * Relative slack when an achieved precision is compared with its target in "precision at a fixed n".
 * Closed-form criteria round up with ceil(raw − 1e−9) (METHODS.md 1.4); without matching slack the
 * inverse could call the computed n short by floating error alone. Searched criteria compare with
 * the very predicate their search used and need no slack.
 */
export const PRECISION_TOLERANCE = 1e-9;

/**
 * True when n reaches a closed form's unrounded requirement `raw`, with exactly the guard of
 * ceil(raw − 1e−9) (METHODS.md 1.4): the inverse then agrees with the forward criterion at every
 * n, where a relative slack on the achieved width would not (for n near 1e7 a 1e−9 slack spans
 * a few hundredths of a participant in raw, so n − 1 could pass).
 * @example meetsRequirement(308, 307.3) // true
 */
export function meetsRequirement(n: number, raw: number): boolean {
  return n >= raw - 1e-9;
}

/**
 * True when an achieved width, SE or margin is no larger than the target (up to the slack). Near
 * n ≈ 1e7 the slack can exceed the change from n − 1 to n; prefer meetsRequirement for closed forms.
 */
export function withinTarget(achieved: number, target: number): boolean {
  return achieved <= target * (1 + PRECISION_TOLERANCE);
}

/**
 * True when an achieved factor (a shrinkage factor) is no smaller than the target (up to the
 * slack). Mind the amplification when the factor is solved from n: near 1 a relative slack of
 * 1e−9 in S can span several values of n (the continuous closed form compares n instead).
 */
export function atLeastTarget(achieved: number, target: number): boolean {
  return achieved >= target * (1 - PRECISION_TOLERANCE);
}
