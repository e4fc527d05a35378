import { describe, expect, it } from 'vitest';
import { chiSquareQuantile, normalQuantile, tQuantile, zForConfidence } from '@shared/engine/numerics/distributions';
import { DomainError } from '@shared/engine/errors';
import { expectClose } from '../../helpers/expect-close';

// Spot checks against printed statistical tables. Tables print 3–4 decimals, hence the tolerances.
describe('quantile functions against published tables', () => {
  it('normal quantiles match the standard normal table (any statistics handbook: 1.645, 1.960, 2.576)', () => {
    expectClose(normalQuantile(0.95), 1.6449, 5e-5, 'z 0.95');
    expectClose(normalQuantile(0.975), 1.96, 5e-4, 'z 0.975');
    expectClose(normalQuantile(0.995), 2.5758, 5e-5, 'z 0.995');
  });

  it('Student-t quantiles match the t table (t_{0.975,10} = 2.228, t_{0.975,30} = 2.042, t_{0.95,5} = 2.015)', () => {
    expectClose(tQuantile(0.975, 10), 2.228, 5e-4, 't 0.975 df 10');
    expectClose(tQuantile(0.975, 30), 2.042, 5e-4, 't 0.975 df 30');
    expectClose(tQuantile(0.95, 5), 2.015, 5e-4, 't 0.95 df 5');
  });

  it('chi-square quantiles match the chi-square table (χ²_{0.975,10} = 20.483, χ²_{0.025,10} = 3.247, χ²_{0.95,1} = 3.841)', () => {
    expectClose(chiSquareQuantile(0.975, 10), 20.483, 5e-4, 'chi2 0.975 df 10');
    expectClose(chiSquareQuantile(0.025, 10), 3.247, 5e-4, 'chi2 0.025 df 10');
    expectClose(chiSquareQuantile(0.95, 1), 3.841, 5e-4, 'chi2 0.95 df 1');
  });

  it('z for 95% confidence is the exact quantile 1.959964 (METHODS.md 1.6, computed with scipy)', () => {
    expectClose(zForConfidence(0.95), 1.959964, 5e-7, 'z 95%');
  });

  it('refuses probabilities and degrees of freedom outside the domain', () => {
    expect(() => normalQuantile(0)).toThrow(DomainError);
    expect(() => normalQuantile(1)).toThrow(DomainError);
    expect(() => tQuantile(0.5, 0)).toThrow(DomainError);
    expect(() => chiSquareQuantile(0.5, -1)).toThrow(DomainError);
    expect(() => zForConfidence(1.2)).toThrow(/confidence/);
  });
});
