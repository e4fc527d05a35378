// The command line, run as users run it: `node scripts/plan.mjs …` in a child process.
import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { DEVELOPMENT_CRITERION_IDS, VALIDATION_CRITERION_IDS } from '@shared/engine/continuous/criterion-ids';
import { CAUTIONS_ONE_LINE } from '@shared/text/cautions';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const script = path.join(root, 'scripts', 'plan.mjs');
const demoFile = path.join(root, 'demo', 'consortium-continuous.plumb');
let work = '';

interface Run {
  readonly code: number;
  readonly stdout: string;
  readonly stderr: string;
}

function plan(...args: string[]): Promise<Run> {
  return new Promise((resolve) => {
    execFile(process.execPath, [script, ...args], { cwd: root, timeout: 60_000 }, (error, stdout, stderr) => {
      const code = error === null ? 0 : typeof error.code === 'number' ? error.code : -1;
      resolve({ code, stdout, stderr });
    });
  });
}

/** The demo plan with one change, written to a file of its own. */
function variant(name: string, change: (plan: Record<string, unknown>) => void): string {
  const doc = JSON.parse(readFileSync(demoFile, 'utf8')) as Record<string, unknown>;
  change(doc);
  const file = path.join(work, name);
  writeFileSync(file, JSON.stringify(doc));
  return file;
}

beforeAll(async () => {
  work = mkdtempSync(path.join(tmpdir(), 'plumbline-cli-'));
  // Builds the command once (scripts/run-ts.mjs); later runs reuse the bundle.
  const help = await plan('--help');
  expect(help.code).toBe(0);
}, 120_000);

afterAll(() => {
  rmSync(work, { recursive: true, force: true });
});

type JsonPlan = {
  populations: { name: string; requiredN: number; binding: string; criteria: { id: string; n: number | null }[] }[];
  cautions: string[];
};

describe('plan --demo', () => {
  it('keeps stdout to the program output even when it has to rebuild the command first', async () => {
    rmSync(path.join(root, 'out', 'node', 'plan.inputs.json'), { force: true }); // forces a rebuild
    const run = await plan('--demo', '--json');
    expect(run.code).toBe(0);
    expect(() => JSON.parse(run.stdout) as unknown).not.toThrow();
  });

  it('--json prints only the JSON object { populations: [{ name, requiredN, binding, criteria: [{ id, n }] }] } and exits 0', async () => {
    const run = await plan('--demo', '--json');
    expect(run.code).toBe(0);
    const out = JSON.parse(run.stdout) as JsonPlan;
    const demo = JSON.parse(readFileSync(demoFile, 'utf8')) as { populations: { name: string }[] };
    expect(out.populations.map((p) => p.name)).toEqual(demo.populations.map((p) => p.name));
    for (const p of out.populations) {
      expect(p.criteria.map((c) => c.id)).toEqual([...VALIDATION_CRITERION_IDS, ...DEVELOPMENT_CRITERION_IDS]);
      expect(Number.isInteger(p.requiredN)).toBe(true);
      expect(p.requiredN).toBe(Math.max(...p.criteria.map((c) => c.n ?? 0)));
      expect(p.criteria.find((c) => c.id === p.binding)?.n).toBe(p.requiredN);
    }
    expect(out.cautions.join(' ')).toMatch(/statistical precision only/i);
  });

  it('the default table shows every population, its required n and binding criterion, and the cautions line', async () => {
    const run = await plan('--demo');
    expect(run.code).toBe(0);
    expect(run.stdout).toContain('Harbour General Hospital — required n 879 (set by Precise R²)');
    expect(run.stdout).toContain('Northfield Teaching Hospital — required n 1,424 (set by Precise calibration slope)');
    expect(run.stdout).toContain(CAUTIONS_ONE_LINE);
    expect(run.stderr).toBe('');
  });

  it('--csv gives a header, one row per population and a totals row (RFC 4180 line ends)', async () => {
    const run = await plan('--demo', '--csv');
    expect(run.code).toBe(0);
    const lines = run.stdout.split('\r\n').filter((l) => l !== '');
    expect(lines).toHaveLength(7);
    expect(lines[0]).toMatch(/^Rank,Population,/);
    expect(lines[0]).toContain('Required n');
    expect(lines[6]).toMatch(/^Total,5 populations/);
  });

  it('--markdown gives a heading, the comparison table and the cautions', async () => {
    const run = await plan('--demo', '--markdown');
    expect(run.code).toBe(0);
    expect(run.stdout.startsWith('# ')).toBe(true);
    expect(run.stdout).toMatch(/^\| Rank \| Population \|/m);
    expect(run.stdout).toMatch(/^> These numbers concern statistical precision only/m);
  });

  it('reads a plan file given by path exactly like the demo', async () => {
    const [fromFile, fromDemo] = await Promise.all([plan(demoFile, '--json'), plan('--demo', '--json')]);
    expect(fromFile.code).toBe(0);
    expect(fromFile.stdout).toBe(fromDemo.stdout);
  });
});

describe('invalid input exits 2 with the field path and the allowed range on stderr', () => {
  it('an R² outside (0, 1)', async () => {
    const file = variant('bad-r2.plumb', (doc) => {
      ((doc['populations'] as Record<string, Record<string, unknown>>[])[0]?.['anticipated'] as Record<string, unknown>)[
        'rSquared'
      ] = 1.5;
    });
    const run = await plan(file, '--json');
    expect(run.code).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toContain('populations[0].anticipated.rSquared');
    expect(run.stderr).toContain('greater than 0 and less than 1');
    expect(run.stderr).toContain('1.5');
  });

  it('a negative CITL width and a fractional number of predictor parameters, both named', async () => {
    const file = variant('bad-two.plumb', (doc) => {
      const pop = (doc['populations'] as Record<string, Record<string, Record<string, unknown>>>[])[2];
      if (pop !== undefined) pop['precision'] = { ...pop['precision'], citl: { width: -0.1 } };
      (doc['updating'] as Record<string, unknown>)['predictorParameters'] = 2.5;
    });
    const run = await plan(file);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain('populations[2].precision.citl.width');
    expect(run.stderr).toContain('updating.predictorParameters');
    expect(run.stderr).toContain('whole number');
  });

  it('a calibration-slope range that includes 0', async () => {
    const file = variant('bad-range.plumb', (doc) => {
      const pop = (doc['populations'] as Record<string, Record<string, unknown>>[])[1];
      if (pop !== undefined) pop['ranges'] = { slope: { low: -0.5, high: 1.2 } };
    });
    const run = await plan(file);
    expect(run.code).toBe(2);
    expect(run.stderr).toContain('populations[1].ranges.slope.high');
  });

  it('text that is not JSON, located by line and column', async () => {
    const file = path.join(work, 'broken.plumb');
    writeFileSync(file, '{\n  "format": "plumbline-plan",\n  "name": }\n');
    const run = await plan(file);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/line 3, column 11/);
  });

  it('unknown options and two formats at once', async () => {
    const [unknown, both, none] = await Promise.all([plan('--demo', '--yaml'), plan('--demo', '--json', '--csv'), plan()]);
    for (const run of [unknown, both, none]) {
      expect(run.code).toBe(2);
      expect(run.stdout).toBe('');
    }
    expect(unknown.stderr).toContain('unknown option --yaml');
    expect(both.stderr).toContain('choose one output format');
  });
});

describe('other failures exit 1', () => {
  it('a file that does not exist', async () => {
    const run = await plan(path.join(work, 'missing.plumb'));
    expect(run.code).toBe(1);
    expect(run.stderr).toContain('no such file');
  });
});
