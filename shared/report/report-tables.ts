// The comparison table as the printed report shows it: numbers formatted for reading (through
// shared/format/numbers.ts), split in two so that it fits an A4 page — the n of every criterion,
// then the requirement with its worst case and the recruitment arithmetic.
import type { CriterionResult } from '../engine/types';
import { formatCount, formatMonths, formatPercent, formatSignificant } from '../format/numbers';
import type { ComparisonRow } from '../summary/comparison';
import type { ReportTable } from './document';
import type { ReportRows } from './report-rows';

const FEASIBILITY_WORDS = { fits: 'fits', exceeds: 'exceeds', unknown: 'not known' } as const;

/** A criterion's n as the report prints it; ◆ marks the binding criterion. */
export function criterionCellText(result: CriterionResult | undefined, binding: string | null): string {
  if (result === undefined) return '—';
  if (result.n === null) return result.status === 'not-converged' ? 'not reached' : 'n/a';
  return result.id === binding ? `${formatCount(result.n)} ◆` : formatCount(result.n);
}

/** The required n in words when there is no number. */
export function requiredText(row: ComparisonRow): string {
  if (row.problem !== null) return 'not planned';
  if (row.requiredN === null) return row.binding === null ? '—' : 'out of reach';
  return formatCount(row.requiredN);
}

/** Table: required n by criterion, one row per population in ranked order. */
export function criterionTable({ rows, columns, totalRequiredN }: ReportRows): ReportTable {
  return {
    caption: 'Sample size by criterion and population (participants with an observed outcome)',
    header: ['Rank', 'Population', ...columns.map((c) => c.header), 'Required n'],
    numeric: [true, false, ...columns.map(() => true), true],
    rows: rows.map((row, index) => [
      String(index + 1),
      row.name,
      ...columns.map((c) =>
        criterionCellText(
          row.criteria.find((r) => r.id === c.id),
          row.binding,
        ),
      ),
      requiredText(row),
    ]),
    footer: ['', `Total (${rows.length} populations)`, ...columns.map(() => ''), formatCount(totalRequiredN)],
    note:
      '◆ marks the binding criterion, which sets the required n; n/a: not assessable (an input it needs is missing). Columns: ' +
      columns.map((c) => `${c.header}: ${c.label}`).join('; ') +
      '.',
  };
}

/** Table: the requirement, its worst case over the ranges, the enrolment target and the recruitment time. */
export function recruitmentTable({ rows, totals, totalRequiredN }: ReportRows): ReportTable {
  return {
    caption: 'Requirement, worst case and recruitment by population',
    header: [
      'Rank',
      'Population',
      'Required n',
      'Binding criterion',
      'Worst-case n',
      'Worst case from',
      'Missing outcomes',
      'Enrol',
      'Enrolled per month',
      'Months to recruit',
      'Finish',
      'Window',
    ],
    numeric: [true, false, true, false, true, false, true, true, true, true, false, false],
    rows: rows.map((row, index) => [
      String(index + 1),
      row.name,
      requiredText(row),
      row.bindingLabel ?? '—',
      row.worstCase === null
        ? 'no ranges'
        : row.worstCase.requiredN === null
          ? 'out of reach'
          : formatCount(row.worstCase.requiredN),
      row.worstCase?.assumption ?? '—',
      formatPercent(row.missingOutcomeFraction),
      formatCount(row.enrolmentTarget),
      row.perMonth === null ? '—' : formatSignificant(row.perMonth),
      row.months === null ? 'no accrual given' : formatMonths(row.months),
      row.finishDate ?? '—',
      FEASIBILITY_WORDS[row.feasibility],
    ]),
    footer: [
      '',
      totals.longestMonths === null ? 'Total' : 'Total; the longest recruitment',
      formatCount(totalRequiredN),
      '',
      '',
      '',
      '',
      formatCount(totals.enrolmentTarget),
      '',
      totals.longestMonths === null ? '' : formatMonths(totals.longestMonths),
      '',
      totals.exceeding > 0 ? `${totals.exceeding} exceed` : '',
    ],
    note: 'Enrol = required n ÷ (1 − missing-outcome fraction), rounded up. Enrolled per month = accrual × eligible × consenting. Window: whether recruitment fits the study window.',
  };
}
