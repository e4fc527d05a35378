// The command line's --report, run as users run it: `node scripts/plan.mjs …` in a child process.
import { execFile } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { formatCount } from '@shared/format/numbers';
import { reportRows } from '@shared/report/report-rows';
import { comparisonCells } from '@shared/summary/table-cells';
import { cliPlanner } from '../../../src-main/cli/planner';
import { HAS_POPPLER, pdfPageCount, pdfPageTexts, POPPLER_MISSING } from '../main/report/pdf-tools';
import { demoProject } from '../report/demo-plan';
import { containsNumberText, expectedTexts } from '../report/table-numbers';

const root = path.resolve(import.meta.dirname, '../../..');
const script = path.join(root, 'scripts', 'plan.mjs');
const work = mkdtempSync(path.join(tmpdir(), 'plumbline report cli '));

function plan(args: string[], env: NodeJS.ProcessEnv = process.env): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [script, ...args], { cwd: root, timeout: 90_000, env }, (error, stdout, stderr) => {
      resolve({ code: error === null ? 0 : typeof error.code === 'number' ? error.code : -1, stdout, stderr });
    });
  });
}

const data = reportRows(demoProject(), cliPlanner);
const expected = expectedTexts(comparisonCells(data.rows, data.totals), data.rows, data.totals);

describe('plan --report', () => {
  it('--demo --report file.md writes the Markdown report holding every number of the comparison table', async () => {
    const file = path.join(work, 'demo report.md');
    const run = await plan(['--demo', '--report', file]);
    expect(run.stderr).toBe('');
    expect(run.code).toBe(0);
    expect(run.stdout).toBe(`Wrote the report to ${file}.\n`);
    const text = readFileSync(file, 'utf8').replace(/\\/g, '');
    expect(text).toContain('## Sample size justification');
    expect(expected.filter((e) => !containsNumberText(text, e.text)).map((e) => `${e.row} / ${e.column}`)).toEqual([]);
  });

  it.skipIf(!HAS_POPPLER)(
    HAS_POPPLER
      ? '--report=file.pdf writes a PDF whose text holds the required n of every population'
      : `PDF check skipped: ${POPPLER_MISSING}`,
    async () => {
      const file = path.join(work, 'demo report.pdf');
      const run = await plan(['--demo', `--report=${file}`]);
      expect(run.code).toBe(0);
      expect(pdfPageCount(file)).toBeGreaterThanOrEqual(6);
      const text = pdfPageTexts(file).join(' ').replace(/\s+/g, ' ');
      for (const row of data.rows) expect(containsNumberText(text, formatCount(row.requiredN))).toBe(true);
    },
  );

  it('refuses a file type it cannot write, a missing file name and a format option beside it (exit 2)', async () => {
    for (const args of [
      ['--demo', '--report', path.join(work, 'r.docx')],
      ['--demo', '--report'],
      ['--demo', '--json', '--report', path.join(work, 'r.md')],
    ]) {
      const run = await plan(args);
      expect(run.code, args.join(' ')).toBe(2);
      expect(run.stderr).toMatch(/^plan: .*(--report|file name)/);
    }
    expect(existsSync(path.join(work, 'r.md'))).toBe(false);
  });

  it('says why no PDF was made when CHROMIUM_PATH points nowhere (exit 1)', async () => {
    const run = await plan(['--demo', '--report', path.join(work, 'none.pdf')], {
      ...process.env,
      CHROMIUM_PATH: '/nowhere/chromium',
    });
    expect(run.code).toBe(1);
    expect(run.stderr).toContain('CHROMIUM_PATH is set to "/nowhere/chromium"');
    expect(existsSync(path.join(work, 'none.pdf'))).toBe(false);
  });
});
