// The messages between the workspace and the simulation worker, declared once. The client and
// the worker both check what arrives with the guards below before reading it; the configuration
// inside a start message is validated by the engine (parseSimulationConfig), field by field.
import type { SimulationConfigInput, SimulationProgress, SimulationResult } from '@shared/engine/simulation';

/** Workspace → worker. `runId` ties every answer to the run it belongs to. */
export type ToWorker =
  | { readonly type: 'start'; readonly runId: number; readonly config: SimulationConfigInput }
  | { readonly type: 'cancel'; readonly runId: number };

/** How far a run has got. */
export interface RunProgress {
  /** Completed replicates. */
  readonly done: number;
  readonly total: number;
  readonly elapsedMs: number;
  /** Null until there is something to extrapolate from. */
  readonly estimatedRemainingMs: number | null;
}

/** Worker → workspace. */
export type FromWorker =
  | ({ readonly type: 'progress'; readonly runId: number; readonly partial: SimulationResult } & RunProgress)
  | {
      readonly type: 'result';
      readonly runId: number;
      /** Complete, or partial when the run was cancelled (the completed replicates only). */
      readonly result: SimulationResult;
      readonly elapsedMs: number;
      readonly cancelled: boolean;
    }
  | {
      readonly type: 'error';
      readonly runId: number;
      /** The configuration field at fault (e.g. "replicates", "population.rSquared"), if any. */
      readonly field: string | null;
      readonly message: string;
    };

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null;
}

const hasRunId = (value: Record<string, unknown>): boolean => typeof value['runId'] === 'number';

/** A message a worker may act on (the config itself is left to the engine's validation). */
export function isToWorker(value: unknown): value is ToWorker {
  if (!isRecord(value) || !hasRunId(value)) return false;
  return value['type'] === 'cancel' || (value['type'] === 'start' && 'config' in value);
}

/** A message the client may act on. */
export function isFromWorker(value: unknown): value is FromWorker {
  if (!isRecord(value) || !hasRunId(value)) return false;
  switch (value['type']) {
    case 'progress':
      return typeof value['done'] === 'number' && typeof value['total'] === 'number' && isRecord(value['partial']);
    case 'result':
      return isRecord(value['result']) && typeof value['cancelled'] === 'boolean';
    case 'error':
      return typeof value['message'] === 'string';
    default:
      return false;
  }
}

/**
 * Time left, extrapolated from the observations simulated so far (smoother than replicates when
 * n is large): elapsed × (total − done) / done. Null before the first observation.
 * @example estimateRemainingMs({ observationsDone: 250, observationsTotal: 1000, … }, 100) // 300
 */
export function estimateRemainingMs(progress: SimulationProgress, elapsedMs: number): number | null {
  if (progress.done) return 0;
  if (progress.observationsDone <= 0 || !(elapsedMs >= 0)) return null;
  return (elapsedMs * (progress.observationsTotal - progress.observationsDone)) / progress.observationsDone;
}
