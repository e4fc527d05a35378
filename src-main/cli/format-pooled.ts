// The across-sites figures on the command line, for plans whose aim is pooled or both: lines for
// the readable table, a Markdown section, and a `pooled` field beside `populations` in the JSON.
import type { ProjectPlan } from '@shared/engine/plan/plan-project';
import { formatCount, formatMonths, formatPercent } from '@shared/format/numbers';
import type { Project } from '@shared/model/project';
import { formatPooledInput, formatPooledWidth } from '@shared/summary/pooled-paragraph';
import {
  pooledParagraph,
  pooledSettingsOf,
  pooledSummary,
  type PooledMeasureFigures,
  type PooledSummary,
  type TauCase,
} from '@shared/summary/pooled-summary';

/** The pooled summary when the plan's aim is pooled or both (null for the site-specific aim). */
export function cliPooledSummary(project: Project, plan: ProjectPlan): PooledSummary | null {
  if (pooledSettingsOf(project).aim === 'site-specific') return null;
  return pooledSummary(project, { requiredN: new Map(plan.populations.map((p) => [p.id, p.requiredN])) });
}

const verdict = (met: boolean | null): string => (met === null ? '' : met ? ' met' : ' NOT met');

function caseLine(m: PooledMeasureFigures, c: TauCase): string {
  const p = c.precision;
  const which = c.which === 'base' ? '' : ` (${c.which} τ)`;
  const pi =
    p.predictionIntervalWidth === null
      ? 'no prediction interval (fewer than 3 sites)'
      : `prediction-interval width ${formatPooledWidth(p.predictionIntervalWidth)}` +
        (p.targetPredictionIntervalWidth === null
          ? ''
          : ` (target ${formatPooledInput(p.targetPredictionIntervalWidth)}:${verdict(p.meetsPrediction)})`);
  return (
    `    ${m.name}${which}, τ = ${formatPooledInput(c.tau)}: summary SE ${formatPooledWidth(p.summarySe)}, ` +
    `summary CI width ${formatPooledWidth(p.summaryCiWidth)} (target ${formatPooledInput(p.targetSummaryCiWidth)}:${verdict(p.meetsSummary)}), ${pi}`
  );
}

function measureLines(summary: PooledSummary): string[] {
  const lines: string[] = [];
  for (const m of summary.measures) {
    lines.push(`  ${m.name[0]?.toUpperCase() ?? ''}${m.name.slice(1)} (on ${m.scale}):`);
    if (m.atPlanned !== null) {
      lines.push(`   at each site's planned n:`);
      lines.push(...m.atPlanned.map((c) => caseLine(m, c)));
      const base = m.atPlanned.find((c) => c.which === 'base')?.precision;
      if (base !== undefined) {
        const pi =
          base.predictionFloorWidth === null
            ? ''
            : `, prediction interval ${formatPooledWidth(base.predictionFloorWidth)} (${formatPooledWidth(base.predictionFloorManySites)} with any number of sites)`;
        lines.push(
          `    heterogeneity floors: summary CI ${formatPooledWidth(base.summaryFloorWidth)} with ${formatCount(summary.k)} sites${pi}`,
        );
      }
    }
    if (m.atProposal !== null) {
      lines.push(`   at the proposed n:`);
      lines.push(...m.atProposal.map((c) => caseLine(m, c)));
    }
    if (m.comparison !== null) lines.push(`    ${m.comparison.sentence}`);
    lines.push(...m.problems.map((p) => `    ! ${p}`));
  }
  return lines;
}

/** Lines for the readable table: the figures, the proposal per site, the paragraph and the cautions. */
export function pooledTableText(summary: PooledSummary | null): string {
  if (summary === null) return '';
  const goal = summary.objective === 'fewest-participants' ? 'fewest participants' : 'shortest recruitment';
  const lines: string[] = [
    '',
    `Across sites — aim: ${summary.aim}; ${goal}; ${formatPercent(summary.confidence, 1)} intervals; ${formatCount(summary.k)} sites`,
  ];
  lines.push(...summary.notes.map((n) => `  ${n}`));
  lines.push(...measureLines(summary));
  const proposal = summary.proposal;
  if (proposal !== null) {
    lines.push(
      proposal.status === 'feasible'
        ? `  Proposal: ${formatCount(proposal.totalN)} participants with an outcome (enrol ${formatCount(proposal.totalEnrolment)}; longest recruitment ${formatMonths(proposal.longestMonths)})`
        : `  No proposal (${proposal.status}):`,
    );
    if (proposal.status === 'feasible') {
      for (const s of proposal.sites) {
        const cap = s.atCapacity === true ? ', at capacity' : '';
        lines.push(
          `    ${s.name}: n ${formatCount(s.n)} of capacity ${formatCount(s.capacity)}${cap}; own required n ${formatCount(s.siteSpecificN)}; enrol ${formatCount(s.enrolmentTarget)}, ${formatMonths(s.months)}`,
        );
      }
    }
    lines.push(...proposal.messages.map((m) => `    ${m}`));
  }
  lines.push('', 'Paragraph for the protocol:', '', pooledParagraph(summary));
  return `${lines.join('\n')}\n`;
}

function cell(text: string): string {
  return text.replace(/\|/g, '\\|').replace(/[\r\n]+/g, ' ');
}

/** The Markdown section: a table of the figures, the proposal table, then the paragraph. */
export function pooledMarkdownText(summary: PooledSummary | null): string {
  if (summary === null) return '';
  const lines: string[] = ['', '## Across sites', ''];
  lines.push(...summary.notes.map((n) => `- ${cell(n)}`));
  const rows = summary.measures.flatMap((m) =>
    [
      ...(m.atPlanned ?? []).map((c) => ({ m, c, at: 'planned n' })),
      ...(m.atProposal ?? []).map((c) => ({ m, c, at: 'proposal' })),
    ].map(({ c, at }) => {
      const p = c.precision;
      return `| ${cell(m.name)} | ${at} | ${c.which} | ${formatPooledInput(c.tau)} | ${formatPooledWidth(p.summarySe)} | ${formatPooledWidth(p.summaryCiWidth)} | ${formatPooledInput(p.targetSummaryCiWidth)}${verdict(p.meetsSummary)} | ${p.predictionIntervalWidth === null ? '—' : formatPooledWidth(p.predictionIntervalWidth)} | ${p.targetPredictionIntervalWidth === null ? '' : `${formatPooledInput(p.targetPredictionIntervalWidth)}${verdict(p.meetsPrediction)}`} |`;
    }),
  );
  if (rows.length > 0) {
    lines.push(
      '',
      '| Measure | At | τ | τ value | Summary SE | Summary CI width | Target | Prediction-interval width | Target |',
      '| --- | --- | --- | --- | --- | --- | --- | --- | --- |',
      ...rows,
    );
  }
  const proposal = summary.proposal;
  if (proposal !== null && proposal.status === 'feasible') {
    lines.push('', '| Site | Proposed n | Capacity | Own required n | Enrol | Months |', '| --- | --- | --- | --- | --- | --- |');
    for (const s of proposal.sites) {
      lines.push(
        `| ${cell(s.name)} | ${formatCount(s.n)}${s.atCapacity === true ? ' (at capacity)' : ''} | ${formatCount(s.capacity)} | ${formatCount(s.siteSpecificN)} | ${formatCount(s.enrolmentTarget)} | ${formatMonths(s.months)} |`,
      );
    }
  }
  if (proposal !== null) lines.push('', ...proposal.messages.map((m) => `- ${cell(m)}`));
  lines.push(
    '',
    ...pooledParagraph(summary)
      .split('\n\n')
      .flatMap((p) => [p, '']),
  );
  // Blocks that are absent leave no run of blank lines behind.
  return lines.join('\n').replace(/\n{3,}/g, '\n\n');
}

/**
 * The JSON output with a `pooled` field beside `populations` (every existing field unchanged):
 * the summary without its chart curves, and the paragraph.
 */
export function withPooledJson(json: string, summary: PooledSummary | null): string {
  if (summary === null) return json;
  const { populations, ...rest } = JSON.parse(json) as Record<string, unknown>;
  const pooled = {
    ...summary,
    measures: summary.measures.map(({ curves: _curves, ...m }) => m),
    paragraph: pooledParagraph(summary),
  };
  return `${JSON.stringify({ populations, pooled, ...rest }, null, 2)}\n`;
}
