// Between a simulation result and the record kept in the plan file, both ways, and the edit that
// files a record under its population.
import type { MeasureSummary, SimulationResult } from '../engine/simulation';
import type { Project } from '../model/project';
import type { SimulationBasis, SimulationRecord, StoredMeasure } from '../model/simulation-record';

/** When and how long a run took: kept with the record, never part of its numbers. */
export interface RunTiming {
  /** ISO 8601, UTC, e.g. new Date().toISOString(). */
  readonly ranAt: string;
  readonly elapsedMs: number;
}

/** A measure's summary as stored: the engine's fields, nothing else. */
export function storedMeasureOf(m: MeasureSummary): StoredMeasure {
  return {
    id: m.id,
    label: m.label,
    trueValue: m.trueValue,
    scale: m.scale,
    targetValue: m.targetValue,
    interval: m.interval,
    replicates: m.replicates,
    replicatesNotEstimable: m.replicatesNotEstimable,
    meanEstimate: m.meanEstimate,
    empiricalSe: m.empiricalSe,
    meanSize: m.meanSize,
    shareMeetingTarget: m.shareMeetingTarget,
    coverage: m.coverage,
  };
}

/**
 * The record of a finished or cancelled run: the inputs as the engine simulated them (defaults
 * filled in), seed, counts, engine version and every measure's summary.
 * @example recordOf(result, 'required-n', { ranAt: '2026-03-02T10:15:00.000Z', elapsedMs: 120 }).replicatesDone // 2000
 */
export function recordOf(result: SimulationResult, basis: SimulationBasis, timing: RunTiming): SimulationRecord {
  const measures = result.measures.map(storedMeasureOf);
  return {
    basis,
    n: result.n,
    seed: result.seed,
    replicatesRequested: result.replicatesRequested,
    replicatesDone: result.replicatesDone,
    engineVersion: result.engineVersion,
    ranAt: timing.ranAt,
    elapsedMs: timing.elapsedMs,
    inputs:
      result.outcome === 'continuous'
        ? { outcome: 'continuous', population: result.population, targets: result.targets }
        : { outcome: 'binary', population: result.population, targets: result.targets },
    measures,
  };
}

/** A stored record read back as a result, so it is shown and judged exactly as a fresh run. */
export function resultOf(record: SimulationRecord): SimulationResult {
  const common = {
    engineVersion: record.engineVersion,
    seed: record.seed,
    n: record.n,
    replicatesRequested: record.replicatesRequested,
    replicatesDone: record.replicatesDone,
    partial: record.replicatesDone < record.replicatesRequested,
    confidence: record.inputs.targets.confidence,
    measures: record.measures,
  };
  const inputs = record.inputs;
  return inputs.outcome === 'continuous'
    ? { ...common, outcome: 'continuous', population: inputs.population, targets: inputs.targets }
    : { ...common, outcome: 'binary', population: inputs.population, targets: inputs.targets };
}

/**
 * The plan with `record` filed as the latest check of population `populationId`. Records of
 * populations no longer in the plan are dropped on the way, so removed sites leave nothing behind.
 */
export function withSimulation(project: Project, populationId: string, record: SimulationRecord): Project {
  const ids = new Set(project.populations.map((p) => p.id));
  if (!ids.has(populationId)) return project;
  const kept = Object.entries(project.simulations ?? {}).filter(([id]) => ids.has(id) && id !== populationId);
  return { ...project, simulations: Object.fromEntries([...kept, [populationId, record]]) };
}
