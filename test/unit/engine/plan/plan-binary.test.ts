// The binary planner of a project population: how the file's fields map onto the engine input
// (every binary check value is tested in the engine's own tests; here the mapping, the events,
// the development settings, the dispatch by outcome type and the refusal of mixed outcomes), with
// fast-check properties.
import { readFileSync } from 'node:fs';
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { DEFAULT_BINARY_PRECISION } from '@shared/engine/binary/binary-population-input';
import { binaryPrecisionAtN, planBinaryPopulation } from '@shared/engine/binary/plan-binary-population';
import { binaryPlanner } from '@shared/engine/plan/binary-planner';
import { continuousPlanner } from '@shared/engine/plan/continuous-planner';
import { planBinary } from '@shared/engine/plan/plan-binary';
import { planProject } from '@shared/engine/plan/plan-project';
import { parsePlanText } from '@shared/model/plan-file';
import { binaryPopulationSchema, continuousPopulationSchema, projectSchema } from '@shared/model/project';
import type { BinaryPopulation, Project } from '@shared/model/project';
import { comparisonRow } from '@shared/summary/comparison';
import { enginePlanner } from '@shared/summary/planner';
import { expectClose } from '../../helpers/expect-close';
import { binaryPopulationArbitrary } from '../../model/helpers/binary-population-arbitrary';

const updatingOff: Pick<Project, 'updating'> = {
  updating: { enabled: false, targetShrinkage: 0.9, optimismMargin: 0.05, shrinkageForm: 'adjusted-r2-link' },
};
const updatingOn = (extra: Partial<Project['updating']> = {}): Pick<Project, 'updating'> => ({
  updating: { ...updatingOff.updating, enabled: true, predictorParameters: 12, anticipatedCoxSnellR2: 0.1, ...extra },
});

const population = (input: unknown): BinaryPopulation => binaryPopulationSchema.parse(input);

/** phi 0.1, C 0.8, two thresholds (one with sensitivity and specificity), the default targets. */
const methodsSite = population({
  id: 'm',
  name: 'Methods site',
  outcome: 'binary',
  anticipated: {
    outcomeProportion: 0.1,
    cStatistic: 0.8,
    thresholds: [{ threshold: 0.1 }, { threshold: 0.2, sensitivity: 0.6, specificity: 0.85 }],
  },
});

describe('planBinary maps a project population onto the engine', () => {
  it('gives the engine plan of the same inputs: criteria, n, binding, events (default targets, LP fitted)', () => {
    const engine = planBinaryPopulation({
      anticipated: {
        outcomeProportion: 0.1,
        cStatistic: 0.8,
        thresholds: [{ threshold: 0.1 }, { threshold: 0.2, sensitivity: 0.6, specificity: 0.85 }],
      },
      precision: DEFAULT_BINARY_PRECISION,
    });
    const plan = planBinary(methodsSite, updatingOff);
    expect(plan.criteria).toEqual(engine.criteria);
    expect(plan.criteria.map((c) => c.id)).toEqual(['oe', 'slope', 'c-statistic', 'net-benefit@0.1', 'net-benefit@0.2']);
    expect(plan.requiredN).toBe(engine.n);
    expect(plan.binding).toBe(engine.bindingId);
    expect(plan.validationN).toBe(engine.n);
    expect(plan.developmentN).toBeNull();
    expect(plan.events).toEqual(engine.events);
    expect(plan.lp).toEqual(engine.lp);
    expect(plan.warnings).toEqual(engine.warnings);
  });

  it('states the events at the required n as n·phi, exact and rounded up', () => {
    const plan = planBinary(methodsSite, updatingOff);
    const n = plan.requiredN ?? Number.NaN;
    expectClose(plan.events?.exact ?? Number.NaN, n * 0.1, 1e-9 * n, 'events = n·phi (floating-point product)');
    expect(plan.events?.whole).toBe(Math.ceil((plan.events?.exact ?? 0) - 1e-9));
  });

  it('passes the O/E limits, the LP, the miscalibration and every precision target through unchanged', () => {
    const precision = {
      confidence: 0.9,
      oe: { lower: 0.8, upper: 1.25 },
      slope: { width: 0.3 },
      cStatistic: { width: 0.08 },
      netBenefit: { width: 0.05, standardised: false },
    };
    const site = population({
      id: 'x',
      name: 'X',
      outcome: 'binary',
      anticipated: { outcomeProportion: 0.2, lpMean: -1.8, lpSd: 0.9, calibrationIntercept: 0.2, calibrationSlope: 0.8 },
      precision,
    });
    const engine = planBinaryPopulation({
      anticipated: {
        outcomeProportion: 0.2,
        lpMean: -1.8,
        lpSd: 0.9,
        calibrationIntercept: 0.2,
        calibrationSlope: 0.8,
        thresholds: [],
      },
      precision,
    });
    expect(planBinary(site, updatingOff).criteria).toEqual(engine.criteria);
    expect(planBinary(site, updatingOff).lp?.source).toBe('given');
  });

  it('with a fixed available n, reports what it delivers exactly as binaryPrecisionAtN does', () => {
    const fixed = population({ ...methodsSite, recruitment: { availableN: 1500 } });
    const plan = planBinary(fixed, updatingOn());
    expect(plan.availableN).toBe(1500);
    const input = {
      anticipated: { outcomeProportion: 0.1, cStatistic: 0.8, thresholds: methodsSite.anticipated.thresholds },
      precision: DEFAULT_BINARY_PRECISION,
    };
    const options = {
      development: { predictorParameters: 12, coxSnellR2: 0.1, targetShrinkage: 0.9, optimismMargin: 0.05, riskMargin: 0.05 },
    };
    expect(plan.precisionAtAvailableN).toEqual(binaryPrecisionAtN(input, 1500, options));
  });
});

describe('model updating for a binary population', () => {
  it('adds the three development minimums with the plan settings, and events per predictor parameter', () => {
    const plan = planBinary(methodsSite, updatingOn({ riskMargin: 0.03, targetShrinkage: 0.95 }));
    const engine = planBinaryPopulation(
      {
        anticipated: { outcomeProportion: 0.1, cStatistic: 0.8, thresholds: methodsSite.anticipated.thresholds },
        precision: DEFAULT_BINARY_PRECISION,
      },
      {
        development: { predictorParameters: 12, coxSnellR2: 0.1, targetShrinkage: 0.95, optimismMargin: 0.05, riskMargin: 0.03 },
      },
    );
    expect(plan.criteria.map((c) => c.id).slice(-3)).toEqual(['dev-shrinkage', 'dev-optimism', 'dev-overall-risk']);
    expect(plan.criteria).toEqual(engine.criteria);
    expect(plan.requiredN).toBe(engine.n);
    expect(plan.developmentN).toBe(Math.max(...plan.criteria.filter((c) => c.purpose === 'development').map((c) => c.n ?? 0)));
    expectClose(plan.eventsPerParameter ?? Number.NaN, (plan.events?.exact ?? Number.NaN) / 12, 1e-12, 'EPP = E/P');
  });

  it('lists them as not assessable, naming the missing project fields, when P or the Cox–Snell R² is missing', () => {
    const plan = planBinary(methodsSite, { updating: { ...updatingOn().updating, anticipatedCoxSnellR2: undefined } });
    const dev = plan.criteria.filter((c) => c.purpose === 'development');
    expect(dev.map((c) => [c.id, c.status, c.n])).toEqual([
      ['dev-shrinkage', 'not-assessable', null],
      ['dev-optimism', 'not-assessable', null],
      ['dev-overall-risk', 'not-assessable', null],
    ]);
    expect(dev[0]?.reason).toBe('needs the anticipated Cox–Snell R² (updating.anticipatedCoxSnellR2)');
    expect(plan.requiredN).toBe(planBinary(methodsSite, updatingOff).requiredN);
    expect(plan.developmentN).toBeNull();
    const neither = planBinary(methodsSite, { updating: { ...updatingOff.updating, enabled: true } });
    expect(neither.criteria.at(-1)?.reason).toBe(
      'needs the number of predictor parameters (updating.predictorParameters) and the anticipated Cox–Snell R² (updating.anticipatedCoxSnellR2)',
    );
  });

  it('refuses a Cox–Snell R² impossible at the outcome proportion with the project field named', () => {
    const rare = population({ ...methodsSite, anticipated: { outcomeProportion: 0.01, cStatistic: 0.8 } });
    expect(() => planBinary(rare, updatingOn({ anticipatedCoxSnellR2: 0.2 }))).toThrow(
      /^updating\.anticipatedCoxSnellR2 = 0\.2 is outside/,
    );
  });
});

describe('the planner dispatches on the outcome type and refuses mixed outcomes', () => {
  const continuous = continuousPopulationSchema.parse({
    id: 'c',
    name: 'Continuous site',
    outcome: 'continuous',
    anticipated: { rSquared: 0.5, outcomeVariance: 1 },
    precision: { citl: { width: 0.5 } },
  });
  const binaryProject = projectSchema.parse({
    format: 'plumbline-plan',
    schemaVersion: 2,
    name: 'B',
    outcome: 'binary',
    populations: [methodsSite],
  });

  it('sends a binary population to the binary engine and a continuous one to the continuous engine', () => {
    expect(enginePlanner.plan(methodsSite, binaryProject)).toEqual(binaryPlanner.plan(methodsSite, binaryProject));
    const continuousProject = { ...binaryProject, outcome: 'continuous' as const, populations: [continuous] };
    expect(enginePlanner.plan(continuous, continuousProject)).toEqual(continuousPlanner.plan(continuous, continuousProject));
    expect(enginePlanner.sensitivity(continuous, continuousProject)).toEqual([]);
  });

  it("refuses a population whose outcome type is not the plan's, and the comparison row says why", () => {
    expect(() => enginePlanner.plan(continuous, binaryProject)).toThrow(/outcome of population "Continuous site"/);
    const row = comparisonRow(continuous, binaryProject, enginePlanner);
    expect(row.requiredN).toBeNull();
    expect(row.problem).toContain("the plan's outcome type (one model predicts one outcome type)");
  });

  it('plans the bundled binary demo: every population planned, the same numbers as the planner, events in each row', () => {
    const parsed = parsePlanText(readFileSync('demo/consortium-binary.plumb', 'utf8'));
    if (!parsed.ok) throw new Error(parsed.error.message);
    const demo = parsed.project;
    expect(demo.outcome).toBe('binary');
    expect(demo.populations.length).toBeGreaterThanOrEqual(4);
    const plan = planProject(demo);
    for (const [i, p] of plan.populations.entries()) {
      const population = demo.populations[i];
      if (population?.outcome !== 'binary') throw new Error('the binary demo holds only binary populations');
      expect(p.requiredN).toBe(planBinary(population, demo).requiredN);
      expect(p.events?.whole).toBeGreaterThan(0);
      expect(comparisonRow(population, demo, enginePlanner).events).toEqual(p.events);
    }
    expect(plan.totalRequiredN).toBe(plan.populations.reduce((sum, p) => sum + (p.requiredN ?? Number.NaN), 0));
    // the sites differ in event rate
    expect(new Set(demo.populations.map((p) => (p.outcome === 'binary' ? p.anticipated.outcomeProportion : 0))).size).toBe(
      demo.populations.length,
    );
  });
});

describe('properties', () => {
  it('the O/E criterion asks for more participants as the outcome proportion falls', () => {
    fc.assert(
      fc.property(fc.double({ min: 0.01, max: 0.9, noNaN: true }), fc.double({ min: 0.01, max: 0.9, noNaN: true }), (a, b) => {
        fc.pre(a !== b);
        const [low, high] = a < b ? [a, b] : [b, a];
        const oeN = (phi: number) =>
          planBinary(
            population({ ...methodsSite, anticipated: { outcomeProportion: phi, cStatistic: 0.75 } }),
            updatingOff,
          ).criteria.find((c) => c.id === 'oe')?.n ?? Number.NaN;
        expect(oeN(low)).toBeGreaterThanOrEqual(oeN(high));
      }),
      { numRuns: 60 },
    );
  });

  it('every output is finite and whole for valid populations, with or without model updating', () => {
    fc.assert(
      fc.property(binaryPopulationArbitrary('p'), fc.boolean(), (input, updating) => {
        const site = population(input);
        const plan = planBinary(site, updating ? updatingOn({ anticipatedCoxSnellR2: 0.05 }) : updatingOff);
        for (const c of plan.criteria) {
          if (c.n !== null) expect(Number.isInteger(c.n) && c.n >= 1).toBe(true);
          for (const i of c.intermediates) expect(Number.isFinite(i.value), `${c.id} ${i.name}`).toBe(true);
        }
        if (plan.requiredN !== null) {
          expect(Number.isInteger(plan.requiredN)).toBe(true);
          expect(Number.isFinite(plan.events?.exact ?? Number.NaN)).toBe(true);
          expect(Number.isInteger(plan.events?.whole ?? Number.NaN)).toBe(true);
        } else {
          expect(plan.binding === null || plan.criteria.some((c) => c.status === 'not-converged')).toBe(true);
        }
        if (plan.lp !== null && plan.lp !== undefined) {
          expect(Number.isFinite(plan.lp.mean) && Number.isFinite(plan.lp.sd)).toBe(true);
        }
      }),
      { numRuns: 120 },
    );
  });
});
