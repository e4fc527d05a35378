// The across-sites section of the report, for plans whose aim is pooled or both: the protocol
// paragraph (sources numbered by the report's register), a table of the pooled figures at the
// planned and proposed n, and the proposal per site. Given to the report as an extra section.
import { formatCount, formatMonths } from '../format/numbers';
import type { Project } from '../model/project';
import type { Block, ReportSection, ReportTable } from '../report/document';
import type { Cite } from '../report/reference-register';
import { formatPooledInput, formatPooledWidth, pooledParagraph } from './pooled-paragraph';
import { pooledSettingsOf, pooledSummary, type PooledSummary, type PooledSummaryOptions } from './pooled-summary';

const verdict = (met: boolean | null): string => (met === null ? '' : met ? ': met' : ': not met');

function figuresTable(summary: PooledSummary): ReportTable | null {
  const rows = summary.measures.flatMap((m) =>
    [
      ...(m.atPlanned ?? []).map((c) => ({ c, at: 'planned n' })),
      ...(m.atProposal ?? []).map((c) => ({ c, at: 'proposed n' })),
    ].map(({ c, at }) => {
      const p = c.precision;
      return [
        m.name,
        at,
        `${formatPooledInput(c.tau)}${c.which === 'base' ? '' : ` (${c.which})`}`,
        formatPooledWidth(p.summarySe),
        `${formatPooledWidth(p.summaryCiWidth)} (target ≤ ${formatPooledInput(p.targetSummaryCiWidth)}${verdict(p.meetsSummary)})`,
        p.predictionIntervalWidth === null
          ? '—'
          : `${formatPooledWidth(p.predictionIntervalWidth)}${p.targetPredictionIntervalWidth === null ? '' : ` (target ≤ ${formatPooledInput(p.targetPredictionIntervalWidth)}${verdict(p.meetsPrediction)})`}`,
      ];
    }),
  );
  if (rows.length === 0) return null;
  return {
    caption: `Random-effects summary and prediction interval across the ${formatCount(summary.k)} sites`,
    header: ['Measure', 'At', 'τ', 'Summary SE', 'Summary CI width', 'Prediction-interval width'],
    rows,
    numeric: [false, false, true, true, true, true],
    note: 'τ: anticipated between-site SD (low and high ends of its range marked). Widths on the scale the measure is pooled on.',
  };
}

function proposalTable(summary: PooledSummary): ReportTable | null {
  const proposal = summary.proposal;
  if (proposal === null || proposal.status !== 'feasible') return null;
  return {
    caption: `Proposed participants per site (${proposal.objective === 'fewest-participants' ? 'fewest participants' : 'shortest recruitment'})`,
    header: ['Site', 'Proposed n', 'Capacity', 'Own required n', 'Enrol', 'Months'],
    rows: proposal.sites.map((s) => [
      s.name,
      `${formatCount(s.n)}${s.atCapacity === true ? ' (at capacity)' : ''}`,
      formatCount(s.capacity),
      formatCount(s.siteSpecificN),
      formatCount(s.enrolmentTarget),
      formatMonths(s.months),
    ]),
    footer: [
      'All sites',
      formatCount(proposal.totalN),
      '',
      '',
      formatCount(proposal.totalEnrolment),
      formatMonths(proposal.longestMonths),
    ],
    numeric: [false, true, true, true, true, true],
    note: 'Capacity: participants with an outcome the site can contribute (enrolment per month over the window, less missing outcomes, or its fixed available n).',
  };
}

/**
 * The report's across-sites section when the plan's aim is pooled or both (none for the
 * site-specific aim), as a function of the report's citation register.
 * @example planReport({ project, planner, extraSections: pooledReportSections(project), reproducibility })
 */
export function pooledReportSections(project: Project, options: PooledSummaryOptions = {}): ((cite: Cite) => ReportSection)[] {
  if (pooledSettingsOf(project).aim === 'site-specific') return [];
  const summary = pooledSummary(project, options);
  return [
    (cite) => {
      const [intro, ...rest] = pooledParagraph(summary, cite).split('\n\n');
      const figures = figuresTable(summary);
      const proposal = proposalTable(summary);
      const blocks: Block[] = [
        { kind: 'paragraph', text: (intro ?? '').replace(/^Precision across sites\. /, '') },
        ...(figures === null ? [] : [{ kind: 'table' as const, table: figures }]),
        ...(proposal === null ? [] : [{ kind: 'table' as const, table: proposal }]),
        ...rest.map((text): Block => {
          const lead = /^(Approximations\.) /.exec(text);
          return lead === null
            ? { kind: 'paragraph', text }
            : { kind: 'paragraph', lead: lead[1] ?? '', text: text.slice(lead[0].length) };
        }),
      ];
      return { id: 'across-sites', title: 'Precision across sites', blocks };
    },
  ];
}
