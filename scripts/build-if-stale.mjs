// Builds the app (electron-vite build) when out/ is missing or older than any source file.
import { spawnSync } from 'node:child_process';
import { existsSync, readdirSync, statSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
const SOURCES = ['src-main', 'src-renderer', 'shared', 'package.json', 'electron.vite.config.ts'];
const OUTPUTS = ['out/main/index.js', 'out/main/loopback.js', 'out/preload/index.cjs', 'out/renderer/index.html'];

function newestMtime(target) {
  const stat = statSync(target);
  if (!stat.isDirectory()) return stat.mtimeMs;
  let newest = stat.mtimeMs;
  for (const entry of readdirSync(target)) newest = Math.max(newest, newestMtime(path.join(target, entry)));
  return newest;
}

export function buildIfStale({ quiet = false } = {}) {
  const outputs = OUTPUTS.map((p) => path.join(root, p));
  const built = outputs.every((p) => existsSync(p)) ? Math.min(...outputs.map((p) => statSync(p).mtimeMs)) : 0;
  const sources = Math.max(...SOURCES.map((p) => newestMtime(path.join(root, p))));
  if (built > sources) return;
  if (!quiet) console.error('Building Plumbline…');
  const result = spawnSync(process.execPath, [path.join(root, 'node_modules/electron-vite/bin/electron-vite.js'), 'build'], {
    cwd: root,
    stdio: ['ignore', quiet ? 'ignore' : process.stderr, process.stderr],
  });
  if (result.status !== 0) throw new Error('The build failed (see the messages above).');
}

if (import.meta.url === `file://${process.argv[1]}`) buildIfStale();
