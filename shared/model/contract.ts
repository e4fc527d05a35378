// The IPC contract: every channel declared once with its zod request and response schema.
// Main registers handlers for exactly these channels (src-main/handlers), the preload exposes
// exactly these names (shared/model/channels.ts), and the renderer's typed client is inferred
// from here. No channel name or payload shape is written anywhere else.
import { z } from 'zod';
import type { Channel, Envelope } from './channels';
import { projectSchema } from './project';

export interface ChannelSpec {
  readonly request: z.ZodType;
  readonly response: z.ZodType;
}

const noArguments = z.object({}).strict();

export const contract = {
  appInfo: {
    request: noArguments,
    response: z.object({
      name: z.string(),
      version: z.string(),
      runtime: z.enum(['electron', 'browser']),
      userDataDir: z.string(),
      documentsDir: z.string(),
    }),
  },
  loadDemo: {
    request: z.object({ which: z.enum(['continuous']).default('continuous') }).strict(),
    response: z.object({ path: z.string(), project: projectSchema }),
  },
} as const satisfies { readonly [C in Channel]: ChannelSpec };

export type Contract = typeof contract;
export type RequestOf<C extends Channel> = z.input<Contract[C]['request']>;
export type ParsedRequestOf<C extends Channel> = z.output<Contract[C]['request']>;
export type ResponseOf<C extends Channel> = z.output<Contract[C]['response']>;

/** The typed API the renderer sees on window.api. */
export type Api = { readonly [C in Channel]: (request: RequestOf<C>) => Promise<Envelope<ResponseOf<C>>> };
