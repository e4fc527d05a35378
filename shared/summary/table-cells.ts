// The comparison table as plain cells (numbers stay numbers), the common source of the TSV copy,
// the CSV and XLSX exports and the report's table.
import type { ComparisonRow, ComparisonTotals } from './comparison';
import { criterionColumns } from './criterion-columns';

export type CellValue = string | number | null;

export interface CellTable {
  readonly header: readonly string[];
  readonly body: readonly (readonly CellValue[])[];
  readonly footer: readonly CellValue[];
}

const FEASIBILITY_WORDS = { fits: 'fits', exceeds: 'exceeds', unknown: 'unknown' } as const;

/** True when any row expects events (a binary-outcome plan): the table then has an events column. */
export function hasEvents(rows: readonly ComparisonRow[]): boolean {
  return rows.some((row) => row.events !== undefined && row.events !== null);
}

export function comparisonCells(rows: readonly ComparisonRow[], totals: ComparisonTotals): CellTable {
  const columns = criterionColumns(rows);
  const withEvents = hasEvents(rows);
  const header = [
    'Rank',
    'Population',
    ...columns.map((c) => `${c.header} (n)`),
    'Required n',
    ...(withEvents ? ['Events at required n'] : []),
    'Binding criterion',
    'Worst-case n',
    'Worst case from',
    'Missing-outcome fraction',
    'Enrolment target',
    'Enrolled per month',
    'Months to recruit',
    'Finish date',
    'Feasibility',
  ];
  const body = rows.map((row, index) => [
    index + 1,
    row.name,
    ...columns.map((c) => row.criteria.find((r) => r.id === c.id)?.n ?? null),
    row.requiredN,
    ...(withEvents ? [row.events?.whole ?? null] : []),
    row.bindingLabel,
    row.worstCase?.requiredN ?? null,
    row.worstCase?.assumption ?? null,
    row.missingOutcomeFraction,
    row.enrolmentTarget,
    row.perMonth === null ? null : Number(row.perMonth.toFixed(4)),
    row.months === null ? null : Number(row.months.toFixed(2)),
    row.finishDate,
    FEASIBILITY_WORDS[row.feasibility],
  ]);
  const footer: CellValue[] = [
    'Total',
    `${totals.populations} populations`,
    ...columns.map(() => null),
    ...(withEvents ? [null] : []),
    null,
    null,
    null,
    null,
    null,
    totals.enrolmentTarget,
    null,
    totals.longestMonths === null ? null : Number(totals.longestMonths.toFixed(2)),
    totals.longestSite === null ? null : `longest: ${totals.longestSite}`,
    totals.exceeding > 0 ? `${totals.exceeding} exceed` : null,
  ];
  return { header, body, footer };
}

/** Header, body and the footer when there is one (a table without totals has an empty footer). */
function lines(table: CellTable): (readonly CellValue[])[] {
  return table.footer.length === 0 ? [table.header, ...table.body] : [table.header, ...table.body, table.footer];
}

function tsvCell(value: CellValue): string {
  if (value === null) return '';
  return String(value).replace(/[\t\r\n]+/g, ' ');
}

/** Tab-separated text for pasting into a spreadsheet: header, rows, totals. */
export function toTsv(table: CellTable): string {
  return `${lines(table)
    .map((row) => row.map(tsvCell).join('\t'))
    .join('\n')}\n`;
}

function csvCell(value: CellValue): string {
  if (value === null) return '';
  const text = String(value);
  return /[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text;
}

/** RFC 4180 CSV: CRLF line ends, fields with commas, quotes or line breaks quoted, quotes doubled. */
export function toCsv(table: CellTable): string {
  return `${lines(table)
    .map((row) => row.map(csvCell).join(','))
    .join('\r\n')}\r\n`;
}
