import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { smallestFromEstimate } from '@shared/engine/continuous/smallest-from-estimate';
import { smallestIntegerMeeting } from '@shared/engine/numerics/integer-search';

describe('smallest integer from an estimate', () => {
  it('finds the same n as the plain integer search whatever the estimate (monotone conditions)', () => {
    fc.assert(
      fc.property(
        fc.integer({ min: 1, max: 1_000 }),
        fc.integer({ min: 1, max: 100_000 }),
        fc.double({ min: -10, max: 1e6, noNaN: true }),
        (lowest, gap, estimate) => {
          const threshold = lowest + gap;
          const meets = (n: number): boolean => n >= threshold;
          expect(smallestFromEstimate(meets, estimate, lowest, 10_000_000)).toEqual(
            smallestIntegerMeeting(meets, lowest, 10_000_000),
          );
        },
      ),
      { numRuns: 500 },
    );
  });

  it('confirms a correct estimate with two evaluations', () => {
    let calls = 0;
    const meets = (n: number): boolean => {
      calls += 1;
      return n * n >= 50;
    };
    expect(smallestFromEstimate(meets, 7.07, 1, 1000).n).toBe(8);
    expect(calls).toBe(2);
  });

  it('returns the lowest n when it already meets, and reports when even the upper end does not', () => {
    expect(smallestFromEstimate(() => true, 50, 3, 100)).toEqual({ n: 3, converged: true });
    expect(smallestFromEstimate(() => false, 50, 3, 100)).toEqual({ n: null, converged: false });
    expect(smallestFromEstimate(() => false, 500, 3, 100)).toEqual({ n: null, converged: false });
    expect(smallestFromEstimate(() => true, Number.NaN, 3, 100)).toEqual({ n: 3, converged: true });
  });
});
