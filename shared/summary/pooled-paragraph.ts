// The across-sites paragraph for a protocol: what is pooled and how, the anticipated heterogeneity,
// the figures at the planned numbers, the floors, the proposal and the approximations, in plain
// scientific English. Every number comes from the summary, formatted here in one way.
import { REFERENCES } from '../engine/references';
import type { ReferenceKey } from '../engine/types';
import { formatCount, formatMonths, formatPercent, formatSignificant } from '../format/numbers';
import type { PooledMeasureFigures, PooledProposal, PooledSummary, TauCase } from './pooled-summary';

/** Widths and SEs: three significant digits. */
export const formatPooledWidth = (x: number | null): string => formatSignificant(x, 3);
/** τ and targets as the planner typed them (up to six significant digits). */
export const formatPooledInput = (x: number | null): string => formatSignificant(x, 6);

/** A short pointer to a source: its DOI, or else its journal, year and pages (the citation's last part). */
export function referenceSource(key: ReferenceKey): string {
  const citation = REFERENCES[key].citation;
  return /doi:\S+/.exec(citation)?.[0] ?? citation.split('. ').at(-1) ?? citation;
}

/** Gives the citation mark for some references (a report's numbered register, e.g. "[1, 3]"). */
export type CiteReferences = (keys: readonly ReferenceKey[]) => string;

/** Without a register: the DOIs (or journal and year) in parentheses. */
const citeBySource: CiteReferences = (keys) => `(${keys.map(referenceSource).join('; ')})`;

function list(items: readonly string[]): string {
  if (items.length <= 1) return items.join('');
  return `${items.slice(0, -1).join(', ')} and ${items.at(-1) ?? ''}`;
}

const capitalise = (text: string): string => `${text[0]?.toUpperCase() ?? ''}${text.slice(1)}`;

function metVerdict(met: boolean | null): string {
  return met === null ? '' : met ? ' (target met)' : ' (target not met)';
}

function widthsSentence(c: TauCase, level: string): string {
  const p = c.precision;
  const pi =
    p.predictionIntervalWidth === null
      ? 'no prediction interval (fewer than 3 sites)'
      : `a prediction-interval width of ${formatPooledWidth(p.predictionIntervalWidth)}${metVerdict(p.meetsPrediction)}`;
  return `a summary SE of ${formatPooledWidth(p.summarySe)}, a summary ${level} CI width of ${formatPooledWidth(p.summaryCiWidth)}${metVerdict(p.meetsSummary)} and ${pi}`;
}

function rangeSentence(cases: readonly TauCase[], level: string): string | null {
  const low = cases.find((c) => c.which === 'low');
  const high = cases.find((c) => c.which === 'high');
  if (low === undefined || high === undefined) return null;
  const pi =
    low.precision.predictionIntervalWidth === null || high.precision.predictionIntervalWidth === null
      ? ''
      : ` and the prediction-interval width from ${formatPooledWidth(low.precision.predictionIntervalWidth)} to ${formatPooledWidth(high.precision.predictionIntervalWidth)}`;
  return `Across τ from ${formatPooledInput(low.tau)} to ${formatPooledInput(high.tau)}, the summary ${level} CI width runs from ${formatPooledWidth(low.precision.summaryCiWidth)} to ${formatPooledWidth(high.precision.summaryCiWidth)}${pi}.`;
}

function measureParagraph(m: PooledMeasureFigures, summary: PooledSummary, level: string): string {
  const parts: string[] = [];
  const range =
    m.tauRange === null ? '' : ` (plausible range ${formatPooledInput(m.tauRange.low)} to ${formatPooledInput(m.tauRange.high)})`;
  const piTarget =
    m.target.maxPredictionIntervalWidth === undefined
      ? ''
      : ` and a ${level} prediction-interval width of at most ${formatPooledInput(m.target.maxPredictionIntervalWidth)}`;
  parts.push(
    `For the ${m.name} (on ${m.scale}) we anticipate a between-site SD of the true site values of τ = ${formatPooledInput(m.tau)}${range}, ` +
      `and target a summary ${level} CI width of at most ${formatPooledInput(m.target.maxSummaryCiWidth)}${piTarget}.`,
  );
  const base = m.atPlanned?.find((c) => c.which === 'base');
  if (m.perSite !== null && base !== undefined) {
    const ses = m.perSite.map((s) => s.se);
    parts.push(
      `At each site's planned n the per-site SE ranges from ${formatPooledWidth(Math.min(...ses))} to ${formatPooledWidth(Math.max(...ses))}, ` +
        `giving ${widthsSentence(base, level)}.`,
    );
    const across = rangeSentence(m.atPlanned ?? [], level);
    if (across !== null) parts.push(across);
    const p = base.precision;
    const floorPi =
      p.predictionFloorWidth === null
        ? ''
        : ` and the prediction-interval width above ${formatPooledWidth(p.predictionFloorWidth)} (2·t·τ; ${formatPooledWidth(p.predictionFloorManySites)}, 2·z·τ, with any number of sites)`;
    parts.push(
      `However many participants each site recruits, heterogeneity keeps the summary CI width above ${formatPooledWidth(p.summaryFloorWidth)} with ${formatCount(summary.k)} sites${floorPi}.`,
    );
  }
  const fewest = m.minimumSites;
  if (fewest !== null) {
    const summarySites =
      fewest.summary.sites === null ? (fewest.summary.reason ?? '') : `at least ${formatCount(fewest.summary.sites)}`;
    const predictionSites =
      fewest.prediction === null
        ? ''
        : fewest.prediction.sites === null
          ? `; the prediction-interval target cannot be met by any number of sites (${fewest.prediction.reason ?? ''})`
          : ` and at least ${formatCount(fewest.prediction.sites)} for the prediction-interval target`;
    parts.push(`Even with unlimited participants per site, the summary target needs ${summarySites} sites${predictionSites}.`);
  }
  const atProposal = m.atProposal?.find((c) => c.which === 'base');
  if (atProposal !== undefined) {
    const high = m.atProposal?.find((c) => c.which === 'high');
    const highText =
      high === undefined
        ? ''
        : ` Should τ be as high as ${formatPooledInput(high.tau)}, the proposal would give a summary CI width of ${formatPooledWidth(high.precision.summaryCiWidth)}${metVerdict(high.precision.meetsSummary)}` +
          (high.precision.predictionIntervalWidth === null
            ? '.'
            : ` and a prediction-interval width of ${formatPooledWidth(high.precision.predictionIntervalWidth)}${metVerdict(high.precision.meetsPrediction)}.`);
    parts.push(`With the proposed numbers below this becomes ${widthsSentence(atProposal, level)}.${highText}`);
  }
  if (m.comparison !== null && m.curves !== null) {
    const around = m.curves.basis === 'proposal' ? 'the proposal' : 'the planned numbers';
    parts.push(`Starting from ${around}, with the added site resembling ${m.curves.typicalSite}: ${m.comparison.sentence}`);
  }
  parts.push(...m.problems.map((p) => `${p.replace(/\.$/, '')}.`));
  return parts.join(' ');
}

function proposalParagraph(proposal: PooledProposal): string {
  const goal = proposal.objective === 'fewest-participants' ? 'with the fewest participants' : 'with the shortest recruitment';
  const within = proposal.aim === 'both' ? ' while every site still meets its own targets' : '';
  if (proposal.status !== 'feasible' || proposal.totalN === null) {
    return `No allocation of participants to the sites meets the pooled targets${within}: ${proposal.messages.join(' ')}`;
  }
  const perSite = proposal.sites.map((s) => {
    const cap = s.atCapacity === true ? ', its capacity' : '';
    const months = s.months === null ? '' : `, about ${formatMonths(s.months)}`;
    return `${s.name} ${formatCount(s.n)}${cap}${months}`;
  });
  const enrol =
    proposal.totalEnrolment === null ? '' : ` (${formatCount(proposal.totalEnrolment)} to enrol, allowing for missing outcomes)`;
  const longest =
    proposal.longestMonths === null ? '' : `; the longest recruitment takes ${formatMonths(proposal.longestMonths)}`;
  return (
    `To meet the pooled targets ${goal}${within}, we propose participants with an outcome per site as follows: ${list(perSite)}; ` +
    `${formatCount(proposal.totalN)} in all${enrol}${longest}. No site is asked for more than it can recruit in the window ` +
    `(enrolment per month × the window, less missing outcomes, or its fixed available n). ${proposal.messages.join(' ')}` +
    (proposal.method === null ? '' : ` Method: ${proposal.method}`)
  );
}

/**
 * The protocol paragraph for the across-sites figures of a summary: the method (random-effects
 * weights, the Higgins–Thompson–Spiegelhalter prediction interval with t on K − 2), each pooled
 * measure's anticipated τ, targets and figures, the proposal (pooled and both aims), what keeps
 * figures from being shown, and the approximations (POOLED_CAUTIONS). Plain text, paragraphs
 * separated by blank lines; sources are cited with `cite` (a report's numbered register), or by DOI.
 * @example pooledParagraph(pooledSummary(project)).startsWith('Precision across sites.') // true
 */
export function pooledParagraph(summary: PooledSummary, cite: CiteReferences = citeBySource): string {
  const level = formatPercent(summary.confidence, 1);
  const aimText =
    summary.aim === 'pooled'
      ? 'The aim is the precision of the summary across sites rather than at each site.'
      : summary.aim === 'both'
        ? 'The aim is both: every site meets its own precision targets, and the summary across sites meets the pooled targets.'
        : 'The aim is site-specific precision; the pooled figures below are for information.';
  const paragraphs: string[] = [];
  const used = [...new Set(summary.measures.flatMap((m) => m.references))];
  const seSources: readonly ReferenceKey[] = used.length > 0 ? used : ['VAL-CONT'];
  const df = summary.k >= 3 ? ` = ${formatCount(summary.k - 2)}` : '';
  paragraphs.push(
    `Precision across sites. ${aimText} The model's performance in the ${formatCount(summary.k)} sites will be summarised by a random-effects meta-analysis of the site estimates, ` +
      `with inverse-variance weights 1/(SE² + τ²) ${cite(['DERSIMONIAN-LAIRD-1986'])}, and its spread by the Higgins–Thompson–Spiegelhalter ${level} prediction interval for the performance in a new site, ` +
      `summary ± t·√(τ² + SE²) with t on K − 2${df} degrees of freedom ${cite(['HIGGINS-THOMPSON-SPIEGELHALTER-2009'])}. ` +
      `Each site's SE is that of its site-specific criterion at its n ${cite(seSources)}; the planned n of a site is its fixed available n, or else the n its own targets require.`,
  );
  for (const m of summary.measures) paragraphs.push(measureParagraph(m, summary, level));
  if (summary.proposal !== null) paragraphs.push(proposalParagraph(summary.proposal));
  if (summary.notes.length > 0) paragraphs.push(summary.notes.join(' '));
  paragraphs.push(`Approximations. ${summary.cautions.map(capitalise).join(' ')}`);
  return paragraphs.join('\n\n');
}
