// The across-sites figures on the command line, run as users run it (`node scripts/plan.mjs …`),
// on the bundled demo with pooled settings added: the figures and the paragraph appear for the
// pooled and both aims only, and the JSON gains a `pooled` field without changing the others.
import { execFile } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { formatCount } from '@shared/format/numbers';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../..');
const script = path.join(root, 'scripts', 'plan.mjs');
const demoFile = path.join(root, 'demo', 'consortium-continuous.plumb');
let work = '';

function plan(...args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  return new Promise((resolve) => {
    execFile(process.execPath, [script, ...args], { cwd: root, timeout: 60_000 }, (error, stdout, stderr) => {
      resolve({ code: error === null ? 0 : typeof error.code === 'number' ? error.code : -1, stdout, stderr });
    });
  });
}

/** The demo plan with these pooled settings, written to a file of its own. */
function withPooled(name: string, pooled: unknown): string {
  const doc = JSON.parse(readFileSync(demoFile, 'utf8')) as Record<string, unknown>;
  doc['pooled'] = pooled;
  const file = path.join(work, name);
  writeFileSync(file, JSON.stringify(doc));
  return file;
}

const SLOPE = { tau: 0.05, tauRange: { low: 0.02, high: 0.1 }, summaryCiWidth: 0.15, predictionIntervalWidth: 0.5 };

interface PooledJson {
  aim: string;
  measures: { key: string; atPlanned: { which: string }[] | null; curves?: unknown }[];
  proposal: {
    status: string;
    totalN: number | null;
    sites: { name: string; n: number | null; capacity: number | null }[];
  } | null;
  paragraph: string;
}

beforeAll(async () => {
  work = mkdtempSync(path.join(tmpdir(), 'plumbline-pooled-cli-'));
  expect((await plan('--help')).code).toBe(0);
}, 120_000);

afterAll(() => {
  rmSync(work, { recursive: true, force: true });
});

describe('plan with pooled settings', () => {
  it('the site-specific aim prints nothing across sites, and --json has no pooled field', async () => {
    const file = withPooled('site-specific.plumb', { aim: 'site-specific', measures: { slope: SLOPE } });
    const table = await plan(file);
    expect(table.code).toBe(0);
    expect(table.stdout).not.toContain('Across sites');
    const json = JSON.parse((await plan(file, '--json')).stdout) as Record<string, unknown>;
    expect(Object.keys(json)).not.toContain('pooled');
  });

  it('the pooled aim adds the figures, the proposal within capacity and the paragraph; the existing JSON fields are unchanged', async () => {
    const file = withPooled('pooled.plumb', { aim: 'pooled', measures: { slope: SLOPE } });
    const json = JSON.parse((await plan(file, '--json')).stdout) as Record<string, unknown> & { pooled: PooledJson };
    const plain = JSON.parse((await plan('--demo', '--json')).stdout) as Record<string, unknown>;
    expect(Object.keys(json)).toEqual(['populations', 'pooled', ...Object.keys(plain).filter((k) => k !== 'populations')]);
    for (const key of Object.keys(plain)) expect(json[key]).toEqual(plain[key]);
    const pooled = json.pooled;
    expect(pooled.aim).toBe('pooled');
    expect(pooled.measures.map((m) => m.key)).toEqual(['slope']);
    expect(pooled.measures[0]?.atPlanned?.map((c) => c.which)).toEqual(['low', 'base', 'high']);
    expect(pooled.measures[0]).not.toHaveProperty('curves');
    expect(pooled.proposal?.status).toBe('feasible');
    for (const s of pooled.proposal?.sites ?? []) expect(s.n ?? Infinity).toBeLessThanOrEqual(s.capacity ?? -1);
    expect(pooled.paragraph).toContain('Precision across sites.');

    const table = await plan(file);
    expect(table.code).toBe(0);
    expect(table.stdout).toContain('Across sites — aim: pooled; fewest participants; 95% intervals; 5 sites');
    expect(table.stdout).toContain(`Proposal: ${formatCount(pooled.proposal?.totalN)} participants with an outcome`);
    for (const s of pooled.proposal?.sites ?? []) expect(table.stdout).toContain(`${s.name}: n ${formatCount(s.n)} of capacity`);
    expect(table.stdout).toContain(pooled.paragraph);

    const markdown = await plan(file, '--markdown');
    expect(markdown.stdout).toContain('## Across sites');
    expect(markdown.stdout).toContain('| Site | Proposed n | Capacity | Own required n | Enrol | Months |');
    expect(markdown.stdout).not.toMatch(/\n{3,}/);
  }, 60_000);

  it('--report writes the across-sites section with its sources numbered among the report’s references', async () => {
    const file = withPooled('report.plumb', { aim: 'pooled', measures: { slope: SLOPE } });
    const target = path.join(work, 'report ü.md');
    const run = await plan(file, '--report', target);
    expect(run.code).toBe(0);
    const report = readFileSync(target, 'utf8');
    expect(report).toContain('Precision across sites');
    expect(report).toMatch(/Higgins–Thompson–Spiegelhalter 95% prediction interval .* \[\d+\]\./);
    expect(report).toContain('A re-evaluation of random-effects meta-analysis. J R Stat Soc A 2009');
    expect(report).toContain('| Site | Proposed n | Capacity | Own required n | Enrol | Months |');
    const plain = path.join(work, 'site-specific.md');
    await plan(withPooled('report-site.plumb', { aim: 'site-specific', measures: { slope: SLOPE } }), '--report', plain);
    expect(readFileSync(plain, 'utf8')).not.toContain('Precision across sites');
  }, 60_000);

  it('the both aim explains why the demo cannot meet every site’s own targets and the pooled ones', async () => {
    const run = await plan(withPooled('both.plumb', { aim: 'both', measures: { slope: SLOPE } }));
    expect(run.stdout).toContain('No proposal (infeasible):');
    expect(run.stdout).toContain('for its own targets, more than it can recruit');
  });

  it('a bad pooled value exits 2 and names the field and its range', async () => {
    const run = await plan(withPooled('bad.plumb', { aim: 'pooled', measures: { slope: { ...SLOPE, tau: -0.1 } } }));
    expect(run.code).toBe(2);
    expect(run.stderr).toContain('pooled.measures.slope.tau');
    expect(run.stderr).toContain('between-site SD τ of the calibration slope must be at least 0');
  });
});
