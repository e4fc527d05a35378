// The simulation check of a plan's population: inputs, closed form at n, staleness, the record kept
// in the plan file and its way back to a result.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { planPopulation } from '@shared/engine/plan/plan-population';
import { isContinuousPopulation } from '@shared/engine/plan/plan-project';
import { resolveLp } from '@shared/engine/binary/resolve-lp';
import { validationPrecisionAtN } from '@shared/engine/continuous/evaluate-continuous';
import { validationInputsOf } from '@shared/engine/plan/population-inputs';
import { createSimulation, parseSimulationConfig, simulationVerdict } from '@shared/engine/simulation';
import type { SimulationResult } from '@shared/engine/simulation';
import { parsePlanText, parsePlanValue, serialisePlan } from '@shared/model/plan-file';
import { FORMAT_TAG, populationSchema, projectSchema, SCHEMA_VERSION } from '@shared/model/project';
import type { ContinuousPopulation, Project } from '@shared/model/project';
import { simulationRecordSchema } from '@shared/model/simulation-record';
import type { SimulationRecord } from '@shared/model/simulation-record';
import {
  canonicalJson,
  closedFormAtN,
  simulatedInputsOf,
  simulationConfigOf,
  simulationNotes,
  simulationStaleness,
  simulationTargets,
  verdictReferences,
} from '@shared/summary/simulation-check';
import type { PlanForSimulation } from '@shared/summary/simulation-check';
import { SIMULATION_HEADER, simulationCells } from '@shared/summary/simulation-cells';
import { recordOf, resultOf, withSimulation } from '@shared/summary/simulation-store';
import { expectClose } from '../helpers/expect-close';

const DEMO = new URL('../../../demo/consortium-continuous.plumb', import.meta.url);

/** A one-population plan: R² 0.8, var(Y) 100, CITL width 1 (closed-form CITL n 308, VAL-CONT). */
function plan(population: Record<string, unknown> = {}): Project {
  return projectSchema.parse({
    format: FORMAT_TAG,
    schemaVersion: SCHEMA_VERSION,
    name: 'Test plan',
    outcome: 'continuous',
    populations: [
      {
        id: 'p1',
        name: 'Site one',
        outcome: 'continuous',
        anticipated: { rSquared: 0.8, outcomeVariance: 100 },
        precision: { citl: { width: 1 } },
        ...population,
      },
      {
        id: 'p2',
        name: 'Site two',
        outcome: 'continuous',
        anticipated: { rSquared: 0.5, outcomeVariance: 4 },
        precision: { citl: { width: 0.5 } },
      },
    ],
  });
}

function firstOf(project: Project): ContinuousPopulation {
  const p = project.populations[0];
  if (p === undefined || !isContinuousPopulation(p)) throw new Error('no continuous population');
  return p;
}

function planOf(project: Project, population: ContinuousPopulation): PlanForSimulation {
  const p = planPopulation(population, project);
  return { criteria: p.criteria, requiredN: p.requiredN, availableN: p.availableN };
}

function inputsOf(population: ContinuousPopulation) {
  const outcome = simulatedInputsOf(population);
  if (!outcome.ok) throw new Error(outcome.reason);
  return outcome.inputs;
}

function run(project: Project, n: number, replicates = 200, seed = 11): SimulationResult {
  const sim = createSimulation(simulationConfigOf(inputsOf(firstOf(project)), n, replicates, seed));
  for (let guard = 0; guard < 100_000 && !sim.step(Infinity).done; guard++);
  return sim.result();
}

const TIMING = { ranAt: '2026-03-02T10:15:00.000Z', elapsedMs: 42 };

describe('simulatedInputsOf and simulationConfigOf', () => {
  it('fill the defaults (slope 1, CITL 0) and give a configuration the engine accepts unchanged', () => {
    const inputs = inputsOf(firstOf(plan()));
    expect(inputs).toEqual({
      outcome: 'continuous',
      population: { rSquared: 0.8, outcomeVariance: 100, slope: 1, citl: 0 },
      targets: {
        confidence: 0.95,
        rSquared: { width: 0.1 },
        citl: { width: 1 },
        slope: { width: 0.2 },
        residualSd: { marginFactor: 1.1 },
      },
    });
    const parsed = parseSimulationConfig(simulationConfigOf(inputs, 308, 2000, 5));
    // The engine's parsed population and targets equal the inputs, so a stored record compares equal later.
    expect(canonicalJson({ outcome: parsed.outcome, population: parsed.population, targets: parsed.targets })).toBe(
      canonicalJson(inputs),
    );
  });

  it('map a binary population: the LP as the planner resolves it and the O/E limits as their margin factor', () => {
    const population = populationSchema.parse({
      id: 'b1',
      name: 'Binary site',
      outcome: 'binary',
      anticipated: { outcomeProportion: 0.1, cStatistic: 0.8 },
      precision: { oe: { lower: 0.9, upper: 1.1 } },
    });
    const outcome = simulatedInputsOf(population);
    if (!outcome.ok || outcome.inputs.outcome !== 'binary') throw new Error('binary inputs expected');
    const lp = resolveLp({ outcomeProportion: 0.1, cStatistic: 0.8 });
    if (lp.kind !== 'fitted') throw new Error('the LP fit should converge for phi 0.1, C 0.8');
    expect(outcome.inputs.population).toEqual({
      lpMean: lp.lp.mean,
      lpSd: lp.lp.sd,
      calibrationIntercept: 0,
      calibrationSlope: 1,
    });
    // Limits L–U around O/E = 1 mean SE* = (ln U − ln L)/(2z), so the margin exp(z·SE*) is √(U/L):
    // √(1.1/0.9) = 1.105542 (solved in closed form here; rounding only).
    expectClose(outcome.inputs.targets.oe.marginFactor, Math.sqrt(1.1 / 0.9), 1e-12, 'O/E margin for limits 0.9–1.1');
    expect(() => parseSimulationConfig(simulationConfigOf(outcome.inputs, 1000, 10, 1))).not.toThrow();
  });

  it('say why a binary population without an LP distribution cannot be simulated', () => {
    const population = populationSchema.parse({
      id: 'b2',
      name: 'No C',
      outcome: 'binary',
      anticipated: { outcomeProportion: 0.2 },
    });
    const outcome = simulatedInputsOf(population);
    expect(outcome.ok).toBe(false);
    if (!outcome.ok) expect(outcome.reason).toMatch(/linear predictor.*C-statistic/);
  });
});

describe('simulationTargets and closedFormAtN', () => {
  it('offer the required n, and the available n when one is stated', () => {
    const project = plan({ recruitment: { availableN: 500 } });
    const p = planOf(project, firstOf(project));
    expect(simulationTargets(p).map((t) => [t.basis, t.n])).toEqual([
      ['required-n', p.requiredN],
      ['available-n', 500],
    ]);
    expect(simulationTargets(planOf(plan(), firstOf(plan()))).map((t) => t.basis)).toEqual(['required-n']);
  });

  it('give each measure its criterion n and the SE and size of the precision-at-n functions', () => {
    const project = plan();
    const population = firstOf(project);
    const p = planOf(project, population);
    const closed = closedFormAtN(population, p, 308);
    // CITL: n = 308 for var(Y) 100, R² 0.8, width 1 at 95% [VAL-CONT] (Stat Med 2021;40(1):133–146, doi:10.1002/sim.8766).
    expect(closed.citl?.criterionN).toBe(308);
    const atN = validationPrecisionAtN(validationInputsOf(population), 308);
    expect(closed['r-squared']?.se).toBe(atN.find((x) => x.id === 'r2')?.se);
    expect(closed['slope-residual-sd']?.achieved).toBe(atN.find((x) => x.id === 'residual-sd-slope')?.achieved);
    expect(closed['outcome-sd']).toBeUndefined();
    expect(verdictReferences(closed).citl).toEqual({ se: closed.citl?.se, n: 308 });
  });

  it('note when the plan sets its own R² for the CITL or slope model', () => {
    expect(simulationNotes(firstOf(plan()))).toEqual([]);
    const notes = simulationNotes(firstOf(plan({ anticipated: { rSquared: 0.8, outcomeVariance: 100, rSquaredCitl: 0.7 } })));
    expect(notes).toHaveLength(1);
    expect(notes[0]).toContain('R² = 0.7');
  });
});

describe('the stored record', () => {
  it('passes the schema, survives a save and an open, and reads back as the same result and verdict', () => {
    const project = plan();
    const population = firstOf(project);
    const result = run(project, 308);
    const record = recordOf(result, 'required-n', TIMING);
    expect(simulationRecordSchema.parse(record)).toEqual(record);
    const saved = withSimulation(project, 'p1', record);
    const reopened = parsePlanText(serialisePlan(saved));
    if (!reopened.ok) throw new Error(reopened.error.message);
    const back = reopened.project.simulations?.['p1'];
    expect(back).toEqual(record);
    const closed = verdictReferences(closedFormAtN(population, planOf(project, population), 308));
    expect(simulationVerdict(resultOf(record), closed)).toEqual(simulationVerdict(result, closed));
    expect(resultOf(record)).toEqual(result);
  });

  it('leaves plans without simulations valid, and rejects bad records naming the field', () => {
    const project = plan();
    expect(parsePlanValue(JSON.parse(serialisePlan(project))).ok).toBe(true);
    const record = recordOf(run(project, 308, 20), 'required-n', TIMING);
    const bad = (change: Partial<Record<keyof SimulationRecord, unknown>>, field: RegExp, words: RegExp): void => {
      const parsed = parsePlanValue({ ...JSON.parse(serialisePlan(project)), simulations: { p1: { ...record, ...change } } });
      expect(parsed.ok).toBe(false);
      if (parsed.ok) return;
      const problem = parsed.error.problems.find((p) => field.test(p.path));
      expect(problem?.message, JSON.stringify(parsed.error.problems)).toMatch(words);
    };
    bad({ seed: 2.5 }, /^simulations\.p1\.seed$/, /simulation seed must be a whole number from 0 to 4,294,967,295/);
    bad({ replicatesDone: 30 }, /^simulations\.p1\.replicatesDone$/, /must not exceed replicates requested/);
    bad({ ranAt: 'yesterday' }, /^simulations\.p1\.ranAt$/, /ISO 8601/);
    bad({ n: 3 }, /^simulations\.p1\.n$/, /simulated n must be a whole number from 4/);
    bad(
      { measures: [{ ...record.measures[0], id: 'accuracy' }] },
      /^simulations\.p1\.measures\[0\]\.id$/,
      /simulated measure id must be one of/,
    );
    bad(
      { inputs: { ...record.inputs, population: { ...record.inputs.population, rSquared: 1.2 } } },
      /^simulations\.p1\.inputs\.population\.rSquared$/,
      /simulated R² must be greater than 0 and less than 1/,
    );
  });

  it('is filed under its population, and records of removed populations are dropped', () => {
    const project = plan();
    const record = recordOf(run(project, 308, 20), 'required-n', TIMING);
    const both = withSimulation(withSimulation(project, 'p1', record), 'p2', { ...record, seed: 99 });
    expect(Object.keys(both.simulations ?? {})).toEqual(['p1', 'p2']);
    const removed = { ...both, populations: both.populations.filter((p) => p.id !== 'p1') };
    expect(Object.keys(withSimulation(removed, 'p2', record).simulations ?? {})).toEqual(['p2']);
    expect(withSimulation(project, 'nobody', record)).toBe(project);
  });
});

describe('simulationStaleness', () => {
  const project = plan();
  const population = firstOf(project);
  const p = planOf(project, population);
  const record = recordOf(run(project, p.requiredN ?? 0, 20), 'required-n', TIMING);

  it('is empty while the population and its required n are unchanged', () => {
    expect(simulationStaleness(record, population, p)).toEqual([]);
  });

  it('names a changed anticipated value or target, and a changed n', () => {
    const edited = plan({ anticipated: { rSquared: 0.7, outcomeVariance: 100 } });
    const editedPopulation = firstOf(edited);
    const reasons = simulationStaleness(record, editedPopulation, planOf(edited, editedPopulation));
    expect(reasons[0]).toBe('the anticipated values or precision targets changed after it ran');
    expect(reasons[1]).toMatch(/^the required n is now [\d,]+ \(it ran at [\d,]+\)$/);
    const source = plan({ sources: { rSquared: 'a new note' } });
    expect(simulationStaleness(record, firstOf(source), planOf(source, firstOf(source)))).toEqual([]);
  });

  it('for a run at the available n, notices when that n is changed or removed', () => {
    const withN = plan({ recruitment: { availableN: 500 } });
    const atAvailable = recordOf(run(withN, 500, 20), 'available-n', TIMING);
    const pop = firstOf(withN);
    expect(simulationStaleness(atAvailable, pop, planOf(withN, pop))).toEqual([]);
    expect(simulationStaleness(atAvailable, pop, { ...planOf(withN, pop), availableN: 600 })).toEqual([
      'the available n is now 600 (it ran at 500)',
    ]);
    expect(simulationStaleness(atAvailable, pop, { ...planOf(withN, pop), availableN: null })).toEqual([
      'the population states no available n now',
    ]);
  });
});

describe('simulationCells', () => {
  it('gives one row per measure under the header, closed form beside simulated with Monte Carlo errors', () => {
    const project = plan();
    const population = firstOf(project);
    const result = run(project, 308);
    const rows = simulationCells(result, closedFormAtN(population, planOf(project, population), 308));
    expect(rows.map((r) => r.id)).toEqual(['r-squared', 'citl', 'slope', 'outcome-sd', 'citl-residual-sd', 'slope-residual-sd']);
    for (const r of rows) expect(r.cells).toHaveLength(SIMULATION_HEADER.length);
    const citl = rows[1]?.cells ?? [];
    expect(citl[1]).toBe('308');
    expect(citl[3]).toMatch(/^0\.\d+ ± 0\.\d+$/);
    expect(citl[8]).toMatch(/^\d+(\.\d)?% ± \d+(\.\d)?%$/);
    // Residual SD margins depend on n only: no Monte Carlo error, shown as a margin factor.
    expect(rows[4]?.cells[5]).toMatch(/^×\/÷ 1\.\d+$/);
  });
});

describe('the demo plan', () => {
  it('can be simulated at every population’s required n', () => {
    const parsed = parsePlanText(readFileSync(DEMO, 'utf8'));
    if (!parsed.ok) throw new Error(parsed.error.message);
    for (const population of parsed.project.populations) {
      if (!isContinuousPopulation(population)) continue;
      const p = planOf(parsed.project, population);
      expect(p.requiredN).not.toBeNull();
      expect(() => parseSimulationConfig(simulationConfigOf(inputsOf(population), p.requiredN ?? 0, 2000, 1))).not.toThrow();
    }
  });
});
