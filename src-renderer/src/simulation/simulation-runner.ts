// The worker's side of a simulation run, free of any worker API so it can be tested with a fake
// host: it answers start and cancel messages, runs the engine one bounded step per task, and
// posts progress with the partial result, then the final (or cancelled) result.
import { DomainError } from '@shared/engine/errors';
import { createSimulation, parseSimulationConfig } from '@shared/engine/simulation';
import type { Simulation } from '@shared/engine/simulation';
import { estimateRemainingMs, isToWorker } from './simulation-messages';
import type { FromWorker } from './simulation-messages';

export interface RunnerHost {
  readonly post: (message: FromWorker) => void;
  /** Milliseconds from any fixed origin (performance.now in the worker). */
  readonly now: () => number;
  /**
   * Runs `task` as a new task, after any message already waiting (a cancel) has been handled.
   * The worker uses a MessageChannel: unlike nested timers it is not clamped to 4 ms.
   */
  readonly defer: (task: () => void) => void;
}

/** Progress is posted at most this often (and always at the end): about ten updates a second. */
export const PROGRESS_INTERVAL_MS = 100;

interface ActiveRun {
  readonly runId: number;
  readonly simulation: Simulation;
  readonly startedAt: number;
  lastProgressAt: number;
}

export interface SimulationRunner {
  /** Handles one message from the workspace (anything unrecognised is answered with an error). */
  readonly receive: (message: unknown) => void;
}

function describe(error: unknown): { field: string | null; message: string } {
  if (error instanceof DomainError) return { field: error.field, message: error.message };
  return { field: null, message: error instanceof Error ? error.message : String(error) };
}

/**
 * Each task runs one engine step, whose observation budget (maxObservationsPerStep, 250,000 by
 * default: a few milliseconds) bounds how long a cancel waits. Between steps the worker is free
 * to take the next message, so a cancel is answered at the next step boundary with the
 * replicates completed so far.
 */
export function createSimulationRunner(host: RunnerHost): SimulationRunner {
  let active: ActiveRun | null = null;

  const postProgress = (run: ActiveRun, at: number): void => {
    const progress = run.simulation.progress();
    const elapsedMs = at - run.startedAt;
    run.lastProgressAt = at;
    host.post({
      type: 'progress',
      runId: run.runId,
      done: progress.replicatesDone,
      total: progress.replicatesTotal,
      elapsedMs,
      estimatedRemainingMs: estimateRemainingMs(progress, elapsedMs),
      partial: run.simulation.result(),
    });
  };

  const finish = (run: ActiveRun, cancelled: boolean): void => {
    active = null;
    host.post({
      type: 'result',
      runId: run.runId,
      result: run.simulation.result(),
      elapsedMs: host.now() - run.startedAt,
      cancelled,
    });
  };

  const slice = (run: ActiveRun): void => {
    if (active !== run) return; // cancelled or replaced while this task waited
    let done: boolean;
    try {
      done = run.simulation.step(Infinity).done;
    } catch (error) {
      active = null;
      host.post({ type: 'error', runId: run.runId, ...describe(error) });
      return;
    }
    const at = host.now();
    if (done) {
      postProgress(run, at);
      finish(run, false);
      return;
    }
    if (at - run.lastProgressAt >= PROGRESS_INTERVAL_MS) postProgress(run, at);
    host.defer(() => slice(run));
  };

  const start = (runId: number, config: unknown): void => {
    if (active !== null) finish(active, true);
    let simulation: Simulation;
    try {
      simulation = createSimulation(parseSimulationConfig(config));
    } catch (error) {
      host.post({ type: 'error', runId, ...describe(error) });
      return;
    }
    const startedAt = host.now();
    const run: ActiveRun = { runId, simulation, startedAt, lastProgressAt: startedAt };
    active = run;
    postProgress(run, startedAt);
    host.defer(() => slice(run));
  };

  const receive = (message: unknown): void => {
    if (!isToWorker(message)) {
      const runId =
        typeof message === 'object' && message !== null && typeof (message as { runId?: unknown }).runId === 'number'
          ? (message as { runId: number }).runId
          : -1;
      host.post({ type: 'error', runId, field: null, message: 'the simulation worker received a message it does not know' });
      return;
    }
    if (message.type === 'start') start(message.runId, message.config);
    else if (active !== null && active.runId === message.runId) finish(active, true);
  };

  return { receive };
}
