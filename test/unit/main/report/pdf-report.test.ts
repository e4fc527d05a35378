import { mkdtempSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { describe, expect, it } from 'vitest';
import { planReport } from '@shared/report/plan-report';
import { renderHtml } from '@shared/report/render-html';
import { reportRows } from '@shared/report/report-rows';
import { comparisonCells } from '@shared/summary/table-cells';
import { enginePlanner } from '@shared/summary/planner';
import { findChromium, PdfUnavailableError, printHtmlWithChromium } from '../../../../src-main/report/chromium-pdf';
import { demoProject, demoWithPopulations } from '../../report/demo-plan';
import { containsNumberText, expectedTexts } from '../../report/table-numbers';
import { HAS_POPPLER, pdfPageCount, pdfPageTexts, POPPLER_MISSING } from './pdf-tools';

const reproducibility = {
  appName: 'Plumbline',
  appVersion: 'test',
  fileName: 'consortium-continuous.plumb',
  contentHash: '0123456789abcdef'.repeat(4),
  date: '2026-01-15',
};
const FOOTLINE = /^Plumbline test · consortium-continuous\.plumb · SHA-256 0123456789abcdef…$/;
const PAGE_NUMBER = /^Page (\d+) of (\d+)$/;

async function printToFile(html: string, name: string): Promise<string> {
  const file = path.join(mkdtempSync(path.join(os.tmpdir(), 'plumbline-pdf-test-')), name);
  writeFileSync(file, await printHtmlWithChromium(html));
  return file;
}

/** A page's lines without the page-margin lines (reproducibility footline and page number). */
function bodyLines(page: string): string[] {
  return page
    .split('\n')
    .map((l) => l.trim())
    .filter((l) => l !== '' && !FOOTLINE.test(l) && !PAGE_NUMBER.test(l));
}

describe('Chromium', () => {
  it('is found at CHROMIUM_PATH or the usual places, and a wrong CHROMIUM_PATH is named in the error', async () => {
    await expect(findChromium({ CHROMIUM_PATH: '/no/such/chromium' })).rejects.toThrow(PdfUnavailableError);
    await expect(findChromium({ CHROMIUM_PATH: '/no/such/chromium' })).rejects.toThrow(
      'CHROMIUM_PATH is set to "/no/such/chromium"',
    );
    await expect(findChromium({})).resolves.toMatch(/chrom/i);
  });
});

describe.skipIf(!HAS_POPPLER)(HAS_POPPLER ? 'the PDF report' : `the PDF report (skipped: ${POPPLER_MISSING})`, () => {
  it('of the demo has the title page, then the summary, figures, justification, assumptions and references each from a new page, every page numbered', async () => {
    const project = demoProject();
    const file = await printToFile(
      renderHtml(planReport({ project, planner: enginePlanner, reproducibility })),
      'demo report.pdf',
    );
    const count = pdfPageCount(file);
    const pages = pdfPageTexts(file);
    expect(pages).toHaveLength(count);
    expect(count).toBeGreaterThanOrEqual(6);
    expect(count).toBeLessThanOrEqual(20);
    pages.forEach((page, i) => {
      const lines = page.split('\n').map((l) => l.trim());
      expect(lines, `page ${i + 1} number`).toContain(`Page ${i + 1} of ${count}`);
      // The first page carries the details in full instead of the footline.
      expect(
        lines.some((l) => FOOTLINE.test(l)),
        `page ${i + 1} footline`,
      ).toBe(i > 0);
    });
    const title = pages[0] ?? '';
    // The title breaks after a hyphen ("length-of-" / "stay"), and pdftotext joins such lines without it.
    const unhyphenated = (t: string): string => t.replace(/\s+/g, ' ').replace(/-/g, '');
    expect(unhyphenated(title)).toContain(unhyphenated(project.name));
    expect(title).toContain('2026-01-15');
    expect(title).toContain(reproducibility.contentHash);
    expect(title).not.toContain('Table 1');
    const starts = pages.map((p) => bodyLines(p)[0] ?? '');
    for (const heading of ['Summary', 'Figures', 'Sample size justification', 'Assumptions', 'References'])
      expect(starts, `a page starts with ${heading}`).toContain(heading);
    expect(starts.indexOf('Summary')).toBe(1);
    expect(starts.indexOf('Figures')).toBe(2);
  });

  it('of the demo holds every number of the comparison table in its text, as the table formats it', async () => {
    const project = demoProject();
    const file = await printToFile(
      renderHtml(planReport({ project, planner: enginePlanner, reproducibility })),
      'demo report.pdf',
    );
    const text = pdfPageTexts(file)
      .map((p) => bodyLines(p).join(' '))
      .join(' ')
      .replace(/\s+/g, ' ');
    const data = reportRows(project, enginePlanner);
    const expected = expectedTexts(comparisonCells(data.rows, data.totals), data.rows, data.totals);
    expect(expected).toHaveLength(5 * 21 + 2);
    expect(expected.filter((e) => !containsNumberText(text, e.text)).map((e) => `${e.row} / ${e.column}: ${e.text}`)).toEqual([]);
  });

  it('never splits a table row across pages and repeats the header on every page a table continues on (30 populations)', async () => {
    // Names of varied length give rows of five lines and more at varied heights, so that rows
    // fall across page ends (each row's cells alone would have split there).
    const copies = demoWithPopulations(30);
    const project = {
      ...copies,
      populations: copies.populations.map((p, i) => ({
        ...p,
        name: `${p.name}${' with a long descriptive site name'.repeat(i % 4)}`,
      })),
    };
    const file = await printToFile(
      renderHtml(planReport({ project, planner: enginePlanner, reproducibility })),
      'long report.pdf',
    );
    const pages = pdfPageTexts(file, true);
    const rowStart = /^\s*(\d+)\s{1,}(Northfield|St Brennan|Carrow|Harbour|Eastmere)/;
    const header = /^\s*Rank\s+Population\b/;
    let rowsSeen = 0;
    let continuedPages = 0;
    for (const [index, page] of pages.entries()) {
      const lines = page.split('\n').filter((l) => l.trim() !== '');
      lines.forEach((line, i) => {
        if (!header.test(line)) return;
        // Below a header (first or repeated) the next line starts a whole row, or the totals.
        const next = lines[i + 1] ?? '';
        expect(
          rowStart.test(next) || /^\s*Total\b/.test(next),
          `page ${index + 1}: after the header comes "${next.trim()}"`,
        ).toBe(true);
      });
      const firstRow = lines.findIndex((l) => rowStart.test(l));
      if (firstRow < 0) continue;
      rowsSeen += lines.filter((l) => rowStart.test(l)).length;
      const headerAbove = lines.slice(0, firstRow).some((l) => header.test(l));
      expect(headerAbove, `page ${index + 1} has table rows under a header`).toBe(true);
      const caption = lines.slice(0, firstRow).some((l) => /Table \d\./.test(l));
      if (!caption) continuedPages += 1;
    }
    expect(rowsSeen).toBe(2 * 30);
    expect(continuedPages, 'at least one table runs on to another page, so the check is not vacuous').toBeGreaterThan(0);
  });
});
