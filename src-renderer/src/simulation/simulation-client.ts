// The workspace's side of the simulation worker, free of any browser API so it can be tested
// with a fake worker: it runs a queue of jobs one after another (a population, or every
// population of the plan), keeps the latest progress and partial result, hands each finished or
// cancelled result to `onResult`, and records errors with the field at fault.
import type { SimulationConfigInput, SimulationResult } from '@shared/engine/simulation';
import { isFromWorker } from './simulation-messages';
import type { FromWorker, RunProgress, ToWorker } from './simulation-messages';

/** One population to simulate. */
export interface SimulationJob<Tag = unknown> {
  /** Identifies the job to the caller (a population id). */
  readonly key: string;
  /** Shown while it runs, e.g. the population's name. */
  readonly label: string;
  readonly config: SimulationConfigInput;
  /** Anything the caller needs back with the result (e.g. the n basis). */
  readonly tag: Tag;
}

export interface FinishedRun<Tag = unknown> {
  readonly job: SimulationJob<Tag>;
  readonly result: SimulationResult;
  readonly elapsedMs: number;
  /** True when the run was cancelled: `result` then holds the completed replicates only. */
  readonly cancelled: boolean;
}

export interface RunningState<Tag = unknown> {
  readonly job: SimulationJob<Tag>;
  /** Position in the queue (0-based) and its length: "population 2 of 5". */
  readonly index: number;
  readonly count: number;
  readonly progress: RunProgress | null;
  readonly partial: SimulationResult | null;
  readonly cancelling: boolean;
}

export interface JobError {
  readonly key: string;
  readonly label: string;
  readonly field: string | null;
  readonly message: string;
}

export interface SimulationClientState<Tag = unknown> {
  readonly running: RunningState<Tag> | null;
  /** Errors of the latest batch, one per failed job. */
  readonly errors: readonly JobError[];
}

/** What the client needs from a worker; the factory wires the worker's events to the callbacks. */
export interface WorkerPort {
  readonly postMessage: (message: ToWorker) => void;
  readonly terminate: () => void;
}

export type WorkerFactory = (onMessage: (data: unknown) => void, onFailure: (message: string) => void) => WorkerPort;

export interface Timers {
  readonly set: (task: () => void, ms: number) => unknown;
  readonly clear: (handle: unknown) => void;
}

export interface SimulationClientOptions<Tag> {
  readonly createWorker: WorkerFactory;
  readonly onResult: (run: FinishedRun<Tag>) => void;
  readonly timers: Timers;
}

export interface SimulationClient<Tag = unknown> {
  /** Runs `jobs` one after another, replacing any batch still running (its latest partial result is kept). */
  readonly run: (jobs: readonly SimulationJob<Tag>[]) => void;
  /** Stops the running job (its completed replicates are kept) and drops the rest of the batch. */
  readonly cancel: () => void;
  readonly getState: () => SimulationClientState<Tag>;
  readonly subscribe: (listener: () => void) => () => void;
  /**
   * Ends the worker at once and forgets the batch, delivering nothing (the screen is going away).
   * A later `run` starts a new worker.
   */
  readonly stop: () => void;
}

/**
 * How long a cancel may wait for the worker's answer before the worker is ended and the latest
 * partial result it posted is kept instead (the worker answers between two steps, normally
 * within a few milliseconds; this only guards against a worker that stopped listening).
 */
export const CANCEL_GRACE_MS = 1_000;

export function createSimulationClient<Tag>(options: SimulationClientOptions<Tag>): SimulationClient<Tag> {
  const { createWorker, onResult, timers } = options;
  const listeners = new Set<() => void>();
  let state: SimulationClientState<Tag> = { running: null, errors: [] };
  let worker: WorkerPort | null = null;
  let queue: readonly SimulationJob<Tag>[] = [];
  let position = 0;
  let runId = 0;
  let graceTimer: unknown = null;

  const setState = (next: SimulationClientState<Tag>): void => {
    state = next;
    for (const listener of listeners) listener();
  };

  const clearGrace = (): void => {
    if (graceTimer !== null) timers.clear(graceTimer);
    graceTimer = null;
  };

  const endWorker = (): void => {
    worker?.terminate();
    worker = null;
  };

  const startNext = (errors: readonly JobError[]): void => {
    clearGrace();
    const job = queue[position];
    if (job === undefined) {
      queue = [];
      setState({ running: null, errors });
      return;
    }
    runId++;
    setState({
      running: { job, index: position, count: queue.length, progress: null, partial: null, cancelling: false },
      errors,
    });
    port().postMessage({ type: 'start', runId, config: job.config });
  };

  const deliver = (running: RunningState<Tag>, result: SimulationResult, elapsedMs: number, cancelled: boolean): void => {
    onResult({ job: running.job, result, elapsedMs, cancelled });
  };

  const handle = (message: FromWorker): void => {
    const running = state.running;
    if (running === null || message.runId !== runId) return; // an answer to a run already settled
    switch (message.type) {
      case 'progress': {
        const { done, total, elapsedMs, estimatedRemainingMs, partial } = message;
        setState({ ...state, running: { ...running, progress: { done, total, elapsedMs, estimatedRemainingMs }, partial } });
        return;
      }
      case 'result':
        deliver(running, message.result, message.elapsedMs, message.cancelled);
        if (message.cancelled || running.cancelling) {
          queue = [];
          position = 0;
          clearGrace();
          setState({ running: null, errors: state.errors });
          return;
        }
        position++;
        startNext(state.errors);
        return;
      case 'error': {
        const error: JobError = {
          key: running.job.key,
          label: running.job.label,
          field: message.field,
          message: message.message,
        };
        if (running.cancelling) {
          queue = [];
          clearGrace();
          setState({ running: null, errors: [...state.errors, error] });
          return;
        }
        position++;
        startNext([...state.errors, error]);
        return;
      }
    }
  };

  /** The worker fails as a whole (it did not load, or threw outside a run): the batch stops. */
  const fail = (message: string): void => {
    endWorker();
    clearGrace();
    const running = state.running;
    queue = [];
    const error: JobError = {
      key: running?.job.key ?? '',
      label: running?.job.label ?? 'the simulation',
      field: null,
      message: `the simulation worker stopped: ${message}`,
    };
    setState({ running: null, errors: [...state.errors, error] });
  };

  function port(): WorkerPort {
    if (worker === null) {
      worker = createWorker(
        (data) => {
          if (isFromWorker(data)) handle(data);
        },
        (message) => fail(message),
      );
    }
    return worker;
  }

  const cancel = (): void => {
    const running = state.running;
    if (running === null || running.cancelling) return;
    setState({ ...state, running: { ...running, cancelling: true } });
    port().postMessage({ type: 'cancel', runId });
    const cancelledRun = runId;
    graceTimer = timers.set(() => {
      graceTimer = null;
      const still = state.running;
      if (still === null || runId !== cancelledRun) return;
      // The worker did not answer: end it and keep what it last reported.
      endWorker();
      runId++;
      if (still.partial !== null) deliver(still, still.partial, still.progress?.elapsedMs ?? 0, true);
      queue = [];
      setState({ running: null, errors: state.errors });
    }, CANCEL_GRACE_MS);
  };

  const run = (jobs: readonly SimulationJob<Tag>[]): void => {
    const previous = state.running;
    if (previous !== null) {
      // The previous run is ended at once rather than asked; what it last reported is kept.
      endWorker();
      runId++;
      if (previous.partial !== null) deliver(previous, previous.partial, previous.progress?.elapsedMs ?? 0, true);
    }
    queue = jobs;
    position = 0;
    startNext([]);
  };

  return {
    run,
    cancel,
    getState: () => state,
    subscribe: (listener) => {
      listeners.add(listener);
      return () => listeners.delete(listener);
    },
    stop: () => {
      clearGrace();
      endWorker();
      runId++;
      queue = [];
      if (state.running !== null) setState({ running: null, errors: state.errors });
    },
  };
}
