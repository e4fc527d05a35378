// Public face of the simulation engine: what a worker, the command line or the UI needs.
export { createSimulation } from './create-simulation';
export type { Simulation } from './create-simulation';
export { SIMULATION_ENGINE_VERSION } from './engine-version';
export { parseSimulationConfig, SIMULATION_LIMITS } from './simulation-config';
export type {
  BinarySimulationConfig,
  BinarySimulationConfigInput,
  ContinuousSimulationConfig,
  ContinuousSimulationConfigInput,
  SimulationConfig,
  SimulationConfigInput,
} from './simulation-config';
export { simulationVerdict } from './simulation-verdict';
export type {
  ClosedFormReference,
  ClosedFormReferences,
  MeasureVerdict,
  SimulationVerdict,
  VerdictStatus,
} from './simulation-verdict';
export type {
  BinarySimulationResult,
  ContinuousSimulationResult,
  IntervalScale,
  MeasureId,
  MeasureSummary,
  MonteCarloEstimate,
  SimulationProgress,
  SimulationResult,
} from './types';
