import { describe, expect, it } from 'vitest';
import { fitLogisticCalibration } from '@shared/engine/simulation/fit-logistic-calibration';
import { mannWhitneyCStatistic } from '@shared/engine/simulation/mann-whitney-c-statistic';
import { expectClose } from '../../helpers/expect-close';
import fixture from './fixtures/binary-fits.json';

// Reference fits computed with an independent reference implementation (scipy: optimize.minimize
// on the logistic log-likelihood, stats.mannwhitneyu for the C-statistic); generator
// fixtures/make_binary_fits.py. The data sets are invented.
interface FitRecord {
  readonly name: string;
  readonly lp: readonly number[];
  readonly y: readonly number[];
  readonly intercept: number;
  readonly slope: number;
  readonly slopeSe: number;
  readonly c: number;
  readonly cSe: number;
}

const records: readonly FitRecord[] = fixture.records;

describe('per-replicate binary estimators against scipy', () => {
  it('the fixture holds five data sets', () => {
    expect(records).toHaveLength(5);
  });

  it.each(records.map((r) => [r.name, r] as const))(
    '%s: Newton–Raphson slope and SE match the scipy maximum-likelihood fit (1e-8)',
    (_, r) => {
      const lp = Float64Array.from(r.lp);
      const y = Uint8Array.from(r.y);
      for (const start of [null, { intercept: 0, slope: 1 }, { intercept: 3, slope: -2 }]) {
        const fit = fitLogisticCalibration(lp, y, lp.length, start);
        expect(fit.converged).toBe(true);
        expectClose(fit.slope, r.slope, 1e-8 * (1 + Math.abs(r.slope)), `${r.name} slope (start ${JSON.stringify(start)})`);
        expectClose(fit.slopeSe, r.slopeSe, 1e-8 * r.slopeSe, `${r.name} slope SE`);
        const mean = r.lp.reduce((s, v) => s + v, 0) / r.lp.length;
        expectClose(
          fit.centredIntercept - fit.slope * mean,
          r.intercept,
          1e-8 * (1 + Math.abs(r.intercept)),
          `${r.name} intercept`,
        );
      }
    },
  );

  it.each(records.map((r) => [r.name, r] as const))(
    '%s: Mann–Whitney C (ties count one half) and Hanley–McNeil SE match scipy (1e-12)',
    (_, r) => {
      const n = r.lp.length;
      const estimate = mannWhitneyCStatistic(
        Float64Array.from(r.lp),
        Uint8Array.from(r.y),
        n,
        new Float64Array(n),
        new Float64Array(n),
      );
      expectClose(estimate?.c ?? Number.NaN, r.c, 1e-12, `${r.name} C`);
      expectClose(estimate?.se ?? Number.NaN, r.cSe, 1e-12, `${r.name} C SE`);
    },
  );

  it('reports non-convergence under complete separation and without events, and C is not estimable without events', () => {
    const lp = Float64Array.from([-2, -1, 0, 1, 2, 3]);
    const separated = fitLogisticCalibration(lp, Uint8Array.from([0, 0, 0, 1, 1, 1]), 6);
    expect(separated.converged).toBe(false);
    expect(fitLogisticCalibration(lp, new Uint8Array(6), 6).converged).toBe(false);
    expect(mannWhitneyCStatistic(lp, new Uint8Array(6), 6, new Float64Array(6), new Float64Array(6))).toBeNull();
  });
});
