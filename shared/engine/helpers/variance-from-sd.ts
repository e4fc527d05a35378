import { requirePositive } from './domain-guards';

/**
 * Outcome variance from a standard deviation: var = SD².
 * Domain: SD > 0 and finite (a zero SD leaves nothing to predict); otherwise a DomainError.
 * Common practice. Exact up to one rounding.
 * @example varianceFromSd(0.6) // 0.36
 */
export function varianceFromSd(sd: number): number {
  requirePositive('sd', sd);
  return sd * sd;
}
