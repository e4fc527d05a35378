import { mkdtempSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { parse } from 'csv-parse/sync';
import ExcelJS from 'exceljs';
import { describe, expect, it } from 'vitest';
import type { Envelope } from '@shared/model/channels';
import { dispatch } from '../../../../src-main/handlers/dispatch';
import { testHandlerContext } from '../../helpers/handler-context';
import { chromiumPrinter } from '../../../../src-main/report/chromium-pdf';
import { demoProject } from '../../report/demo-plan';

const { base, ctx } = testHandlerContext('exports');
const project = demoProject();

/** The error of a refused call (fails the test when the call succeeded). */
function failure(answer: Envelope<unknown>): { code: string; message: string } {
  if (answer.ok) throw new Error('the call was expected to fail');
  return answer.error;
}
const folder = mkdtempSync(path.join(base, 'Dokumente ü '));

describe('exportReport', () => {
  it('writes the Markdown report, adding .md to a name without it, with the plan file named in its footer', async () => {
    const answer = await dispatch(
      'exportReport',
      { project, planPath: '/plans/coastal five.plumb', format: 'md', path: path.join(folder, 'report') },
      ctx,
    );
    expect(answer).toMatchObject({ ok: true, value: { path: path.join(folder, 'report.md') } });
    const text = readFileSync(path.join(folder, 'report.md'), 'utf8');
    expect(text).toContain('# Coastal Five consortium');
    expect(text).toContain('Plan file: coastal five.plumb.');
    expect(answer).toMatchObject({ value: { bytes: Buffer.byteLength(text) } });
  });

  it('answers pdf-unavailable with the reason where the host cannot print', async () => {
    const answer = await dispatch(
      'exportReport',
      { project, planPath: null, format: 'pdf', path: path.join(folder, 'r.pdf') },
      ctx,
    );
    expect(failure(answer)).toMatchObject({ code: 'pdf-unavailable' });
    expect(failure(answer).message).toContain('cannot print PDFs');
  });

  it('prints the PDF through the host’s printToPdf (here headless Chromium)', async () => {
    const answer = await dispatch(
      'exportReport',
      { project, planPath: null, format: 'pdf', path: path.join(folder, 'report.PDF') },
      { ...ctx, printToPdf: chromiumPrinter() },
    );
    expect(answer).toMatchObject({ ok: true, value: { path: path.join(folder, 'report.PDF') } });
    expect(readFileSync(path.join(folder, 'report.PDF')).subarray(0, 5).toString('latin1')).toBe('%PDF-');
  });

  it('refuses an unknown format and a request without the plan path, naming the field', async () => {
    const bad = await dispatch('exportReport', { project, planPath: null, format: 'docx', path: path.join(folder, 'x') }, ctx);
    expect(failure(bad)).toMatchObject({ code: 'invalid-request' });
    expect(failure(bad).message).toContain('format');
    const missing = await dispatch('exportReport', { project, format: 'md', path: path.join(folder, 'x') }, ctx);
    expect(failure(missing)).toMatchObject({ code: 'invalid-request' });
    expect(failure(missing).message).toContain('planPath');
  });

  it('says which file could not be written', async () => {
    const answer = await dispatch(
      'exportReport',
      { project, planPath: null, format: 'txt', path: path.join(folder, 'no such folder', 'r.txt') },
      ctx,
    );
    expect(failure(answer)).toMatchObject({ code: 'not-found' });
    expect(failure(answer).message).toContain('no such folder');
  });
});

describe('exportTable', () => {
  it('writes either table as CSV', async () => {
    for (const table of ['comparison', 'criteria'] as const) {
      const answer = await dispatch(
        'exportTable',
        { project, planPath: null, format: 'csv', table, path: path.join(folder, table) },
        ctx,
      );
      expect(answer).toMatchObject({ ok: true, value: { path: path.join(folder, `${table}.csv`) } });
      const records: string[][] = parse(readFileSync(path.join(folder, `${table}.csv`)), { bom: true });
      expect(records[0]?.[0]).toBe(table === 'comparison' ? 'Rank' : 'Population id');
      expect(records).toHaveLength(table === 'comparison' ? 1 + 5 + 1 : 1 + 5 * 9);
    }
  });

  it('writes the workbook with both tables and the plan’s hash on the About sheet', async () => {
    const answer = await dispatch(
      'exportTable',
      { project, planPath: '/x/plan.plumb', format: 'xlsx', path: path.join(folder, 'tables.xlsx') },
      ctx,
    );
    expect(answer).toMatchObject({ ok: true });
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.readFile(path.join(folder, 'tables.xlsx'));
    const about = workbook.getWorksheet('About');
    const rows = about?.getSheetValues().filter((r) => Array.isArray(r)) as unknown[][];
    expect(rows.map((r) => r[1])).toContain('Plan SHA-256 (canonical JSON)');
    expect(rows.find((r) => r[1] === 'Plan file')?.[2]).toBe('plan.plumb');
  });

  it('refuses a table choice for the workbook and a CSV without one', async () => {
    const withTable = await dispatch(
      'exportTable',
      { project, planPath: null, format: 'xlsx', table: 'comparison', path: path.join(folder, 'x') },
      ctx,
    );
    expect(withTable).toMatchObject({ ok: false, error: { code: 'invalid-request' } });
    const without = await dispatch('exportTable', { project, planPath: null, format: 'csv', path: path.join(folder, 'x') }, ctx);
    expect(failure(without)).toMatchObject({ code: 'invalid-request' });
    expect(failure(without).message).toContain('table');
  });
});
