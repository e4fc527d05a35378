/**
 * Raised when an input lies outside the domain of a formula. The engine never clamps silently
 * and never returns NaN or Infinity: callers validate at the zod edge, and anything that still
 * slips through ends here with the field, the value and the allowed range named.
 */
export class DomainError extends Error {
  readonly field: string;
  readonly value: unknown;
  readonly allowed: string;

  constructor(field: string, value: unknown, allowed: string) {
    super(`${field} = ${String(value)} is outside its allowed range: ${allowed}`);
    this.name = 'DomainError';
    this.field = field;
    this.value = value;
    this.allowed = allowed;
  }
}
