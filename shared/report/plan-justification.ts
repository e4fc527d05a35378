// The justification for the whole plan: what is validated and how it is sized, the totals, then
// one subsection per population in the table's order; with the references and cautions it is the
// text people paste into a protocol (justificationDocument), and the core of the printed report.
import type { CriterionResult, ReferenceKey } from '../engine/types';
import { formatCount, formatMonths } from '../format/numbers';
import type { Project } from '../model/project';
import type { Planner } from '../summary/comparison';
import { CAUTIONS } from '../text/cautions';
import { list, paragraph, type Block, type NumberedReference, type ReportDocument, type ReportSection } from './document';
import { populationJustification } from './population-justification';
import { enteredNumber } from './population-values';
import { createReferenceRegister, type Cite } from './reference-register';
import { reportRows, type ReportRows } from './report-rows';

/** A section a caller adds (the pooled analysis, say); a function receives the citation register. */
export type ExtraSection = ReportSection | ((cite: Cite) => ReportSection);

function referencesOf(criteria: readonly CriterionResult[]): ReferenceKey[] {
  return [...new Set(criteria.flatMap((c) => c.references))];
}

/** The model's name, or a plain description when it has none. */
export function modelName(project: Project): string {
  return project.model.name.trim() === '' ? 'a clinical prediction model' : project.model.name.trim();
}

function aimParagraph(project: Project, count: number): Block {
  const model = modelName(project);
  const description =
    project.model.description.trim() === '' ? '' : ` ${project.model.description.trim().replace(/([^.])$/, '$1.')}`;
  const reported =
    project.model.reportedPerformance.trim() === ''
      ? ''
      : ` Reported development performance: ${project.model.reportedPerformance.trim().replace(/([^.])$/, '$1.')}`;
  const populations = count === 1 ? 'one population' : `${count} populations`;
  return paragraph(`This plan sizes the external validation of ${model} in ${populations}.${description}${reported}`, 'Aim.');
}

function methodParagraph(data: ReportRows, cite: Cite): Block {
  const validation = data.rows.flatMap((r) => r.criteria.filter((c) => c.purpose === 'validation'));
  const mark = cite(referencesOf(validation));
  return paragraph(
    'Each population is sized on its own, so that the model’s performance there can be estimated precisely. ' +
      'For each measure of performance, a criterion gives the smallest number of participants with an observed outcome for which the expected confidence interval meets a precision target; ' +
      `the required n of a population is the largest over its criteria, and the criterion that sets it is called binding${mark === '' ? '' : `. The criteria follow published methods ${mark}`}. ` +
      'Where low and high values are given for an anticipated value, each is varied across its range with the others held at their base values, and the largest requirement is reported as the worst case (a one-at-a-time sensitivity analysis; common practice).',
    'Method.',
  );
}

function updatingParagraph(data: ReportRows, cite: Cite): Block {
  const u = data.project.updating;
  if (!u.enabled)
    return paragraph(
      'The model is to be validated as published, without local updating, so only the validation criteria apply.',
      'Model updating.',
    );
  const development = data.rows.flatMap((r) => r.criteria.filter((c) => c.purpose === 'development'));
  const mark = cite(referencesOf(development));
  // Only the settings that are given: not every outcome type reads every one, and a criterion
  // that lacks an input says so in its own line.
  const settings = [
    u.predictorParameters === undefined ? null : `${formatCount(u.predictorParameters)} predictor parameters`,
    u.anticipatedAdjustedRSquared === undefined
      ? null
      : `anticipated adjusted R² ${enteredNumber(u.anticipatedAdjustedRSquared)}`,
    `target shrinkage factor ${enteredNumber(u.targetShrinkage)}`,
    `allowed optimism in R² ${enteredNumber(u.optimismMargin)}`,
  ]
    .filter((item): item is string => item !== null)
    .join(', ');
  return paragraph(
    `The model will be updated locally (${settings}), so each population must also meet the minimums for developing a model${mark === '' ? '' : ` ${mark}`}.`,
    'Model updating.',
  );
}

export function totalsParagraph(data: ReportRows): Block {
  const { rows, totals, totalRequiredN, project } = data;
  const parts: string[] = [];
  if (totalRequiredN === null)
    parts.push('The total cannot be stated, because the requirement of at least one population is unknown.');
  else {
    parts.push(
      `In total, ${formatCount(totalRequiredN)} participants with an observed outcome are required across the ${rows.length === 1 ? 'one population' : `${rows.length} populations`}, ` +
        `and ${formatCount(totals.enrolmentTarget)} are to be enrolled once missing outcomes are allowed for.`,
    );
  }
  if (totals.longestMonths !== null && totals.longestSite !== null) {
    parts.push(`Recruitment takes longest at ${totals.longestSite}: ${formatMonths(totals.longestMonths)}.`);
  }
  const window = project.study.windowMonths;
  if (window !== undefined) {
    const exceeding = rows.filter((r) => r.feasibility === 'exceeds').map((r) => r.name);
    const unknown = rows.filter((r) => r.feasibility === 'unknown').length;
    parts.push(
      exceeding.length === 0
        ? `Every site with an accrual rate can enrol its target within the ${enteredNumber(window)}-month recruitment window.`
        : `${exceeding.length} of ${rows.length} sites cannot enrol their target within the ${enteredNumber(window)}-month recruitment window: ${exceeding.join('; ')}.`,
    );
    if (unknown > 0)
      parts.push(
        `For ${unknown === 1 ? 'one site' : `${unknown} sites`} the time to recruit is not known (no accrual rate or no required n).`,
      );
  }
  return paragraph(parts.join(' '), 'Totals.');
}

/** The justification section: aim, method, updating, totals, then one subsection per population. */
export function justificationSection(data: ReportRows, cite: Cite): ReportSection {
  const byId = new Map(data.project.populations.map((p) => [p.id, p]));
  const blocks = [
    aimParagraph(data.project, data.rows.length),
    methodParagraph(data, cite),
    updatingParagraph(data, cite),
    totalsParagraph(data),
  ];
  const subsections = data.rows.flatMap((row, index) => {
    const population = byId.get(row.populationId);
    return population === undefined
      ? []
      : [populationJustification({ population, row, rank: index + 1, count: data.rows.length, project: data.project, cite })];
  });
  return { id: 'justification', title: 'Sample size justification', blocks, subsections };
}

export function resolveExtraSections(extra: readonly ExtraSection[] | undefined, cite: Cite): ReportSection[] {
  return (extra ?? []).map((section) => (typeof section === 'function' ? section(cite) : section));
}

export function cautionsSection(): ReportSection {
  return { id: 'cautions', title: 'Cautions', blocks: [list(CAUTIONS)] };
}

export function referencesSection(items: readonly NumberedReference[]): ReportSection {
  return {
    id: 'references',
    title: 'References',
    blocks: items.length === 0 ? [paragraph('No published source is cited.')] : [{ kind: 'references', items }],
  };
}

export interface JustificationInput {
  readonly project: Project;
  readonly planner: Planner;
  readonly extraSections?: readonly ExtraSection[];
}

/**
 * The text to paste into a protocol: the justification, any extra sections, the numbered
 * references (in order of first use) and the cautions.
 * @example renderText(justificationDocument({ project, planner: enginePlanner }))
 */
export function justificationDocument({ project, planner, extraSections }: JustificationInput): ReportDocument {
  const register = createReferenceRegister();
  const data = reportRows(project, planner);
  const sections = [justificationSection(data, register.cite), ...resolveExtraSections(extraSections, register.cite)];
  return {
    title: project.name,
    subtitle: [`Sample size for the external validation of ${modelName(project)}`],
    sections: [...sections, referencesSection(register.list()), cautionsSection()],
  };
}
