import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { projectSchema } from '@shared/model/project';
import type { ParsedRequestOf, ResponseOf } from '@shared/model/contract';
import { describeProblems, fieldProblems } from '@shared/model/validation-message';
import type { HandlerContext } from './context';
import { HandlerError } from './handler-error';

export const DEMO_FILES = { continuous: 'consortium-continuous.plumb' } as const;

/** Reads a bundled demo plan from disk and validates it like any other plan. */
export async function loadDemo(request: ParsedRequestOf<'loadDemo'>, ctx: HandlerContext): Promise<ResponseOf<'loadDemo'>> {
  const file = path.join(ctx.demoDir, DEMO_FILES[request.which]);
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch {
    throw new HandlerError('demo-missing', `The demo plan could not be read at ${file}.`);
  }
  const parsed = projectSchema.safeParse(JSON.parse(text), { reportInput: true });
  if (!parsed.success) {
    throw new HandlerError('demo-invalid', `The demo plan is not valid:\n${describeProblems(fieldProblems(parsed.error))}`);
  }
  return { path: file, project: parsed.data };
}
