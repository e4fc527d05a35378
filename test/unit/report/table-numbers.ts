// How the justification text writes each number of the comparison table, column by column,
// through shared/format/numbers.ts: the check that the text holds every number of the table.
import { formatCount, formatMonths, formatPercent, formatSignificant } from '@shared/format/numbers';
import type { ComparisonRow, ComparisonTotals } from '@shared/summary/comparison';
import type { CellTable, CellValue } from '@shared/summary/table-cells';

export interface ExpectedText {
  readonly column: string;
  readonly row: string;
  readonly text: string;
}

const COUNT_COLUMNS = /\(n\)$|^Rank$|^Required n$|^Worst-case n$|^Enrolment target$/;

/**
 * The text each numeric or text cell should appear as. Months are shown the way the workspace
 * table shows them, from the row's unrounded months (the cell holds them to two decimals, and
 * rounding 19.846 to 19.85 and then to one decimal would give 19.9, not the 19.8 on screen).
 */
export function expectedTexts(table: CellTable, rows: readonly ComparisonRow[], totals: ComparisonTotals): ExpectedText[] {
  const out: ExpectedText[] = [];
  table.body.forEach((cells, r) => {
    const row = rows[r];
    if (row === undefined) throw new Error(`no comparison row for table row ${r}`);
    cells.forEach((value: CellValue, c) => {
      const column = table.header[c] ?? '';
      if (value === null) return;
      let text: string;
      if (typeof value === 'number') {
        if (COUNT_COLUMNS.test(column)) text = formatCount(value);
        else if (column === 'Missing-outcome fraction') text = formatPercent(value);
        else if (column === 'Enrolled per month') text = formatSignificant(value);
        else if (column === 'Months to recruit') text = formatMonths(row.months);
        else throw new Error(`no rule for the numeric column "${column}"`);
      } else if (column === 'Feasibility') {
        text = value === 'fits' ? 'within the' : value === 'exceeds' ? 'beyond the' : 'not known';
      } else text = value;
      out.push({ column, row: row.name, text });
    });
  });
  out.push({ column: 'total enrolment', row: 'Total', text: formatCount(totals.enrolmentTarget) });
  if (totals.longestMonths !== null)
    out.push({ column: 'longest months', row: 'Total', text: formatMonths(totals.longestMonths) });
  return out;
}

/** True when `needle` occurs in `text` as a whole number, not inside a longer one ("234" in "1,234"). */
export function containsNumberText(text: string, needle: string): boolean {
  const escaped = needle.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
  return new RegExp(`(?<![\\d.,])${escaped}(?![\\d]|[.,]\\d)`).test(text);
}
