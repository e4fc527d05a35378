// npm test: every check and every test, in the order a failure is cheapest to find, ending with
// one plain line "N passed, N failed, N skipped" (unit and end-to-end tests added up; a failed
// type-check, lint, format check or build counts as one failure each).
import { spawnSync } from 'node:child_process';
import { existsSync, mkdirSync, readFileSync, rmSync } from 'node:fs';
import path from 'node:path';

const root = path.resolve(import.meta.dirname, '..');
const bin = (name) => path.join(root, 'node_modules', '.bin', name);
const results = path.join(root, 'test-results');
rmSync(results, { recursive: true, force: true });
mkdirSync(results, { recursive: true });

let passed = 0;
let failed = 0;
let skipped = 0;
const failures = [];

function step(name, command, args) {
  const started = Date.now();
  console.log(`\n=== ${name}`);
  const run = spawnSync(command, args, { cwd: root, stdio: 'inherit', env: process.env });
  const seconds = ((Date.now() - started) / 1000).toFixed(1);
  console.log(`=== ${name}: ${run.status === 0 ? 'ok' : 'FAILED'} (${seconds} s)`);
  return run.status === 0;
}

function check(name, command, args) {
  if (!step(name, command, args)) {
    failed += 1;
    failures.push(name);
  }
}

check('type-check (node, web, e2e)', bin('tsc'), ['-b']);
check('lint', bin('eslint'), ['--max-warnings', '0', '.']);
check('format', bin('prettier'), ['--check', '--log-level', 'warn', '.']);

const unitReport = path.join(results, 'unit.json');
const unitOk = step('unit tests (vitest)', bin('vitest'), [
  'run',
  '--reporter=default',
  '--reporter=json',
  `--outputFile.json=${unitReport}`,
]);
if (existsSync(unitReport)) {
  const report = JSON.parse(readFileSync(unitReport, 'utf8'));
  passed += report.numPassedTests;
  failed += report.numFailedTests;
  skipped += report.numPendingTests + report.numTodoTests;
  if (!unitOk && report.numFailedTests === 0) {
    failed += 1;
    failures.push('unit tests (vitest did not finish cleanly)');
  }
} else {
  failed += 1;
  failures.push('unit tests (no report)');
}

const built = step('build (electron-vite)', process.execPath, [
  path.join(root, 'node_modules/electron-vite/bin/electron-vite.js'),
  'build',
]);
if (!built) {
  failed += 1;
  failures.push('build');
} else {
  const e2eReport = path.join(results, 'e2e-report.json');
  const e2eOk = step('end-to-end tests (playwright, Debian chromium)', bin('playwright'), ['test']);
  if (existsSync(e2eReport)) {
    const { stats } = JSON.parse(readFileSync(e2eReport, 'utf8'));
    passed += stats.expected + stats.flaky;
    failed += stats.unexpected;
    skipped += stats.skipped;
    if (!e2eOk && stats.unexpected === 0) {
      failed += 1;
      failures.push('end-to-end tests (playwright did not finish cleanly)');
    }
  } else {
    failed += 1;
    failures.push('end-to-end tests (no report)');
  }
}

console.log('');
if (failures.length > 0) console.log(`Failed: ${failures.join('; ')}`);
console.log(`${passed} passed, ${failed} failed, ${skipped} skipped`);
process.exit(failed === 0 ? 0 : 1);
