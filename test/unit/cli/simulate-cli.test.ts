// `plan --simulate <replicates> --seed <s>`, run as users run it (node scripts/plan.mjs in a child
// process), and its argument reader on its own.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { extractSimulateArgs } from '../../../src-main/cli/simulate-args';
import { REPO_ROOT, runPlanCommand as plan } from './plan-command';

const demoFile = path.join(REPO_ROOT, 'demo', 'consortium-continuous.plumb');
let work = '';

beforeAll(async () => {
  work = mkdtempSync(path.join(tmpdir(), 'plumbline-simulate-'));
  expect((await plan('--help')).code).toBe(0); // builds the command once
}, 120_000);

afterAll(() => {
  rmSync(work, { recursive: true, force: true });
});

interface JsonMeasure {
  id: string;
  closedForm: { criterionId: string; n: number | null; se: number | null } | null;
  empiricalSe: { value: number; mcse: number } | null;
  shareMeetingTarget: { value: number; mcse: number } | null;
  status: string;
  verdict: string;
}
interface JsonPopulation {
  id: string;
  requiredN: number;
  criteria: { id: string; n: number | null }[];
  simulation?: { ran: boolean; n: number; seed: number; replicatesDone: number; headline: string; measures: JsonMeasure[] };
}

describe('plan --demo --simulate', () => {
  it('prints the same text for the same seed, with progress on stderr only', async () => {
    const first = await plan('--demo', '--simulate', '300', '--seed', '42');
    const second = await plan('--demo', '--simulate=300', '--seed=42');
    expect(first.code).toBe(0);
    expect(second.stdout).toBe(first.stdout);
    expect(first.stdout).toContain('Check by simulation');
    expect(first.stdout).toContain('300 simulated studies of n = 879 (seed 42)');
    expect(first.stdout).not.toContain('simulation: ');
    expect(first.stderr).toMatch(/^simulation: Harbour General Hospital: 300 replicates of n = 879…$/m);
    expect(first.stderr).toMatch(/^simulation: Harbour General Hospital: done in /m);
    const other = await plan('--demo', '--simulate', '300', '--seed', '43');
    expect(other.stdout).not.toBe(first.stdout);
  });

  it('adds a simulation field to each population in --json and changes no other field', async () => {
    const plain = JSON.parse((await plan('--demo', '--json')).stdout) as { populations: JsonPopulation[] };
    const run = await plan('--demo', '--json', '--simulate', '200', '--seed', '5');
    expect(run.code).toBe(0);
    const simulated = JSON.parse(run.stdout) as { populations: JsonPopulation[] };
    expect(simulated.populations.map(({ simulation: _s, ...rest }) => rest)).toEqual(plain.populations);
    for (const p of simulated.populations) {
      const s = p.simulation;
      expect(s, p.id).toMatchObject({ ran: true, n: p.requiredN, seed: 5, replicatesDone: 200 });
      expect(s?.measures.map((m) => m.id)).toEqual([
        'r-squared',
        'citl',
        'slope',
        'outcome-sd',
        'citl-residual-sd',
        'slope-residual-sd',
      ]);
      for (const m of s?.measures ?? []) {
        if (m.closedForm === null) continue;
        // The closed-form n beside each measure is its criterion's n in the same output.
        expect(m.closedForm.n).toBe(p.criteria.find((c) => c.id === m.closedForm?.criterionId)?.n);
        expect(m.verdict).toContain(`At n = ${p.requiredN.toLocaleString('en-GB')}`);
      }
    }
  });

  it('adds a section with a table per population to --markdown', async () => {
    const run = await plan('--demo', '--markdown', '--simulate', '100', '--seed', '9');
    expect(run.code).toBe(0);
    expect(run.stdout).toContain('## Check by simulation');
    expect(run.stdout).toContain('| Measure | Closed-form n | SE (closed form) | SE (simulated ± MC) |');
    expect(run.stdout).toContain('100 simulated studies of n = 879 (seed 9)');
  });

  it('draws and prints a seed when none is given', async () => {
    const run = await plan('--demo', '--simulate', '20');
    expect(run.code).toBe(0);
    const seed = /seed (\d+) drawn at random/.exec(run.stderr)?.[1];
    expect(seed).toBeDefined();
    expect(run.stdout).toContain(`(seed ${seed})`);
  });

  it('exits 2 naming the option or field when a value is out of range', async () => {
    const cases: [string[], RegExp][] = [
      [['--simulate', '1'], /--simulate must be a whole number from 2 to 1,000,000 \(got 1\)/],
      [['--simulate', 'many'], /--simulate must be a whole number from 2 to 1,000,000/],
      [['--simulate'], /--simulate needs a whole number/],
      [['--simulate', '10', '--seed', '4294967296'], /--seed must be a whole number from 0 to 4,294,967,295/],
      [['--seed', '3'], /--seed goes with --simulate/],
      [['--simulate', '10', '--csv'], /not --csv/],
    ];
    for (const [args, message] of cases) {
      const run = await plan('--demo', ...args);
      expect(run.code, args.join(' ')).toBe(2);
      expect(run.stderr).toMatch(message);
      expect(run.stdout).toBe('');
    }
    // A required n of about 28 million is beyond what one simulated study may hold.
    const doc = JSON.parse(readFileSync(demoFile, 'utf8')) as { populations: { precision: { citl: { width: number } } }[] };
    const first = doc.populations[0];
    if (first === undefined) throw new Error('the demo has populations');
    first.precision.citl.width = 0.0005;
    const file = path.join(work, 'huge.plumb');
    writeFileSync(file, JSON.stringify(doc));
    const huge = await plan(file, '--simulate', '10', '--seed', '1');
    expect(huge.code).toBe(2);
    expect(huge.stderr).toMatch(/Harbour General Hospital: n: a whole number from 4 to 10,000,000 \(n = [\d,]+\)/);
  }, 120_000);
});

describe('extractSimulateArgs', () => {
  it('takes --simulate and --seed out and leaves the rest, file names after -- included', () => {
    expect(extractSimulateArgs(['--demo', '--simulate', '500', '--seed', '7', '--json'])).toEqual({
      ok: true,
      rest: ['--demo', '--json'],
      simulate: { replicates: 500, seed: 7 },
    });
    expect(extractSimulateArgs(['--simulate=40', '--', '--seed'])).toEqual({
      ok: true,
      rest: ['--', '--seed'],
      simulate: { replicates: 40, seed: null },
    });
    expect(extractSimulateArgs(['plan.plumb'])).toEqual({ ok: true, rest: ['plan.plumb'], simulate: null });
  });

  it('refuses repeats, missing values and the outputs it does not go with', () => {
    const message = (argv: string[]): string => {
      const r = extractSimulateArgs(argv);
      return r.ok ? '' : r.message;
    };
    expect(message(['--simulate', '5', '--simulate', '6'])).toBe('give --simulate once');
    expect(message(['--simulate', '--seed', '4'])).toBe('--simulate needs a whole number from 2 to 1,000,000');
    expect(message(['--simulate', '5', '--seed'])).toBe('--seed needs a whole number from 0 to 4,294,967,295');
    expect(message(['--simulate', '5', '--report', 'r.pdf'])).toContain('does not go with --report');
    expect(message(['--simulate', '1e3'])).toBe('--simulate must be a whole number from 2 to 1,000,000 (got 1e3)');
  });
});
