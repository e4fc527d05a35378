// A simulation check as it is kept in the plan file: the inputs it simulated, the seed and the
// replicate counts that reproduce it, the engine version, when it ran, and every measure's
// summary with its Monte Carlo error. The verdict text is not stored: it is derived from these
// numbers whenever the result is shown, so it always reads the same as a fresh run's.
import { z } from 'zod';
import type { MeasureId } from '../engine/simulation';
import { formatCount } from '../format/numbers';

/** Every measure id the simulation engine reports (continuous, then binary). */
export const SIMULATION_MEASURE_IDS = [
  'r-squared',
  'citl',
  'slope',
  'outcome-sd',
  'citl-residual-sd',
  'slope-residual-sd',
  'observed-expected',
  'binary-slope',
  'c-statistic',
] as const satisfies readonly MeasureId[];
// Fails to compile when the engine gains a measure this list does not name.
const everyMeasureListed: Exclude<MeasureId, (typeof SIMULATION_MEASURE_IDS)[number]> extends never ? true : never = true;
void everyMeasureListed;

const MAX_SEED = 4_294_967_295;
const MAX_REPLICATES = 1_000_000;
const MAX_N = 10_000_000;

const finite = (what: string) =>
  z.number({ error: `${what} must be a number` }).refine(Number.isFinite, { error: `${what} must be finite` });

const wholeNumber = (what: string, from: number, to: number) => {
  const allowed = `${what} must be a whole number from ${formatCount(from)} to ${formatCount(to)}`;
  return z.number({ error: allowed }).int({ error: allowed }).min(from, { error: allowed }).max(to, { error: allowed });
};

const between = (what: string, allowed: string, ok: (v: number) => boolean) =>
  finite(what).refine(ok, { error: `${what} must be ${allowed}` });

const openUnit = (what: string) => between(what, 'greater than 0 and less than 1', (v) => v > 0 && v < 1);
const positive = (what: string) => between(what, 'greater than 0', (v) => v > 0);

const continuousInputsSchema = z.object({
  outcome: z.literal('continuous'),
  population: z.object({
    rSquared: openUnit('simulated R²'),
    outcomeVariance: positive('simulated outcome variance'),
    slope: between('simulated calibration slope', 'a non-zero number from -100 to 100', (v) => v !== 0 && Math.abs(v) <= 100),
    citl: finite('simulated calibration-in-the-large'),
  }),
  targets: z.object({
    confidence: openUnit('simulated confidence level'),
    rSquared: z.object({ width: positive('simulated target CI width for R²') }),
    citl: z.object({ width: positive('simulated target CI width for CITL') }),
    slope: z.object({ width: positive('simulated target CI width for the calibration slope') }),
    residualSd: z.object({
      marginFactor: between('simulated margin factor for residual SDs', 'greater than 1 and at most 10', (v) => v > 1 && v <= 10),
    }),
  }),
});

const binaryInputsSchema = z.object({
  outcome: z.literal('binary'),
  population: z.object({
    lpMean: between('simulated mean of the linear predictor', 'a number from -50 to 50', (v) => Math.abs(v) <= 50),
    lpSd: between('simulated SD of the linear predictor', 'greater than 0 and at most 20', (v) => v > 0 && v <= 20),
    calibrationIntercept: between('simulated calibration intercept', 'a number from -50 to 50', (v) => Math.abs(v) <= 50),
    calibrationSlope: between('simulated calibration slope', 'greater than 0 and at most 100', (v) => v > 0 && v <= 100),
  }),
  targets: z.object({
    confidence: openUnit('simulated confidence level'),
    oe: z.object({
      marginFactor: between('simulated margin factor for O/E', 'greater than 1 and at most 10', (v) => v > 1 && v <= 10),
    }),
    slope: z.object({ width: positive('simulated target CI width for the calibration slope') }),
    cStatistic: z.object({ width: positive('simulated target CI width for the C-statistic') }),
  }),
});

/** What was simulated, apart from n, the seed and the replicate count: compared to detect staleness. */
export const simulatedInputsSchema = z.discriminatedUnion('outcome', [continuousInputsSchema, binaryInputsSchema], {
  error: 'simulated outcome must be "continuous" or "binary"',
});
export type SimulatedInputs = z.infer<typeof simulatedInputsSchema>;

const estimateSchema = (what: string) =>
  z
    .object({
      value: finite(what),
      mcse: between(`Monte Carlo SE of ${what}`, 'at least 0', (v) => v >= 0),
    })
    .nullable();

const shareSchema = (what: string) =>
  z
    .object({
      value: between(what, 'from 0 to 1', (v) => v >= 0 && v <= 1),
      mcse: between(`Monte Carlo SE of ${what}`, 'at least 0', (v) => v >= 0),
    })
    .nullable();

export const storedMeasureSchema = z.object({
  id: z.enum(SIMULATION_MEASURE_IDS, { error: `simulated measure id must be one of ${SIMULATION_MEASURE_IDS.join(', ')}` }),
  label: z.string().min(1, { error: 'simulated measure label must not be empty' }).max(200),
  trueValue: finite('true value of the simulated measure'),
  scale: z.enum(['ci-width', 'margin-factor'], { error: 'simulated measure scale must be "ci-width" or "margin-factor"' }),
  targetValue: positive('target of the simulated measure'),
  interval: z.string().max(200),
  replicates: wholeNumber('replicates summarised for the measure', 0, MAX_REPLICATES),
  replicatesNotEstimable: wholeNumber('replicates in which the measure could not be estimated', 0, MAX_REPLICATES),
  meanEstimate: estimateSchema('the mean estimate'),
  empiricalSe: estimateSchema('the empirical SE'),
  meanSize: estimateSchema('the mean interval size'),
  shareMeetingTarget: shareSchema('the share meeting the target'),
  coverage: shareSchema('the coverage'),
});
export type StoredMeasure = z.infer<typeof storedMeasureSchema>;

/** At which n the check ran: the plan's required n, or the population's fixed available n. */
export const simulationBasisSchema = z.enum(['required-n', 'available-n'], {
  error: 'simulation basis must be "required-n" or "available-n"',
});
export type SimulationBasis = z.infer<typeof simulationBasisSchema>;

export const simulationRecordSchema = z
  .object({
    basis: simulationBasisSchema,
    n: wholeNumber('simulated n', 4, MAX_N),
    seed: wholeNumber('simulation seed', 0, MAX_SEED),
    replicatesRequested: wholeNumber('replicates requested', 2, MAX_REPLICATES),
    /** Completed replicates; fewer than requested when the run was cancelled (a partial result). */
    replicatesDone: wholeNumber('replicates done', 0, MAX_REPLICATES),
    engineVersion: z.string().min(1, { error: 'simulation engine version must not be empty' }).max(100),
    /** When the run ended, as an ISO 8601 date and time in UTC. */
    ranAt: z.iso.datetime({ error: 'time the simulation ran must be an ISO 8601 date and time, e.g. 2026-03-02T10:15:00Z' }),
    elapsedMs: between('simulation running time (ms)', 'at least 0', (v) => v >= 0),
    inputs: simulatedInputsSchema,
    measures: z.array(storedMeasureSchema).max(SIMULATION_MEASURE_IDS.length, {
      error: `a simulation stores at most ${SIMULATION_MEASURE_IDS.length} measures`,
    }),
  })
  .refine((r) => r.replicatesDone <= r.replicatesRequested, {
    error: 'replicates done must not exceed replicates requested',
    path: ['replicatesDone'],
  });
export type SimulationRecord = z.infer<typeof simulationRecordSchema>;

/** The plan's simulation checks, one (the latest) per population id. */
export const simulationsSchema = z.record(
  z.string().min(1, { error: 'a simulation is filed under a population id, which must not be empty' }).max(100),
  simulationRecordSchema,
);
export type Simulations = z.infer<typeof simulationsSchema>;
