import { describe, expect, it } from 'vitest';
import { DomainError } from '@shared/engine/errors';
import { createSimulation } from '@shared/engine/simulation/create-simulation';
import { binaryGeneratingModel } from '@shared/engine/simulation/binary-generating-model';
import type { BinarySimulationConfigInput } from '@shared/engine/simulation/simulation-config';
import type { MeasureId, MeasureSummary, MonteCarloEstimate, SimulationResult } from '@shared/engine/simulation/types';
import { expectClose } from '../../helpers/expect-close';
import { runToEnd } from './simulation-fixtures';

// Binary validation by simulation against the closed forms and Monte Carlo values of the methods
// reference, section 5 ([VAL-BIN], Stat Med 2021;40(19):4230–4251, doi:10.1002/sim.9025); the
// [CALC] and [MC] values there were computed with an independent reference implementation (scipy).
// Tolerances: K = 4 Monte Carlo SEs (see continuous-precision.test.ts for the reasoning), plus the
// allowance written beside each check.
const K = 4;
// Outcome proportion 0.1 and C 0.8 give LP ~ N(−2.77700, 1.28826²) (methods reference 5.2 table).
const LP = { lpMean: -2.776998, lpSd: 1.288257 };
const TARGETS = { confidence: 0.95, oe: { marginFactor: 1.105 }, slope: { width: 0.2 }, cStatistic: { width: 0.1 } };

function config(change: Partial<BinarySimulationConfigInput> = {}): BinarySimulationConfigInput {
  return { outcome: 'binary', population: LP, n: 1500, replicates: 2000, seed: 1500, targets: TARGETS, ...change };
}

function measure(result: SimulationResult, id: MeasureId): MeasureSummary {
  const found = result.measures.find((m) => m.id === id);
  if (!found) throw new Error(`measure ${id} missing`);
  return found;
}

function get(estimate: MonteCarloEstimate | null, label: string): MonteCarloEstimate {
  if (estimate === null) throw new Error(`${label}: no estimate`);
  return estimate;
}

/** E[g(expit(LP))] for LP ~ N(mean, sd²) by the trapezoid rule on ±10 SD (20,000 steps; error far below 1e-10). */
function expectOverLp(mean: number, sd: number, g: (p: number) => number): number {
  const steps = 20_000;
  const h = 20 / steps;
  let total = 0;
  for (let k = 0; k <= steps; k++) {
    const t = -10 + k * h;
    const weight = (k === 0 || k === steps ? 0.5 : 1) * h * (Math.exp(-0.5 * t * t) / Math.sqrt(2 * Math.PI));
    total += weight * g(1 / (1 + Math.exp(-(mean + sd * t))));
  }
  return total;
}

describe('binary validation by simulation (phi 0.1, C 0.8, n = 1,500, 2,000 replicates)', () => {
  const result = runToEnd(createSimulation(config()));

  it('the generating model has the anticipated outcome proportion 0.1 and C-statistic 0.8 (methods reference 5.2, scipy)', () => {
    const model = binaryGeneratingModel({ ...LP, calibrationIntercept: 0, calibrationSlope: 1 });
    expectClose(model.outcomeProportion, 0.1, 2e-6, 'outcome proportion');
    expectClose(model.cStatistic, 0.8, 2e-6, 'C-statistic');
    expect(model.observedExpected).toBe(1);
  });

  it('calibration slope: simulated SE matches the [MC] 0.0880 and exceeds the closed form 0.08625 by about 2% (methods reference 5.2)', () => {
    const slope = measure(result, 'binary-slope');
    expect(slope.replicates).toBe(2000);
    const se = get(slope.empiricalSe, 'slope SE');
    // [MC]: 2,000 replicates, so its own Monte Carlo SE is about 0.0880/√4000.
    expectClose(se.value, 0.088, K * Math.hypot(se.mcse, 0.088 / Math.sqrt(4000)) + 5e-5, 'slope SE vs [MC] 0.0880');
    // Closed form 0.08625 [CALC]; the small-sample excess is about 2% [MC]: allow 0–3% above it.
    expectClose(se.value, 0.08625 * 1.015, K * se.mcse + 0.08625 * 0.015, 'slope SE vs closed form');
    // The logistic MLE of the slope is biased away from 0 by O(1/n) (common practice): allow 2%.
    const mean = get(slope.meanEstimate, 'slope mean');
    expectClose(mean.value, 1, K * mean.mcse + 0.02, 'mean slope');
    const coverage = get(slope.coverage, 'slope coverage');
    expectClose(coverage.value, 0.95, K * coverage.mcse + 0.01, 'slope coverage');
  });

  it('C-statistic: simulated SE matches the Newcombe closed form 0.01904 and the [MC] 0.01898 (methods reference 5.3)', () => {
    const c = measure(result, 'c-statistic');
    const se = get(c.empiricalSe, 'C SE');
    // Newcombe's planning SE agrees with simulation within about 1% (methods reference 9.10).
    expectClose(se.value, 0.01904, K * se.mcse + 0.01904 * 0.01, 'C SE vs Newcombe 0.01904');
    expectClose(se.value, 0.01898, K * Math.hypot(se.mcse, 0.01898 / Math.sqrt(4000)) + 5e-6, 'C SE vs [MC] 0.01898');
    const mean = get(c.meanEstimate, 'C mean');
    expectClose(mean.value, 0.8, K * mean.mcse, 'mean C (Mann–Whitney is unbiased)');
    // The Hanley–McNeil SE overstates the SE here, so its interval over-covers.
    expect(get(c.coverage, 'C coverage').value).toBeGreaterThanOrEqual(0.95);
  });

  it('O/E with E from the same sample: the SE is √(E[p(1 − p)]/n)/phi, below the E-fixed closed form 0.0775 (methods reference 5.1)', () => {
    const oe = measure(result, 'observed-expected');
    const se = get(oe.empiricalSe, 'O/E SE');
    // Delta method [DERIVED]: O/E − 1 ≈ (Ō − Ē)/phi and Var(Ō − Ē) = E[Var(Y | LP)]/n = E[p(1 − p)]/n
    // for a well-calibrated model. Its error is O(1/n): allow 1%.
    const expected = Math.sqrt(expectOverLp(LP.lpMean, LP.lpSd, (p) => p * (1 - p)) / 1500) / 0.1;
    expectClose(se.value, expected, K * se.mcse + 0.01 * expected, 'O/E SE');
    const closedForm = Math.sqrt((1 - 0.1) / (1500 * 0.1));
    expectClose(closedForm, 0.0775, 5e-5, 'E-fixed closed form at n = 1,500 ([MC] row of 5.1)');
    expect(se.value + K * se.mcse).toBeLessThan(closedForm);
    expectClose(get(oe.meanEstimate, 'O/E mean').value, 1, K * get(oe.meanEstimate, 'O/E mean').mcse + 0.002, 'mean O/E');
    // The interval uses the conservative E-fixed SE, so it over-covers.
    expect(get(oe.coverage, 'O/E coverage').value).toBeGreaterThanOrEqual(0.95);
  });
});

describe('binary simulation: miscalibration, rare events, reproducibility and validation', () => {
  it('a miscalibrated model (α −0.3, β 0.8) gives mean estimates at the true slope, O/E and C', () => {
    const population = { ...LP, calibrationIntercept: -0.3, calibrationSlope: 0.8 };
    const truth = binaryGeneratingModel(population);
    const result = runToEnd(createSimulation(config({ population, n: 2000, replicates: 600, seed: 9 })));
    for (const [id, value, bias] of [
      ['binary-slope', 0.8, 0.02],
      ['observed-expected', truth.observedExpected, 0.003],
      ['c-statistic', truth.cStatistic, 0.001],
    ] as const) {
      const mean = get(measure(result, id).meanEstimate, id);
      expectClose(mean.value, value, K * mean.mcse + bias, `mean ${id}`);
    }
    expect(Math.abs(truth.observedExpected - 1)).toBeGreaterThan(0.05); // a real miscalibration
  });

  it('counts replicates without events as not estimable, and still returns only finite numbers', () => {
    const result = runToEnd(createSimulation(config({ population: { lpMean: -7, lpSd: 0.5 }, n: 10, replicates: 300, seed: 2 })));
    const oe = measure(result, 'observed-expected');
    expect(oe.replicatesNotEstimable).toBeGreaterThan(250);
    expect(oe.replicates + oe.replicatesNotEstimable).toBe(300);
    const numbers = JSON.stringify(result).match(/-?\d+(\.\d+)?(e[-+]?\d+)?|null|NaN|Infinity/g) ?? [];
    expect(numbers.filter((token) => token === 'NaN' || token === 'Infinity')).toEqual([]);
  });

  it('gives the same numbers for the same seed however the run is chunked, and others for another seed', () => {
    const small = config({ n: 3000, replicates: 12 });
    const whole = runToEnd(createSimulation(small));
    const split = runToEnd(createSimulation({ ...small, maxObservationsPerStep: 1000 }), 1);
    expect(split).toEqual(whole);
    expect(whole).toMatchObject({
      outcome: 'binary',
      seed: 1500,
      replicatesDone: 12,
      population: { calibrationIntercept: 0, calibrationSlope: 1 },
    });
    const other = runToEnd(createSimulation({ ...small, seed: 1501 }));
    expect(other.measures[1]?.meanEstimate?.value).not.toBe(whole.measures[1]?.meanEstimate?.value);
  });

  it.each([
    ['n', { n: 9 }],
    ['n', { n: 100_001 }],
    ['population.lpSd', { population: { lpMean: -2, lpSd: 0 } }],
    ['population.calibrationSlope', { population: { lpMean: -2, lpSd: 1, calibrationSlope: 0 } }],
    ['targets.oe.marginFactor', { targets: { ...TARGETS, oe: { marginFactor: 1 } } }],
    ['replicates', { n: 100_000, replicates: 30_000 }],
  ] as const)('rejects a bad %s with a DomainError naming it', (field, change) => {
    expect(() => createSimulation(config(change as Partial<BinarySimulationConfigInput>))).toThrow(DomainError);
    expect(() => createSimulation(config(change as Partial<BinarySimulationConfigInput>))).toThrow(`${field} = `);
  });
});
