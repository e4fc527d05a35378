import { describe, expect, it } from 'vitest';
import { applyFieldEdit, parseNumberText } from '../../../src-renderer/src/state/field-edit';
import { getAt, setAt } from '../../../src-renderer/src/state/paths';
import { continuousPopulationSchema } from '@shared/model/project';

const population = continuousPopulationSchema.parse({
  id: 'p1',
  name: 'Site',
  outcome: 'continuous',
  anticipated: { rSquared: 0.5, outcomeVariance: 4 },
  precision: { citl: { width: 0.5 } },
});

describe('field edits are validated by the schema', () => {
  it('accepts a valid value and fills defaults', () => {
    const edit = applyFieldEdit(population, 'anticipated.rSquared', 0.7, 'Anticipated R²');
    expect(edit).toMatchObject({
      ok: true,
      population: { anticipated: { rSquared: 0.7 }, precision: { slope: { width: 0.2 } } },
    });
  });

  it('refuses an out-of-range value with a message naming the field and its range', () => {
    const edit = applyFieldEdit(population, 'anticipated.rSquared', 1.3, 'Anticipated R²');
    expect(edit).toEqual({ ok: false, message: 'anticipated R² must be greater than 0 and less than 1 (got 1.3)' });
  });

  it('an empty optional field falls back to its default; an empty required one is refused', () => {
    expect(applyFieldEdit(population, 'anticipated.slope', undefined, 'slope')).toMatchObject({ ok: true });
    const missing = applyFieldEdit(population, 'precision.citl.width', undefined, 'CITL width');
    expect(missing.ok).toBe(false);
  });

  it('parses typed numbers strictly', () => {
    expect(parseNumberText(' 0.25 ')).toEqual({ ok: true, value: 0.25 });
    expect(parseNumberText('\u22121')).toEqual({ ok: true, value: -1 });
    expect(parseNumberText('')).toEqual({ ok: true, value: undefined });
    expect(parseNumberText('1e-3')).toEqual({ ok: true, value: 0.001 });
    expect(parseNumberText('0,5').ok).toBe(false);
    expect(parseNumberText('abc').ok).toBe(false);
    expect(parseNumberText('1e999').ok).toBe(false);
  });

  it('getAt/setAt read and replace nested values without touching other branches', () => {
    const next = setAt(population, 'precision.citl.width', 0.8);
    expect(getAt(next, 'precision.citl.width')).toBe(0.8);
    expect(getAt(population, 'precision.citl.width')).toBe(0.5);
    expect(next.anticipated).toBe(population.anticipated);
    expect(getAt(setAt(population, 'anticipated.slope', undefined), 'anticipated.slope')).toBeUndefined();
  });
});
