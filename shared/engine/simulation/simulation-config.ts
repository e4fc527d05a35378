// What a simulation run needs, validated at the edge: anything a worker message or the command
// line hands in is parsed here, and the first bad field becomes a DomainError naming it.
import { z } from 'zod';
import { DomainError } from '../errors';
import { formatCount } from '../../format/numbers';

/** Largest n per replicate and replicate count; their product is capped too (see below). */
export const SIMULATION_LIMITS = {
  minN: 4,
  maxN: 10_000_000,
  minReplicates: 2,
  maxReplicates: 1_000_000,
  /** n × replicates: about ten minutes on one core at the 20 million observations/s target. */
  maxObservations: 10_000_000_000,
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

export const continuousSimulationConfigSchema = z
  .object({
    outcome: z.literal('continuous', { error: 'the text "continuous"' }),
    population: continuousSimulationPopulationSchema,
    n: wholeNumber(SIMULATION_LIMITS.minN, SIMULATION_LIMITS.maxN),
    replicates: wholeNumber(SIMULATION_LIMITS.minReplicates, SIMULATION_LIMITS.maxReplicates),
    /** Any 32-bit unsigned integer; stored with the result so the run can be repeated exactly. */
    seed: wholeNumber(0, 4_294_967_295),
    targets: continuousSimulationTargetsSchema,
    /** Most observations simulated by one `step` call (bounds the time a cancel waits). */
    maxObservationsPerStep: wholeNumber(
      SIMULATION_LIMITS.minObservationsPerStep,
      SIMULATION_LIMITS.maxObservationsPerStep,
    ).default(SIMULATION_LIMITS.defaultObservationsPerStep),
  })
  .refine((c) => c.n * c.replicates <= SIMULATION_LIMITS.maxObservations, {
    error: `at most ${formatCount(SIMULATION_LIMITS.maxObservations)} simulated observations in all (n × replicates)`,
    path: ['replicates'],
  });

export type ContinuousSimulationConfig = z.infer<typeof continuousSimulationConfigSchema>;
export type ContinuousSimulationConfigInput = z.input<typeof continuousSimulationConfigSchema>;

/** Every outcome type a simulation can run (binary joins this union). */
export type SimulationConfig = ContinuousSimulationConfig;
export type SimulationConfigInput = ContinuousSimulationConfigInput;

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
  const parsed = continuousSimulationConfigSchema.safeParse(input);
  if (parsed.success) return parsed.data;
  const issue = parsed.error.issues[0];
  const path = issue?.path ?? [];
  const field = path.length > 0 ? path.map(String).join('.') : 'config';
  throw new DomainError(field, valueAt(input, path), issue?.message ?? 'a simulation configuration object');
}
