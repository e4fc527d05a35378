// Is the Electron runtime (the binary npm does not ship) present on this machine?
// Electron's package fetches it on first use; on offline hosts that fetch fails, so we look
// for it ourselves instead of letting `require('electron')` try.
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import path from 'node:path';

export function electronBinary() {
  const require = createRequire(import.meta.url);
  let dir;
  try {
    dir = path.dirname(require.resolve('electron/package.json'));
  } catch {
    return { available: false, reason: 'the electron package is not installed' };
  }
  const pathFile = path.join(dir, 'path.txt');
  if (!existsSync(pathFile))
    return { available: false, reason: 'the Electron runtime has not been downloaded (offline machine)' };
  const binary = path.join(dir, 'dist', readFileSync(pathFile, 'utf8').trim());
  if (!existsSync(binary)) return { available: false, reason: `the Electron runtime is missing at ${binary}` };
  return { available: true, binary };
}
