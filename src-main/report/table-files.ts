// The comparison table and the per-criterion detail as files: CSV (RFC 4180, UTF-8) and XLSX
// (exceljs), numbers kept as numbers and finish dates as dates.
//
// The CSV starts with a UTF-8 byte-order mark. RFC 4180 permits it, standard parsers skip it
// (csv-parse with `bom: true`, Python's utf-8-sig, R's readr), and without it Excel on Windows
// reads the file in the local code page and garbles "R²", "×/÷" and "–". The command line's
// --csv, written to a pipe, has no mark.
import type { Worksheet } from 'exceljs';
import type { CellTable, CellValue } from '@shared/summary/table-cells';
import { toCsv } from '@shared/summary/table-cells';
import { CRITERIA_N_COLUMN } from '@shared/report/criteria-cells';

export const UTF8_BOM = '\uFEFF';

/** The CSV file's text: byte-order mark, then RFC 4180 records with CRLF line ends. */
export function csvFileText(table: CellTable): string {
  return `${UTF8_BOM}${toCsv(table)}`;
}

/** Excel number formats by comparison-table header; other numeric columns are whole counts. */
const COMPARISON_FORMATS: Readonly<Record<string, string>> = {
  'Missing-outcome fraction': '0.0%',
  'Enrolled per month': '0.0###',
  'Months to recruit': '0.00',
};

const ISO_DATE = /^(\d{4})-(\d{2})-(\d{2})$/;

/** A cell for the sheet: numbers stay numbers, YYYY-MM-DD becomes a date, empty stays empty. */
export function sheetValue(value: CellValue): string | number | Date | null {
  if (typeof value === 'string') {
    const m = ISO_DATE.exec(value);
    if (m !== null) return new Date(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
  }
  return value;
}

export interface WorkbookContent {
  readonly comparison: CellTable;
  readonly criteria: CellTable;
  /** Label and value lines for the About sheet (plan, date, version, hash, cautions). */
  readonly about: readonly (readonly [string, string])[];
}

function fillSheet(
  sheet: Worksheet,
  table: CellTable,
  formatFor: (column: number) => string | undefined,
  wrapColumns: ReadonlySet<number>,
): void {
  sheet.addRow([...table.header]);
  for (const row of table.body) sheet.addRow(row.map(sheetValue));
  if (table.footer.length > 0) sheet.addRow(table.footer.map(sheetValue)).font = { bold: true };
  sheet.getRow(1).font = { bold: true };
  sheet.views = [{ state: 'frozen', ySplit: 1 }];
  table.header.forEach((title, i) => {
    const column = sheet.getColumn(i + 1);
    const longest = Math.max(
      title.length,
      ...table.body.map((r) => (r[i] === null || r[i] === undefined ? 0 : String(r[i]).length)),
    );
    column.width = Math.min(wrapColumns.has(i) ? 60 : 40, Math.max(8, longest + 2));
    const format = formatFor(i);
    column.eachCell({ includeEmpty: false }, (cell, rowNumber) => {
      if (rowNumber === 1) {
        cell.alignment = { wrapText: true, vertical: 'bottom' };
        return;
      }
      if (cell.value instanceof Date) cell.numFmt = 'yyyy-mm-dd';
      else if (typeof cell.value === 'number' && format !== undefined) cell.numFmt = format;
      if (wrapColumns.has(i)) cell.alignment = { wrapText: true, vertical: 'top' };
    });
  });
}

/**
 * The XLSX workbook: a Comparison sheet, a Criteria sheet (one row per population × criterion)
 * and an About sheet. exceljs is loaded on first use, so starting the app does not pay for it.
 */
export async function xlsxFileBytes(content: WorkbookContent): Promise<Uint8Array> {
  const { default: ExcelJS } = await import('exceljs');
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Plumbline';
  const comparison = workbook.addWorksheet('Comparison');
  fillSheet(comparison, content.comparison, (i) => COMPARISON_FORMATS[content.comparison.header[i] ?? ''] ?? '#,##0', new Set());
  const criteria = workbook.addWorksheet('Criteria');
  const textColumns = new Set(
    ['Target', 'Formula', 'References', 'Intermediates', 'Reason'].map((h) => content.criteria.header.indexOf(h)),
  );
  fillSheet(criteria, content.criteria, (i) => (i === CRITERIA_N_COLUMN ? '#,##0' : undefined), textColumns);
  const about = workbook.addWorksheet('About');
  for (const [label, value] of content.about) about.addRow([label, value]);
  about.getColumn(1).width = 28;
  about.getColumn(2).width = 100;
  about.getColumn(1).font = { bold: true };
  const buffer = await workbook.xlsx.writeBuffer();
  return new Uint8Array(buffer);
}
