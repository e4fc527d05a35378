// What each number of a population means, for people: label, unit, default and the allowed range
// as the schema enforces it, per outcome type. The editor, the report's assumptions table and the
// command line read these, so a field is described once.
import {
  CALIBRATION_INTERCEPT_LIMIT,
  CALIBRATION_SLOPE_MAX,
  LP_MEAN_LIMIT,
  LP_SD_RANGE,
} from '../engine/binary/validate-binary-population-input';
import { MAX_C_FOR_FIT } from '../engine/binary/fit-normal-lp';
import type { BinaryRangeKey, ContinuousAnticipatedKey, OutcomeType } from './project';

export type FieldGroup = 'anticipated' | 'precision' | 'recruitment';

export interface FieldSpec {
  /** Dot path inside a population, e.g. "anticipated.rSquared". */
  readonly path: string;
  readonly label: string;
  readonly unit: string;
  readonly allowed: string;
  /** The value used when the field is left empty; undefined when there is none. */
  readonly defaultText?: string;
  readonly required: boolean;
  readonly integer?: boolean;
  readonly group: FieldGroup;
  readonly help: string;
  /** For anticipated values: the key of its low/high range. */
  readonly rangeKey?: ContinuousAnticipatedKey | BinaryRangeKey;
}

export const CONTINUOUS_FIELDS: readonly FieldSpec[] = [
  {
    path: 'anticipated.rSquared',
    label: 'Anticipated R²',
    unit: '',
    allowed: 'between 0 and 1 (exclusive)',
    required: true,
    group: 'anticipated',
    help: 'Proportion of outcome variance the model is expected to explain in this population (use an optimism-adjusted or previously validated value).',
    rangeKey: 'rSquared',
  },
  {
    path: 'anticipated.outcomeVariance',
    label: 'Outcome variance',
    unit: 'outcome units²',
    allowed: 'greater than 0',
    required: true,
    group: 'anticipated',
    help: 'Variance of the outcome in this population; the helper below derives it from an SD, IQR, quartiles or range.',
    rangeKey: 'outcomeVariance',
  },
  {
    path: 'anticipated.rSquaredCitl',
    label: 'R² for the CITL model',
    unit: '',
    allowed: 'between 0 and 1 (exclusive)',
    defaultText: 'same as anticipated R²',
    required: false,
    group: 'anticipated',
    help: 'R² entering the variance of observed minus predicted outcomes.',
    rangeKey: 'rSquaredCitl',
  },
  {
    path: 'anticipated.rSquaredSlope',
    label: 'R² for the calibration-slope model',
    unit: '',
    allowed: 'between 0 and 1 (exclusive)',
    defaultText: 'same as anticipated R²',
    required: false,
    group: 'anticipated',
    help: 'R² of the regression of observed on predicted outcomes.',
    rangeKey: 'rSquaredSlope',
  },
  {
    path: 'anticipated.slope',
    label: 'Anticipated calibration slope',
    unit: '',
    allowed: 'non-zero, between −100 and 100',
    defaultText: '1',
    required: false,
    group: 'anticipated',
    help: '1 means predictions are neither too extreme nor too modest; 1 is the conservative choice.',
    rangeKey: 'slope',
  },
  {
    path: 'anticipated.outcomeMean',
    label: 'Anticipated outcome mean',
    unit: 'outcome units',
    allowed: 'any finite number',
    required: false,
    group: 'anticipated',
    help: 'Needed only for the development criterion on the intercept (model updating).',
    rangeKey: 'outcomeMean',
  },
  {
    path: 'anticipated.outcomeSd',
    label: 'Anticipated outcome SD',
    unit: 'outcome units',
    allowed: 'greater than 0',
    required: false,
    group: 'anticipated',
    help: 'Needed only for the development criterion on the intercept (model updating).',
    rangeKey: 'outcomeSd',
  },
  {
    path: 'precision.confidence',
    label: 'Confidence level',
    unit: '',
    allowed: 'between 0 and 1 (exclusive)',
    defaultText: '0.95',
    required: false,
    group: 'precision',
    help: 'Level of every confidence interval below.',
  },
  {
    path: 'precision.rSquared.width',
    label: 'Target CI width for R²',
    unit: '',
    allowed: 'greater than 0',
    defaultText: '0.1',
    required: false,
    group: 'precision',
    help: 'Full width of the confidence interval for R².',
  },
  {
    path: 'precision.citl.width',
    label: 'Target CI width for CITL',
    unit: 'outcome units',
    allowed: 'greater than 0',
    required: true,
    group: 'precision',
    help: 'Full width of the confidence interval for calibration-in-the-large, in outcome units. There is no universal default: a width of about half the outcome SD is one starting point.',
  },
  {
    path: 'precision.slope.width',
    label: 'Target CI width for the calibration slope',
    unit: '',
    allowed: 'greater than 0',
    defaultText: '0.2',
    required: false,
    group: 'precision',
    help: 'Full width of the confidence interval for the calibration slope.',
  },
  {
    path: 'precision.residualSd.marginFactor',
    label: 'Margin factor for residual SDs',
    unit: '×',
    allowed: 'greater than 1, at most 10',
    defaultText: '1.1',
    required: false,
    group: 'precision',
    help: 'The CI for each residual SD should lie within SD ÷ factor and SD × factor (1.1 = within 10%).',
  },
  {
    path: 'recruitment.accrualPerMonth',
    label: 'Patients seen per month',
    unit: 'per month',
    allowed: 'greater than 0',
    required: false,
    group: 'recruitment',
    help: 'Patients the site sees per month who could be screened.',
  },
  {
    path: 'recruitment.eligibleFraction',
    label: 'Eligible fraction',
    unit: '',
    allowed: 'greater than 0, at most 1',
    defaultText: '1',
    required: false,
    group: 'recruitment',
    help: 'Share of screened patients who meet the eligibility criteria.',
  },
  {
    path: 'recruitment.consentFraction',
    label: 'Consent fraction',
    unit: '',
    allowed: 'greater than 0, at most 1',
    defaultText: '1',
    required: false,
    group: 'recruitment',
    help: 'Share of eligible patients expected to consent.',
  },
  {
    path: 'recruitment.missingOutcomeFraction',
    label: 'Missing-outcome fraction',
    unit: '',
    allowed: 'at least 0, less than 1',
    defaultText: '0',
    required: false,
    group: 'recruitment',
    help: 'Share of enrolled participants expected to have no outcome; enrolment is inflated to make up for it.',
  },
  {
    path: 'recruitment.availableN',
    label: 'Fixed available n (existing cohort)',
    unit: 'participants',
    allowed: 'a whole number, at least 1',
    required: false,
    integer: true,
    group: 'recruitment',
    help: 'When the data already exist (a cohort or registry), the precision this n gives is shown instead of a plan.',
  },
];

function sharedField(path: string): FieldSpec {
  const spec = CONTINUOUS_FIELDS.find((f) => f.path === path);
  if (spec === undefined) throw new Error(`no field description for ${path}`);
  return spec;
}

/**
 * The numbers of a binary-outcome population. The risk thresholds for net benefit are a list
 * (edited as one), and whether the net-benefit width is standardised is a yes/no setting; the O/E
 * target is either `precision.oe.width` or both `precision.oe.lower` and `precision.oe.upper`.
 */
export const BINARY_FIELDS: readonly FieldSpec[] = [
  {
    path: 'anticipated.outcomeProportion',
    label: 'Anticipated outcome proportion',
    unit: '',
    allowed: 'between 0 and 1 (exclusive)',
    required: true,
    group: 'anticipated',
    help: 'Share of participants expected to have the outcome (the event rate) in this population.',
    rangeKey: 'outcomeProportion',
  },
  {
    path: 'anticipated.cStatistic',
    label: 'Anticipated C-statistic',
    unit: '',
    allowed: `between 0.5 and 1 (exclusive); below ${MAX_C_FOR_FIT} when the linear predictor is fitted to it`,
    required: false,
    group: 'anticipated',
    help: 'Area under the ROC curve expected here. 0.5 is excluded because it is a model that ranks no better than chance (nothing to validate), 1 because it is a perfect model. With the outcome proportion it gives the distribution of the linear predictor, unless that is given below.',
    rangeKey: 'cStatistic',
  },
  {
    path: 'anticipated.lpMean',
    label: 'Mean of the linear predictor',
    unit: 'log-odds',
    allowed: `between −${LP_MEAN_LIMIT} and ${LP_MEAN_LIMIT}; with its SD`,
    defaultText: 'fitted to outcome proportion and C',
    required: false,
    group: 'anticipated',
    help: "Mean of the model's linear predictor (log-odds of the predicted risk) in this population, if known from a previous validation. Give the SD too.",
    rangeKey: 'lpMean',
  },
  {
    path: 'anticipated.lpSd',
    label: 'SD of the linear predictor',
    unit: 'log-odds',
    allowed: `from ${LP_SD_RANGE.min} to ${LP_SD_RANGE.max}; with its mean`,
    defaultText: 'fitted to outcome proportion and C',
    required: false,
    group: 'anticipated',
    help: "SD of the model's linear predictor in this population. Give the mean too.",
    rangeKey: 'lpSd',
  },
  {
    path: 'anticipated.calibrationIntercept',
    label: 'Anticipated calibration intercept',
    unit: 'log-odds',
    allowed: `between −${CALIBRATION_INTERCEPT_LIMIT} and ${CALIBRATION_INTERCEPT_LIMIT}`,
    defaultText: '0',
    required: false,
    group: 'anticipated',
    help: 'Anticipated miscalibration: logit P(outcome) = intercept + slope × linear predictor. 0 and 1 mean well calibrated.',
    rangeKey: 'calibrationIntercept',
  },
  {
    path: 'anticipated.calibrationSlope',
    label: 'Anticipated calibration slope',
    unit: '',
    allowed: `greater than 0, at most ${CALIBRATION_SLOPE_MAX}`,
    defaultText: '1',
    required: false,
    group: 'anticipated',
    help: '1 means predictions are neither too extreme nor too modest; below 1, too extreme.',
    rangeKey: 'calibrationSlope',
  },
  sharedField('precision.confidence'),
  {
    path: 'precision.oe.width',
    label: 'Target CI width for O/E',
    unit: '',
    allowed: 'greater than 0',
    defaultText: '0.2',
    required: false,
    group: 'precision',
    help: 'Total width of the CI for O/E (observed ÷ expected events) around a well-calibrated O/E of 1: the CI runs from e^(−z·SE) to e^(z·SE) on the ratio scale, and its width is their difference.',
  },
  {
    path: 'precision.oe.lower',
    label: 'Lower limit of the target CI for O/E',
    unit: '',
    allowed: 'greater than 0, below 1; with the upper limit',
    required: true,
    group: 'precision',
    help: 'The CI for O/E expected around an O/E of 1, e.g. 0.9 to 1.1; the SE of ln(O/E) is (ln upper − ln lower) ÷ 2z.',
  },
  {
    path: 'precision.oe.upper',
    label: 'Upper limit of the target CI for O/E',
    unit: '',
    allowed: 'above 1; with the lower limit',
    required: true,
    group: 'precision',
    help: 'The CI for O/E expected around an O/E of 1, e.g. 0.9 to 1.1.',
  },
  sharedField('precision.slope.width'),
  {
    path: 'precision.cStatistic.width',
    label: 'Target CI width for the C-statistic',
    unit: '',
    allowed: 'greater than 0',
    defaultText: '0.1',
    required: false,
    group: 'precision',
    help: 'Full width of the confidence interval for the C-statistic.',
  },
  {
    path: 'precision.netBenefit.width',
    label: 'Target CI width for net benefit',
    unit: '',
    allowed: 'greater than 0',
    defaultText: '0.2',
    required: false,
    group: 'precision',
    help: 'Full width of the CI for net benefit at each risk threshold, or for standardised net benefit (net benefit ÷ outcome proportion) when that is chosen.',
  },
  ...CONTINUOUS_FIELDS.filter((f) => f.group === 'recruitment'),
];

/** The field descriptions of each outcome type. */
export const POPULATION_FIELDS: Readonly<Record<OutcomeType, readonly FieldSpec[]>> = {
  continuous: CONTINUOUS_FIELDS,
  binary: BINARY_FIELDS,
};
