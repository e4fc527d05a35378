// --simulate: the simulation check of every population at its required n, one after another,
// with progress on stderr (stdout gets only the results, so the same seed prints the same text).
import { randomInt } from 'node:crypto';
import { DomainError } from '@shared/engine/errors';
import { createSimulation, parseSimulationConfig, simulationVerdict } from '@shared/engine/simulation';
import type { SimulationConfigInput, SimulationResult, SimulationVerdict } from '@shared/engine/simulation';
import { formatCount, formatDuration, formatPercent } from '@shared/format/numbers';
import type { Project } from '@shared/model/project';
import type { ComparisonRow } from '@shared/summary/comparison';
import { closedFormAtN, simulatedInputsOf, simulationConfigOf, verdictReferences } from '@shared/summary/simulation-check';
import type { ClosedFormAtN } from '@shared/summary/simulation-check';
import { MAX_SEED } from './simulate-args';

/** A population left out, with the reason. */
export interface SkippedSimulation {
  readonly ran: false;
  readonly populationId: string;
  readonly name: string;
  readonly reason: string;
}

export type PopulationSimulation =
  | SkippedSimulation
  | {
      readonly ran: true;
      readonly populationId: string;
      readonly name: string;
      readonly result: SimulationResult;
      readonly closed: ClosedFormAtN;
      readonly verdict: SimulationVerdict;
    };

interface Job {
  readonly populationId: string;
  readonly name: string;
  readonly config: SimulationConfigInput;
  readonly closed: ClosedFormAtN;
}

/** How often progress is written to stderr during one population's run. */
const PROGRESS_EVERY_MS = 1_000;

/**
 * Checks every population's configuration before anything runs. A population that cannot be
 * simulated (no required n, or no LP distribution for a binary outcome) is skipped with its
 * reason; a configuration the engine refuses (e.g. n × replicates too large) is an error naming
 * the option or field.
 */
export function prepareSimulations(
  project: Project,
  rows: readonly ComparisonRow[],
  replicates: number,
  seed: number,
): { readonly ok: true; readonly jobs: readonly (Job | SkippedSimulation)[] } | { readonly ok: false; readonly message: string } {
  const jobs: (Job | SkippedSimulation)[] = [];
  for (const row of rows) {
    const population = project.populations.find((p) => p.id === row.populationId);
    const skip = (reason: string): void => {
      jobs.push({ ran: false, populationId: row.populationId, name: row.name, reason });
    };
    if (population === undefined) continue;
    if (row.requiredN === null) {
      skip(row.problem ?? 'no required n to simulate at (a target is out of reach)');
      continue;
    }
    const inputs = simulatedInputsOf(population);
    if (!inputs.ok) {
      skip(inputs.reason);
      continue;
    }
    const config = simulationConfigOf(inputs.inputs, row.requiredN, replicates, seed);
    try {
      parseSimulationConfig(config);
    } catch (error) {
      if (!(error instanceof DomainError)) throw error;
      const option = error.field === 'replicates' ? '--simulate' : error.field === 'seed' ? '--seed' : error.field;
      return { ok: false, message: `${row.name}: ${option}: ${error.allowed} (n = ${formatCount(row.requiredN)})` };
    }
    const plan = { criteria: row.criteria, requiredN: row.requiredN, availableN: row.availableN };
    jobs.push({ populationId: row.populationId, name: row.name, config, closed: closedFormAtN(population, plan, row.requiredN) });
  }
  return { ok: true, jobs };
}

/** Runs the prepared jobs in order; `now` is a millisecond clock, `stderr` takes the progress lines. */
export function runSimulations(
  jobs: readonly (Job | SkippedSimulation)[],
  stderr: (text: string) => void,
  now: () => number,
): PopulationSimulation[] {
  return jobs.map((job) => {
    if ('ran' in job) {
      stderr(`simulation: ${job.name}: skipped (${job.reason})\n`);
      return job;
    }
    const sim = createSimulation(job.config);
    const total = sim.progress().replicatesTotal;
    stderr(`simulation: ${job.name}: ${formatCount(total)} replicates of n = ${formatCount(sim.result().n)}…\n`);
    const started = now();
    let reported = started;
    for (let progress = sim.progress(); !progress.done;) {
      progress = sim.step(Infinity);
      const at = now();
      if (!progress.done && at - reported >= PROGRESS_EVERY_MS) {
        reported = at;
        const share = progress.observationsDone / progress.observationsTotal;
        const left = ((at - started) * (1 - share)) / share;
        stderr(
          `simulation: ${job.name}: ${formatPercent(share, 0)} (${formatCount(progress.replicatesDone)} of ${formatCount(total)}), about ${formatDuration(left)} left\n`,
        );
      }
    }
    stderr(`simulation: ${job.name}: done in ${formatDuration(now() - started)}\n`);
    const result = sim.result();
    return {
      ran: true,
      populationId: job.populationId,
      name: job.name,
      result,
      closed: job.closed,
      verdict: simulationVerdict(result, verdictReferences(job.closed)),
    };
  });
}

/**
 * --simulate for the whole plan: draws a seed when none is given (and says so on stderr), checks
 * every configuration, then runs them. Returns the results, or the message of the first
 * configuration the engine refuses.
 */
export function simulateAll(
  project: Project,
  rows: readonly ComparisonRow[],
  options: { readonly replicates: number; readonly seed: number | null },
  stderr: (text: string) => void,
): PopulationSimulation[] | { readonly message: string } {
  const seed = options.seed ?? randomInt(0, MAX_SEED + 1);
  if (options.seed === null) stderr(`simulation: seed ${seed} drawn at random (give --seed ${seed} to repeat this output)\n`);
  const prepared = prepareSimulations(project, rows, options.replicates, seed);
  if (!prepared.ok) return { message: prepared.message };
  return runSimulations(prepared.jobs, stderr, () => performance.now());
}
