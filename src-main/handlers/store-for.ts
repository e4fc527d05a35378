import { ProjectStore } from '../store';
import type { StoreResult } from '../store/store-error';
import type { HandlerContext } from './context';
import { HandlerError } from './handler-error';

const stores = new WeakMap<HandlerContext, ProjectStore>();

/** The one ProjectStore of a host (created on first use). */
export function storeFor(ctx: HandlerContext): ProjectStore {
  let store = stores.get(ctx);
  if (store === undefined) {
    store = new ProjectStore({ userDataDir: ctx.userDataDir, instanceId: ctx.instanceId });
    stores.set(ctx, store);
  }
  return store;
}

/** Unwraps a store result, turning a failure into a HandlerError that keeps its code and field problems. */
export function unwrap<T>(result: StoreResult<T>): T {
  if (result.ok) return result.value;
  const problems = result.error.problems?.map((p) => `${p.path}: ${p.message}`).join('\n');
  throw new HandlerError(result.error.code, problems ? `${result.error.message}\n${problems}` : result.error.message);
}
