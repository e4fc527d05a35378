// Reading PDFs in tests with poppler-utils (pdfinfo, pdftotext), an independent PDF reader.
import { spawnSync } from 'node:child_process';

/** Whether pdfinfo and pdftotext can be run here. */
export const HAS_POPPLER = ['pdfinfo', 'pdftotext'].every((tool) => spawnSync(tool, ['-v']).error === undefined);

export const POPPLER_MISSING =
  'pdfinfo/pdftotext (poppler-utils) are not installed, so the PDF checks are skipped: apt-get install poppler-utils';

/** The page count pdfinfo reads from the file. */
export function pdfPageCount(file: string): number {
  const run = spawnSync('pdfinfo', [file], { encoding: 'utf8' });
  const match = /^Pages:\s+(\d+)$/m.exec(run.stdout);
  if (run.status !== 0 || match === null) throw new Error(`pdfinfo could not read ${file}: ${run.stderr}`);
  return Number(match[1]);
}

/** The text of each page (pdftotext separates pages with form feeds); `layout` keeps the columns. */
export function pdfPageTexts(file: string, layout = false): string[] {
  const run = spawnSync('pdftotext', [...(layout ? ['-layout'] : []), '-enc', 'UTF-8', file, '-'], { encoding: 'utf8' });
  if (run.status !== 0) throw new Error(`pdftotext could not read ${file}: ${run.stderr}`);
  const pages = run.stdout.split('\f');
  if (pages.at(-1)?.trim() === '') pages.pop();
  return pages;
}
