import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { MeasureTally } from '@shared/engine/simulation/measure-tally';
import type { MeasureDefinition } from '@shared/engine/simulation/types';
import { expectClose } from '../../helpers/expect-close';

const DEFINITION: MeasureDefinition = {
  id: 'citl',
  label: 'calibration-in-the-large',
  trueValue: 0,
  scale: 'ci-width',
  targetValue: 1,
  interval: 'Wald',
};

// Two-pass textbook formulas are the reference for the one-pass updates (common practice).
function twoPass(x: readonly number[]): { mean: number; sd: number; m2: number; m4: number } {
  const mean = x.reduce((s, v) => s + v, 0) / x.length;
  const dev = (p: number) => x.reduce((s, v) => s + (v - mean) ** p, 0) / x.length;
  return { mean, sd: Math.sqrt((dev(2) * x.length) / (x.length - 1)), m2: dev(2), m4: dev(4) };
}

describe('the one-pass tally of a measure across replicates', () => {
  it('gives the two-pass mean, SD, fourth-moment MCSE of the SD, width mean and counts (1e-9 relative)', () => {
    fc.assert(
      fc.property(
        fc.array(fc.tuple(fc.double({ min: -1e3, max: 1e3, noNaN: true }), fc.double({ min: 0, max: 2, noNaN: true })), {
          minLength: 2,
          maxLength: 200,
        }),
        (rows) => {
          const tally = new MeasureTally(DEFINITION);
          for (const [estimate, width] of rows) tally.add(estimate, estimate - width / 2, estimate + width / 2, width);
          const s = tally.summary();
          const est = twoPass(rows.map((r) => r[0]));
          const wid = twoPass(rows.map((r) => r[1]));
          const r = rows.length;
          const scale = 1e-9 * (1 + Math.abs(est.mean) + est.sd);
          expectClose(s.meanEstimate?.value ?? Number.NaN, est.mean, scale, 'mean');
          expectClose(s.empiricalSe?.value ?? Number.NaN, est.sd, scale, 'SD');
          expectClose(s.meanEstimate?.mcse ?? Number.NaN, est.sd / Math.sqrt(r), scale, 'MCSE of mean');
          if (est.sd > 1e-6) {
            const mcseSd = Math.sqrt(Math.max(est.m4 - est.m2 ** 2, 0) / r) / (2 * est.sd);
            // m₄ − m₂² cancels when the fourth moment is nearly m₂² (two replicates): scale the tolerance by √m₄.
            const magnitude = Math.sqrt(est.m4 / r) / (2 * est.sd);
            expectClose(s.empiricalSe?.mcse ?? Number.NaN, mcseSd, 1e-6 * magnitude, 'MCSE of SD');
          }
          expectClose(s.meanSize?.value ?? Number.NaN, wid.mean, 1e-9, 'mean width');
          expectClose(s.meanSize?.mcse ?? Number.NaN, wid.sd / Math.sqrt(r), 1e-9, 'MCSE of mean width');
          const meets = rows.filter((row) => row[1] <= 1).length / r;
          const covers = rows.filter(([e, w]) => e - w / 2 <= 0 && 0 <= e + w / 2).length / r;
          expect(s.shareMeetingTarget?.value).toBe(meets);
          expect(s.coverage?.value).toBe(covers);
          expectClose(s.coverage?.mcse ?? Number.NaN, Math.sqrt((covers * (1 - covers)) / r), 1e-12, 'MCSE of coverage');
        },
      ),
      { seed: 8, numRuns: 200 },
    );
  });

  it('for normal estimates the MCSE of the SD is close to SD/√(2(R − 1)) (Morris, White & Crowther, Stat Med 2019, doi:10.1002/sim.8086)', () => {
    // Normal scores at equally spaced probabilities stand in for normal estimates (kurtosis ≈ 3).
    const r = 2000;
    const tally = new MeasureTally(DEFINITION);
    const scores: number[] = [];
    for (let i = 0; i < r; i++) {
      // Box–Muller on a fixed lattice, deterministic and close to normal.
      const u = (i + 0.5) / r;
      const v = ((i * 7919) % r) / r + 0.5 / r;
      scores.push(Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v));
    }
    for (const x of scores) tally.add(x, x - 1, x + 1, 2);
    const s = tally.summary();
    const sd = s.empiricalSe?.value ?? Number.NaN;
    expectClose(
      s.empiricalSe?.mcse ?? Number.NaN,
      sd / Math.sqrt(2 * (r - 1)),
      0.1 * (sd / Math.sqrt(2 * (r - 1))),
      'MCSE of SD',
    );
  });

  it('gives no summary statistics with fewer than two replicates, and counts non-estimable replicates apart', () => {
    const tally = new MeasureTally(DEFINITION);
    tally.add(0.1, -0.4, 0.6, 1);
    tally.notEstimable += 2;
    const s = tally.summary();
    expect(s).toMatchObject({ replicates: 1, replicatesNotEstimable: 2, meanEstimate: null, empiricalSe: null, coverage: null });
  });
});
