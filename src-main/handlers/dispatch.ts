// One generic path from an untrusted payload to a handler and back: parse the request with the
// channel's zod schema, run the handler, parse the response, answer with an envelope. Both hosts
// (Electron's ipcMain and the loopback HTTP host) call this and nothing else.
import { CHANNELS, type Channel, type Envelope } from '@shared/model/channels';
import { contract } from '@shared/model/contract';
import { describeProblems, fieldProblems } from '@shared/model/validation-message';
import type { HandlerContext } from './context';
import { HandlerError } from './handler-error';
import { handlers } from './index';

export function isChannel(name: unknown): name is Channel {
  return typeof name === 'string' && (CHANNELS as readonly string[]).includes(name);
}

export async function dispatch(channel: unknown, payload: unknown, ctx: HandlerContext): Promise<Envelope<unknown>> {
  if (!isChannel(channel)) {
    return {
      ok: false,
      error: { code: 'unknown-channel', message: `There is no channel named ${JSON.stringify(String(channel)).slice(0, 80)}.` },
    };
  }
  const spec = contract[channel];
  const parsed = spec.request.safeParse(payload, { reportInput: true });
  if (!parsed.success) {
    return {
      ok: false,
      error: {
        code: 'invalid-request',
        message: `The request to ${channel} was refused:\n${describeProblems(fieldProblems(parsed.error))}`,
      },
    };
  }
  try {
    const handler = handlers[channel] as (request: unknown, ctx: HandlerContext) => Promise<unknown>;
    const value = await handler(parsed.data, ctx);
    const checked = spec.response.safeParse(value);
    if (!checked.success) {
      return {
        ok: false,
        error: { code: 'invalid-response', message: `${channel} produced an answer that breaks its contract.` },
      };
    }
    return { ok: true, value: checked.data };
  } catch (error) {
    if (error instanceof HandlerError) return { ok: false, error: { code: error.code, message: error.message } };
    const message = error instanceof Error ? error.message : String(error);
    return { ok: false, error: { code: 'internal', message: `${channel} failed: ${message}` } };
  }
}
