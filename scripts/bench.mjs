// `npm run bench`: builds and runs every test/bench/*.bench.ts in turn (scripts/run-ts.mjs), each
// exporting `bench(): Promise<readonly string[]>`, and prints a header and its lines per file.
// Speed targets are checked here, never in unit tests. Exit 1 if a benchmark fails to build or run.
import { readdirSync } from 'node:fs';
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { buildTs, repoRoot } from './run-ts.mjs';

const benchDir = path.join(repoRoot, 'test', 'bench');
const only = process.argv.slice(2);
const files = readdirSync(benchDir)
  .filter((f) => f.endsWith('.bench.ts'))
  .filter((f) => only.length === 0 || only.some((name) => f.includes(name)))
  .sort();

let failed = 0;
for (const file of files) {
  console.log(`\n== ${file} ==`);
  try {
    const bundle = await buildTs(path.join('test', 'bench', file), { name: `bench-${file.replace(/\.bench\.ts$/, '')}` });
    const module = await import(pathToFileURL(bundle).href);
    if (typeof module.bench !== 'function') throw new Error('it does not export bench()');
    for (const line of await module.bench()) console.log(`  ${line}`);
  } catch (error) {
    failed += 1;
    console.log(`  FAILED: ${error instanceof Error ? error.message : String(error)}`);
  }
}
if (files.length === 0) console.log('no benchmarks found');
process.exitCode = failed > 0 ? 1 : 0;
