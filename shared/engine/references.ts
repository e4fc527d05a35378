import type { ReferenceKey } from './types';

export interface Reference {
  readonly key: ReferenceKey;
  /** Full citation by title, journal, year and DOI (no author names for the sample-size papers). */
  readonly citation: string;
}

/** Every source a formula or check in the engine cites. Reports number them in order of use. */
export const REFERENCES: Readonly<Record<ReferenceKey, Reference>> = {
  'VAL-CONT': {
    key: 'VAL-CONT',
    citation:
      'Minimum sample size for external validation of a clinical prediction model with a continuous outcome. Stat Med 2021;40(1):133–146. doi:10.1002/sim.8766',
  },
  'DEV-CONT': {
    key: 'DEV-CONT',
    citation:
      'Minimum sample size for developing a multivariable prediction model: Part I – continuous outcomes. Stat Med 2019;38(7):1262–1275. doi:10.1002/sim.7993',
  },
  'DEV-BIN-SURV': {
    key: 'DEV-BIN-SURV',
    citation:
      'Minimum sample size for developing a multivariable prediction model: Part II – binary and time-to-event outcomes. Stat Med 2019;38(7):1276–1296. doi:10.1002/sim.7992 (correction doi:10.1002/sim.8409)',
  },
  'DEV-BMJ': {
    key: 'DEV-BMJ',
    citation:
      'Calculating the sample size required for developing a clinical prediction model. BMJ 2020;368:m441. doi:10.1136/bmj.m441',
  },
  'VAL-BIN': {
    key: 'VAL-BIN',
    citation:
      'Minimum sample size for external validation of a clinical prediction model with a binary outcome. Stat Med 2021;40(19):4230–4251. doi:10.1002/sim.9025',
  },
  'VAL-BIN-SIM': {
    key: 'VAL-BIN-SIM',
    citation:
      'Sample size for validating a risk model with a binary outcome. Stat Methods Med Res 2021;30(10):2187–2206. doi:10.1177/09622802211007522',
  },
  'VAL-SIM': {
    key: 'VAL-SIM',
    citation:
      'External validation sample size by simulation. J Clin Epidemiol 2021;135:79–89. doi:10.1016/j.jclinepi.2021.02.011',
  },
  'EVAL-BMJ': {
    key: 'EVAL-BMJ',
    citation:
      'Evaluation of clinical prediction models (part 3): calculating the sample size required for an external validation study. BMJ 2024;384:e074821. doi:10.1136/bmj-2023-074821',
  },
  'C-TO-R2': {
    key: 'C-TO-R2',
    citation:
      'A note on estimating the Cox–Snell R² from a reported C statistic (AUROC) to inform sample size calculations for developing a prediction model with a binary outcome. Stat Med 2021;40(4):859–864. doi:10.1002/sim.8806',
  },
  'NEWCOMBE-2006': {
    key: 'NEWCOMBE-2006',
    citation:
      'Newcombe RG. Confidence intervals for an effect size measure based on the Mann–Whitney statistic. Stat Med 2006;25(4):559–573',
  },
  'HANLEY-MCNEIL-1982': {
    key: 'HANLEY-MCNEIL-1982',
    citation: 'Hanley JA, McNeil BJ. The meaning and use of the area under a ROC curve. Radiology 1982;143:29–36',
  },
  'WISHART-1931': {
    key: 'WISHART-1931',
    citation:
      'Wishart J. The mean and second moment coefficient of the multiple correlation coefficient. Biometrika 1931;22:353–361',
  },
  'OLKIN-FINN-1995': {
    key: 'OLKIN-FINN-1995',
    citation: 'Olkin I, Finn JD. Correlations redux. Psychol Bull 1995;118:155–164',
  },
  'HOZO-2005': {
    key: 'HOZO-2005',
    citation:
      'Hozo SP, Djulbegovic B, Hozo I. Estimating the mean and variance from the median, range, and the size of a sample. BMC Med Res Methodol 2005;5:13',
  },
  'WAN-2014': {
    key: 'WAN-2014',
    citation:
      'Wan X, Wang W, Liu J, Tong T. Estimating the sample mean and standard deviation from the sample size, median, range and/or interquartile range. BMC Med Res Methodol 2014;14:135',
  },
  'VICKERS-ELKIN-2006': {
    key: 'VICKERS-ELKIN-2006',
    citation:
      'Vickers AJ, Elkin EB. Decision curve analysis: a novel method for evaluating prediction models. Med Decis Making 2006;26:565–574',
  },
  'MARSH-JANES-PEPE-2020': {
    key: 'MARSH-JANES-PEPE-2020',
    citation:
      'Marsh TL, Janes H, Pepe MS. Statistical inference for net benefit measures in biomarker validation studies. Biometrics 2020;76:843–852',
  },
  'HIGGINS-THOMPSON-SPIEGELHALTER-2009': {
    key: 'HIGGINS-THOMPSON-SPIEGELHALTER-2009',
    citation:
      'Higgins JPT, Thompson SG, Spiegelhalter DJ. A re-evaluation of random-effects meta-analysis. J R Stat Soc A 2009;172(1):137–159. doi:10.1111/j.1467-985X.2008.00552.x',
  },
  'DERSIMONIAN-LAIRD-1986': {
    key: 'DERSIMONIAN-LAIRD-1986',
    citation:
      'DerSimonian R, Laird N. Meta-analysis in clinical trials. Control Clin Trials 1986;7(3):177–188. doi:10.1016/0197-2456(86)90046-2',
  },
  'COMMON-PRACTICE': {
    key: 'COMMON-PRACTICE',
    citation: 'Common practice in applied statistics (no single published source).',
  },
};
