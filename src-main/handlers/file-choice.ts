import { readdir } from 'node:fs/promises';
import path from 'node:path';
import { FILE_EXTENSION } from '@shared/model/project';
import type { ParsedRequestOf, ResponseOf } from '@shared/model/contract';
import type { FileFilter, HandlerContext } from './context';
import { HandlerError } from './handler-error';

const TITLES = {
  open: 'Open a plan',
  save: 'Save the plan',
  import: 'Import populations from a plan',
  export: 'Export the population as a plan',
  'report-pdf': 'Save the report as PDF',
  'report-md': 'Save the report as Markdown',
  'table-csv': 'Export the table as CSV',
  'table-xlsx': 'Export the tables as an Excel workbook',
} as const;

/** The file type of each save that is not a plan file. */
const FILTERS: Readonly<Partial<Record<keyof typeof TITLES, FileFilter>>> = {
  'report-pdf': { name: 'PDF document', extensions: ['pdf'] },
  'report-md': { name: 'Markdown text', extensions: ['md'] },
  'table-csv': { name: 'CSV table', extensions: ['csv'] },
  'table-xlsx': { name: 'Excel workbook', extensions: ['xlsx'] },
};

/** A native file dialog where the host has one (desktop); the browser host answers native: false and the page shows its own picker. */
export async function chooseFile(request: ParsedRequestOf<'chooseFile'>, ctx: HandlerContext): Promise<ResponseOf<'chooseFile'>> {
  if (ctx.dialogs === undefined) return { native: false, path: null };
  const title = TITLES[request.purpose];
  const defaultPath = request.suggestedName === undefined ? ctx.documentsDir : path.join(ctx.documentsDir, request.suggestedName);
  const filter = FILTERS[request.purpose];
  const chosen =
    request.purpose === 'open' || request.purpose === 'import'
      ? await ctx.dialogs.chooseOpenPath({ title, defaultPath: ctx.documentsDir })
      : await ctx.dialogs.chooseSavePath({ title, defaultPath, ...(filter === undefined ? {} : { filters: [filter] }) });
  return { native: true, path: chosen };
}

/** Folders and plan files in a folder (the documents folder by default), for the in-page picker. */
export async function listFolder(request: ParsedRequestOf<'listFolder'>, ctx: HandlerContext): Promise<ResponseOf<'listFolder'>> {
  const folder = path.resolve(request.path ?? ctx.documentsDir);
  let entries;
  try {
    entries = await readdir(folder, { withFileTypes: true });
  } catch (error) {
    const code = typeof error === 'object' && error !== null && 'code' in error ? String(error.code) : '';
    throw new HandlerError(
      code === 'ENOENT' ? 'not-found' : 'io-error',
      `The folder "${folder}" could not be listed${code ? ` (${code})` : ''}.`,
    );
  }
  const listed = entries
    .filter((e) => !e.name.startsWith('.') && (e.isDirectory() || (e.isFile() && e.name.endsWith(FILE_EXTENSION))))
    .map((e) => ({
      name: e.name,
      path: path.join(folder, e.name),
      kind: e.isDirectory() ? ('folder' as const) : ('plan' as const),
    }))
    .sort((a, b) => (a.kind === b.kind ? a.name.localeCompare(b.name) : a.kind === 'folder' ? -1 : 1));
  const parent = path.dirname(folder);
  return { path: folder, parent: parent === folder ? null : parent, entries: listed };
}
