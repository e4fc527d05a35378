import type { ParsedRequestOf, ResponseOf } from '@shared/model/contract';
import type { HandlerContext } from './context';

export async function appInfo(_request: ParsedRequestOf<'appInfo'>, ctx: HandlerContext): Promise<ResponseOf<'appInfo'>> {
  return {
    name: ctx.appName,
    version: ctx.appVersion,
    runtime: ctx.runtime,
    userDataDir: ctx.userDataDir,
    documentsDir: ctx.documentsDir,
  };
}
