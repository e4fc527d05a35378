// `npm run --silent plan -- <plan-file> [--json | --csv | --markdown]` (or `--demo [binary]`): builds the
// command from src-main/cli/plan.ts when its sources changed (scripts/run-ts.mjs), then runs it.
// Only the command's own output reaches stdout; the exit status is the command's.
import path from 'node:path';
import { pathToFileURL } from 'node:url';
import { buildTs, repoRoot } from './run-ts.mjs';

process.stdout.on('error', (error) => {
  if (error.code === 'EPIPE') process.exit(process.exitCode ?? 0); // the reader (e.g. `head`) has gone
  throw error;
});

let runPlan;
try {
  const bundle = await buildTs('src-main/cli/plan.ts');
  ({ runPlan } = await import(pathToFileURL(bundle).href));
} catch (error) {
  process.stderr.write(`plan: could not build the command: ${error instanceof Error ? error.message : String(error)}\n`);
  process.exit(1);
}

process.exitCode = await runPlan(process.argv.slice(2), {
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
  demoDir: path.join(repoRoot, 'demo'),
});
