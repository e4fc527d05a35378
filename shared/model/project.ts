// The project document: the single truth for what a plan file holds. The command line, the
// app, the reports and the JSON Schema published in schema/ are all derived from these schemas.
import { z } from 'zod';
import { MAX_C_FOR_FIT } from '../engine/binary/fit-normal-lp';
import { maxCoxSnellR2 } from '../engine/binary/max-cox-snell-r2';
import {
  CALIBRATION_INTERCEPT_LIMIT,
  CALIBRATION_SLOPE_MAX,
  LP_MEAN_LIMIT,
  LP_SD_RANGE,
} from '../engine/binary/validate-binary-population-input';
import { DEFAULT_BINARY_PRECISION } from '../engine/binary/binary-population-input';
import { formatSignificant } from '../format/numbers';
import { simulationsSchema } from './simulation-record';

export const FORMAT_TAG = 'plumbline-plan';
export const SCHEMA_VERSION = 2;
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

/** What every population has, whatever its outcome type. */
const populationIdentity = {
  id: z.string().min(1, { error: 'population id must not be empty' }).max(100),
  name: z
    .string({ error: 'population name must be text' })
    .trim()
    .min(1, { error: 'population name must not be empty' })
    .max(200, { error: 'population name must be at most 200 characters' }),
  notes: z.string().max(20_000).default(''),
};

export const continuousPopulationSchema = z
  .object({
    ...populationIdentity,
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

// ---- Binary outcomes (an event within a period, a diagnosis): the project-file mirror of the
// engine's BinaryPopulationInput, with every domain rule of validateBinaryPopulationInput stated
// here so that bad input is refused at this edge with the field named.

const C_RANGE_WHY =
  '0.5 is a model that ranks patients no better than chance, so there is no discrimination to validate; 1 is a perfect model';

/** Strictly between 0.5 and 1: a C-statistic (area under the ROC curve). */
const cStatisticValue = (what: string) =>
  z
    .number({ error: `${what} must be a number` })
    .gt(0.5, { error: `${what} must be greater than 0.5 and less than 1 (${C_RANGE_WHY})` })
    .lt(1, { error: `${what} must be greater than 0.5 and less than 1 (${C_RANGE_WHY})` });

/** A finite number with |v| at most `limit`. */
const withinPlusMinus = (what: string, limit: number, why: string) =>
  finite(what).refine((v) => Math.abs(v) <= limit, { error: `${what} must lie between −${limit} and ${limit} (${why})` });

export const netBenefitThresholdSchema = z
  .object({
    /** Risk above which a patient would be offered the intervention. */
    threshold: openUnit('risk threshold'),
    /** Anticipated sensitivity and specificity at the threshold: both or neither (then computed from the LP). */
    sensitivity: openUnit('anticipated sensitivity at the threshold').optional(),
    specificity: openUnit('anticipated specificity at the threshold').optional(),
  })
  .superRefine((t, ctx) => {
    if ((t.sensitivity === undefined) !== (t.specificity === undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: [t.sensitivity === undefined ? 'sensitivity' : 'specificity'],
        message:
          'give the sensitivity and the specificity at this threshold together, or neither (then both are computed from the linear predictor)',
      });
    }
  });
export type NetBenefitThreshold = z.infer<typeof netBenefitThresholdSchema>;

/** Most risk thresholds per population (one net-benefit criterion each). */
export const MAX_THRESHOLDS = 20;

export const binaryAnticipatedSchema = z
  .object({
    /** Proportion of participants expected to have the outcome in this population. */
    outcomeProportion: openUnit('anticipated outcome proportion'),
    /** Anticipated C-statistic (area under the ROC curve) in this population. */
    cStatistic: cStatisticValue('anticipated C-statistic').optional(),
    /** Mean and SD of the model's linear predictor (log-odds) here; both or neither. */
    lpMean: withinPlusMinus(
      'mean of the linear predictor',
      LP_MEAN_LIMIT,
      'a mean log-odds beyond that gives almost everyone a risk of essentially 0 or 1',
    ).optional(),
    lpSd: finite('SD of the linear predictor')
      .refine((v) => v >= LP_SD_RANGE.min && v <= LP_SD_RANGE.max, {
        error: `SD of the linear predictor must be from ${LP_SD_RANGE.min} to ${LP_SD_RANGE.max} (below that the model gives everyone nearly the same risk and its calibration slope cannot be estimated; above it nearly all risks are 0 or 1)`,
      })
      .optional(),
    /** Anticipated miscalibration: logit P(Y = 1) = intercept + slope·LP; defaults 0 and 1. */
    calibrationIntercept: withinPlusMinus(
      'anticipated calibration intercept',
      CALIBRATION_INTERCEPT_LIMIT,
      'log-odds; beyond that the model is not worth validating',
    ).optional(),
    calibrationSlope: finite('anticipated calibration slope')
      .refine((v) => v > 0 && v <= CALIBRATION_SLOPE_MAX, {
        error: `anticipated calibration slope must be greater than 0 and at most ${CALIBRATION_SLOPE_MAX} (a slope of 0 or less means the model ranks risks the wrong way round or not at all)`,
      })
      .optional(),
    /** Risk thresholds for net benefit; one criterion per threshold. */
    thresholds: z
      .array(netBenefitThresholdSchema)
      .max(MAX_THRESHOLDS, { error: `at most ${MAX_THRESHOLDS} risk thresholds per population` })
      .default([]),
  })
  .superRefine((a, ctx) => {
    if ((a.lpMean === undefined) !== (a.lpSd === undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: [a.lpMean === undefined ? 'lpMean' : 'lpSd'],
        message:
          'give the mean and the SD of the linear predictor together, or neither (then both are fitted to the outcome proportion and C-statistic)',
      });
    }
    if (a.cStatistic !== undefined && a.lpMean === undefined && !(a.cStatistic < MAX_C_FOR_FIT)) {
      ctx.addIssue({
        code: 'custom',
        path: ['cStatistic'],
        input: a.cStatistic,
        message: `anticipated C-statistic must be below ${formatSignificant(MAX_C_FOR_FIT)} when the linear predictor is fitted to it (beyond that the fit is ill-conditioned); give the mean and SD of the linear predictor instead`,
      });
    }
    const seen = new Set<number>();
    a.thresholds.forEach((t, i) => {
      if (seen.has(t.threshold)) {
        ctx.addIssue({
          code: 'custom',
          path: ['thresholds', i, 'threshold'],
          input: t.threshold,
          message: 'risk threshold is listed twice (each threshold gives one criterion)',
        });
      }
      seen.add(t.threshold);
    });
  });
export type BinaryAnticipated = z.infer<typeof binaryAnticipatedSchema>;

/** The anticipated values of a binary population that may have a low/high range. */
export const BINARY_RANGE_KEYS = [
  'outcomeProportion',
  'cStatistic',
  'lpMean',
  'lpSd',
  'calibrationIntercept',
  'calibrationSlope',
] as const;
export type BinaryRangeKey = (typeof BINARY_RANGE_KEYS)[number];

/**
 * The O/E target, in one of two conventions: a total CI width around O/E = 1 (`width`), or the
 * lower and upper limits of the CI expected around O/E = 1 (`lower`, `upper`). Exactly one.
 */
export const oeTargetSchema = z
  .object({
    width: positive('target CI width for O/E').optional(),
    lower: positive('lower limit of the target CI for O/E').optional(),
    upper: positive('upper limit of the target CI for O/E').optional(),
  })
  .superRefine((t, ctx) => {
    const limits = t.lower !== undefined || t.upper !== undefined;
    if (t.width !== undefined && limits) {
      ctx.addIssue({
        code: 'custom',
        path: ['width'],
        message: 'give the O/E target either as a CI width or as CI limits, not both',
      });
    } else if (t.width === undefined && !limits) {
      ctx.addIssue({
        code: 'custom',
        path: ['width'],
        message: 'give the O/E target as a total CI width around 1, or as the lower and upper limits of the CI',
      });
    } else if (limits && (t.lower === undefined || t.upper === undefined)) {
      ctx.addIssue({
        code: 'custom',
        path: [t.lower === undefined ? 'lower' : 'upper'],
        message: 'give the lower and the upper limit of the target CI for O/E together',
      });
    } else if (limits && t.lower !== undefined && t.upper !== undefined && !(t.lower < 1 && t.upper > 1)) {
      ctx.addIssue({
        code: 'custom',
        path: [t.lower < 1 ? 'upper' : 'lower'],
        message:
          'the target CI for O/E must have its lower limit below 1 and its upper limit above 1 (the limits are those expected around a well-calibrated O/E of 1)',
      });
    }
  });
export type OeTargetSettings = z.infer<typeof oeTargetSchema>;

const binaryDefaults = DEFAULT_BINARY_PRECISION;

export const binaryPrecisionSchema = z.object({
  confidence: openUnit('confidence level').default(binaryDefaults.confidence),
  oe: oeTargetSchema.default({ width: 0.2 }),
  slope: z
    .object({ width: positive('target CI width for the calibration slope').default(binaryDefaults.slope.width) })
    .prefault({}),
  cStatistic: z
    .object({ width: positive('target CI width for the C-statistic').default(binaryDefaults.cStatistic.width) })
    .prefault({}),
  netBenefit: z
    .object({
      width: positive('target CI width for net benefit').default(binaryDefaults.netBenefit.width),
      /** When true the width is for standardised net benefit (net benefit ÷ outcome proportion). */
      standardised: z
        .boolean({ error: 'whether the net-benefit width is standardised must be true or false' })
        .default(binaryDefaults.netBenefit.standardised),
    })
    .prefault({}),
});
export type BinaryPrecisionSettings = z.infer<typeof binaryPrecisionSchema>;

export const binaryPopulationSchema = z
  .object({
    ...populationIdentity,
    outcome: z.literal('binary'),
    anticipated: binaryAnticipatedSchema,
    /** Optional low/high range per anticipated value, for the worst case and sensitivity curves. */
    ranges: z.partialRecord(z.enum(BINARY_RANGE_KEYS), rangeSchema).default({}),
    /** Free-text source of each assumption (a paper, a registry, a judgement). */
    sources: z.record(z.string(), z.string().max(5_000)).default({}),
    precision: binaryPrecisionSchema.prefault({}),
    recruitment: recruitmentSchema.prefault({}),
  })
  .superRefine((population, ctx) => {
    // Each end of a range, put in place of the base value, must give admissible anticipated values
    // (the rules between fields included); every domain here is an interval, so the values
    // between the ends are then admissible too.
    for (const [key, range] of Object.entries(population.ranges)) {
      for (const end of ['low', 'high'] as const) {
        const checked = binaryAnticipatedSchema.safeParse({ ...population.anticipated, [key]: range[end] });
        if (!checked.success) {
          const own = checked.error.issues.find((issue) => issue.path[0] === key) ?? checked.error.issues[0];
          ctx.addIssue({
            code: 'custom',
            path: ['ranges', key, end],
            input: range[end],
            message: `${end} end of the range: ${own?.message ?? 'not allowed'}`,
          });
        }
      }
    }
  });
export type BinaryPopulation = z.infer<typeof binaryPopulationSchema>;

export const populationSchema = z.discriminatedUnion('outcome', [continuousPopulationSchema, binaryPopulationSchema], {
  error: 'population outcome must be "continuous" or "binary"',
});
export type Population = z.infer<typeof populationSchema>;

/** Any anticipated value that may have a low/high range, whatever the outcome type. */
export type AnticipatedRangeKey = ContinuousAnticipatedKey | BinaryRangeKey;

/** The outcome types a plan can be for; one model has one, chosen once per plan. */
export const OUTCOME_TYPES = ['continuous', 'binary'] as const;
export type OutcomeType = (typeof OUTCOME_TYPES)[number];

/** The largest Cox–Snell R² any binary outcome allows (its maximum at an outcome proportion of 0.5). */
export const MAX_COX_SNELL_R2 = maxCoxSnellR2(0.5);

export const updatingSchema = z.object({
  /** When on, the development minimums are computed and the larger n is taken. */
  enabled: z.boolean().default(false),
  predictorParameters: positiveInteger('number of predictor parameters').optional(),
  anticipatedAdjustedRSquared: openUnit('anticipated adjusted R²').optional(),
  targetShrinkage: openUnit('target shrinkage factor').default(0.9),
  optimismMargin: openUnit('allowed optimism in R²').default(0.05),
  /** Which form of the shrinkage criterion to use (see the engine's dev-shrinkage). */
  shrinkageForm: z.enum(['adjusted-r2-link', 'closed-form']).default('adjusted-r2-link'),
  /** Binary outcomes: anticipated optimism-adjusted Cox–Snell R² of the updated model. */
  anticipatedCoxSnellR2: openUnit('anticipated Cox–Snell R²')
    .refine((v) => v < MAX_COX_SNELL_R2, {
      error: `anticipated Cox–Snell R² must be below ${formatSignificant(MAX_COX_SNELL_R2)} (no binary outcome allows more)`,
    })
    .optional(),
  /** Binary outcomes: margin of error for the overall risk; the engine's default 0.05 when absent. */
  riskMargin: finite('margin for the overall risk')
    .refine((v) => v > 0 && v < 0.5, {
      error:
        'margin for the overall risk must be greater than 0 and below 0.5 (a risk lies in [0, 1], so a margin of 0.5 says nothing)',
    })
    .optional(),
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

/** The strictest outcome proportion of a binary population for the development minimums: the one whose maximum Cox–Snell R² is lowest. */
function strictestProportion(population: BinaryPopulation): { readonly value: number; readonly where: string } {
  const range = population.ranges.outcomeProportion;
  const candidates = [
    { value: population.anticipated.outcomeProportion, where: '' },
    ...(range === undefined
      ? []
      : [
          { value: range.low, where: ' (low end of its range)' },
          { value: range.high, where: ' (high end of its range)' },
        ]),
  ];
  return candidates.reduce((a, b) => (maxCoxSnellR2(b.value) < maxCoxSnellR2(a.value) ? b : a));
}

/**
 * Rules across the plan: every population has the plan's outcome type (one model predicts one
 * outcome type); for a binary plan with model updating on, the anticipated Cox–Snell R² must be
 * possible at every population's outcome proportion (and below the target shrinkage factor).
 */
function checkPlanRules(
  project: {
    readonly outcome: OutcomeType;
    readonly updating: Updating;
    readonly populations: readonly Population[];
  },
  ctx: z.RefinementCtx,
): void {
  project.populations.forEach((population, i) => {
    if (population.outcome !== project.outcome) {
      ctx.addIssue({
        code: 'custom',
        path: ['populations', i, 'outcome'],
        input: population.outcome,
        message: `population "${population.name}" is for a ${population.outcome} outcome, but the plan is for a ${project.outcome} outcome (one model predicts one outcome type, so every population takes the plan's)`,
      });
    }
  });
  const r2 = project.updating.anticipatedCoxSnellR2;
  if (project.outcome !== 'binary' || !project.updating.enabled || r2 === undefined) return;
  if (!(project.updating.targetShrinkage > r2)) {
    ctx.addIssue({
      code: 'custom',
      path: ['updating', 'targetShrinkage'],
      input: project.updating.targetShrinkage,
      message: `target shrinkage factor must be above the anticipated Cox–Snell R² ${formatSignificant(r2)} (the shrinkage criterion takes ln(1 − R²/S))`,
    });
  }
  let strictest: { readonly name: string; readonly value: number; readonly where: string; readonly max: number } | null = null;
  for (const population of project.populations) {
    if (population.outcome !== 'binary') continue;
    const phi = strictestProportion(population);
    const max = maxCoxSnellR2(phi.value);
    if (strictest === null || max < strictest.max) strictest = { name: population.name, ...phi, max };
  }
  if (strictest !== null && !(r2 < strictest.max)) {
    ctx.addIssue({
      code: 'custom',
      path: ['updating', 'anticipatedCoxSnellR2'],
      input: r2,
      message: `anticipated Cox–Snell R² must be below ${formatSignificant(strictest.max)}, the largest possible at the outcome proportion ${formatSignificant(strictest.value)} of population "${strictest.name}"${strictest.where}`,
    });
  }
}

const projectFields = z.object({
  format: z.literal(FORMAT_TAG, { error: `not a plan file (format tag must be "${FORMAT_TAG}")` }),
  schemaVersion: z.literal(SCHEMA_VERSION),
  name: z.string().trim().min(1, { error: 'project name must not be empty' }).max(200),
  description: z.string().max(20_000).default(''),
  outcome: z.enum(OUTCOME_TYPES, { error: 'plan outcome must be "continuous" or "binary"' }),
  model: modelSchema.prefault({}),
  updating: updatingSchema.prefault({}),
  study: studySchema.prefault({}),
  /** Absent in plans that never set it: read as the defaults of pooledSchema (site-specific aim). */
  pooled: pooledSchema.optional(),
  populations: z.array(populationSchema).max(10_000),
  /** The latest simulation check per population id (optional: plans without one stay valid). */
  simulations: simulationsSchema.optional(),
});
/** The plan document: its fields, and the rules across them (checkPlanRules). */
export const projectSchema = projectFields.superRefine(checkPlanRules);
export type Project = z.infer<typeof projectSchema>;
export type ProjectInput = z.input<typeof projectSchema>;
