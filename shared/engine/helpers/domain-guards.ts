// Domain checks shared by the helpers and the criteria: inner maths never clamps, it refuses with
// the field, the value and the allowed range named (see DomainError).
import { DomainError } from '../errors';

/** Throws a DomainError naming `field` unless `value` is a finite number. */
export function requireFinite(field: string, value: number): void {
  if (!Number.isFinite(value)) throw new DomainError(field, value, 'a finite number');
}

/** Throws a DomainError naming `field` unless `value` is finite and greater than 0. */
export function requirePositive(field: string, value: number): void {
  if (!(value > 0) || !Number.isFinite(value)) throw new DomainError(field, value, 'a finite number greater than 0');
}

/**
 * Throws unless `value` is greater than 0, +Infinity included: a target SE that overflowed a double
 * (a huge CI width at a tiny confidence level) demands no precision at all, which is meaningful.
 */
export function requirePositiveOrInfinite(field: string, value: number): void {
  if (!(value > 0)) throw new DomainError(field, value, 'a number greater than 0 (Infinity allowed)');
}

/** Throws unless `value` lies strictly between 0 and 1 (R², shrinkage, confidence, proportions). */
export function requireOpenUnit(field: string, value: number): void {
  if (!(value > 0 && value < 1)) throw new DomainError(field, value, 'a number strictly between 0 and 1');
}

/** Throws unless `value` is a whole number of at least `min` (a sample size or a count). */
export function requireCount(field: string, value: number, min: number): void {
  if (!Number.isSafeInteger(value) || value < min) throw new DomainError(field, value, `a whole number of at least ${min}`);
}

/** Throws unless lower < upper (quartiles, ranges); names the upper field. */
export function requireOrdered(lowerField: string, lower: number, upperField: string, upper: number): void {
  if (!(upper > lower)) throw new DomainError(upperField, upper, `a number greater than ${lowerField} (${lower})`);
}

/** Throws unless `value` is finite and not 0 (a calibration slope, a mean used as a scale). */
export function requireNonZero(field: string, value: number): void {
  if (value === 0 || !Number.isFinite(value)) throw new DomainError(field, value, 'a finite number other than 0');
}
