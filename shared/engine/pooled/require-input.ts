// Guards the pooled functions need beyond shared/engine/helpers/domain-guards.ts. The zod edge
// rejects bad user input first; these make sure nothing that slips past it is computed silently.
import { formatCount } from '../../format/numbers';
import { DomainError } from '../errors';

/** A finite number ≥ 0 (between-site SD τ). */
export function requireNonNegative(field: string, value: number): void {
  if (!(Number.isFinite(value) && value >= 0)) throw new DomainError(field, value, 'a finite number ≥ 0');
}

/** A whole number in [min, max]. */
export function requireInteger(field: string, value: number, min: number, max: number): void {
  if (!(Number.isInteger(value) && value >= min && value <= max)) {
    throw new DomainError(field, value, `a whole number from ${formatCount(min)} to ${formatCount(max)}`);
  }
}

/** A standard error returned by a caller's function: must be finite and > 0. */
export function requireStandardError(field: string, se: number, n: number): number {
  if (!(Number.isFinite(se) && se > 0)) {
    throw new DomainError(field, se, `a positive finite standard error (it was asked for n = ${n})`);
  }
  return se;
}
