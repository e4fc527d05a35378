// Shapes shared by the simulation driver, the outcome-specific designs and the verdict.
import type { RandomStream } from './random-stream';
import type { BinarySimulationConfig, ContinuousSimulationConfig } from './simulation-config';

/** Measures a simulation can track (continuous now; the binary design adds its own ids). */
export type MeasureId =
  | 'r-squared'
  | 'citl'
  | 'slope'
  | 'outcome-sd'
  | 'citl-residual-sd'
  | 'slope-residual-sd'
  | 'observed-expected'
  | 'binary-slope'
  | 'c-statistic';

/**
 * How a measure's interval size and target are read: `ci-width` is upper − lower on the measure's
 * own scale; `margin-factor` is the multiplicative margin max(upper / estimate, estimate / lower)
 * of an interval for a ratio-type measure (residual SDs, O/E).
 */
export type IntervalScale = 'ci-width' | 'margin-factor';

export interface MeasureDefinition {
  readonly id: MeasureId;
  /** Plain name for the report, e.g. "calibration slope". */
  readonly label: string;
  /** The value the simulated population has by construction. */
  readonly trueValue: number;
  readonly scale: IntervalScale;
  /** The precision target on `scale` (a CI width, or a margin factor such as 1.1). */
  readonly targetValue: number;
  /** The interval in words, e.g. "Wald, z" or "chi-square, df = n − 2". */
  readonly interval: string;
}

/**
 * One replicate's results, parallel to the design's `measures`: the estimate, the CI limits, the
 * interval's size on the measure's scale, and whether the measure could be estimated at all (a
 * binary replicate without events cannot give a slope; such replicates are counted, not averaged).
 */
export interface ReplicateOutcome {
  readonly estimate: Float64Array;
  readonly lower: Float64Array;
  readonly upper: Float64Array;
  readonly size: Float64Array;
  readonly estimable: Uint8Array;
}

/**
 * What the driver needs from an outcome type. A design owns its running state for the replicate in
 * progress, so a replicate can be simulated in several pieces (a chunk boundary may fall inside it).
 */
export interface SimulationDesign {
  readonly n: number;
  readonly measures: readonly MeasureDefinition[];
  /** Relative cost of one observation (continuous = 1), so chunks take about the same time. */
  readonly workPerObservation: number;
  /** Clears the running state: a new replicate starts. */
  begin(): void;
  /** Simulates the next `count` observations of the current replicate from `stream`. */
  simulate(stream: RandomStream, count: number): void;
  /** After n observations: fits the calibration models and writes every measure into `out`. */
  finish(out: ReplicateOutcome): void;
}

/** A Monte Carlo summary statistic with its Monte Carlo standard error. */
export interface MonteCarloEstimate {
  readonly value: number;
  readonly mcse: number;
}

export interface MeasureSummary extends MeasureDefinition {
  /** Replicates in which the measure could be estimated (the summaries below use these). */
  readonly replicates: number;
  /** Completed replicates in which it could not (e.g. no events); 0 for continuous outcomes. */
  readonly replicatesNotEstimable: number;
  /** Mean of the estimates (compare with trueValue for bias). Null with fewer than 2 replicates. */
  readonly meanEstimate: MonteCarloEstimate | null;
  /** Empirical SE: the SD of the estimates across replicates. */
  readonly empiricalSe: MonteCarloEstimate | null;
  /** Mean interval size on `scale` (mean CI width, or mean margin factor). */
  readonly meanSize: MonteCarloEstimate | null;
  /** Share of replicates whose interval size met the target (size ≤ targetValue). */
  readonly shareMeetingTarget: MonteCarloEstimate | null;
  /** Share of replicates whose interval contained trueValue. */
  readonly coverage: MonteCarloEstimate | null;
}

export interface SimulationProgress {
  readonly replicatesDone: number;
  readonly replicatesTotal: number;
  /** Observations simulated so far, including those of a replicate still in progress. */
  readonly observationsDone: number;
  readonly observationsTotal: number;
  readonly done: boolean;
}

interface SimulationResultBase {
  /** Version of the simulation engine; results are reproducible from the seed within one version. */
  readonly engineVersion: string;
  readonly seed: number;
  readonly n: number;
  readonly replicatesRequested: number;
  /** Completed replicates summarised here (a replicate cut off by a cancel is left out). */
  readonly replicatesDone: number;
  /** True when fewer replicates than requested were completed (still running, or cancelled). */
  readonly partial: boolean;
  readonly confidence: number;
  readonly measures: readonly MeasureSummary[];
}

export interface ContinuousSimulationResult extends SimulationResultBase {
  readonly outcome: 'continuous';
  /** The anticipated values simulated, defaults filled in. */
  readonly population: ContinuousSimulationConfig['population'];
  readonly targets: ContinuousSimulationConfig['targets'];
}

export interface BinarySimulationResult extends SimulationResultBase {
  readonly outcome: 'binary';
  readonly population: BinarySimulationConfig['population'];
  readonly targets: BinarySimulationConfig['targets'];
}

export type SimulationResult = ContinuousSimulationResult | BinarySimulationResult;
