import ExcelJS from 'exceljs';
import { parse } from 'csv-parse/sync';
import { describe, expect, it } from 'vitest';
import { criteriaCells } from '@shared/report/criteria-cells';
import { reportRows } from '@shared/report/report-rows';
import type { CellTable, CellValue } from '@shared/summary/table-cells';
import { comparisonCells } from '@shared/summary/table-cells';
import { enginePlanner } from '@shared/summary/planner';
import { csvFileText, UTF8_BOM, xlsxFileBytes } from '../../../../src-main/report/table-files';
import { demoProject } from '../../report/demo-plan';

const data = reportRows(demoProject(), enginePlanner);
const comparison = comparisonCells(data.rows, data.totals);
const criteria = criteriaCells(data.rows);

/** Every record of a table as a CSV parser should read it back: empty for null, numbers as JavaScript writes them. */
function asCsvRecords(table: CellTable): string[][] {
  const records = [table.header, ...table.body, ...(table.footer.length > 0 ? [table.footer] : [])];
  return records.map((r) => r.map((v) => (v === null ? '' : String(v))));
}

describe('CSV export', () => {
  for (const [name, table] of [
    ['comparison', comparison],
    ['criteria', criteria],
  ] as const) {
    it(`${name}: starts with a UTF-8 byte-order mark and round-trips through csv-parse (RFC 4180), line breaks in cells included`, () => {
      const text = csvFileText(table);
      expect(text.startsWith(UTF8_BOM)).toBe(true);
      expect(text.slice(1, 2)).not.toBe(UTF8_BOM);
      const parsed: string[][] = parse(Buffer.from(text, 'utf8'), {
        bom: true,
        relax_column_count: false,
        record_delimiter: '\r\n',
      });
      expect(parsed).toEqual(asCsvRecords(table));
    });
  }

  it('criteria: one row per population and criterion (5 × 9), references with line breaks', () => {
    expect(criteria.body).toHaveLength(5 * 9);
    expect(criteria.body.some((r) => String(r[10]).includes('\n'))).toBe(true);
  });
});

function expectCell(actual: ExcelJS.CellValue, expected: CellValue, where: string): void {
  if (expected === null) expect(actual, where).toBeNull();
  else if (typeof expected === 'number') {
    expect(typeof actual, `${where} is a number`).toBe('number');
    expect(actual, where).toBe(expected);
  } else if (/^\d{4}-\d{2}-\d{2}$/.test(expected)) {
    expect(actual, `${where} is a date`).toBeInstanceOf(Date);
    expect((actual as Date).toISOString().slice(0, 10), where).toBe(expected);
  } else expect(actual, where).toBe(expected);
}

describe('XLSX export', () => {
  it('opens in exceljs with the comparison, criteria and About sheets, every cell as exported: numbers as numbers, dates as dates', async () => {
    const bytes = await xlsxFileBytes({ comparison, criteria, about: [['Plan', 'demo']] });
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load(bytes.slice().buffer);
    expect(workbook.worksheets.map((w) => w.name)).toEqual(['Comparison', 'Criteria', 'About']);
    let checked = 0;
    for (const [sheetName, table] of [
      ['Comparison', comparison],
      ['Criteria', criteria],
    ] as const) {
      const sheet = workbook.getWorksheet(sheetName);
      if (sheet === undefined) throw new Error(`no sheet ${sheetName}`);
      const records = [table.header, ...table.body, ...(table.footer.length > 0 ? [table.footer] : [])];
      expect(sheet.rowCount).toBe(records.length);
      records.forEach((record, r) => {
        record.forEach((value, c) => {
          expectCell(sheet.getRow(r + 1).getCell(c + 1).value, value, `${sheetName}!R${r + 1}C${c + 1}`);
          checked += 1;
        });
      });
    }
    expect(checked).toBe((5 + 2) * 21 + (5 * 9 + 1) * 13);
    const n = workbook.getWorksheet('Comparison')?.getRow(2).getCell(3);
    expect(n?.numFmt).toBe('#,##0');
    expect(workbook.getWorksheet('About')?.getRow(1).getCell(2).value).toBe('demo');
  });
});
