import { describe, expect, it } from 'vitest';
import { createRowCache } from '@shared/summary/row-cache';
import { comparisonRows, type Planner } from '@shared/summary/comparison';
import { projectSchema, type Project } from '@shared/model/project';

const project: Project = projectSchema.parse({
  format: 'plumbline-plan',
  schemaVersion: 2,
  name: 'P',
  outcome: 'continuous',
  populations: ['a', 'b', 'c'].map((id) => ({
    id,
    name: id,
    outcome: 'continuous',
    anticipated: { rSquared: 0.5, outcomeVariance: 1 },
    precision: { citl: { width: 0.5 } },
  })),
});

function countingPlanner(): { planner: Planner; calls: string[] } {
  const calls: string[] = [];
  return {
    calls,
    planner: {
      plan(population) {
        calls.push(population.id);
        const rSquared = population.outcome === 'continuous' ? population.anticipated.rSquared : 0;
        return { criteria: [], requiredN: rSquared * 1000, binding: null };
      },
    },
  };
}

describe('row cache', () => {
  it('replans only the population an edit replaced, and gives the same rows as planning afresh', () => {
    const { planner, calls } = countingPlanner();
    const cache = createRowCache(planner);
    cache.rows(project);
    expect(calls).toEqual(['a', 'b', 'c']);
    const edited = {
      ...project,
      populations: project.populations.map((p) =>
        p.id === 'b' && p.outcome === 'continuous' ? { ...p, anticipated: { ...p.anticipated, rSquared: 0.7 } } : p,
      ),
    };
    const rows = cache.rows(edited);
    expect(calls).toEqual(['a', 'b', 'c', 'b']);
    expect(rows).toEqual(comparisonRows(edited, planner));
  });

  it('replans everything when the updating settings or the study window change', () => {
    const { planner, calls } = countingPlanner();
    const cache = createRowCache(planner);
    cache.rows(project);
    cache.rows({ ...project, updating: { ...project.updating, enabled: true } });
    expect(calls).toHaveLength(6);
    cache.rows({ ...project, study: { windowMonths: 12 } });
    expect(calls).toHaveLength(9);
  });
});
