import { mkdtempSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import type { HandlerContext } from '../../../src-main/handlers/context';

/** A browser-host handler context whose folders live in a fresh temporary folder of its own. */
export function testHandlerContext(prefix: string): { base: string; ctx: HandlerContext } {
  const base = mkdtempSync(path.join(os.tmpdir(), `plumbline-${prefix}-`));
  return {
    base,
    ctx: {
      appName: 'Plumbline',
      appVersion: 'test',
      runtime: 'browser',
      userDataDir: path.join(base, 'user'),
      documentsDir: path.join(base, 'docs'),
      demoDir: path.join(base, 'demo'),
      instanceId: 'test',
    },
  };
}
