import { useEffect, useRef, useState, useSyncExternalStore } from 'react';
import { createSimulationClient } from './simulation-client';
import type { FinishedRun, SimulationClient, SimulationClientState, SimulationJob, WorkerFactory } from './simulation-client';

/** The module worker, bundled by Vite from this exact expression (worker-src 'self' allows it). */
const createWorker: WorkerFactory = (onMessage, onFailure) => {
  const worker = new Worker(new URL('./simulation.worker.ts', import.meta.url), { type: 'module', name: 'simulation' });
  worker.onmessage = (event: MessageEvent<unknown>) => onMessage(event.data);
  worker.onerror = (event: ErrorEvent) => {
    event.preventDefault();
    onFailure(event.message || 'it could not be loaded');
  };
  worker.onmessageerror = () => onFailure('a message could not be read');
  return { postMessage: (message) => worker.postMessage(message), terminate: () => worker.terminate() };
};

export interface UseSimulation<Tag> {
  readonly state: SimulationClientState<Tag>;
  readonly run: (jobs: readonly SimulationJob<Tag>[]) => void;
  readonly cancel: () => void;
}

/**
 * Runs simulation checks in a Web Worker, so the screen never waits for them. `onResult` receives
 * each finished or cancelled run (the latest callback is always used). The worker is created on
 * the first run and ended when the component unmounts (a run still going is dropped).
 */
export function useSimulation<Tag>(onResult: (run: FinishedRun<Tag>) => void): UseSimulation<Tag> {
  const latest = useRef(onResult);
  latest.current = onResult;
  const [client] = useState<SimulationClient<Tag>>(() =>
    createSimulationClient<Tag>({
      createWorker,
      onResult: (run) => latest.current(run),
      timers: { set: (task, ms) => window.setTimeout(task, ms), clear: (handle) => window.clearTimeout(handle as number) },
    }),
  );
  useEffect(() => () => client.stop(), [client]);
  const state = useSyncExternalStore(client.subscribe, client.getState);
  return { state, run: client.run, cancel: client.cancel };
}
