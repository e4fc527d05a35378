import { DomainError } from '../errors';
import { createBinaryDesign } from './binary-design';
import { createContinuousDesign } from './continuous-design';
import { SIMULATION_ENGINE_VERSION } from './engine-version';
import { MeasureTally } from './measure-tally';
import { createRandomStream, replicateStreams } from './random-stream';
import { parseSimulationConfig } from './simulation-config';
import type { SimulationConfigInput } from './simulation-config';
import type { ReplicateOutcome, SimulationProgress, SimulationResult } from './types';

/** A simulation that runs in chunks: drive it with `step` until `done`, read `result` at any time. */
export interface Simulation {
  /**
   * Runs at most `maxReplicates` more replicates, and never more than the configured
   * maxObservationsPerStep observations (in continuous-observation equivalents: a binary
   * observation, with its share of the fitting, counts about ten), then returns. The step that
   * completes a replicate also fits it. A replicate cut off by the observation
   * budget is continued by the next call, so one call stays short even when n is large; the
   * numbers do not depend on how the run is split. After the last replicate it returns done.
   * Pass Infinity to let the observation budget alone decide the chunk.
   */
  step(maxReplicates: number): SimulationProgress;
  progress(): SimulationProgress;
  /** Summary of the completed replicates so far; `partial` is true until all are done. */
  result(): SimulationResult;
}

function emptyOutcome(measures: number): ReplicateOutcome {
  return {
    estimate: new Float64Array(measures),
    lower: new Float64Array(measures),
    upper: new Float64Array(measures),
    size: new Float64Array(measures),
    estimable: new Uint8Array(measures),
  };
}

/**
 * Sets up a Monte Carlo check of a planned sample size: `replicates` validation samples of size n
 * are simulated from the population's anticipated values, the calibration models are fitted to
 * each, and every measure's precision is summarised (empirical SE, mean CI width, share meeting
 * the target, coverage, each with its Monte Carlo SE).
 * Made for a Web Worker or worker thread: it holds no timers and no I/O; the worker calls `step`,
 * posts the progress, checks for a cancel message between calls, and posts `result()` (partial
 * or complete). With the default budget of 250,000 observations a step takes a few milliseconds.
 * Reproducible: replicate r always uses the r-th jump of xoroshiro128plus(seed) (see
 * replicateStreams), and the result stores the seed, the replicate count and the engine version.
 * The stream is integer arithmetic; Math.exp/log/sqrt/atanh/tanh (the samplers' rare slow path
 * and the estimators) are IEEE-correct enough that results are reproducible across V8 builds to
 * the printed precision. Math.random is never used.
 * The config is validated first (parseSimulationConfig): a bad field throws a DomainError naming it.
 * @example
 * const sim = createSimulation({ outcome: 'continuous', population: { rSquared: 0.8, outcomeVariance: 100 },
 *   n: 308, replicates: 2000, seed: 42, targets });
 * while (!sim.step(500).done) {} // sim.result().measures[1].shareMeetingTarget ≈ 0.5
 */
export function createSimulation(input: SimulationConfigInput): Simulation {
  const config = parseSimulationConfig(input);
  const design = config.outcome === 'binary' ? createBinaryDesign(config) : createContinuousDesign(config);
  const { n, replicates, seed, maxObservationsPerStep } = config;
  const measureCount = design.measures.length;
  const tallies = design.measures.map((m) => new MeasureTally(m));
  const outcome = emptyOutcome(measureCount);
  const stream = createRandomStream();
  const nextReplicate = replicateStreams(seed);
  const budgetPerStep = Math.max(1, Math.floor(maxObservationsPerStep / design.workPerObservation));
  let replicatesDone = 0;
  let observedInReplicate = 0;

  const progress = (): SimulationProgress => ({
    replicatesDone,
    replicatesTotal: replicates,
    observationsDone: replicatesDone * n + observedInReplicate,
    observationsTotal: replicates * n,
    done: replicatesDone === replicates,
  });

  const record = (): void => {
    design.finish(outcome);
    for (let m = 0; m < measureCount; m++) {
      const tally = tallies[m]!;
      if (outcome.estimable[m] === 1) {
        tally.add(outcome.estimate[m]!, outcome.lower[m]!, outcome.upper[m]!, outcome.size[m]!);
      } else {
        tally.notEstimable++;
      }
    }
  };

  const step = (maxReplicates: number): SimulationProgress => {
    if (!(maxReplicates >= 1 && (Number.isInteger(maxReplicates) || maxReplicates === Infinity))) {
      throw new DomainError('maxReplicates', maxReplicates, 'a whole number of at least 1, or Infinity');
    }
    let budget = budgetPerStep;
    let completed = 0;
    while (replicatesDone < replicates && completed < maxReplicates && budget > 0) {
      if (observedInReplicate === 0) {
        nextReplicate(stream);
        design.begin();
      }
      const count = Math.min(n - observedInReplicate, budget);
      design.simulate(stream, count);
      observedInReplicate += count;
      budget -= count;
      if (observedInReplicate === n) {
        record();
        replicatesDone++;
        completed++;
        observedInReplicate = 0;
      }
    }
    return progress();
  };

  const result = (): SimulationResult => {
    const common = {
      engineVersion: SIMULATION_ENGINE_VERSION,
      seed,
      n,
      replicatesRequested: replicates,
      replicatesDone,
      partial: replicatesDone < replicates,
      confidence: config.targets.confidence,
      measures: tallies.map((t) => t.summary()),
    };
    return config.outcome === 'binary'
      ? { ...common, outcome: 'binary', population: config.population, targets: config.targets }
      : { ...common, outcome: 'continuous', population: config.population, targets: config.targets };
  };

  return { step, progress, result };
}
