// The process that the crash test kills: it saves two large, different versions of a plan in
// turn, as fast as it can, through the real writePlanFile. Bundled to plain JavaScript by the test
// (Node 20 cannot run TypeScript), run as `node save-loop-child.mjs <plan path> <first version>`.
import { writePlanFile } from '../../../../src-main/store/plan-io';
import { killTestPlans } from './kill-test-versions';

const [target, firstArg] = process.argv.slice(2);
const first = Number(firstArg);
if (target === undefined || !Number.isInteger(first)) {
  process.stderr.write('usage: save-loop-child <plan path> <index of the first version to save>\n');
  process.exit(2);
}
const plans = killTestPlans();
process.stdout.write('ready\n');
for (let i = first; ; i += 1) {
  const result = await writePlanFile(target, plans[i % plans.length]);
  if (!result.ok) {
    process.stderr.write(`${result.error.code}: ${result.error.message}\n`);
    process.exit(1);
  }
}
