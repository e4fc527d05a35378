import { readFile } from 'node:fs/promises';
import path from 'node:path';
import type { ParsedRequestOf, ResponseOf } from '@shared/model/contract';
import { parsePlanText } from '@shared/model/plan-file';
import type { HandlerContext } from './context';
import { HandlerError } from './handler-error';

/** The bundled demo plans (fictional consortia), by the outcome type they plan for. */
export const DEMO_FILES = { continuous: 'consortium-continuous.plumb', binary: 'consortium-binary.plumb' } as const;
export type DemoKind = keyof typeof DEMO_FILES;

/** Reads a bundled demo plan from disk and checks it like any other plan file (older schemas are brought up to date). */
export async function loadDemo(request: ParsedRequestOf<'loadDemo'>, ctx: HandlerContext): Promise<ResponseOf<'loadDemo'>> {
  const file = path.join(ctx.demoDir, DEMO_FILES[request.which]);
  let text: string;
  try {
    text = await readFile(file, 'utf8');
  } catch {
    throw new HandlerError('demo-missing', `The demo plan could not be read at ${file}.`);
  }
  const parsed = parsePlanText(text);
  if (!parsed.ok) throw new HandlerError('demo-invalid', `The demo plan is not valid:\n${parsed.error.message}`);
  return { path: file, project: parsed.project };
}
