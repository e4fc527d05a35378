// Worst case and sensitivity curves over the ranges of a binary population: each point is the
// binary plan with one anticipated value replaced, the worst is the largest n over the sweep, and
// the curves follow the table's planner.
import { describe, expect, it } from 'vitest';
import { planBinary } from '@shared/engine/plan/plan-binary';
import { binaryAssumptionRanges } from '@shared/engine/ranges/binary-assumption-ranges';
import { binarySensitivityCurves } from '@shared/engine/ranges/binary-sensitivity-curves';
import { binaryEffectiveBase, binaryRangedAssumptions } from '@shared/engine/ranges/binary-sweep';
import { binaryWorstCase } from '@shared/engine/ranges/binary-worst-case';
import { binaryPopulationSchema } from '@shared/model/project';
import type { Project } from '@shared/model/project';

const project: Pick<Project, 'updating'> = {
  updating: { enabled: false, targetShrinkage: 0.9, optimismMargin: 0.05, shrinkageForm: 'adjusted-r2-link' },
};

const site = binaryPopulationSchema.parse({
  id: 's',
  name: 'S',
  outcome: 'binary',
  anticipated: { outcomeProportion: 0.1, cStatistic: 0.78 },
  ranges: {
    calibrationSlope: { low: 0.8, high: 1.1 },
    outcomeProportion: { low: 0.06, high: 0.14 },
  },
});

const nAt = (anticipated: Record<string, number>) =>
  planBinary({ ...site, anticipated: { ...site.anticipated, ...anticipated } }, project).requiredN;

describe('binary ranges', () => {
  it('lists the ranged assumptions in the schema order, with their base values (calibration slope 1 by default)', () => {
    expect(binaryRangedAssumptions(site).map((r) => r.key)).toEqual(['outcomeProportion', 'calibrationSlope']);
    expect(binaryEffectiveBase(site, 'calibrationSlope')).toBe(1);
    expect(binaryEffectiveBase(site, 'calibrationIntercept')).toBe(0);
    expect(binaryEffectiveBase(site, 'lpMean')).toBeUndefined();
  });

  it('each point is the plan with that one value replaced; the worst is the largest over the sweep', () => {
    const ranges = binaryAssumptionRanges(site, project, 9);
    const phi = ranges.find((r) => r.key === 'outcomeProportion');
    if (phi === undefined) throw new Error('outcome proportion range missing');
    expect(phi.points.map((p) => p.value)).toHaveLength(9);
    for (const p of phi.points) expect(p.requiredN).toBe(nAt({ outcomeProportion: p.value }));
    expect(phi.base?.requiredN).toBe(planBinary(site, project).requiredN);
    const largest = Math.max(...phi.points.map((p) => p.requiredN ?? 0));
    expect(phi.worst.requiredN).toBe(largest);
  });

  it('the worst case names the assumption and value that asked for most, and matches the plan at that value', () => {
    const worst = binaryWorstCase(site, project);
    if (worst === null) throw new Error('expected a worst case');
    expect(worst.requiredN).toBe(nAt({ [worst.key]: worst.value }));
    const all = binaryAssumptionRanges(site, project).flatMap((r) => r.points.map((p) => p.requiredN ?? 0));
    expect(worst.requiredN).toBe(Math.max(...all));
    expect(worst.assumption).toMatch(/^Anticipated (outcome proportion|calibration slope) at /);
    expect(binaryWorstCase({ ...site, ranges: {} }, project)).toBeNull();
  });

  it('gives one 25-point curve per ranged assumption with a base value, its base n the plan n', () => {
    const curves = binarySensitivityCurves(site, project);
    expect(curves.map((c) => c.key)).toEqual(['outcomeProportion', 'calibrationSlope']);
    for (const curve of curves) {
      expect(curve.points).toHaveLength(25);
      expect(curve.baseN).toBe(planBinary(site, project).requiredN);
      expect(curve.points[0]?.value).toBe(curve.low);
      expect(curve.points.at(-1)?.value).toBe(curve.high);
    }
    const noBase = binaryPopulationSchema.parse({
      ...site,
      anticipated: { outcomeProportion: 0.1, lpMean: -2.5, lpSd: 1 },
      ranges: { cStatistic: { low: 0.7, high: 0.8 } },
    });
    expect(binarySensitivityCurves(noBase, project)).toEqual([]);
    expect(binaryWorstCase(noBase, project)?.key).toBe('cStatistic');
  });
});
