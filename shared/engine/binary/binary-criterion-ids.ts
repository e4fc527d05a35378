// Criterion ids for binary outcomes: the command line, the files and the reports use these strings.

export const BINARY_VALIDATION_CRITERION_IDS = ['oe', 'slope', 'c-statistic'] as const;
export const BINARY_DEVELOPMENT_CRITERION_IDS = ['dev-shrinkage', 'dev-optimism', 'dev-overall-risk'] as const;

/** One net-benefit criterion per risk threshold, e.g. net-benefit@0.1. */
export type NetBenefitCriterionId = `net-benefit@${string}`;

export type BinaryCriterionId =
  (typeof BINARY_VALIDATION_CRITERION_IDS)[number] | (typeof BINARY_DEVELOPMENT_CRITERION_IDS)[number] | NetBenefitCriterionId;

/**
 * The id of the net-benefit criterion at threshold t, written with the threshold as given
 * (String(0.1) = "0.1"), so the id a user types on the command line matches.
 * @example netBenefitId(0.1) // "net-benefit@0.1"
 */
export function netBenefitId(threshold: number): NetBenefitCriterionId {
  return `net-benefit@${String(threshold)}`;
}
