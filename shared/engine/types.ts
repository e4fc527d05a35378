// Result shapes shared by every criterion, so the table, the report and the command line
// read one structure whatever the outcome type.

/** Keys of the published sources (see shared/engine/references.ts). */
export type ReferenceKey =
  | 'VAL-CONT'
  | 'DEV-CONT'
  | 'DEV-BIN-SURV'
  | 'DEV-BMJ'
  | 'VAL-BIN'
  | 'VAL-BIN-SIM'
  | 'VAL-SIM'
  | 'EVAL-BMJ'
  | 'C-TO-R2'
  | 'NEWCOMBE-2006'
  | 'HANLEY-MCNEIL-1982'
  | 'WISHART-1931'
  | 'OLKIN-FINN-1995'
  | 'HOZO-2005'
  | 'WAN-2014'
  | 'VICKERS-ELKIN-2006'
  | 'MARSH-JANES-PEPE-2020'
  | 'HIGGINS-THOMPSON-SPIEGELHALTER-2009'
  | 'DERSIMONIAN-LAIRD-1986'
  | 'COMMON-PRACTICE';

export type CriterionPurpose = 'validation' | 'development';

/**
 * ok: n is the smallest integer meeting the target.
 * not-assessable: an input the criterion needs is missing (reason says which).
 * not-converged: a numerical search failed; n is null and reason says why.
 * always-met: the criterion holds for every admissible n (n is its smallest admissible n).
 */
export type CriterionStatus = 'ok' | 'not-assessable' | 'not-converged' | 'always-met';

export interface Intermediate {
  readonly name: string;
  readonly value: number;
}

export interface CriterionResult {
  readonly id: string;
  readonly label: string;
  readonly purpose: CriterionPurpose;
  readonly status: CriterionStatus;
  readonly n: number | null;
  readonly reason?: string;
  /** The precision target in words, e.g. "95% CI width ≤ 0.1". */
  readonly target: string;
  /** The formula in plain text, for the report and tooltips. */
  readonly formula: string;
  readonly references: readonly ReferenceKey[];
  /** Quantities a reviewer needs to audit the number (σ²_CITL, fitted μ and σ, …). */
  readonly intermediates: readonly Intermediate[];
}

/** What a fixed n would deliver for one measure. */
export interface PrecisionAtN {
  readonly id: string;
  readonly label: string;
  readonly n: number;
  readonly se: number | null;
  /** Width of the CI on the measure's own scale (multiplicative factor for ratio measures). */
  readonly achieved: number | null;
  readonly targetValue: number;
  /** How `achieved` and `targetValue` are read, e.g. "95% CI width" or "multiplicative margin". */
  readonly scale: string;
  readonly meets: boolean | null;
  readonly reason?: string;
}
