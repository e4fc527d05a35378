// The table exports as the handler and tests use them: which table, which format, and the About
// lines that make a workbook traceable to its plan.
import path from 'node:path';
import type { Project } from '@shared/model/project';
import { planContentHash } from '@shared/report/content-hash';
import { criteriaCells } from '@shared/report/criteria-cells';
import { reportRows } from '@shared/report/report-rows';
import type { Planner } from '@shared/summary/comparison';
import { comparisonCells } from '@shared/summary/table-cells';
import { CAUTIONS } from '@shared/text/cautions';
import { localDate } from './report-files';
import { csvFileText, xlsxFileBytes } from './table-files';

export type TableExport = { readonly format: 'csv'; readonly table: 'comparison' | 'criteria' } | { readonly format: 'xlsx' };

export interface TableExportRequest {
  readonly project: Project;
  readonly planner: Planner;
  readonly what: TableExport;
  readonly planPath: string | null;
  readonly appName: string;
  readonly appVersion: string;
  readonly date?: string;
}

/** The file's content: CSV text (with its byte-order mark) or the XLSX bytes. */
export async function tableFileContent(request: TableExportRequest): Promise<string | Uint8Array> {
  const data = reportRows(request.project, request.planner);
  const comparison = comparisonCells(data.rows, data.totals);
  const criteria = criteriaCells(data.rows);
  if (request.what.format === 'csv') return csvFileText(request.what.table === 'comparison' ? comparison : criteria);
  const about: [string, string][] = [
    ['Plan', request.project.name],
    ['Plan file', request.planPath === null ? 'not saved yet' : path.basename(request.planPath)],
    ['Made with', `${request.appName} ${request.appVersion}`],
    ['Date', request.date ?? localDate()],
    ['Plan SHA-256 (canonical JSON)', await planContentHash(request.project)],
    ...CAUTIONS.map((c, i): [string, string] => [i === 0 ? 'Cautions' : '', c]),
  ];
  return xlsxFileBytes({ comparison, criteria, about });
}
