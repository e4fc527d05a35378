// What a simulation run needs, validated at the edge: anything a worker message or the command
// line hands in is parsed here, and the first bad field becomes a DomainError naming it.
import { z } from 'zod';
import { DomainError } from '../errors';
import { formatCount } from '../../format/numbers';

/** Bounds on n, replicates and chunking; the product n × replicates is capped too (see below). */
export const SIMULATION_LIMITS = {
  minN: 4,
  maxN: 10_000_000,
  /** Binary: below 10 a logistic fit is rarely possible; above 100,000 fitting one replicate (a
   * sort and Newton–Raphson passes over n values) would take longer than a step should. */
  minBinaryN: 10,
  maxBinaryN: 100_000,
  minReplicates: 2,
  maxReplicates: 1_000_000,
  /** n × replicates: about ten minutes on one core at the 20 million observations/s target. */
  maxObservations: 10_000_000_000,
  /** Binary observations cost several times more (fitting, sorting): about the same time budget. */
  maxBinaryObservations: 2_000_000_000,
  minObservationsPerStep: 1_000,
  maxObservationsPerStep: 10_000_000,
  /** About 5–13 ms on one core at 20–45 million observations/s: keeps a cancel well under 200 ms. */
  defaultObservationsPerStep: 250_000,
} as const;

const count = (from: number, to: number) => `a whole number from ${formatCount(from)} to ${formatCount(to)}`;

const wholeNumber = (from: number, to: number) => {
  const allowed = count(from, to);
  return z.number({ error: allowed }).int({ error: allowed }).min(from, { error: allowed }).max(to, { error: allowed });
};

const finiteNumber = (allowed: string) => z.number({ error: allowed }).refine(Number.isFinite, { error: allowed });

const between = (allowed: string, ok: (v: number) => boolean) => finiteNumber(allowed).refine(ok, { error: allowed });

const OPEN_UNIT = 'a number strictly between 0 and 1';

export const continuousSimulationPopulationSchema = z.object({
  /** Anticipated R² of the model in the target population. */
  rSquared: between(OPEN_UNIT, (v) => v > 0 && v < 1),
  /** Variance of the outcome in the target population (squared outcome units). */
  outcomeVariance: between('a positive finite number', (v) => v > 0),
  /** Anticipated calibration slope β (default 1). */
  slope: between('a non-zero number from -100 to 100', (v) => v !== 0 && Math.abs(v) <= 100).default(1),
  /** Anticipated calibration-in-the-large, in outcome units (default 0). */
  citl: finiteNumber('a finite number').default(0),
});

/** The precision targets, in the same shape as a population's `precision` in the project file. */
export const continuousSimulationTargetsSchema = z.object({
  confidence: between(OPEN_UNIT, (v) => v > 0 && v < 1),
  rSquared: z.object({ width: between('a positive finite number', (v) => v > 0) }),
  citl: z.object({ width: between('a positive finite number', (v) => v > 0) }),
  slope: z.object({ width: between('a positive finite number', (v) => v > 0) }),
  residualSd: z.object({ marginFactor: between('a number greater than 1 and at most 10', (v) => v > 1 && v <= 10) }),
});

/**
 * A run of one outcome type: its population and targets, n within [minN, maxN], the replicate
 * count, the seed and the step budget; n × replicates at most `maxObservations`.
 */
function runSchema<O extends string, P extends z.ZodType, T extends z.ZodType>(
  outcome: O,
  population: P,
  targets: T,
  nRange: readonly [number, number],
  maxObservations: number,
) {
  return z
    .object({
      outcome: z.literal(outcome, { error: 'the text "continuous" or "binary"' }),
      population,
      n: wholeNumber(nRange[0], nRange[1]),
      replicates: wholeNumber(SIMULATION_LIMITS.minReplicates, SIMULATION_LIMITS.maxReplicates),
      /** Any 32-bit unsigned integer; stored with the result so the run can be repeated exactly. */
      seed: wholeNumber(0, 4_294_967_295),
      targets,
      /** Most observations simulated by one `step` call (bounds the time a cancel waits); a binary
       * observation counts about ten (see SimulationDesign.workPerObservation). */
      maxObservationsPerStep: wholeNumber(
        SIMULATION_LIMITS.minObservationsPerStep,
        SIMULATION_LIMITS.maxObservationsPerStep,
      ).default(SIMULATION_LIMITS.defaultObservationsPerStep),
    })
    .refine((c) => c.n * c.replicates <= maxObservations, {
      error: `at most ${formatCount(maxObservations)} simulated observations in all (n × replicates)`,
      path: ['replicates'],
    });
}

export const continuousSimulationConfigSchema = runSchema(
  'continuous',
  continuousSimulationPopulationSchema,
  continuousSimulationTargetsSchema,
  [SIMULATION_LIMITS.minN, SIMULATION_LIMITS.maxN],
  SIMULATION_LIMITS.maxObservations,
);

export const binarySimulationPopulationSchema = z.object({
  /** Mean of the model's linear predictor (log-odds) in the target population. */
  lpMean: between('a number from -50 to 50', (v) => Math.abs(v) <= 50),
  /** SD of the linear predictor. */
  lpSd: between('a number greater than 0 and at most 20', (v) => v > 0 && v <= 20),
  /** Calibration model logit P(Y = 1) = intercept + slope·LP; defaults 0 and 1 (well calibrated). */
  calibrationIntercept: between('a number from -50 to 50', (v) => Math.abs(v) <= 50).default(0),
  calibrationSlope: between('a number greater than 0 and at most 100', (v) => v > 0 && v <= 100).default(1),
});

export const binarySimulationTargetsSchema = z.object({
  confidence: between(OPEN_UNIT, (v) => v > 0 && v < 1),
  /** Multiplicative margin of the O/E interval, exp(z·SE*(ln O/E)); e.g. 1.105 for a width of 0.2 around 1. */
  oe: z.object({ marginFactor: between('a number greater than 1 and at most 10', (v) => v > 1 && v <= 10) }),
  slope: z.object({ width: between('a positive finite number', (v) => v > 0) }),
  cStatistic: z.object({ width: between('a positive finite number', (v) => v > 0) }),
});

export const binarySimulationConfigSchema = runSchema(
  'binary',
  binarySimulationPopulationSchema,
  binarySimulationTargetsSchema,
  [SIMULATION_LIMITS.minBinaryN, SIMULATION_LIMITS.maxBinaryN],
  SIMULATION_LIMITS.maxBinaryObservations,
);

export type ContinuousSimulationConfig = z.infer<typeof continuousSimulationConfigSchema>;
export type ContinuousSimulationConfigInput = z.input<typeof continuousSimulationConfigSchema>;
export type BinarySimulationConfig = z.infer<typeof binarySimulationConfigSchema>;
export type BinarySimulationConfigInput = z.input<typeof binarySimulationConfigSchema>;

/** Every outcome type a simulation can run, told apart by `outcome`. */
export type SimulationConfig = ContinuousSimulationConfig | BinarySimulationConfig;
export type SimulationConfigInput = ContinuousSimulationConfigInput | BinarySimulationConfigInput;

function valueAt(input: unknown, path: readonly PropertyKey[]): unknown {
  let here: unknown = input;
  for (const key of path) {
    if (here === null || typeof here !== 'object') return undefined;
    here = (here as Record<PropertyKey, unknown>)[key];
  }
  return here;
}

/**
 * Validates a simulation configuration (from a worker message, the command line or a test) and
 * fills its defaults. The first invalid field throws a DomainError whose `field` is the dotted path
 * (e.g. "n", "seed", "population.rSquared", "targets.citl.width") and whose message names the
 * allowed range. Never returns a half-valid configuration.
 * @example parseSimulationConfig({ ...config, n: 2.5 }) // throws DomainError: n = 2.5 is outside its allowed range: a whole number from 4 to 10,000,000
 */
export function parseSimulationConfig(input: unknown): SimulationConfig {
  const outcome = valueAt(input, ['outcome']);
  const schema = outcome === 'binary' ? binarySimulationConfigSchema : continuousSimulationConfigSchema;
  const parsed = schema.safeParse(input);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const path = issue?.path ?? [];
  const field = path.length > 0 ? path.map(String).join('.') : 'config';
  throw new DomainError(field, valueAt(input, path), issue?.message ?? 'a simulation configuration object');
}
