// The simulation worker: a module worker, loaded by useSimulation with
// new Worker(new URL('./simulation.worker.ts', import.meta.url), { type: 'module' }) and allowed by
// the CSP's worker-src 'self'. All the logic is in simulation-runner.ts; this file only connects
// it to the worker's message port.
import type { FromWorker } from './simulation-messages';
import { createSimulationRunner } from './simulation-runner';

/** The parts of the dedicated worker scope used here (the renderer compiles against the DOM lib). */
interface WorkerScope {
  postMessage(message: FromWorker): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<unknown>) => void): void;
}

const scope = globalThis as unknown as WorkerScope;

// Tasks queued through a MessageChannel run after messages already waiting and, unlike nested
// setTimeout calls, are not clamped to 4 ms.
const tasks: (() => void)[] = [];
const channel = new MessageChannel();
channel.port1.onmessage = () => tasks.shift()?.();

const runner = createSimulationRunner({
  post: (message) => scope.postMessage(message),
  now: () => performance.now(),
  defer: (task) => {
    tasks.push(task);
    channel.port2.postMessage(null);
  },
});

scope.addEventListener('message', (event) => runner.receive(event.data));
