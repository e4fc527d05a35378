import { formatCount, formatPercent, formatSignificant } from '../../format/numbers';
import type { MeasureId, MeasureSummary, MonteCarloEstimate, SimulationResult } from './types';

/** What the closed-form engine says about a measure, for the comparison (all optional). */
export interface ClosedFormReference {
  /** Closed-form SE of the measure at the simulated n. */
  readonly se?: number | null;
  /** Closed-form n of the criterion for this measure. */
  readonly n?: number | null;
}

export type ClosedFormReferences = Partial<Record<MeasureId, ClosedFormReference>>;

/**
 * meets-on-average: mean CI width at or below the target. within-simulation-error: above it by less
 * than two Monte Carlo SEs. falls-short: above it by more. met-by-every-study / met-by-no-study: the
 * interval's margin depends on n only (residual SDs), so it is met in all studies or in none.
 * not-summarised: fewer than two replicates could be used.
 */
export type VerdictStatus =
  'meets-on-average' | 'within-simulation-error' | 'falls-short' | 'met-by-every-study' | 'met-by-no-study' | 'not-summarised';

export interface MeasureVerdict {
  readonly measureId: MeasureId;
  readonly status: VerdictStatus;
  readonly text: string;
}

export interface SimulationVerdict {
  readonly headline: string;
  readonly measures: readonly MeasureVerdict[];
}

/** Two Monte Carlo SEs: "within simulation error" means inside this band (about 95%). */
const MC_BAND = 2;

const value = (x: number): string => formatSignificant(x, 3);
/** A value with its Monte Carlo SE, e.g. "52.4% (±0.8%)"; an exact value (MCSE 0) is shown alone. */
const withError = (e: MonteCarloEstimate, show: (x: number) => string, showError = show): string =>
  e.mcse > 0 ? `${show(e.value)} (±${showError(e.mcse)})` : show(e.value);
const percent = (x: number): string => formatPercent(x, 1);

function seSentence(se: MonteCarloEstimate, reference: ClosedFormReference | undefined): string {
  const simulated = `The simulated SE was ${withError(
    se,
    (x) => formatSignificant(x, 3),
    (x) => formatSignificant(x, 2),
  )}`;
  const closed = reference?.se;
  if (closed === undefined || closed === null || !(closed > 0)) return `${simulated}.`;
  const gap = se.value / closed - 1;
  const agreement =
    Math.abs(se.value - closed) <= MC_BAND * se.mcse
      ? 'in agreement within simulation error'
      : `${percent(Math.abs(gap))} ${gap > 0 ? 'larger' : 'smaller'}`;
  return `${simulated} against the closed-form ${formatSignificant(closed, 3)} (${agreement}).`;
}

function coverageSentence(coverage: MonteCarloEstimate, confidence: number): string {
  return `Coverage of the ${percent(confidence)} interval: ${withError(coverage, percent)}.`;
}

function statusOf(meanSize: MonteCarloEstimate, target: number): VerdictStatus {
  if (meanSize.mcse === 0) return meanSize.value <= target ? 'met-by-every-study' : 'met-by-no-study';
  if (meanSize.value <= target) return 'meets-on-average';
  return meanSize.value - MC_BAND * meanSize.mcse <= target ? 'within-simulation-error' : 'falls-short';
}

function conclusionOf(status: VerdictStatus, subject: string, excess: number, size: string): string {
  switch (status) {
    case 'meets-on-average':
      return `${subject} delivers the target on average`;
    case 'within-simulation-error':
      return `${subject} delivers the target on average, within simulation error`;
    case 'falls-short':
      return `${subject} falls short of the target on average (mean ${size} ${percent(excess)} above it)`;
    case 'met-by-every-study':
      return `the margin depends on n only, and ${subject} meets the target in every study`;
    case 'met-by-no-study':
      return `the margin depends on n only, and ${subject} misses the target in every study: more participants are needed for this measure`;
    case 'not-summarised':
      return '';
  }
}

function measureVerdict(m: MeasureSummary, result: SimulationResult, reference: ClosedFormReference | undefined): MeasureVerdict {
  const { meanSize, shareMeetingTarget, empiricalSe, coverage } = m;
  if (!meanSize || !shareMeetingTarget || !empiricalSe || !coverage) return notSummarised(m);
  const subject = reference?.n === result.n ? 'the closed-form n' : 'this n';
  const status = statusOf(meanSize, m.targetValue);
  const width = m.scale === 'ci-width';
  const size = width ? 'width' : 'margin';
  // Margins sit just above 1, so they need four significant digits to be told apart.
  const show = width ? value : (x: number) => formatSignificant(x, 4);
  const shown = width ? show(meanSize.value) : `÷/× ${show(meanSize.value)}`;
  const conclusion = conclusionOf(status, subject, meanSize.value / m.targetValue - 1, size);
  const text =
    `At n = ${formatCount(result.n)}, ${withError(shareMeetingTarget, percent)} of simulated studies met the ${m.label} ${size} target; ` +
    `the mean ${size} was ${shown} against the target ${show(m.targetValue)} — ${conclusion}. ` +
    `${seSentence(empiricalSe, reference)} ${coverageSentence(coverage, result.confidence)}`;
  return { measureId: m.id, status, text };
}

function notSummarised(m: MeasureSummary): MeasureVerdict {
  return {
    measureId: m.id,
    status: 'not-summarised',
    text: `The ${m.label} could be estimated in ${formatCount(m.replicates)} replicates, too few to summarise.`,
  };
}

/**
 * Plain-language reading of a simulation result against its precision targets: one sentence group
 * per measure (share of studies meeting the target, mean CI width against the target, the
 * simulated SE against the closed-form SE when given, coverage), and a headline saying whether the
 * result is complete and which targets are missed on average. "Within simulation error" means
 * within two Monte Carlo SEs. The closed-form values are inputs (from the closed-form engine), so
 * the verdict never recomputes a criterion.
 * The cautions that go with every result (precision only, not clinical utility; defer to ethics
 * committees and regulators) are shown by the caller beside this text.
 * @example simulationVerdict(result, { citl: { n: 308, se: 0.2548 } }).measures[1].text
 * // "At n = 308, 52.2% (±0.4%) of simulated studies met the calibration-in-the-large width target; the mean
 * //  width was 0.998 against the target 1 — the closed-form n delivers the target on average. …"
 */
export function simulationVerdict(result: SimulationResult, closedForm: ClosedFormReferences = {}): SimulationVerdict {
  const measures = result.measures.map((m) => measureVerdict(m, result, closedForm[m.id]));
  const studies = `${formatCount(result.replicatesDone)} simulated studies of n = ${formatCount(result.n)} (seed ${result.seed})`;
  const state = result.partial
    ? `Partial result: ${formatCount(result.replicatesDone)} of ${formatCount(result.replicatesRequested)} replicates completed (seed ${result.seed}).`
    : `${studies}.`;
  if (result.replicatesDone < 2) {
    return { headline: `${state} Too few completed replicates to summarise.`, measures };
  }
  const missed = result.measures.filter((_, i) => {
    const status = measures[i]?.status;
    return status === 'falls-short' || status === 'met-by-no-study';
  });
  const summary =
    missed.length === 0
      ? 'Every precision target is met on average.'
      : `Missed on average: ${missed.map((m) => m.label).join('; ')}.`;
  return { headline: `${state} ${summary}`, measures };
}
