import { describe, expect, it } from 'vitest';
import { createSimulation } from '@shared/engine/simulation/create-simulation';
import { simulationVerdict } from '@shared/engine/simulation/simulation-verdict';
import type { MeasureSummary, SimulationResult } from '@shared/engine/simulation/types';
import { CONTINUOUS_TARGETS, runToEnd } from './simulation-fixtures';

function simulate(n: number, replicates: number): SimulationResult {
  return runToEnd(
    createSimulation({
      outcome: 'continuous',
      population: { rSquared: 0.8, outcomeVariance: 100 },
      n,
      replicates,
      seed: 7,
      targets: CONTINUOUS_TARGETS,
    }),
  );
}

function withMeasure(result: SimulationResult, id: MeasureSummary['id'], change: Partial<MeasureSummary>): SimulationResult {
  return { ...result, measures: result.measures.map((m) => (m.id === id ? { ...m, ...change } : m)) };
}

describe('the plain-language verdict', () => {
  const atCitlN = simulate(308, 4000);

  it('at the CITL closed-form n (308) says about half the studies met the width and the target is delivered on average', () => {
    const verdict = simulationVerdict(atCitlN, { citl: { n: 308, se: Math.sqrt(20 / 308) } });
    const citl = verdict.measures.find((m) => m.measureId === 'citl');
    expect(citl?.status).toBe('meets-on-average');
    expect(citl?.text).toMatch(
      /^At n = 308, 5\d\.\d% \(±0\.8%\) of simulated studies met the calibration-in-the-large width target; the mean width was 0\.99\d against the target 1 — the closed-form n delivers the target on average\./,
    );
    expect(citl?.text).toContain('against the closed-form 0.255 (in agreement within simulation error)');
    expect(citl?.text).toMatch(/Coverage of the 95% interval: 9\d\.\d% \(±0\.\d%\)\./);
    expect(verdict.headline).toBe('4,000 simulated studies of n = 308 (seed 7). Every precision target is met on average.');
  });

  it('says "this n" when the simulated n is not the criterion\'s closed-form n, and the SD margins are fixed by n', () => {
    const verdict = simulationVerdict(atCitlN);
    expect(verdict.measures.find((m) => m.measureId === 'slope')?.text).toContain('this n delivers the target on average');
    const sd = verdict.measures.find((m) => m.measureId === 'slope-residual-sd');
    expect(sd?.status).toBe('met-by-every-study');
    expect(sd?.text).toContain('the mean margin was ÷/× 1.086 against the target 1.1 — the margin depends on n only');
  });

  it('at n = 98 the CITL width and the SD margins fall short, and the headline names them', () => {
    const verdict = simulationVerdict(simulate(98, 500));
    const byId = Object.fromEntries(verdict.measures.map((m) => [m.measureId, m.status]));
    expect(byId).toMatchObject({ citl: 'falls-short', 'outcome-sd': 'met-by-no-study', 'r-squared': 'falls-short' });
    expect(verdict.measures.find((m) => m.measureId === 'citl')?.text).toMatch(
      /falls short of the target on average \(mean width 7\d\.\d% above it\)/,
    );
    expect(verdict.headline).toContain('Missed on average: R²; calibration-in-the-large; SD of the outcome;');
  });

  it('treats a mean width above the target by less than two Monte Carlo SEs as within simulation error', () => {
    const close = withMeasure(atCitlN, 'citl', { meanSize: { value: 1.001, mcse: 0.001 } });
    expect(simulationVerdict(close).measures.find((m) => m.measureId === 'citl')?.status).toBe('within-simulation-error');
    const far = withMeasure(atCitlN, 'citl', { meanSize: { value: 1.003, mcse: 0.001 } });
    expect(simulationVerdict(far).measures.find((m) => m.measureId === 'citl')?.status).toBe('falls-short');
  });

  it('reports a simulated SE that differs from the closed form by more than two Monte Carlo SEs as a percentage', () => {
    const verdict = simulationVerdict(atCitlN, { citl: { se: 0.2 } });
    expect(verdict.measures.find((m) => m.measureId === 'citl')?.text).toMatch(
      /against the closed-form 0\.2 \(2\d\.\d% larger\)/,
    );
  });

  it('flags partial results and declines to summarise fewer than two replicates', () => {
    const sim = createSimulation({
      outcome: 'continuous',
      population: { rSquared: 0.8, outcomeVariance: 100 },
      n: 308,
      replicates: 1000,
      seed: 3,
      targets: CONTINUOUS_TARGETS,
    });
    sim.step(1);
    const one = simulationVerdict(sim.result());
    expect(one.headline).toBe(
      'Partial result: 1 of 1,000 replicates completed (seed 3). Too few completed replicates to summarise.',
    );
    expect(one.measures.every((m) => m.status === 'not-summarised')).toBe(true);
    sim.step(249);
    expect(simulationVerdict(sim.result()).headline).toMatch(/^Partial result: 250 of 1,000 replicates completed \(seed 3\)\./);
  });
});

describe('the verdict for a binary simulation', () => {
  it('at the O/E closed-form n (phi 0.1, SE* 0.051 → 3,461) reads the O/E margin against its target', () => {
    const z = 1.959963984540054;
    const margin = Math.exp(z * 0.051); // target margin for SE(ln O/E) = 0.051 (methods reference 1.2)
    const result = runToEnd(
      createSimulation({
        outcome: 'binary',
        population: { lpMean: -2.776998, lpSd: 1.288257 },
        n: 3461, // methods reference 5.1 check value (scipy)
        replicates: 200,
        seed: 3461,
        targets: { confidence: 0.95, oe: { marginFactor: margin }, slope: { width: 0.2 }, cStatistic: { width: 0.1 } },
      }),
    );
    const verdict = simulationVerdict(result, { 'observed-expected': { n: 3461 } });
    const oe = verdict.measures.find((m) => m.measureId === 'observed-expected');
    expect(['meets-on-average', 'within-simulation-error']).toContain(oe?.status);
    expect(oe?.text).toMatch(
      /^At n = 3,461, \d+(\.\d)?% \(±\d\.\d%\) of simulated studies met the O\/E \(observed over expected events\) margin target; the mean margin was ÷\/× 1\.10\d against the target 1\.105 — the closed-form n delivers the target on average/,
    );
    expect(verdict.measures.find((m) => m.measureId === 'binary-slope')?.status).toBe('falls-short');
    expect(verdict.headline).toContain('Missed on average: calibration slope.');
  });
});
