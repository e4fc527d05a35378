// npm start: build when needed, then open the desktop window, or, where the Electron runtime
// cannot be had, serve the same UI and handlers to the local browser.
import { spawn } from 'node:child_process';
import path from 'node:path';
import { buildIfStale } from './build-if-stale.mjs';
import { electronBinary } from './electron-runtime.mjs';

const root = path.resolve(import.meta.dirname, '..');
buildIfStale();
const electron = electronBinary();
if (electron.available && process.env['PLUMBLINE_BROWSER'] !== '1') {
  const child = spawn(electron.binary, [root], { stdio: 'inherit' });
  child.on('exit', (code) => process.exit(code ?? 0));
} else {
  console.log(
    `No Electron runtime here (${electron.reason ?? 'browser mode requested'}); serving Plumbline to your browser instead.`,
  );
  await import(path.join(root, 'out/main/loopback.js'));
}
