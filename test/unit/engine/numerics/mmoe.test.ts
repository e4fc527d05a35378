import { describe, expect, it } from 'vitest';
import { DomainError } from '@shared/engine/errors';
import { MMOE_MAX_DF, multiplicativeMarginOfError, smallestDfForMargin } from '@shared/engine/numerics/mmoe';
import { expectClose } from '../../helpers/expect-close';

// Values computed with an independent reference implementation (scipy), METHODS.md 2.4 and 8 #1.
describe('multiplicative margin of error of the CI for an SD', () => {
  it('separates df 232 (1.100084) from df 233 (1.099848) at 95% (computed with scipy)', () => {
    // Printed to six decimals, hence 5e-7.
    expectClose(multiplicativeMarginOfError(232), 1.100084, 5e-7, 'MMOE(232)');
    expectClose(multiplicativeMarginOfError(233), 1.099848, 5e-7, 'MMOE(233)');
  });

  it('is set by the lower-tail ratio √(df/χ²_{α/2}) at df 233, as METHODS.md 2.4 states', () => {
    // Recomputing the two sides by hand from the chi-square table: χ²_{0.025,10} = 3.247 → √(10/3.247) = 1.7549.
    expectClose(multiplicativeMarginOfError(10), Math.sqrt(10 / 3.24697), 1e-4, 'MMOE(10) from the printed chi-square table');
  });

  it('first reaches 1.1 at df 233, 1.2 at df 69 and 1.05 at df 848 (computed with scipy)', () => {
    expect(smallestDfForMargin(1.1).n).toBe(233);
    expect(smallestDfForMargin(1.2).n).toBe(69);
    expect(smallestDfForMargin(1.05).n).toBe(848);
  });

  it('needs more df at a higher confidence level and fewer at a lower one', () => {
    const at95 = smallestDfForMargin(1.1, 0.95).n ?? 0;
    expect(smallestDfForMargin(1.1, 0.99).n ?? 0).toBeGreaterThan(at95);
    expect(smallestDfForMargin(1.1, 0.9).n ?? 0).toBeLessThan(at95);
  });

  it('returns the smallest df: the margin is met at df and missed at df − 1, for several targets and levels', () => {
    for (const margin of [1.01, 1.03, 1.1, 1.5, 3]) {
      for (const level of [0.8, 0.95, 0.999]) {
        const { n, converged } = smallestDfForMargin(margin, level);
        expect(converged, `${margin} @ ${level}`).toBe(true);
        const df = n ?? 0;
        expect(multiplicativeMarginOfError(df, level)).toBeLessThanOrEqual(margin);
        if (df > 1) expect(multiplicativeMarginOfError(df - 1, level)).toBeGreaterThan(margin);
      }
    }
  });

  it('reports a margin that would need more than the df cap as not converged instead of guessing', () => {
    const result = smallestDfForMargin(1.00001, 0.999);
    expect(result).toEqual({ n: null, converged: false });
    expect(multiplicativeMarginOfError(MMOE_MAX_DF, 0.999)).toBeGreaterThan(1.00001);
  });

  it('refuses a margin of 1 or less, a non-finite margin, df ≤ 0 and levels outside (0, 1)', () => {
    expect(() => smallestDfForMargin(1)).toThrow(DomainError);
    expect(() => smallestDfForMargin(Number.POSITIVE_INFINITY)).toThrow(/marginFactor/);
    expect(() => multiplicativeMarginOfError(0)).toThrow(/df/);
    expect(() => multiplicativeMarginOfError(10, 1)).toThrow(/confidence/);
    expect(() => smallestDfForMargin(1.1, 0)).toThrow(/confidence/);
  });
});
