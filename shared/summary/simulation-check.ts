// A population of the plan as a simulation check: which n to simulate, the engine configuration,
// what the closed form says about each measure at that n, and whether a stored check is still
// about the population as it is now. Shared by the workspace and the command line.
import { binaryPrecisionAtN } from '../engine/binary/plan-binary-population';
import type { OeTarget } from '../engine/binary/oe-criterion';
import { oeTargetSe } from '../engine/binary/oe-criterion';
import { resolveLp } from '../engine/binary/resolve-lp';
import { validationPrecisionAtN } from '../engine/continuous/evaluate-continuous';
import { zForConfidence } from '../engine/numerics/distributions';
import { validationInputsOf } from '../engine/plan/population-inputs';
import type { ClosedFormReferences, MeasureId, SimulationConfigInput } from '../engine/simulation';
import type { CriterionResult, PrecisionAtN } from '../engine/types';
import { formatCount, formatSignificant } from '../format/numbers';
import type { Population } from '../model/project';
import type { SimulatedInputs, SimulationBasis, SimulationRecord } from '../model/simulation-record';

/** What the check needs from a population's plan (a comparison row or a PopulationPlan). */
export interface PlanForSimulation {
  readonly criteria: readonly CriterionResult[];
  readonly requiredN: number | null;
  readonly availableN: number | null;
}

/** The default number of replicates: Monte Carlo SE of a share about 1.1 percentage points. */
export const DEFAULT_REPLICATES = 2_000;

const CONTINUOUS_MEASURES: readonly MeasureId[] = ['r-squared', 'citl', 'slope', 'citl-residual-sd', 'slope-residual-sd'];
const BINARY_MEASURES: readonly MeasureId[] = ['observed-expected', 'binary-slope', 'c-statistic'];

/** Which criterion of the closed form each simulated measure is checked against. */
const CRITERION_OF_MEASURE: Partial<Record<MeasureId, string>> = {
  'r-squared': 'r2',
  citl: 'citl',
  slope: 'slope',
  'citl-residual-sd': 'residual-sd-citl',
  'slope-residual-sd': 'residual-sd-slope',
  'observed-expected': 'oe',
  'binary-slope': 'slope',
  'c-statistic': 'c-statistic',
};

export interface SimulationTarget {
  readonly basis: SimulationBasis;
  /** Null when there is nothing to simulate at (no required n: a target is out of reach). */
  readonly n: number | null;
  /** "the required n (879)" or "the available n (700)". */
  readonly label: string;
}

/**
 * The n a check may run at: the required n, and the fixed available n when the population states
 * one (an existing cohort, whose question is what that n delivers).
 * @example simulationTargets(plan).map((t) => t.basis) // ['required-n', 'available-n']
 */
export function simulationTargets(plan: PlanForSimulation): SimulationTarget[] {
  const required: SimulationTarget = {
    basis: 'required-n',
    n: plan.requiredN,
    label: plan.requiredN === null ? 'the required n (out of reach)' : `the required n (${formatCount(plan.requiredN)})`,
  };
  return plan.availableN === null
    ? [required]
    : [required, { basis: 'available-n', n: plan.availableN, label: `the available n (${formatCount(plan.availableN)})` }];
}

/** The n of `basis` for this plan, or null (no required n, or no available n stated). */
export function simulationN(plan: PlanForSimulation, basis: SimulationBasis): number | null {
  return basis === 'required-n' ? plan.requiredN : plan.availableN;
}

/** The inputs of a check, or why the population cannot be simulated. */
export type SimulatedInputsOutcome =
  { readonly ok: true; readonly inputs: SimulatedInputs } | { readonly ok: false; readonly reason: string };

/**
 * The anticipated values and targets a check simulates, every default filled in, in the shape the
 * engine reads.
 * Continuous: the model's CITL in the data does not change any precision (every estimator is
 * shift-invariant) and the plan does not ask for one, so it is 0.
 * Binary: the linear predictor's normal distribution as the planner uses it (given, or fitted to
 * the outcome proportion and C-statistic: resolveLp), the calibration intercept and slope (0 and
 * 1 by default), and the O/E target as the multiplicative margin exp(z·SE*) of the target SE of
 * ln(O/E) (oeTargetSe, either convention).
 * @example simulatedInputsOf(population).ok && simulatedInputsOf(population).inputs.population.slope // 1 when the plan leaves it out
 */
export function simulatedInputsOf(population: Population): SimulatedInputsOutcome {
  return population.outcome === 'continuous' ? continuousInputs(population) : binaryInputs(population);
}

type PopulationOf<O extends string> = Extract<Population, { readonly outcome: O }>;

function continuousInputs(population: PopulationOf<'continuous'>): SimulatedInputsOutcome {
  const a = population.anticipated;
  const p = population.precision;
  return {
    ok: true,
    inputs: {
      outcome: 'continuous',
      population: { rSquared: a.rSquared, outcomeVariance: a.outcomeVariance, slope: a.slope ?? 1, citl: 0 },
      targets: {
        confidence: p.confidence,
        rSquared: { width: p.rSquared.width },
        citl: { width: p.citl.width },
        slope: { width: p.slope.width },
        residualSd: { marginFactor: p.residualSd.marginFactor },
      },
    },
  };
}

function binaryInputs(population: PopulationOf<'binary'>): SimulatedInputsOutcome {
  const a = population.anticipated;
  const p = population.precision;
  const lp = resolveLp(a);
  if (lp.kind !== 'given' && lp.kind !== 'fitted') return { ok: false, reason: `the linear predictor ${lp.reason}` };
  const target = oeTargetOf(p.oe);
  if (target === null) return { ok: false, reason: 'the O/E target needs a CI width or both CI limits' };
  const margin = Math.exp(zForConfidence(p.confidence) * oeTargetSe(target, p.confidence).se); // exp(z·SE*(ln O/E)) [VAL-BIN]
  return {
    ok: true,
    inputs: {
      outcome: 'binary',
      population: {
        lpMean: lp.lp.mean,
        lpSd: lp.lp.sd,
        calibrationIntercept: a.calibrationIntercept ?? 0,
        calibrationSlope: a.calibrationSlope ?? 1,
      },
      targets: {
        confidence: p.confidence,
        oe: { marginFactor: margin },
        slope: { width: p.slope.width },
        cStatistic: { width: p.cStatistic.width },
      },
    },
  };
}

/** The plan file's O/E target in the engine's shape (the schema requires one of the two forms). */
function oeTargetOf(oe: {
  readonly width?: number | undefined;
  readonly lower?: number | undefined;
  readonly upper?: number | undefined;
}): OeTarget | null {
  if (oe.width !== undefined) return { width: oe.width };
  if (oe.lower !== undefined && oe.upper !== undefined) return { lower: oe.lower, upper: oe.upper };
  return null;
}

/** The engine configuration of a check (validated by the engine when the run starts). */
export function simulationConfigOf(inputs: SimulatedInputs, n: number, replicates: number, seed: number): SimulationConfigInput {
  return inputs.outcome === 'continuous'
    ? { outcome: 'continuous', population: inputs.population, targets: inputs.targets, n, replicates, seed }
    : { outcome: 'binary', population: inputs.population, targets: inputs.targets, n, replicates, seed };
}

/** What the closed form says about one simulated measure. */
export interface ClosedFormMeasure {
  readonly criterionId: string;
  /** The criterion's own smallest n (null when it could not be sized). */
  readonly criterionN: number | null;
  /** Closed-form SE at the simulated n; null where the closed form works on the margin directly (SDs). */
  readonly se: number | null;
  /** Closed-form CI width (or margin factor) at the simulated n. */
  readonly achieved: number | null;
}

export type ClosedFormAtN = Partial<Record<MeasureId, ClosedFormMeasure>>;

/** The closed form's precision of each measure of a population at n (the engine's inverse functions). */
function precisionAtN(population: Population, n: number): readonly PrecisionAtN[] {
  if (population.outcome === 'continuous') return validationPrecisionAtN(validationInputsOf(population), n);
  const binary: PopulationOf<'binary'> = population;
  const oe = oeTargetOf(binary.precision.oe);
  if (oe === null) return [];
  return binaryPrecisionAtN({ anticipated: binary.anticipated, precision: { ...binary.precision, oe } }, n);
}

/**
 * The closed form beside each measure at the simulated n: the criterion's n, its SE and its
 * interval size at that n (from the engine's precision-at-n functions). The binary O/E is left
 * without an SE: the closed form gives the SE of ln(O/E), the simulation the SD of O/E itself.
 * @example closedFormAtN(population, plan, 879)['r-squared']?.criterionN // 879
 */
export function closedFormAtN(population: Population, plan: PlanForSimulation, n: number): ClosedFormAtN {
  const precision = precisionAtN(population, n);
  const measures = population.outcome === 'binary' ? BINARY_MEASURES : CONTINUOUS_MEASURES;
  const out: ClosedFormAtN = {};
  for (const measure of measures) {
    const criterionId = CRITERION_OF_MEASURE[measure];
    const atN = precision.find((p) => p.id === criterionId);
    if (criterionId === undefined || atN === undefined) continue;
    out[measure] = {
      criterionId,
      criterionN: plan.criteria.find((c) => c.id === criterionId)?.n ?? null,
      se: measure === 'observed-expected' ? null : atN.se,
      achieved: atN.achieved,
    };
  }
  return out;
}

/** The closed-form values in the shape simulationVerdict reads. */
export function verdictReferences(closed: ClosedFormAtN): ClosedFormReferences {
  const out: ClosedFormReferences = {};
  for (const [measure, c] of Object.entries(closed) as [MeasureId, ClosedFormMeasure][]) {
    out[measure] = { se: c.se, n: c.criterionN };
  }
  return out;
}

/**
 * Where the closed form assumes something the simulated data cannot hold: the simulation draws
 * every measure from one data-generating model with the population's R², while the plan may set a
 * different R² for the CITL or the calibration-slope model.
 */
export function simulationNotes(population: Population): string[] {
  if (population.outcome !== 'continuous') return [];
  const a = population.anticipated;
  const notes: string[] = [];
  const differs = (value: number | undefined): value is number => value !== undefined && value !== a.rSquared;
  const drawn = `the simulation draws all measures from one model with R² = ${formatSignificant(a.rSquared)}`;
  if (differs(a.rSquaredCitl)) {
    notes.push(
      `The closed form for calibration-in-the-large uses R² = ${formatSignificant(a.rSquaredCitl)}, set for that model; ${drawn}, so their SEs need not agree.`,
    );
  }
  if (differs(a.rSquaredSlope)) {
    notes.push(
      `The closed form for the calibration slope uses R² = ${formatSignificant(a.rSquaredSlope)}, set for that model; ${drawn}, so their SEs need not agree.`,
    );
  }
  return notes;
}

/** JSON with object keys sorted at every level, so equal inputs give equal text. */
export function canonicalJson(value: unknown): string {
  return JSON.stringify(value, (_key, v: unknown) =>
    v !== null && typeof v === 'object' && !Array.isArray(v)
      ? Object.fromEntries(Object.entries(v as Record<string, unknown>).sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0)))
      : v,
  );
}

/**
 * Why a stored check no longer describes the population (empty when it still does): its
 * anticipated values or targets changed, or the n it ran at is no longer the plan's.
 * @example simulationStaleness(record, editedPopulation, plan) // ['the anticipated values or precision targets changed after it ran']
 */
export function simulationStaleness(record: SimulationRecord, population: Population, plan: PlanForSimulation): string[] {
  const reasons: string[] = [];
  const current = simulatedInputsOf(population);
  if (!current.ok) {
    reasons.push(`it can no longer be simulated: ${current.reason}`);
  } else if (canonicalJson(record.inputs) !== canonicalJson(current.inputs)) {
    reasons.push('the anticipated values or precision targets changed after it ran');
  }
  const n = simulationN(plan, record.basis);
  const which = record.basis === 'required-n' ? 'required n' : 'available n';
  if (n === null) {
    reasons.push(record.basis === 'required-n' ? 'the plan has no required n now' : 'the population states no available n now');
  } else if (n !== record.n) {
    reasons.push(`the ${which} is now ${formatCount(n)} (it ran at ${formatCount(record.n)})`);
  }
  return reasons;
}
