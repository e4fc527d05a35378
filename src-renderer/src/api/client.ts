import type { Channel, Envelope } from '@shared/model/channels';
import type { RequestOf, ResponseOf } from '@shared/model/contract';

/** A failure answered by the main process, with its stable code. */
export class BridgeError extends Error {
  readonly code: string;

  constructor(code: string, message: string) {
    super(message);
    this.name = 'BridgeError';
    this.code = code;
  }
}

/** Calls a channel and unwraps the envelope: resolves with the value or rejects with a BridgeError. */
export async function call<C extends Channel>(channel: C, request: RequestOf<C>): Promise<ResponseOf<C>> {
  const method = window.api[channel] as unknown as (request: RequestOf<C>) => Promise<Envelope<ResponseOf<C>>>;
  const envelope = await method(request);
  if (envelope.ok) return envelope.value;
  throw new BridgeError(envelope.error.code, envelope.error.message);
}
