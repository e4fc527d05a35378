// Handlers for the report and table exports: render the plan's report (PDF through the host's
// printToPdf, Markdown or text) or its tables (CSV, XLSX) and write the file atomically.
import type { ParsedRequestOf, ResponseOf } from '@shared/model/contract';
import { enginePlanner } from '@shared/summary/planner';
import { PdfUnavailableError } from '../report/chromium-pdf';
import { REPORT_EXTENSIONS, reportFileContent, withExtension } from '../report/report-files';
import { tableFileContent } from '../report/table-export';
import { writeFileAtomic } from '../store/atomic-write';
import type { HandlerContext } from './context';
import { HandlerError } from './handler-error';
import { unwrap } from './store-for';

async function writeExport(path: string, content: string | Uint8Array, what: string): Promise<ResponseOf<'exportReport'>> {
  unwrap(await writeFileAtomic(path, content, { action: `write the ${what} to` }));
  return { path, bytes: typeof content === 'string' ? new TextEncoder().encode(content).length : content.length };
}

export async function exportReport(
  request: ParsedRequestOf<'exportReport'>,
  ctx: HandlerContext,
): Promise<ResponseOf<'exportReport'>> {
  const path = withExtension(request.path, REPORT_EXTENSIONS[request.format]);
  let content: string | Uint8Array;
  try {
    content = await reportFileContent({
      project: request.project,
      planner: enginePlanner,
      format: request.format,
      planPath: request.planPath,
      appName: ctx.appName,
      appVersion: ctx.appVersion,
      ...(ctx.printToPdf === undefined ? {} : { printToPdf: ctx.printToPdf }),
    });
  } catch (error) {
    if (error instanceof PdfUnavailableError) throw new HandlerError('pdf-unavailable', error.message);
    throw error;
  }
  return writeExport(path, content, 'report');
}

export async function exportTable(
  request: ParsedRequestOf<'exportTable'>,
  ctx: HandlerContext,
): Promise<ResponseOf<'exportTable'>> {
  const path = withExtension(request.path, request.format === 'csv' ? '.csv' : '.xlsx');
  const content = await tableFileContent({
    project: request.project,
    planner: enginePlanner,
    what: request.format === 'csv' ? { format: 'csv', table: request.table } : { format: 'xlsx' },
    planPath: request.planPath,
    appName: ctx.appName,
    appVersion: ctx.appVersion,
  });
  return writeExport(path, content, request.format === 'csv' ? 'CSV file' : 'workbook');
}
