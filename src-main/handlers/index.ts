// The handler table: one function per channel of the contract, checked by the type below.
import type { Channel } from '@shared/model/channels';
import type { ParsedRequestOf, ResponseOf } from '@shared/model/contract';
import type { HandlerContext } from './context';
import { appInfo } from './app-info';
import { loadDemo } from './load-demo';
import { chooseFile, listFolder } from './file-choice';
import * as planFiles from './plan-files';
import { exportReport, exportTable } from './report-exports';

export type Handlers = {
  readonly [C in Channel]: (request: ParsedRequestOf<C>, ctx: HandlerContext) => Promise<ResponseOf<C>>;
};

export const handlers: Handlers = {
  appInfo,
  loadDemo,
  ...planFiles,
  chooseFile,
  listFolder,
  exportReport,
  exportTable,
};
