// The command line on the binary demo, run as users run it (`node scripts/plan.mjs …`): the
// binary criterion ids, the events in the human output and in --json, --demo binary and
// --demo-binary, and exit status 2 with the field named for a bad binary plan.
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { BINARY_DEVELOPMENT_CRITERION_IDS, BINARY_VALIDATION_CRITERION_IDS } from '@shared/engine/binary/binary-criterion-ids';
import { REPO_ROOT, runPlanCommand as plan } from './plan-command';

const demoFile = path.join(REPO_ROOT, 'demo', 'consortium-binary.plumb');
let work = '';

interface JsonPopulation {
  id: string;
  requiredN: number;
  binding: string;
  criteria: { id: string; n: number | null; status: string }[];
  events: { exact: number; whole: number } | null;
  eventsPerParameter: number | null;
}

beforeAll(async () => {
  work = mkdtempSync(path.join(tmpdir(), 'plumbline-cli-binary-'));
  expect((await plan('--help')).code).toBe(0);
}, 120_000);

afterAll(() => {
  rmSync(work, { recursive: true, force: true });
});

describe('plan --demo binary', () => {
  it('--json lists oe, slope, c-statistic, one net-benefit@t per threshold and the development ids, with events per population', async () => {
    const run = await plan('--demo', 'binary', '--json');
    expect(run.code).toBe(0);
    const out = JSON.parse(run.stdout) as { populations: JsonPopulation[] };
    const doc = JSON.parse(readFileSync(demoFile, 'utf8')) as {
      populations: { id: string; anticipated: { outcomeProportion: number; thresholds?: { threshold: number }[] } }[];
      updating: { predictorParameters: number };
    };
    expect(out.populations.map((p) => p.id)).toEqual(doc.populations.map((p) => p.id));
    for (const p of out.populations) {
      const source = doc.populations.find((d) => d.id === p.id);
      if (source === undefined) throw new Error(`population ${p.id} not in the demo`);
      const thresholdIds = (source.anticipated.thresholds ?? []).map((t) => `net-benefit@${t.threshold}`);
      expect(p.criteria.map((c) => c.id)).toEqual([
        ...BINARY_VALIDATION_CRITERION_IDS,
        ...thresholdIds,
        ...BINARY_DEVELOPMENT_CRITERION_IDS,
      ]);
      expect(p.requiredN).toBe(Math.max(...p.criteria.map((c) => c.n ?? 0)));
      const phi = source.anticipated.outcomeProportion;
      expect(p.events?.exact).toBeCloseTo(p.requiredN * phi, 9);
      expect(p.events?.whole).toBe(Math.ceil((p.events?.exact ?? 0) - 1e-9));
      expect(p.eventsPerParameter).toBeCloseTo((p.events?.exact ?? 0) / doc.updating.predictorParameters, 9);
    }
  });

  it('prints the events beside each required n in the readable table, and --demo-binary is the same demo', async () => {
    const [spaced, joined] = await Promise.all([plan('--demo', 'binary'), plan('--demo-binary')]);
    expect(spaced.code).toBe(0);
    expect(joined.stdout).toBe(spaced.stdout);
    expect(spaced.stdout).toContain('Outcome type: binary');
    const blocks = spaced.stdout.split('\n').filter((l) => l.startsWith('  Expected events at the required n: '));
    const doc = JSON.parse(readFileSync(demoFile, 'utf8')) as { populations: unknown[] };
    expect(blocks).toHaveLength(doc.populations.length);
  });

  it('--csv has the events column after the required n', async () => {
    const run = await plan('--demo', 'binary', '--csv');
    const header = run.stdout.split('\r\n')[0]?.split(',') ?? [];
    expect(header.indexOf('Events at required n')).toBe(header.indexOf('Required n') + 1);
  });

  it('the continuous demo keeps its output and says no events', async () => {
    const run = await plan('--demo', '--json');
    const out = JSON.parse(run.stdout) as { populations: JsonPopulation[] };
    expect(out.populations.every((p) => p.events === null)).toBe(true);
  });
});

describe('a bad binary plan', () => {
  function variant(name: string, change: (plan: { populations: { anticipated: Record<string, unknown> }[] }) => void): string {
    const doc = JSON.parse(readFileSync(demoFile, 'utf8')) as { populations: { anticipated: Record<string, unknown> }[] };
    change(doc);
    const file = path.join(work, name);
    writeFileSync(file, JSON.stringify(doc));
    return file;
  }

  it('exits 2 naming the field and the allowed range (C-statistic 0.5)', async () => {
    const file = variant('c-half.plumb', (doc) => {
      const first = doc.populations[0];
      if (first !== undefined) first.anticipated['cStatistic'] = 0.5;
    });
    const run = await plan(file, '--json');
    expect(run.code).toBe(2);
    expect(run.stdout).toBe('');
    expect(run.stderr).toContain(
      'populations[0].anticipated.cStatistic: anticipated C-statistic must be greater than 0.5 and less than 1',
    );
  });

  it('exits 2 for a continuous population in the binary plan, naming it', async () => {
    const file = variant('mixed.plumb', (doc) => {
      doc.populations.push({
        id: 'cont',
        name: 'Continuous intruder',
        outcome: 'continuous',
        anticipated: { rSquared: 0.3, outcomeVariance: 1 },
        precision: { citl: { width: 0.5 } },
      } as unknown as { anticipated: Record<string, unknown> });
    });
    const run = await plan(file);
    expect(run.code).toBe(2);
    expect(run.stderr).toMatch(/populations\[\d+\]\.outcome: population "Continuous intruder" is for a continuous outcome/);
  });
});
