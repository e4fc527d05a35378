import { describe, expect, it } from 'vitest';
import { PLANNER_OBJECTIVES, PLANNING_AIMS } from '@shared/engine/pooled';
import { fieldProblems } from '@shared/model/validation-message';
import { FORMAT_TAG, SCHEMA_VERSION, pooledSchema, projectSchema } from '@shared/model/project';

const minimal = { format: FORMAT_TAG, schemaVersion: SCHEMA_VERSION, name: 'Plan', outcome: 'continuous', populations: [] };

function problemsOf(pooled: unknown): { path: string; message: string }[] {
  const parsed = projectSchema.safeParse({ ...minimal, pooled }, { reportInput: true });
  if (parsed.success) throw new Error('expected the pooled settings to be refused');
  return fieldProblems(parsed.error);
}

describe('the plan-level pooled settings', () => {
  it('may be absent, so plans written without them stay valid and unchanged; an empty object takes the defaults', () => {
    expect(projectSchema.parse(minimal).pooled).toBeUndefined();
    expect(projectSchema.parse({ ...minimal, pooled: {} }).pooled).toEqual({
      aim: 'site-specific',
      objective: 'fewest-participants',
      confidence: 0.95,
      measures: {},
    });
  });

  it('offer the same aims and objectives as the pooled engine', () => {
    expect(pooledSchema.shape.aim.unwrap().options).toEqual([...PLANNING_AIMS]);
    expect(pooledSchema.shape.objective.unwrap().options).toEqual([...PLANNER_OBJECTIVES]);
  });

  it('keep a full measure entry as written', () => {
    const slope = { tau: 0.05, tauRange: { low: 0.02, high: 0.1 }, summaryCiWidth: 0.1, predictionIntervalWidth: 0.4 };
    const project = projectSchema.parse({ ...minimal, pooled: { aim: 'both', measures: { slope } } });
    expect(project.pooled?.measures.slope).toEqual(slope);
    expect(project.pooled?.aim).toBe('both');
  });

  it.each([
    [{ aim: 'everywhere' }, 'pooled.aim', 'planning aim must be "site-specific", "pooled" or "both"'],
    [
      { objective: 'cheapest' },
      'pooled.objective',
      'pooled planning objective must be "fewest-participants" or "shortest-recruitment"',
    ],
    [{ confidence: 1 }, 'pooled.confidence', 'confidence level of the pooled intervals must be greater than 0 and less than 1'],
    [
      { measures: { slope: { tau: -0.1 } } },
      'pooled.measures.slope.tau',
      'between-site SD τ of the calibration slope must be at least 0',
    ],
    [
      { measures: { rSquared: { tau: 0.6 } } },
      'pooled.measures.rSquared.tau',
      'between-site SD τ of the R² must be at least 0 and at most 0.5',
    ],
    [
      { measures: { citl: { summaryCiWidth: 0 } } },
      'pooled.measures.citl.summaryCiWidth',
      'target width of the summary CI for the CITL (outcome units) must be greater than 0',
    ],
    [
      { measures: { rSquared: { predictionIntervalWidth: 1.5 } } },
      'pooled.measures.rSquared.predictionIntervalWidth',
      'target width of the prediction interval for the R² must be greater than 0 and at most 1',
    ],
    [
      { measures: { slope: { tauRange: { low: 0.2, high: 0.1 } } } },
      'pooled.measures.slope.tauRange.high',
      'low must not exceed high',
    ],
    [
      { measures: { slope: { tau: 0.3, tauRange: { low: 0.02, high: 0.1 } } } },
      'pooled.measures.slope.tau',
      'between-site SD τ of the calibration slope must lie within its low–high range',
    ],
  ])('refuse %j at %s with a message naming the field and its allowed range', (pooled, path, message) => {
    const problems = problemsOf(pooled);
    expect(problems.map((p) => p.path)).toContain(path);
    expect(problems.find((p) => p.path === path)?.message).toContain(message);
  });

  it('refuse infinite and non-numeric values', () => {
    expect(problemsOf({ measures: { slope: { tau: Number.POSITIVE_INFINITY } } })[0]?.message).toContain(
      'between-site SD τ of the calibration slope must be a number',
    );
    expect(problemsOf({ measures: { slope: { summaryCiWidth: '0.1' } } })[0]?.message).toContain(
      'target width of the summary CI for the calibration slope must be a number',
    );
  });
});
