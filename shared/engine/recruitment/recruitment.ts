// Recruitment arithmetic behind the comparison table: how many to enrol, how long that takes at a
// site, when it ends, and whether it fits the study window. Common practice (no published source):
// enrol n/(1 − missing) so that n participants with an observed outcome remain.
import { DomainError } from '../errors';
import { ceilGuarded } from '../numerics/rounding';

/**
 * Participants to enrol so that `n` remain after a fraction `missingOutcome` lose their outcome:
 * ceil(n / (1 − missingOutcome)). Domain: n ≥ 0 integer, 0 ≤ missingOutcome < 1.
 * @example enrolmentTarget(234, 0.1) // 260
 */
export function enrolmentTarget(n: number, missingOutcome: number): number {
  if (!Number.isInteger(n) || n < 0) throw new DomainError('n', n, 'a whole number ≥ 0');
  if (!(missingOutcome >= 0 && missingOutcome < 1)) {
    throw new DomainError('missing-outcome fraction', missingOutcome, 'at least 0 and less than 1');
  }
  return ceilGuarded(n / (1 - missingOutcome));
}

/**
 * Participants enrolled per month: accrual × eligible fraction × consent fraction.
 * @example monthlyEnrolment(100, 0.5, 0.8) // 40
 */
export function monthlyEnrolment(accrualPerMonth: number, eligibleFraction: number, consentFraction: number): number {
  if (!(accrualPerMonth > 0) || !Number.isFinite(accrualPerMonth))
    throw new DomainError('accrual per month', accrualPerMonth, 'greater than 0');
  if (!(eligibleFraction > 0 && eligibleFraction <= 1))
    throw new DomainError('eligible fraction', eligibleFraction, 'greater than 0 and at most 1');
  if (!(consentFraction > 0 && consentFraction <= 1))
    throw new DomainError('consent fraction', consentFraction, 'greater than 0 and at most 1');
  return accrualPerMonth * eligibleFraction * consentFraction;
}

/**
 * Months needed to enrol `target` participants at `perMonth` a month (continuous time).
 * @example monthsToRecruit(260, 40) // 6.5
 */
export function monthsToRecruit(target: number, perMonth: number): number {
  if (!(target >= 0) || !Number.isFinite(target)) throw new DomainError('enrolment target', target, 'a number ≥ 0');
  if (!(perMonth > 0) || !Number.isFinite(perMonth)) throw new DomainError('enrolment per month', perMonth, 'greater than 0');
  return target / perMonth;
}

function daysInMonth(year: number, monthIndex: number): number {
  return new Date(Date.UTC(year, monthIndex + 1, 0)).getUTCDate();
}

/**
 * The day recruitment ends when it starts on `startDate` (YYYY-MM-DD) and lasts `months`:
 * whole calendar months are added first (clamped to the month's last day, as 31 Jan + 1 month
 * = 28/29 Feb), then the fraction of the following month, rounded up to a whole day.
 * @example finishDate('2027-01-15', 6.5) // '2027-07-31'
 */
export function finishDate(startDate: string, months: number): string {
  const match = /^(\d{4})-(\d{2})-(\d{2})$/.exec(startDate);
  if (match === null) throw new DomainError('study start', startDate, 'a date written YYYY-MM-DD');
  if (!(months >= 0) || !Number.isFinite(months)) throw new DomainError('months', months, 'a finite number ≥ 0');
  const year = Number(match[1]);
  const month = Number(match[2]) - 1;
  const day = Number(match[3]);
  const whole = Math.floor(months);
  const targetMonth = month + whole;
  const targetYear = year + Math.floor(targetMonth / 12);
  const targetMonthIndex = ((targetMonth % 12) + 12) % 12;
  const clampedDay = Math.min(day, daysInMonth(targetYear, targetMonthIndex));
  const fractionDays = Math.ceil((months - whole) * daysInMonth(targetYear, targetMonthIndex) - 1e-9);
  const end = new Date(Date.UTC(targetYear, targetMonthIndex, clampedDay + fractionDays));
  return end.toISOString().slice(0, 10);
}

export type Feasibility = 'fits' | 'exceeds' | 'unknown';

/** Whether recruitment fits the window; unknown without accrual or window. */
export function feasibility(months: number | null, windowMonths: number | undefined): Feasibility {
  if (months === null || windowMonths === undefined) return 'unknown';
  return months <= windowMonths + 1e-9 ? 'fits' : 'exceeds';
}
