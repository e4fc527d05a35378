// What each number of a continuous population means, for people: label, unit, default and the
// allowed range as the schema enforces it. The editor, the report's assumptions table and the
// command line read these, so a field is described once.
import type { ContinuousAnticipatedKey } from './project';

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
  readonly rangeKey?: ContinuousAnticipatedKey;
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
