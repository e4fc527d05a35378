// The process that the crash test kills. It saves two large, different versions of a plan in turn,
// as fast as it can, through writeFileAtomic with the plan's backup path, exactly as writePlanFile
// does after checking and serialising the plan. The versions come as finished files (written by the
// test), so that the child spends its time in the write path, where a kill can do harm, rather than
// in the schema check, which runs before any byte is written. Bundled to plain JavaScript by the
// test (Node 20 cannot run TypeScript) and run as
//   node save-loop-child.mjs <plan path> <index of the first version> <version file>...
import { readFileSync } from 'node:fs';
import { writeFileAtomic } from '../../../../src-main/store/atomic-write';
import { backupPathFor } from '../../../../src-main/store/plan-io';

const [target, firstArg, ...versionFiles] = process.argv.slice(2);
const first = Number(firstArg);
if (target === undefined || !Number.isInteger(first) || versionFiles.length < 2) {
  process.stderr.write('usage: save-loop-child <plan path> <index of the first version> <version file> <version file>...\n');
  process.exit(2);
}
const versions = versionFiles.map((file) => readFileSync(file));
process.stdout.write('ready\n');
for (let i = first; ; i += 1) {
  const result = await writeFileAtomic(target, versions[i % versions.length] ?? '', {
    backupPath: backupPathFor(target),
    action: 'save the plan to',
  });
  if (!result.ok) {
    process.stderr.write(`${result.error.code}: ${result.error.message}\n`);
    process.exit(1);
  }
}
