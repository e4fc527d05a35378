// The simulation worker's message protocol, without a real worker: the runner (worker side) with a
// fake host whose clock and task queue the test drives, and the client (workspace side) with a fake
// worker. No test here measures time: the clock is a counter.
import { describe, expect, it } from 'vitest';
import { createSimulation } from '@shared/engine/simulation';
import { CONTINUOUS_TARGETS } from '../../engine/simulation/simulation-fixtures';
import type { SimulationConfigInput, SimulationResult } from '@shared/engine/simulation';
import { estimateRemainingMs, isFromWorker, isToWorker } from '../../../../src-renderer/src/simulation/simulation-messages';
import type { FromWorker, ToWorker } from '../../../../src-renderer/src/simulation/simulation-messages';
import { createSimulationRunner, PROGRESS_INTERVAL_MS } from '../../../../src-renderer/src/simulation/simulation-runner';
import { CANCEL_GRACE_MS, createSimulationClient } from '../../../../src-renderer/src/simulation/simulation-client';
import type { FinishedRun, SimulationJob, WorkerPort } from '../../../../src-renderer/src/simulation/simulation-client';

/** n = 308 (the closed-form CITL n for these values) with a small step so a run takes many tasks. */
function config(replicates: number, seed = 3, extra: Partial<Record<string, unknown>> = {}): SimulationConfigInput {
  return {
    outcome: 'continuous',
    population: { rSquared: 0.8, outcomeVariance: 100 },
    n: 308,
    replicates,
    seed,
    targets: CONTINUOUS_TARGETS,
    maxObservationsPerStep: 10_000,
    ...extra,
  };
}

/** The engine driven directly, one step(Infinity) per task as the runner does. */
function engineAfter(input: SimulationConfigInput, steps: number): SimulationResult {
  const sim = createSimulation(input);
  for (let i = 0; i < steps && !sim.progress().done; i++) sim.step(Infinity);
  return sim.result();
}

/** A host with a counter for a clock (each reading advances it by `tick` ms) and a task queue. */
function fakeHost(tick = 7) {
  const posted: FromWorker[] = [];
  const tasks: (() => void)[] = [];
  let clock = 0;
  const host = {
    post: (m: FromWorker) => posted.push(m),
    now: () => (clock += tick),
    defer: (task: () => void) => tasks.push(task),
  };
  const pump = (limit = 100_000): number => {
    let ran = 0;
    while (tasks.length > 0 && ran < limit) {
      tasks.shift()?.();
      ran++;
    }
    return ran;
  };
  return { host, posted, tasks, pump };
}

const ofType = <T extends FromWorker['type']>(posted: readonly FromWorker[], type: T) =>
  posted.filter((m): m is Extract<FromWorker, { type: T }> => m.type === type);

describe('the message guards', () => {
  it('accept the declared messages and refuse anything else', () => {
    expect(isToWorker({ type: 'start', runId: 1, config: {} })).toBe(true);
    expect(isToWorker({ type: 'cancel', runId: 1 })).toBe(true);
    for (const bad of [null, 3, 'start', { type: 'start', runId: 1 }, { type: 'cancel' }, { type: 'stop', runId: 1 }]) {
      expect(isToWorker(bad), JSON.stringify(bad)).toBe(false);
    }
    expect(isFromWorker({ type: 'error', runId: 2, field: null, message: 'x' })).toBe(true);
    expect(isFromWorker({ type: 'progress', runId: 2, done: 1, total: 2 })).toBe(false);
    expect(isFromWorker({ type: 'result', runId: 2, result: {} })).toBe(false);
  });

  it('estimate the time left from the observations done', () => {
    const progress = { replicatesDone: 1, replicatesTotal: 4, observationsDone: 250, observationsTotal: 1000, done: false };
    expect(estimateRemainingMs(progress, 100)).toBe(300);
    expect(estimateRemainingMs({ ...progress, observationsDone: 0 }, 100)).toBeNull();
    expect(estimateRemainingMs({ ...progress, done: true }, 100)).toBe(0);
  });
});

describe('the runner (worker side)', () => {
  it('runs to the end in bounded tasks, posting progress and the same result as the engine with the same seed', () => {
    const { host, posted, pump } = fakeHost();
    const runner = createSimulationRunner(host);
    runner.receive({ type: 'start', runId: 1, config: config(60) });
    const tasks = pump();
    // 60 × 308 observations at 10,000 per step: one task per step.
    expect(tasks).toBe(Math.ceil((60 * 308) / 10_000));
    const progress = ofType(posted, 'progress');
    expect(progress[0]?.done).toBe(0);
    expect(progress.at(-1)?.done).toBe(60);
    for (let i = 1; i < progress.length; i++) expect(progress[i]?.done).toBeGreaterThanOrEqual(progress[i - 1]?.done ?? 0);
    const results = ofType(posted, 'result');
    expect(results).toHaveLength(1);
    expect(results[0]?.cancelled).toBe(false);
    expect(results[0]?.result).toEqual(engineAfter(config(60), Infinity));
    expect(posted.at(-1)?.type).toBe('result');
  });

  it('posts progress no more often than every PROGRESS_INTERVAL_MS of its clock', () => {
    const { host, posted, pump } = fakeHost(1);
    const runner = createSimulationRunner(host);
    runner.receive({ type: 'start', runId: 1, config: config(200) });
    pump();
    const progress = ofType(posted, 'progress');
    const middle = progress.slice(1, -1);
    for (let i = 1; i < middle.length; i++) {
      expect((middle[i]?.elapsedMs ?? 0) - (middle[i - 1]?.elapsedMs ?? 0)).toBeGreaterThanOrEqual(PROGRESS_INTERVAL_MS);
    }
    expect(progress.length).toBeLessThan(Math.ceil((200 * 308) / 10_000));
  });

  it('answers a cancel at once with the completed replicates, and runs no further step', () => {
    const { host, posted, tasks, pump } = fakeHost();
    const runner = createSimulationRunner(host);
    const input = config(1000);
    runner.receive({ type: 'start', runId: 4, config: input });
    pump(5);
    const before = posted.length;
    runner.receive({ type: 'cancel', runId: 4 });
    expect(posted.length).toBe(before + 1);
    const answer = posted.at(-1);
    if (answer?.type !== 'result') throw new Error('a cancel is answered with a result');
    expect(answer.cancelled).toBe(true);
    expect(answer.result.partial).toBe(true);
    // Five steps of 10,000 observations complete ⌊50,000 / 308⌋ = 162 replicates.
    expect(answer.result.replicatesDone).toBe(Math.floor(50_000 / 308));
    expect(answer.result).toEqual(engineAfter(input, 5));
    // The task already queued finds the run gone and does nothing.
    expect(tasks).toHaveLength(1);
    pump();
    expect(posted.length).toBe(before + 1);
  });

  it('ignores a cancel for another run', () => {
    const { host, posted, pump } = fakeHost();
    const runner = createSimulationRunner(host);
    runner.receive({ type: 'start', runId: 2, config: config(40) });
    runner.receive({ type: 'cancel', runId: 1 });
    pump();
    expect(ofType(posted, 'result')[0]?.cancelled).toBe(false);
  });

  it('reports an invalid configuration with the field and its allowed range, and an unknown message', () => {
    const { host, posted } = fakeHost();
    const runner = createSimulationRunner(host);
    runner.receive({ type: 'start', runId: 1, config: config(40, 3, { n: 2.5 }) });
    runner.receive({ type: 'start', runId: 2, config: config(2_000_000) });
    runner.receive({ type: 'start', runId: 3, config: config(40, -1) });
    runner.receive({ type: 'hello', runId: 9 });
    const errors = ofType(posted, 'error');
    expect(errors.map((e) => [e.runId, e.field])).toEqual([
      [1, 'n'],
      [2, 'replicates'],
      [3, 'seed'],
      [9, null],
    ]);
    expect(errors[0]?.message).toContain('a whole number from 4 to 10,000,000');
    expect(errors[3]?.message).toContain('does not know');
  });
});

interface Harness {
  readonly results: FinishedRun<string>[];
  readonly sent: ToWorker[];
  readonly terminated: () => number;
  readonly pump: (limit?: number) => number;
  readonly fireTimers: () => void;
  readonly client: ReturnType<typeof createSimulationClient<string>>;
  /** Delivers a message as if the worker had posted it. */
  readonly deliver: (message: unknown) => void;
  readonly fail: (message: string) => void;
}

/** A client whose fake worker runs the real runner on a task queue the test pumps (or, `deaf`, ignores everything). */
function harness(deaf = false): Harness {
  const results: FinishedRun<string>[] = [];
  const sent: ToWorker[] = [];
  const timers: (() => void)[] = [];
  const { host, pump } = fakeHost();
  let terminated = 0;
  let onMessage: (data: unknown) => void = () => undefined;
  let onFailure: (message: string) => void = () => undefined;
  const createWorker = (message: (data: unknown) => void, failure: (m: string) => void): WorkerPort => {
    onMessage = message;
    onFailure = failure;
    const runner = createSimulationRunner({ ...host, post: (m) => onMessage(structuredClone(m)) });
    return {
      postMessage: (m) => {
        sent.push(m);
        if (!deaf) runner.receive(structuredClone(m));
      },
      terminate: () => {
        terminated++;
      },
    };
  };
  const client = createSimulationClient<string>({
    createWorker,
    onResult: (run) => results.push(run),
    timers: {
      set: (task, ms) => {
        expect(ms).toBe(CANCEL_GRACE_MS);
        timers.push(task);
        return timers.length;
      },
      clear: () => undefined,
    },
  });
  return {
    results,
    sent,
    terminated: () => terminated,
    pump,
    fireTimers: () => timers.splice(0).forEach((t) => t()),
    client,
    deliver: (m) => onMessage(m),
    fail: (m) => onFailure(m),
  };
}

const job = (key: string, input: SimulationConfigInput): SimulationJob<string> => ({
  key,
  label: `Site ${key}`,
  config: input,
  tag: key,
});

describe('the client (workspace side)', () => {
  it('runs a batch one job after another and hands over each complete result', () => {
    const h = harness();
    h.client.run([job('a', config(30, 1)), job('b', config(30, 2))]);
    expect(h.client.getState().running?.job.key).toBe('a');
    expect(h.client.getState().running?.count).toBe(2);
    h.pump();
    expect(h.results.map((r) => [r.job.key, r.cancelled, r.result.replicatesDone])).toEqual([
      ['a', false, 30],
      ['b', false, 30],
    ]);
    expect(h.results[1]?.result).toEqual(engineAfter(config(30, 2), Infinity));
    expect(h.client.getState()).toEqual({ running: null, errors: [] });
    expect(h.sent.map((m) => m.type)).toEqual(['start', 'start']);
  });

  it('keeps the latest progress and partial result while a job runs, and tells subscribers', () => {
    const h = harness();
    let notified = 0;
    const unsubscribe = h.client.subscribe(() => notified++);
    h.client.run([job('a', config(2000))]);
    h.pump(20);
    const running = h.client.getState().running;
    expect(running?.progress?.done).toBeGreaterThan(0);
    expect(running?.partial?.replicatesDone).toBe(running?.progress?.done);
    expect(running?.progress?.estimatedRemainingMs).toBeGreaterThan(0);
    expect(notified).toBeGreaterThan(1);
    unsubscribe();
  });

  it('records a failed job with its field and goes on with the next', () => {
    const h = harness();
    h.client.run([job('a', config(30, 1, { n: 2 })), job('b', config(30, 2))]);
    h.pump();
    expect(h.results.map((r) => r.job.key)).toEqual(['b']);
    const errors = h.client.getState().errors;
    expect(errors).toHaveLength(1);
    expect(errors[0]).toMatchObject({ key: 'a', label: 'Site a', field: 'n' });
  });

  it('cancel keeps the completed replicates of the running job and drops the rest of the batch', () => {
    const h = harness();
    h.client.run([job('a', config(1000)), job('b', config(30))]);
    h.pump(5);
    h.client.cancel();
    // The fake worker answers within the same task, as the real one does at its next step boundary.
    expect(h.results).toHaveLength(1);
    expect(h.results[0]?.cancelled).toBe(true);
    expect(h.results[0]?.result.replicatesDone).toBe(Math.floor(50_000 / 308));
    expect(h.client.getState().running).toBeNull();
    h.pump();
    expect(h.results).toHaveLength(1);
    expect(h.sent.map((m) => m.type)).toEqual(['start', 'cancel']);
  });

  it('ignores answers that belong to an earlier run', () => {
    const h = harness(true);
    h.client.run([job('a', config(100))]);
    const partial = engineAfter(config(100), 1);
    h.deliver({ type: 'result', runId: 999, result: partial, elapsedMs: 1, cancelled: false });
    h.deliver({ type: 'progress', runId: 1, done: 32, total: 100, elapsedMs: 5, estimatedRemainingMs: 10, partial });
    expect(h.results).toHaveLength(0);
    expect(h.client.getState().running?.progress?.done).toBe(32);
  });

  it('when a cancelled worker does not answer, ends it after the grace period and keeps the last partial result', () => {
    const h = harness(true);
    h.client.run([job('a', config(100))]);
    const partial = engineAfter(config(100), 2);
    h.deliver({
      type: 'progress',
      runId: 1,
      done: partial.replicatesDone,
      total: 100,
      elapsedMs: 9,
      estimatedRemainingMs: 20,
      partial,
    });
    h.client.cancel();
    expect(h.client.getState().running?.cancelling).toBe(true);
    expect(h.results).toHaveLength(0);
    h.fireTimers();
    expect(h.terminated()).toBe(1);
    expect(h.results).toHaveLength(1);
    expect(h.results[0]).toMatchObject({ cancelled: true, elapsedMs: 9 });
    expect(h.results[0]?.result).toEqual(partial);
    expect(h.client.getState().running).toBeNull();
  });

  it('stops the batch with a message when the worker itself fails (e.g. it could not be loaded)', () => {
    const h = harness(true);
    h.client.run([job('a', config(100)), job('b', config(100))]);
    h.fail('blocked by the content security policy');
    const state = h.client.getState();
    expect(state.running).toBeNull();
    expect(state.errors[0]?.message).toBe('the simulation worker stopped: blocked by the content security policy');
    expect(h.terminated()).toBe(1);
  });

  it('stop ends the worker and delivers nothing; a later run starts a new worker', () => {
    const h = harness();
    h.client.run([job('a', config(1000))]);
    h.pump(3);
    h.client.stop();
    h.pump();
    expect(h.results).toHaveLength(0);
    expect(h.terminated()).toBe(1);
    h.client.run([job('b', config(20))]);
    h.pump();
    expect(h.results.map((r) => r.job.key)).toEqual(['b']);
  });
});
