/**
 * Smallest integer at least `raw`, guarding against floating error just above an integer
 * (97.00000000001 must give 97, not 98). Convention: METHODS.md 1.4, ceil(raw − 1e−9).
 * @example ceilGuarded(97.00000000001) // 97
 */
export function ceilGuarded(raw: number): number {
  return Math.ceil(raw - 1e-9);
}
