// What every part of the report reads: the comparison rows in the table's default order (ranked
// by required n), their totals and criterion columns, computed once per report.
import type { Project } from '../model/project';
import type { ComparisonRow, ComparisonTotals, Planner } from '../summary/comparison';
import { comparisonRows, comparisonTotals, rankByRequiredN } from '../summary/comparison';
import type { CriterionColumn } from '../summary/criterion-columns';
import { criterionColumns } from '../summary/criterion-columns';

export interface ReportRows {
  readonly project: Project;
  /** Ranked by required n, largest first (the table's default order). */
  readonly rows: readonly ComparisonRow[];
  readonly totals: ComparisonTotals;
  readonly columns: readonly CriterionColumn[];
  /** Sum of the required n; null when a population's requirement is unknown. */
  readonly totalRequiredN: number | null;
}

/** Plans every population with `planner` and ranks the rows as the table does. */
export function reportRows(project: Project, planner: Planner): ReportRows {
  const rows = rankByRequiredN(comparisonRows(project, planner));
  const totalRequiredN = rows.reduce<number | null>(
    (sum, row) => (sum === null || row.requiredN === null ? null : sum + row.requiredN),
    0,
  );
  return { project, rows, totals: comparisonTotals(rows), columns: criterionColumns(rows), totalRequiredN };
}
