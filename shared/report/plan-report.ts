// The printed report of a plan: the summary tables, the charts, the justification, any sections a
// caller adds, the assumptions, the references, the cautions and the reproducibility details.
import { criterionColumns } from '../summary/criterion-columns';
import { criterionBarsSvg } from './charts/criterion-bars-svg';
import { recruitmentSvg } from './charts/recruitment-svg';
import { paragraph, type Block, type ReportDocument, type ReportSection, type Reproducibility } from './document';
import { ASSUMPTIONS_NOTE, assumptionsTable, settingsTable } from './assumptions-table';
import {
  cautionsSection,
  justificationSection,
  modelName,
  referencesSection,
  resolveExtraSections,
  totalsParagraph,
  type JustificationInput,
} from './plan-justification';
import { createReferenceRegister } from './reference-register';
import { criterionTable, recruitmentTable } from './report-tables';
import { reportRows, type ReportRows } from './report-rows';

/** Populations per bar chart, so that one figure fits on a page. */
export const BARS_PER_FIGURE = 8;
/** Sites per recruitment chart. */
export const SITES_PER_FIGURE = 24;

export interface PlanReportInput extends JustificationInput {
  readonly reproducibility: Reproducibility;
}

function chunks<T>(items: readonly T[], size: number): T[][] {
  const out: T[][] = [];
  for (let i = 0; i < items.length; i += size) out.push(items.slice(i, i + size));
  return out;
}

function part(index: number, size: number, total: number, chunkCount: number): string {
  return chunkCount <= 1 ? '' : ` (populations ${index * size + 1}–${Math.min(total, (index + 1) * size)} of ${total})`;
}

function figuresSection({ rows, project }: ReportRows): ReportSection {
  const blocks: Block[] = [];
  const barChunks = chunks(rows, BARS_PER_FIGURE);
  barChunks.forEach((group, i) =>
    blocks.push({
      kind: 'figure',
      figure: {
        caption: `n per population by criterion${part(i, BARS_PER_FIGURE, rows.length, barChunks.length)}; the binding criterion is drawn solid, outlined and marked ◆ with its n`,
        svg: criterionBarsSvg(group, criterionColumns(group)),
        description:
          'One group of bars per population, in the order of the tables; each bar is one criterion’s n. The numbers are those of the first table.',
      },
    }),
  );
  const window = project.study.windowMonths;
  const siteChunks = chunks(rows, SITES_PER_FIGURE);
  siteChunks.forEach((group, i) =>
    blocks.push({
      kind: 'figure',
      figure: {
        caption: `Months to enrol the target per site${window === undefined ? '' : ', against the recruitment window (dashed line)'}${part(i, SITES_PER_FIGURE, rows.length, siteChunks.length)}`,
        svg: recruitmentSvg(group, window),
        description:
          'One bar per site: the months needed to enrol its target at its enrolment rate. The numbers are those of the second table.',
      },
    }),
  );
  return { id: 'figures', title: 'Figures', blocks };
}

/**
 * The whole report as a document model (render it with renderHtml, renderMarkdown or renderText).
 * References are numbered in order of first use across the document.
 * @example renderHtml(planReport({ project, planner: enginePlanner, reproducibility })) // a print-ready page
 */
export function planReport({ project, planner, extraSections, reproducibility }: PlanReportInput): ReportDocument {
  const register = createReferenceRegister();
  const data = reportRows(project, planner);
  const description = project.description.trim();
  const summary: ReportSection = {
    id: 'summary',
    title: 'Summary',
    blocks: [
      ...(description === '' ? [] : [paragraph(description)]),
      totalsParagraph(data),
      { kind: 'table', table: criterionTable(data) },
      { kind: 'table', table: recruitmentTable(data) },
    ],
  };
  const justification = justificationSection(data, register.cite);
  const extra = resolveExtraSections(extraSections, register.cite);
  const assumptions: ReportSection = {
    id: 'assumptions',
    title: 'Assumptions',
    blocks: [
      { kind: 'table', table: settingsTable(project) },
      ...project.populations.map((population, i, all): Block => {
        const table = assumptionsTable(population);
        return { kind: 'table', table: i === all.length - 1 ? { ...table, note: ASSUMPTIONS_NOTE } : table };
      }),
    ],
  };
  return {
    title: project.name,
    subtitle: [
      `Sample size for the external validation of ${modelName(project)}`,
      `${data.rows.length === 1 ? 'One population' : `${data.rows.length} populations`} · prepared ${reproducibility.date}`,
    ],
    sections: [
      summary,
      figuresSection(data),
      justification,
      ...extra,
      assumptions,
      referencesSection(register.list()),
      cautionsSection(),
    ],
    reproducibility,
  };
}
