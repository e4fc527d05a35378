// Shared by the simulation tests: the usual continuous targets and a run-to-completion helper.
import type { Simulation } from '@shared/engine/simulation/create-simulation';
import type { SimulationResult } from '@shared/engine/simulation/types';

/** Widths 0.1 (R²), 1 (CITL, outcome units), 0.2 (slope) and margin 1.1, at 95%. */
export const CONTINUOUS_TARGETS = {
  confidence: 0.95,
  rSquared: { width: 0.1 },
  citl: { width: 1 },
  slope: { width: 0.2 },
  residualSd: { marginFactor: 1.1 },
} as const;

/** Steps `sim` with chunks of `chunk` replicates until done (bounded, so a bug cannot hang a test). */
export function runToEnd(sim: Simulation, chunk: number = Infinity): SimulationResult {
  for (let guard = 0; guard < 10_000_000 && !sim.step(chunk).done; guard++);
  return sim.result();
}
