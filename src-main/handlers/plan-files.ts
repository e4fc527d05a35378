// Handlers for plan files: open, revert, save, close, autosave and recovery, the recent list,
// import and export of populations. Each is a thin adapter over the ProjectStore.
import type { Channel } from '@shared/model/channels';
import type { ParsedRequestOf, ResponseOf } from '@shared/model/contract';
import type { HandlerContext } from './context';
import { storeFor, unwrap } from './store-for';

type Handler<C extends Channel> = (request: ParsedRequestOf<C>, ctx: HandlerContext) => Promise<ResponseOf<C>>;

export const openPlan: Handler<'openPlan'> = async (request, ctx) => {
  const opened = unwrap(await storeFor(ctx).open(request.path, request.documentId, { takeOverLock: request.takeOverLock }));
  return {
    path: opened.path,
    project: opened.project,
    migratedFrom: opened.migratedFrom,
    lock: opened.lock,
    warnings: [...opened.warnings],
  };
};

export const revertPlan: Handler<'revertPlan'> = async (request, ctx) => {
  const read = unwrap(await storeFor(ctx).revert(request.path));
  return { path: read.path, project: read.project };
};

export const peekPlan: Handler<'peekPlan'> = async (request, ctx) => {
  const read = unwrap(await storeFor(ctx).revert(request.path));
  return { path: read.path, project: read.project };
};

export const savePlan: Handler<'savePlan'> = async (request, ctx) => {
  const store = storeFor(ctx);
  const options = { takeOverLock: request.takeOverLock };
  const saved = unwrap(
    request.previousPath === null || request.previousPath === request.path
      ? await store.save(request.path, request.project, request.documentId, options)
      : await store.saveAs(request.path, request.project, request.documentId, request.previousPath, options),
  );
  return {
    path: saved.path,
    project: saved.project,
    bytes: saved.bytes,
    backupPath: saved.backupPath,
    warnings: [...saved.warnings],
    lock: saved.lock,
  };
};

export const closePlan: Handler<'closePlan'> = async (request, ctx) => {
  const closed = unwrap(await storeFor(ctx).close(request.path, request.documentId));
  return { lockReleased: closed.lockReleased, recoveryDiscarded: closed.recoveryDiscarded, warnings: [...closed.warnings] };
};

export const autosave: Handler<'autosave'> = async (request, ctx) => {
  const written = unwrap(await storeFor(ctx).autosave(request.documentId, request.path, request.project));
  return { savedAt: written.savedAt };
};

export const listRecovery: Handler<'listRecovery'> = async (_request, ctx) => ({
  items: [...unwrap(await storeFor(ctx).listRecoverable())],
});

export const restoreRecovery: Handler<'restoreRecovery'> = async (request, ctx) =>
  unwrap(await storeFor(ctx).restore(request.documentId));

export const discardRecovery: Handler<'discardRecovery'> = async (request, ctx) => ({
  discarded: unwrap(await storeFor(ctx).discardRecovery(request.documentId)),
});

export const recentPlans: Handler<'recentPlans'> = async (_request, ctx) => {
  const list = unwrap(await storeFor(ctx).recentProjects());
  return { entries: [...list.entries], problem: list.problem };
};

export const forgetRecent: Handler<'forgetRecent'> = async (request, ctx) => {
  const list = unwrap(await storeFor(ctx).forgetRecent(request.path));
  return { entries: [...list.entries], problem: list.problem };
};

export const importPopulations: Handler<'importPopulations'> = async (request, ctx) => {
  const result = unwrap(
    await storeFor(ctx).importPopulationsFromFile(request.project, request.sourcePath, request.populationIds),
  );
  return { project: result.project, imported: [...result.imported] };
};

export const exportPopulation: Handler<'exportPopulation'> = async (request, ctx) => {
  const written = unwrap(
    await storeFor(ctx).exportPopulationToFile(request.project, request.populationId, request.path, {
      takeOverLock: request.takeOverLock,
    }),
  );
  return { path: written.path, bytes: written.bytes };
};
