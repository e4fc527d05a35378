import { readFile } from 'node:fs/promises';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { copyName, duplicatePopulation, exportPopulation, importPopulations, issueId } from '@shared/model/population-ops';
import { parsePlanText } from '@shared/model/plan-file';
import { projectSchema } from '@shared/model/project';
import type { Project } from '@shared/model/project';
import { newEmptyProject } from '@shared/model/new-project';
import { projectInputArbitrary } from './helpers/project-arbitrary';

async function fixturePlan(): Promise<Project> {
  const result = parsePlanText(await readFile(new URL('./fixtures/schema-1.plumb', import.meta.url), 'utf8'));
  if (!result.ok) throw new Error(result.error.message);
  return result.project;
}

describe('issueId and copyName', () => {
  it('keep a free id, otherwise number it without stacking suffixes', () => {
    expect(issueId(new Set(['b']), 'a')).toBe('a');
    expect(issueId(new Set(['a']), 'a')).toBe('a-2');
    expect(issueId(new Set(['a', 'a-2']), 'a-2')).toBe('a-3');
    expect(issueId(new Set(), '')).toBe('population-2');
  });

  it('shorten a long id so the numbered one still fits the 100-character limit', () => {
    const long = 'x'.repeat(100);
    const id = issueId(new Set([long]), long);
    expect(id).toBe(`${'x'.repeat(98)}-2`);
  });

  it('name copies "(copy)", then "(copy 2)", within the 200-character limit and without splitting a character', () => {
    expect(copyName(new Set(), 'Site A')).toBe('Site A (copy)');
    expect(copyName(new Set(['Site A (copy)']), 'Site A')).toBe('Site A (copy 2)');
    const emoji = '😀'.repeat(100); // 200 UTF-16 units
    // 193 units are left for the name; the 97th emoji would be split, so 96 are kept
    expect(copyName(new Set(), emoji)).toBe(`${'😀'.repeat(96)} (copy)`);
  });
});

describe('duplicatePopulation', () => {
  it('inserts the copy after the original with a new id and "(copy)" name, and leaves the input unchanged', async () => {
    const plan = await fixturePlan();
    const before = structuredClone(plan);
    const result = duplicatePopulation(plan, 'harbour-general');
    if (!result.ok) throw new Error(result.error.message);
    expect(result.value.project.populations.map((p) => p.id)).toEqual([
      'harbour-general',
      'harbour-general-2',
      'lakeside-registry',
    ]);
    expect(result.value.population).toMatchObject({ id: 'harbour-general-2', name: 'Harbour General, Études cliniques (copy)' });
    const { id: _a, name: _b, ...copyRest } = result.value.population;
    const { id: _c, name: _d, ...originalRest } = plan.populations[0] ?? {};
    expect(copyRest).toEqual(originalRest);
    expect(plan).toEqual(before);
  });

  it('copies deeply: changing the copy does not change the original', async () => {
    const result = duplicatePopulation(await fixturePlan(), 'harbour-general');
    if (!result.ok) throw new Error(result.error.message);
    expect(result.value.population.ranges).not.toBe(result.value.project.populations[0]?.ranges);
  });

  it('fails with "no-such-population" for an unknown id', async () => {
    expect(duplicatePopulation(await fixturePlan(), 'nowhere')).toEqual({
      ok: false,
      error: {
        code: 'no-such-population',
        message: 'The plan "Northwind wound-healing score: external validation" has no population with id "nowhere".',
      },
    });
  });
});

describe('importPopulations', () => {
  it('appends all populations, re-issuing the ids that clash', async () => {
    const plan = await fixturePlan();
    const result = importPopulations(plan, plan);
    if (!result.ok) throw new Error(result.error.message);
    expect(result.value.project.populations.map((p) => p.id)).toEqual([
      'harbour-general',
      'lakeside-registry',
      'harbour-general-2',
      'lakeside-registry-2',
    ]);
    expect(result.value.imported).toEqual([
      { sourceId: 'harbour-general', id: 'harbour-general-2', name: 'Harbour General, Études cliniques' },
      { sourceId: 'lakeside-registry', id: 'lakeside-registry-2', name: 'Lakeside wound registry' },
    ]);
  });

  it('imports only the listed populations, in the order listed, keeping ids that are free', async () => {
    const result = importPopulations(newEmptyProject(), await fixturePlan(), ['lakeside-registry', 'harbour-general']);
    expect(result.ok && result.value.project.populations.map((p) => p.id)).toEqual(['lakeside-registry', 'harbour-general']);
  });

  it('fails with "no-such-population" for an id the source does not have', async () => {
    expect(importPopulations(newEmptyProject(), await fixturePlan(), ['nowhere'])).toMatchObject({
      ok: false,
      error: { code: 'no-such-population' },
    });
  });

  it('fails with "outcome-mismatch" when the outcome types differ', async () => {
    // Only continuous outcomes exist in this schema version; a binary plan is forced in to test the guard.
    const binary = { ...(await fixturePlan()), outcome: 'binary' } as unknown as Project;
    const result = importPopulations(newEmptyProject(), binary);
    expect(result).toEqual({
      ok: false,
      error: {
        code: 'outcome-mismatch',
        message:
          'Cannot import: "Untitled plan" plans for a continuous outcome, and the populations of "Northwind wound-healing score: external validation" are for a binary outcome.',
      },
    });
  });

  it('gives a valid plan with unique ids for any two valid plans with unique ids', () => {
    fc.assert(
      fc.property(projectInputArbitrary(4), projectInputArbitrary(4), (a, b) => {
        const target = projectSchema.parse(a);
        const source = projectSchema.parse(b);
        const result = importPopulations(target, source);
        if (!result.ok) throw new Error(result.error.message);
        const ids = result.value.project.populations.map((p) => p.id);
        expect(new Set(ids).size).toBe(ids.length);
        expect(ids).toHaveLength(target.populations.length + source.populations.length);
      }),
      { numRuns: 100 },
    );
  });
});

describe('exportPopulation', () => {
  it('makes a one-population plan with the same model, settings and study window', async () => {
    const plan = await fixturePlan();
    const result = exportPopulation(plan, 'lakeside-registry');
    if (!result.ok) throw new Error(result.error.message);
    expect(result.value.name).toBe('Lakeside wound registry (from Northwind wound-healing score: external validation)');
    expect(result.value.populations).toEqual([plan.populations[1]]);
    expect({ ...result.value, name: plan.name, populations: plan.populations }).toEqual(plan);
  });

  it('cuts the plan name to the 200-character limit', async () => {
    const plan = { ...(await fixturePlan()), name: 'P'.repeat(200) };
    const result = exportPopulation(plan, 'harbour-general');
    expect(result.ok && result.value.name.length).toBe(200);
  });

  it('fails with "no-such-population" for an unknown id', async () => {
    expect(exportPopulation(await fixturePlan(), 'nowhere')).toMatchObject({ ok: false, error: { code: 'no-such-population' } });
  });
});

describe('newEmptyProject', () => {
  it('is a valid plan with no populations and the schema defaults', () => {
    const project = newEmptyProject();
    expect(projectSchema.safeParse(project).success).toBe(true);
    expect(project).toMatchObject({
      name: 'Untitled plan',
      outcome: 'continuous',
      populations: [],
      updating: { enabled: false },
    });
  });
});
