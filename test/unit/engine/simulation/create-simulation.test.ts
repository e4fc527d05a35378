import { describe, expect, it } from 'vitest';
import { DomainError } from '@shared/engine/errors';
import { createSimulation } from '@shared/engine/simulation/create-simulation';
import { SIMULATION_ENGINE_VERSION } from '@shared/engine/simulation/engine-version';
import type { SimulationConfigInput } from '@shared/engine/simulation/simulation-config';
import { CONTINUOUS_TARGETS, runToEnd } from './simulation-fixtures';

const BASE: SimulationConfigInput = {
  outcome: 'continuous',
  population: { rSquared: 0.8, outcomeVariance: 100 },
  n: 308,
  replicates: 400,
  seed: 42,
  targets: CONTINUOUS_TARGETS,
};

function thrown(action: () => unknown): unknown {
  try {
    action();
  } catch (error) {
    return error;
  }
  return undefined;
}

function allNumbers(value: unknown, out: number[] = []): number[] {
  if (typeof value === 'number') out.push(value);
  else if (value !== null && typeof value === 'object') for (const v of Object.values(value)) allNumbers(v, out);
  return out;
}

describe('the simulation driver', () => {
  it('gives identical results for the same seed, and different ones for another seed', () => {
    const a = runToEnd(createSimulation(BASE), 1000);
    const b = runToEnd(createSimulation(BASE), 1000);
    const c = runToEnd(createSimulation({ ...BASE, seed: 43 }), 1000);
    expect(b).toEqual(a);
    expect(c.measures[1]?.empiricalSe?.value).not.toBe(a.measures[1]?.empiricalSe?.value);
    expect(c.measures[0]?.meanEstimate?.value).not.toBe(a.measures[0]?.meanEstimate?.value);
  });

  it('gives the same numbers however the run is chunked, even when a chunk boundary falls inside a replicate', () => {
    const whole = runToEnd(createSimulation(BASE), 1000);
    const oneByOne = runToEnd(createSimulation(BASE), 1);
    const split = runToEnd(createSimulation({ ...BASE, maxObservationsPerStep: 1000 }), 3);
    expect(oneByOne).toEqual(whole);
    expect(split).toEqual(whole);
  });

  it('step runs at most maxReplicates replicates and at most maxObservationsPerStep observations, then returns', () => {
    const sim = createSimulation({ ...BASE, n: 5000, replicates: 3, maxObservationsPerStep: 2000 });
    expect(sim.step(10)).toEqual({
      replicatesDone: 0,
      replicatesTotal: 3,
      observationsDone: 2000,
      observationsTotal: 15_000,
      done: false,
    });
    sim.step(10);
    expect(sim.step(10)).toMatchObject({ replicatesDone: 1, observationsDone: 6000 });
    const small = createSimulation(BASE);
    expect(small.step(7)).toMatchObject({ replicatesDone: 7, observationsDone: 7 * 308, done: false });
  });

  it('keeps partial results when stopped early (a cancel), flags them, and resumes where it stopped', () => {
    const sim = createSimulation(BASE);
    sim.step(1);
    const one = sim.result();
    expect(one.partial).toBe(true);
    expect(one.replicatesDone).toBe(1);
    expect(one.measures.every((m) => m.empiricalSe === null && m.coverage === null)).toBe(true);
    sim.step(99);
    const hundred = sim.result();
    expect(hundred).toMatchObject({ partial: true, replicatesDone: 100, replicatesRequested: 400 });
    expect(hundred.measures[1]?.replicates).toBe(100);
    expect(hundred.measures[1]?.empiricalSe?.value).toBeGreaterThan(0);
    const finished = runToEnd(sim, 50);
    expect(finished.partial).toBe(false);
    expect(finished).toEqual(runToEnd(createSimulation(BASE), 400));
    expect(sim.step(10)).toMatchObject({ replicatesDone: 400, done: true });
    expect(sim.result()).toEqual(finished);
  });

  it('stores the engine version, seed, replicate counts, n, and the population with its defaults (β 1, CITL 0)', () => {
    const result = runToEnd(createSimulation(BASE), 1000);
    expect(result).toMatchObject({
      engineVersion: SIMULATION_ENGINE_VERSION,
      outcome: 'continuous',
      seed: 42,
      n: 308,
      replicatesRequested: 400,
      replicatesDone: 400,
      confidence: 0.95,
      population: { rSquared: 0.8, outcomeVariance: 100, slope: 1, citl: 0 },
    });
    expect(result.measures.map((m) => m.id)).toEqual([
      'r-squared',
      'citl',
      'slope',
      'outcome-sd',
      'citl-residual-sd',
      'slope-residual-sd',
    ]);
  });

  it('returns only finite numbers for extreme admissible inputs', () => {
    for (const population of [
      { rSquared: 0.999999, outcomeVariance: 1e-8, slope: 100, citl: 1e6 },
      { rSquared: 1e-6, outcomeVariance: 1e8, slope: -0.01, citl: -5 },
    ]) {
      const result = runToEnd(createSimulation({ ...BASE, n: 4, replicates: 50, population }), 1000);
      const numbers = allNumbers(result);
      expect(numbers.length).toBeGreaterThan(50);
      expect(numbers.every(Number.isFinite)).toBe(true);
    }
  });
});

describe('configuration and step arguments are validated', () => {
  const bad: readonly [string, Record<string, unknown>][] = [
    ['n', { n: 2.5 }],
    ['n', { n: 3 }],
    ['n', { n: -1 }],
    ['n', { n: Number.NaN }],
    ['n', { n: Number.POSITIVE_INFINITY }],
    ['n', { n: '308' }],
    ['n', { n: 10_000_001 }],
    ['n', { n: undefined }],
    ['replicates', { replicates: 1 }],
    ['replicates', { replicates: 10.5 }],
    ['replicates', { replicates: 1_000_001 }],
    ['replicates', { n: 1_000_000, replicates: 100_000 }],
    ['seed', { seed: -1 }],
    ['seed', { seed: 1.5 }],
    ['seed', { seed: 4_294_967_296 }],
    ['seed', { seed: 'abc' }],
    ['population.rSquared', { population: { rSquared: 1, outcomeVariance: 100 } }],
    ['population.rSquared', { population: { rSquared: 0, outcomeVariance: 100 } }],
    ['population.outcomeVariance', { population: { rSquared: 0.5, outcomeVariance: 0 } }],
    ['population.slope', { population: { rSquared: 0.5, outcomeVariance: 1, slope: 0 } }],
    ['population.slope', { population: { rSquared: 0.5, outcomeVariance: 1, slope: 101 } }],
    ['population.citl', { population: { rSquared: 0.5, outcomeVariance: 1, citl: Number.NaN } }],
    ['targets.citl.width', { targets: { ...BASE.targets, citl: { width: 0 } } }],
    ['targets.residualSd.marginFactor', { targets: { ...BASE.targets, residualSd: { marginFactor: 1 } } }],
    ['targets.confidence', { targets: { ...BASE.targets, confidence: 95 } }],
    ['maxObservationsPerStep', { maxObservationsPerStep: 10 }],
    ['outcome', { outcome: 'survival' }],
  ];
  it.each(bad)('rejects a bad %s with a DomainError naming it', (field, change) => {
    const error = thrown(() => createSimulation({ ...BASE, ...change }));
    expect(error).toBeInstanceOf(DomainError);
    expect(error).toMatchObject({ field });
    expect((error as Error).message).toContain(`${field} = `);
  });

  it('says what is allowed, e.g. for n', () => {
    expect(() => createSimulation({ ...BASE, n: 2.5 })).toThrow(
      'n = 2.5 is outside its allowed range: a whole number from 4 to 10,000,000',
    );
  });

  it('rejects input that is not an object', () => {
    expect(() => createSimulation(null as unknown as SimulationConfigInput)).toThrow(DomainError);
  });

  it.each([0, -1, 1.5, Number.NaN])('rejects step(%s) with a DomainError naming maxReplicates', (chunk) => {
    const sim = createSimulation(BASE);
    expect(() => sim.step(chunk)).toThrow(/maxReplicates/);
    expect(sim.progress().replicatesDone).toBe(0);
  });
});
