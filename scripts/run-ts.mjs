// Runs TypeScript entry points under plain Node 20 (no native TypeScript): bundles one entry with
// vite's programmatic build (SSR mode, target node20, '@shared' resolved, Node built-ins and
// node_modules packages left as imports) into out/node/<name>.mjs and returns that path.
// A build is skipped when the output is newer than every module it was built from (listed in a
// manifest beside the output), than package.json and than this script: measured on the project's
// 2-core machine, a build of the command line costs about 0.4 s in a new process (most of it
// loading vite) and the freshness check about 1 ms. The bundle is written to a
// private folder and renamed into place, so concurrent runs never see a half-written file.
// Nothing is printed: the callers' stdout must carry only their own program's output.
import { existsSync, mkdirSync, readFileSync, renameSync, rmSync, statSync, utimesSync, writeFileSync } from 'node:fs';
import { builtinModules } from 'node:module';
import path from 'node:path';
import { fileURLToPath } from 'node:url';

export const repoRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');
const outDir = path.join(repoRoot, 'out', 'node');
const builtins = new Set(builtinModules);

function isExternal(id) {
  if (id.startsWith('node:') || builtins.has(id) || builtins.has(id.split('/')[0])) return true;
  if (id.startsWith('.') || id.startsWith('/') || id.startsWith('\0') || id.startsWith('@shared/')) return false;
  return !path.isAbsolute(id);
}

function mtime(file) {
  try {
    return statSync(file).mtimeMs;
  } catch {
    return Number.POSITIVE_INFINITY;
  }
}

function isFresh(entryPath, outFile, manifestFile) {
  if (!existsSync(outFile) || !existsSync(manifestFile)) return false;
  const built = mtime(outFile);
  let manifest;
  try {
    manifest = JSON.parse(readFileSync(manifestFile, 'utf8'));
  } catch {
    return false;
  }
  const inputs = manifest?.inputs;
  if (manifest?.entry !== entryPath || !Array.isArray(inputs)) return false;
  const always = [fileURLToPath(import.meta.url), path.join(repoRoot, 'package.json')];
  return [...always, ...inputs].every((file) => mtime(file) <= built);
}

/**
 * Bundles `entry` (a path relative to the repository root) to out/node/<name>.mjs unless that file
 * is up to date, and returns its absolute path. `name` defaults to the entry's base name;
 * `force` rebuilds regardless.
 */
export async function buildTs(entry, { name, force = false } = {}) {
  const entryPath = path.resolve(repoRoot, entry);
  const outName = name ?? path.basename(entryPath).replace(/\.[cm]?tsx?$/, '');
  const outFile = path.join(outDir, `${outName}.mjs`);
  const manifestFile = path.join(outDir, `${outName}.inputs.json`);
  if (!force && isFresh(entryPath, outFile, manifestFile)) return outFile;

  const { build } = await import('vite');
  const started = new Date();
  const workDir = path.join(outDir, `.build-${outName}-${process.pid}-${Date.now()}`);
  mkdirSync(workDir, { recursive: true });
  try {
    const result = await build({
      configFile: false,
      envFile: false,
      root: repoRoot,
      logLevel: 'silent',
      clearScreen: false,
      resolve: { alias: { '@shared': path.join(repoRoot, 'shared') } },
      ssr: { target: 'node' },
      build: {
        ssr: entryPath,
        outDir: workDir,
        emptyOutDir: false,
        target: 'node20',
        minify: false,
        sourcemap: false,
        copyPublicDir: false,
        reportCompressedSize: false,
        rolldownOptions: {
          external: isExternal,
          output: { format: 'es', entryFileNames: `${outName}.mjs`, chunkFileNames: `${outName}-[name]-[hash].mjs` },
        },
      },
    });
    const outputs = (Array.isArray(result) ? result : [result]).flatMap((r) => r.output ?? []);
    const chunks = outputs.filter((o) => o.type === 'chunk');
    if (chunks.length !== 1)
      throw new Error(`expected one bundle for ${entry}, got ${chunks.length} (dynamic imports are not supported here)`);
    const bundled = chunks.flatMap((c) => c.moduleIds ?? Object.keys(c.modules ?? {}));
    const inputs = [...new Set([entryPath, ...bundled])].filter((id) => !id.startsWith('\0') && path.isAbsolute(id));
    // The manifest goes first and the bundle is stamped with the build's start time, so a source
    // saved while the build ran makes the next run rebuild.
    const builtFile = path.join(workDir, `${outName}.mjs`);
    utimesSync(builtFile, started, started);
    writeFileSync(path.join(workDir, 'inputs.json'), `${JSON.stringify({ entry: entryPath, inputs }, null, 2)}\n`);
    renameSync(path.join(workDir, 'inputs.json'), manifestFile);
    renameSync(builtFile, outFile);
    return outFile;
  } finally {
    rmSync(workDir, { recursive: true, force: true });
  }
}
