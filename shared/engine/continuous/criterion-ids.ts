// Criterion ids: the command line, the files and the reports all use these exact strings.

export const VALIDATION_CRITERION_IDS = ['r2', 'citl', 'slope', 'residual-sd-citl', 'residual-sd-slope'] as const;
export const DEVELOPMENT_CRITERION_IDS = ['dev-shrinkage', 'dev-optimism', 'dev-residual-sd', 'dev-intercept'] as const;

export type ValidationCriterionId = (typeof VALIDATION_CRITERION_IDS)[number];
export type DevelopmentCriterionId = (typeof DEVELOPMENT_CRITERION_IDS)[number];
export type ContinuousCriterionId = ValidationCriterionId | DevelopmentCriterionId;
