// The project document: the single truth for what a plan file holds. The command line, the
// app, the reports and the JSON Schema published in schema/ are all derived from these schemas.
import { z } from 'zod';
import { simulationsSchema } from './simulation-record';

export const FORMAT_TAG = 'plumbline-plan';
export const SCHEMA_VERSION = 1;
export const FILE_EXTENSION = '.plumb';

const finite = (what: string) =>
  z.number({ error: `${what} must be a number` }).refine(Number.isFinite, { error: `${what} must be finite` });

/** Strictly between 0 and 1 (R², proportions, confidence levels). */
export const openUnit = (what: string) =>
  z
    .number({ error: `${what} must be a number` })
    .gt(0, { error: `${what} must be greater than 0 and less than 1` })
    .lt(1, { error: `${what} must be greater than 0 and less than 1` });

/** Positive and finite (variances, widths, rates). */
export const positive = (what: string) => finite(what).refine((v) => v > 0, { error: `${what} must be greater than 0` });

export const positiveInteger = (what: string) =>
  z
    .number({ error: `${what} must be a whole number` })
    .int({ error: `${what} must be a whole number` })
    .min(1, { error: `${what} must be at least 1` })
    .max(100_000_000, { error: `${what} must be at most 100,000,000` });

/** A low/high range around an anticipated value (the base value lives in `anticipated`). */
export const rangeSchema = z
  .object({ low: finite('low'), high: finite('high') })
  .refine((r) => r.low <= r.high, { error: 'low must not exceed high', path: ['high'] });
export type Range = z.infer<typeof rangeSchema>;

export const continuousAnticipatedSchema = z.object({
  /** Anticipated R² of the model in the target population (proportion of variance explained). */
  rSquared: openUnit('anticipated R²'),
  /** Variance of the outcome in the target population, in squared outcome units. */
  outcomeVariance: positive('outcome variance'),
  /** R² used for the calibration-in-the-large model; defaults to rSquared. */
  rSquaredCitl: openUnit('R² for the CITL model').optional(),
  /** R² of the calibration-slope model; defaults to rSquared. */
  rSquaredSlope: openUnit('R² for the calibration-slope model').optional(),
  /** Anticipated calibration slope; default 1 (the conservative choice). */
  slope: finite('anticipated calibration slope')
    .refine((v) => v !== 0, { error: 'anticipated calibration slope must not be 0' })
    .refine((v) => Math.abs(v) <= 100, { error: 'anticipated calibration slope must lie between -100 and 100' })
    .optional(),
  /** Anticipated mean of the outcome (development intercept criterion). */
  outcomeMean: finite('anticipated outcome mean').optional(),
  /** Anticipated SD of the outcome (development intercept criterion). */
  outcomeSd: positive('anticipated outcome SD').optional(),
});
export type ContinuousAnticipated = z.infer<typeof continuousAnticipatedSchema>;
export type ContinuousAnticipatedKey = keyof ContinuousAnticipated;

export const continuousPrecisionSchema = z.object({
  confidence: openUnit('confidence level').default(0.95),
  rSquared: z.object({ width: positive('target CI width for R²').default(0.1) }).prefault({}),
  citl: z.object({ width: positive('target CI width for CITL (outcome units)') }),
  slope: z.object({ width: positive('target CI width for the calibration slope').default(0.2) }).prefault({}),
  residualSd: z
    .object({
      marginFactor: finite('margin factor for residual SDs')
        .refine((v) => v > 1 && v <= 10, { error: 'margin factor for residual SDs must be greater than 1 and at most 10' })
        .default(1.1),
    })
    .prefault({}),
});
export type ContinuousPrecision = z.infer<typeof continuousPrecisionSchema>;

export const recruitmentSchema = z.object({
  /** Patients seen per month at the site who could be screened. */
  accrualPerMonth: positive('accrual per month').optional(),
  /** Fraction of screened patients who are eligible. */
  eligibleFraction: finite('eligible fraction')
    .refine((v) => v > 0 && v <= 1, { error: 'eligible fraction must be greater than 0 and at most 1' })
    .default(1),
  /** Fraction of eligible patients who consent. */
  consentFraction: finite('consent fraction')
    .refine((v) => v > 0 && v <= 1, { error: 'consent fraction must be greater than 0 and at most 1' })
    .default(1),
  /** Expected fraction of enrolled participants whose outcome will be missing. */
  missingOutcomeFraction: finite('missing-outcome fraction')
    .refine((v) => v >= 0 && v < 1, { error: 'missing-outcome fraction must be at least 0 and less than 1' })
    .default(0),
  /** Size of an existing cohort or registry, when n is fixed rather than planned. */
  availableN: positiveInteger('available cohort size').optional(),
});
export type Recruitment = z.infer<typeof recruitmentSchema>;

export const continuousPopulationSchema = z
  .object({
    id: z.string().min(1, { error: 'population id must not be empty' }).max(100),
    name: z
      .string({ error: 'population name must be text' })
      .trim()
      .min(1, { error: 'population name must not be empty' })
      .max(200, { error: 'population name must be at most 200 characters' }),
    notes: z.string().max(20_000).default(''),
    outcome: z.literal('continuous'),
    anticipated: continuousAnticipatedSchema,
    /** Optional low/high range per anticipated value, for the worst case and sensitivity curves. */
    ranges: z.partialRecord(continuousAnticipatedSchema.keyof(), rangeSchema).default({}),
    /** Free-text source of each assumption (a paper, a registry, a judgement). */
    sources: z.record(z.string(), z.string().max(5_000)).default({}),
    precision: continuousPrecisionSchema,
    recruitment: recruitmentSchema.prefault({}),
  })
  .superRefine((population, ctx) => {
    // Each end of a range must itself be an admissible anticipated value.
    for (const [key, range] of Object.entries(population.ranges)) {
      const field = continuousAnticipatedSchema.shape[key as ContinuousAnticipatedKey];
      for (const end of ['low', 'high'] as const) {
        const checked = field.safeParse(range[end]);
        if (!checked.success) {
          ctx.addIssue({
            code: 'custom',
            path: ['ranges', key, end],
            input: range[end],
            message: `${end} end of the range: ${checked.error.issues[0]?.message ?? 'not allowed'}`,
          });
        }
      }
    }
    // Every value between the ends is swept too, and a calibration slope of 0 is not admissible.
    const slope = population.ranges.slope;
    if (slope !== undefined && slope.low < 0 && slope.high > 0) {
      ctx.addIssue({
        code: 'custom',
        path: ['ranges', 'slope', 'high'],
        input: slope.high,
        message: 'the range of the calibration slope must not include 0 (give both ends the same sign)',
      });
    }
  });
export type ContinuousPopulation = z.infer<typeof continuousPopulationSchema>;

export const populationSchema = continuousPopulationSchema;
export type Population = z.infer<typeof populationSchema>;

export const updatingSchema = z.object({
  /** When on, the development minimums are computed and the larger n is taken. */
  enabled: z.boolean().default(false),
  predictorParameters: positiveInteger('number of predictor parameters').optional(),
  anticipatedAdjustedRSquared: openUnit('anticipated adjusted R²').optional(),
  targetShrinkage: openUnit('target shrinkage factor').default(0.9),
  optimismMargin: openUnit('allowed optimism in R²').default(0.05),
  /** Which form of the shrinkage criterion to use (see the engine's dev-shrinkage). */
  shrinkageForm: z.enum(['adjusted-r2-link', 'closed-form']).default('adjusted-r2-link'),
});
export type Updating = z.infer<typeof updatingSchema>;

export const modelSchema = z.object({
  name: z.string().max(200).default(''),
  description: z.string().max(20_000).default(''),
  /** Development performance as reported by the model's authors (free text plus optional R²). */
  reportedPerformance: z.string().max(5_000).default(''),
  reportedRSquared: openUnit('reported R²').optional(),
});

export const studySchema = z.object({
  /** First day of recruitment, YYYY-MM-DD. */
  startDate: z
    .string()
    .regex(/^\d{4}-\d{2}-\d{2}$/, { error: 'study start must be a date written YYYY-MM-DD' })
    .refine((s) => !Number.isNaN(Date.parse(`${s}T00:00:00Z`)), { error: 'study start must be a real date' })
    .optional(),
  /** Length of the recruitment window in months. */
  windowMonths: positive('recruitment window (months)')
    .refine((v) => v <= 600, { error: 'recruitment window (months) must be at most 600' })
    .optional(),
});

/** At least 0 (and at most `max` when given), finite: between-site SDs. */
const atLeastZero = (what: string, max?: number) =>
  finite(what).refine((v) => v >= 0 && (max === undefined || v <= max), {
    error: max === undefined ? `${what} must be at least 0` : `${what} must be at least 0 and at most ${max}`,
  });

/** Greater than 0 (and at most `max` when given), finite: target widths. */
const widthAtMost = (what: string, max?: number) =>
  max === undefined
    ? positive(what)
    : positive(what).refine((v) => v <= max, { error: `${what} must be greater than 0 and at most ${max}` });

/**
 * One measure pooled across sites: the anticipated between-site SD τ of its true site values (with
 * an optional low/high range) and the precision wanted for the random-effects summary. The measure
 * is pooled once τ and the summary width are both given; everything is on the scale the per-site
 * estimate is on.
 */
const pooledMeasureSchema = (measure: string, limits: { readonly tau?: number; readonly width?: number } = {}) => {
  const tauWhat = `between-site SD τ of the ${measure}`;
  return z
    .object({
      tau: atLeastZero(tauWhat, limits.tau).optional(),
      tauRange: z
        .object({
          low: atLeastZero(`low end of the ${tauWhat}`, limits.tau),
          high: atLeastZero(`high end of the ${tauWhat}`, limits.tau),
        })
        .refine((r) => r.low <= r.high, { error: 'low must not exceed high', path: ['high'] })
        .optional(),
      summaryCiWidth: widthAtMost(`target width of the summary CI for the ${measure}`, limits.width).optional(),
      predictionIntervalWidth: widthAtMost(`target width of the prediction interval for the ${measure}`, limits.width).optional(),
    })
    .superRefine((m, ctx) => {
      if (m.tau !== undefined && m.tauRange !== undefined && (m.tau < m.tauRange.low || m.tau > m.tauRange.high)) {
        ctx.addIssue({
          code: 'custom',
          path: ['tau'],
          input: m.tau,
          message: `${tauWhat} must lie within its low–high range`,
        });
      }
    });
};

/** Planning across sites (a random-effects summary of the sites' estimates); off unless the aim says so. */
export const pooledSchema = z.object({
  /** site-specific: every site meets its own targets; pooled: the summary across sites does; both. */
  aim: z
    .enum(['site-specific', 'pooled', 'both'], { error: 'planning aim must be "site-specific", "pooled" or "both"' })
    .default('site-specific'),
  objective: z
    .enum(['fewest-participants', 'shortest-recruitment'], {
      error: 'pooled planning objective must be "fewest-participants" or "shortest-recruitment"',
    })
    .default('fewest-participants'),
  confidence: openUnit('confidence level of the pooled intervals').default(0.95),
  /** Keys as in each population's precision targets. */
  measures: z
    .object({
      slope: pooledMeasureSchema('calibration slope').optional(),
      citl: pooledMeasureSchema('CITL (outcome units)').optional(),
      rSquared: pooledMeasureSchema('R²', { tau: 0.5, width: 1 }).optional(),
    })
    .prefault({}),
});
export type Pooled = z.infer<typeof pooledSchema>;
export type PooledMeasureKey = keyof Pooled['measures'];
export type PooledMeasureSettings = NonNullable<Pooled['measures'][PooledMeasureKey]>;

export const projectSchema = z.object({
  format: z.literal(FORMAT_TAG, { error: `not a plan file (format tag must be "${FORMAT_TAG}")` }),
  schemaVersion: z.literal(SCHEMA_VERSION),
  name: z.string().trim().min(1, { error: 'project name must not be empty' }).max(200),
  description: z.string().max(20_000).default(''),
  outcome: z.literal('continuous'),
  model: modelSchema.prefault({}),
  updating: updatingSchema.prefault({}),
  study: studySchema.prefault({}),
  /** Absent in plans that never set it: read as the defaults of pooledSchema (site-specific aim). */
  pooled: pooledSchema.optional(),
  populations: z.array(populationSchema).max(10_000),
  /** The latest simulation check per population id (optional: plans without one stay valid). */
  simulations: simulationsSchema.optional(),
});
export type Project = z.infer<typeof projectSchema>;
export type ProjectInput = z.input<typeof projectSchema>;
