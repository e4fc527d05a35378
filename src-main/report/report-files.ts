// What an exported report file holds, for each format: the same document rendered as a PDF (by
// the host's Chromium), as Markdown or as plain text. Used by the exportReport handler and the
// command line's --report.
import path from 'node:path';
import type { Project } from '@shared/model/project';
import { planContentHash } from '@shared/report/content-hash';
import type { ExtraSection } from '@shared/report/plan-justification';
import { planReport } from '@shared/report/plan-report';
import { renderHtml } from '@shared/report/render-html';
import { renderMarkdown } from '@shared/report/render-markdown';
import { renderText } from '@shared/report/render-text';
import type { Planner } from '@shared/summary/comparison';
import { pooledReportSections } from '@shared/summary/pooled-report-section';
import { PdfUnavailableError } from './chromium-pdf';

export type ReportFormat = 'pdf' | 'md' | 'txt';

export const REPORT_EXTENSIONS: Readonly<Record<ReportFormat, string>> = { pdf: '.pdf', md: '.md', txt: '.txt' };

/** The report format a file name asks for, from its extension; null for any other. */
export function reportFormatOf(file: string): ReportFormat | null {
  const extension = path.extname(file).toLowerCase();
  const found = (Object.entries(REPORT_EXTENSIONS) as [ReportFormat, string][]).find(([, ext]) => ext === extension);
  return found === undefined ? null : found[0];
}

/** The path with `extension` added unless it already ends with it (in any letter case). */
export function withExtension(file: string, extension: string): string {
  return file.toLowerCase().endsWith(extension) ? file : `${file}${extension}`;
}

/** Today's date on this computer, YYYY-MM-DD. */
export function localDate(now: Date = new Date()): string {
  const pad = (n: number): string => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

export interface ReportFileRequest {
  readonly project: Project;
  readonly planner: Planner;
  readonly format: ReportFormat;
  /** The plan's file, for the reproducibility footer (its name only is printed); null when unsaved. */
  readonly planPath: string | null;
  readonly appName: string;
  readonly appVersion: string;
  readonly date?: string;
  readonly printToPdf?: (html: string) => Promise<Uint8Array>;
  readonly extraSections?: readonly ExtraSection[];
}

/** The bytes (PDF) or text (Markdown, plain text) of the report. */
export async function reportFileContent(request: ReportFileRequest): Promise<Uint8Array | string> {
  const doc = planReport({
    project: request.project,
    planner: request.planner,
    // The across-sites section (pooled and both aims) comes first among the extra sections.
    extraSections: [...pooledReportSections(request.project), ...(request.extraSections ?? [])],
    reproducibility: {
      appName: request.appName,
      appVersion: request.appVersion,
      fileName: request.planPath === null ? null : path.basename(request.planPath),
      contentHash: await planContentHash(request.project),
      date: request.date ?? localDate(),
    },
  });
  if (request.format === 'md') return renderMarkdown(doc);
  if (request.format === 'txt') return renderText(doc);
  if (request.printToPdf === undefined)
    throw new PdfUnavailableError('This host cannot print PDFs; save the report as Markdown instead.');
  return request.printToPdf(renderHtml(doc));
}
