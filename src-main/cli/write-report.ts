// --report <file>: the plan's report written to a file (PDF through headless Chromium, Markdown or
// plain text), with one line on stdout saying where it went.
import type { Project } from '@shared/model/project';
import { APP_NAME, APP_VERSION } from '../app-meta';
import { chromiumPrinter, PdfUnavailableError } from '../report/chromium-pdf';
import { reportFileContent, reportFormatOf } from '../report/report-files';
import { writeFileAtomic } from '../store/atomic-write';
import { cliPlanner } from './planner';

/** Where the command writes its messages. */
export interface ReportIo {
  readonly stdout: (text: string) => void;
  readonly stderr: (text: string) => void;
}

/** Writes the report of `project` (read from `planPath`) to `target`; resolves to whether it was written. */
export async function writeReportFile(project: Project, planPath: string, target: string, io: ReportIo): Promise<boolean> {
  const format = reportFormatOf(target);
  if (format === null) {
    io.stderr(`plan: --report writes a .pdf, .md or .txt file (got ${target})\n`);
    return false;
  }
  let content: string | Uint8Array;
  try {
    content = await reportFileContent({
      project,
      planner: cliPlanner,
      format,
      planPath,
      appName: APP_NAME,
      appVersion: APP_VERSION,
      printToPdf: chromiumPrinter(),
    });
  } catch (error) {
    const reason = error instanceof PdfUnavailableError || error instanceof Error ? error.message : String(error);
    io.stderr(`plan: the report could not be made: ${reason}\n`);
    return false;
  }
  const written = await writeFileAtomic(target, content, { action: 'write the report to' });
  if (!written.ok) {
    io.stderr(`plan: ${written.error.message}\n`);
    return false;
  }
  io.stdout(`Wrote the report to ${target}.\n`);
  return true;
}
