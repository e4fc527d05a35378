import { describe, expect, it } from 'vitest';
import {
  enrolmentTarget,
  feasibility,
  finishDate,
  monthlyEnrolment,
  monthsToRecruit,
} from '@shared/engine/recruitment/recruitment';
import { DomainError } from '@shared/engine/errors';
import { expectClose } from '../../helpers/expect-close';

// Hand-worked values (common practice: inflate n by 1/(1 − missing), months = target / rate).
describe('derived recruitment columns, worked by hand', () => {
  it('inflates n for missing outcomes and rounds up: 234 / 0.9 = 260 exactly; 235 / 0.85 = 276.47 → 277', () => {
    expect(enrolmentTarget(234, 0.1)).toBe(260);
    expect(enrolmentTarget(235, 0.15)).toBe(277);
    expect(enrolmentTarget(918, 0)).toBe(918);
  });

  it('monthly enrolment is accrual × eligible × consent: 120 × 0.6 × 0.75 = 54', () => {
    expectClose(monthlyEnrolment(120, 0.6, 0.75), 54, 1e-12, 'monthly');
  });

  it('months to recruit: 277 at 54 a month = 5.1296 months', () => {
    expectClose(monthsToRecruit(277, 54), 5.12963, 1e-5, 'months');
  });

  it('finish date: 15 Jan 2027 + 6.5 months = 15 Jul + 15.5 → 16 days = 31 Jul 2027', () => {
    expect(finishDate('2027-01-15', 6.5)).toBe('2027-07-31');
  });

  it('finish date clamps to the end of a shorter month: 31 Jan 2027 + 1 month = 28 Feb 2027; 2028 is a leap year (29 Feb)', () => {
    expect(finishDate('2027-01-31', 1)).toBe('2027-02-28');
    expect(finishDate('2028-01-31', 1)).toBe('2028-02-29');
  });

  it('finish date crosses years: 1 Nov 2027 + 14 months = 1 Jan 2029; + 0 months is the start', () => {
    expect(finishDate('2027-11-01', 14)).toBe('2029-01-01');
    expect(finishDate('2027-11-01', 0)).toBe('2027-11-01');
  });

  it('feasibility compares months with the window, unknown without data', () => {
    expect(feasibility(17.9, 18)).toBe('fits');
    expect(feasibility(18, 18)).toBe('fits');
    expect(feasibility(18.01, 18)).toBe('exceeds');
    expect(feasibility(null, 18)).toBe('unknown');
    expect(feasibility(3, undefined)).toBe('unknown');
  });

  it('refuses impossible inputs by name', () => {
    expect(() => enrolmentTarget(100, 1)).toThrow(DomainError);
    expect(() => enrolmentTarget(-1, 0)).toThrow(/n = -1/);
    expect(() => monthlyEnrolment(0, 1, 1)).toThrow(/accrual per month/);
    expect(() => monthlyEnrolment(10, 1.2, 1)).toThrow(/eligible fraction/);
    expect(() => finishDate('2027/01/01', 1)).toThrow(/study start/);
  });
});
