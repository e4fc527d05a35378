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
const filePath = z
  .string()
  .min(1, { error: 'a file path must not be empty' })
  .max(4096, { error: 'a file path must be at most 4096 characters' });
const documentId = z.string().regex(/^[A-Za-z0-9_-]{1,64}$/, { error: 'a document id is 1 to 64 letters, digits, - or _' });

const lockHolderSchema = z.object({
  pid: z.number(),
  hostname: z.string(),
  instanceId: z.string(),
  documentId: z.string(),
  since: z.string(),
});
/** Whether this window holds the plan's lock, or someone else has it open. */
export const lockStateSchema = z.discriminatedUnion('status', [
  z.object({ status: z.literal('acquired') }),
  z.object({ status: z.literal('took-over-stale'), previous: lockHolderSchema.nullable() }),
  z.object({ status: z.literal('took-over'), previous: lockHolderSchema }),
  z.object({
    status: z.literal('held-elsewhere'),
    warning: z.object({
      kind: z.enum(['another-window', 'another-instance', 'another-computer']),
      holder: lockHolderSchema,
      message: z.string(),
    }),
  }),
  z.object({ status: z.literal('unavailable'), message: z.string() }),
]);
export type LockStateView = z.infer<typeof lockStateSchema>;

const recentListSchema = z.object({
  entries: z.array(z.object({ path: z.string(), name: z.string(), openedAt: z.string(), missing: z.boolean() })),
  problem: z.string().nullable(),
});

const savedSchema = z.object({
  path: z.string(),
  project: projectSchema,
  bytes: z.number(),
  backupPath: z.string().nullable(),
  warnings: z.array(z.string()),
  lock: lockStateSchema,
});

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
    request: z.object({ which: z.enum(['continuous', 'binary']).default('continuous') }).strict(),
    response: z.object({ path: z.string(), project: projectSchema }),
  },
  openPlan: {
    request: z.object({ path: filePath, documentId, takeOverLock: z.boolean().default(false) }).strict(),
    response: z.object({
      path: z.string(),
      project: projectSchema,
      migratedFrom: z.number().nullable(),
      lock: lockStateSchema,
      warnings: z.array(z.string()),
    }),
  },
  revertPlan: {
    request: z.object({ path: filePath }).strict(),
    response: z.object({ path: z.string(), project: projectSchema }),
  },
  peekPlan: {
    request: z.object({ path: filePath }).strict(),
    response: z.object({ path: z.string(), project: projectSchema }),
  },
  savePlan: {
    request: z
      .object({
        path: filePath,
        project: projectSchema,
        documentId,
        previousPath: filePath.nullable().default(null),
        takeOverLock: z.boolean().default(false),
      })
      .strict(),
    response: savedSchema,
  },
  closePlan: {
    request: z.object({ path: filePath.nullable(), documentId }).strict(),
    response: z.object({ lockReleased: z.boolean(), recoveryDiscarded: z.boolean(), warnings: z.array(z.string()) }),
  },
  autosave: {
    request: z.object({ documentId, path: filePath.nullable(), project: projectSchema }).strict(),
    response: z.object({ savedAt: z.string() }),
  },
  listRecovery: {
    request: noArguments,
    response: z.object({
      items: z.array(
        z.object({
          documentId: z.string(),
          originalPath: z.string().nullable(),
          originalExists: z.boolean(),
          savedAt: z.string(),
          projectName: z.string(),
          inUse: z.boolean(),
          problem: z.string().nullable(),
        }),
      ),
    }),
  },
  restoreRecovery: {
    request: z.object({ documentId }).strict(),
    response: z.object({
      documentId: z.string(),
      originalPath: z.string().nullable(),
      savedAt: z.string(),
      project: projectSchema,
      migratedFrom: z.number().nullable(),
    }),
  },
  discardRecovery: {
    request: z.object({ documentId }).strict(),
    response: z.object({ discarded: z.boolean() }),
  },
  recentPlans: {
    request: noArguments,
    response: recentListSchema,
  },
  forgetRecent: {
    request: z.object({ path: filePath }).strict(),
    response: recentListSchema,
  },
  importPopulations: {
    request: z
      .object({ project: projectSchema, sourcePath: filePath, populationIds: z.array(z.string()).max(10_000).optional() })
      .strict(),
    response: z.object({
      project: projectSchema,
      imported: z.array(z.object({ sourceId: z.string(), id: z.string(), name: z.string() })),
    }),
  },
  exportPopulation: {
    request: z
      .object({
        project: projectSchema,
        populationId: z.string().min(1),
        path: filePath,
        takeOverLock: z.boolean().default(false),
      })
      .strict(),
    response: z.object({ path: z.string(), bytes: z.number() }),
  },
  chooseFile: {
    request: z
      .object({
        purpose: z.enum(['open', 'save', 'import', 'export', 'report-pdf', 'report-md', 'table-csv', 'table-xlsx']),
        suggestedName: z.string().max(255).optional(),
      })
      .strict(),
    response: z.object({ native: z.boolean(), path: z.string().nullable() }),
  },
  listFolder: {
    request: z.object({ path: filePath.optional() }).strict(),
    response: z.object({
      path: z.string(),
      parent: z.string().nullable(),
      entries: z.array(z.object({ name: z.string(), path: z.string(), kind: z.enum(['folder', 'plan']) })),
    }),
  },
  exportReport: {
    request: z
      .object({ project: projectSchema, planPath: filePath.nullable(), format: z.enum(['pdf', 'md', 'txt']), path: filePath })
      .strict(),
    response: z.object({ path: z.string(), bytes: z.number() }),
  },
  exportTable: {
    request: z.discriminatedUnion('format', [
      z
        .object({
          project: projectSchema,
          planPath: filePath.nullable(),
          format: z.literal('csv'),
          table: z.enum(['comparison', 'criteria']),
          path: filePath,
        })
        .strict(),
      z.object({ project: projectSchema, planPath: filePath.nullable(), format: z.literal('xlsx'), path: filePath }).strict(),
    ]),
    response: z.object({ path: z.string(), bytes: z.number() }),
  },
} as const satisfies { readonly [C in Channel]: ChannelSpec };

export type Contract = typeof contract;
export type RequestOf<C extends Channel> = z.input<Contract[C]['request']>;
export type ParsedRequestOf<C extends Channel> = z.output<Contract[C]['request']>;
export type ResponseOf<C extends Channel> = z.output<Contract[C]['response']>;

/** The typed API the renderer sees on window.api. */
export type Api = { readonly [C in Channel]: (request: RequestOf<C>) => Promise<Envelope<ResponseOf<C>>> };
