// The justification for one population, in plain scientific English: what is estimated, every
// anticipated value with its source, every precision target and the n each criterion needs (with
// its formula and numbered sources), the binding criterion, the worst case over the ranges, the
// enrolment after missing outcomes, the recruitment time and, when the model will be updated, the
// development minimums. It reads CriterionResult and ComparisonRow only, so any outcome type's
// criteria come through unchanged.
import { requiredSize } from '../engine/plan/required-size';
import type { CriterionResult, PrecisionAtN, ReferenceKey } from '../engine/types';
import { formatCount, formatMonths, formatPercent, formatSignificant } from '../format/numbers';
import type { FieldSpec } from '../model/population-fields';
import type { Population, Project } from '../model/project';
import type { ComparisonRow } from '../summary/comparison';
import { criterionSentence } from './criterion-sentence';
import { list, paragraph, type Block, type ReportSection } from './document';
import { enteredNumber, fieldsFor, rangeOf, sourceOf, valueAt, withUnit } from './population-values';
import type { Cite } from './reference-register';

export interface PopulationContext {
  readonly population: Population;
  readonly row: ComparisonRow;
  /** Position in the table's ranking (1 = largest required n) and the number of populations. */
  readonly rank: number;
  readonly count: number;
  readonly project: Project;
  readonly cite: Cite;
}

/** An id usable as an HTML anchor. */
export function anchorFor(prefix: string, id: string): string {
  return `${prefix}-${id.replace(/[^A-Za-z0-9_-]+/g, '-')}`;
}

/** Free text set inside brackets without a doubled full stop. */
function clause(text: string): string {
  return text.trim().replace(/[.\s]+$/, '');
}

function anticipatedItem(population: Population, spec: FieldSpec): string | null {
  const value = valueAt(population, spec.path);
  const range = rangeOf(population, spec);
  const source = sourceOf(population, spec);
  const rangeText = range === undefined ? '' : `, range ${enteredNumber(range.low)} to ${withUnit(range.high, spec.unit)}`;
  const sourceText = source === null ? 'source not stated' : `source: ${clause(source)}`;
  if (typeof value === 'number') return `${spec.label}: ${withUnit(value, spec.unit)}${rangeText} (${sourceText}).`;
  if (range === undefined && source === null) {
    // A value that is neither given nor defaulted enters no number; a criterion that needs it says so.
    return spec.defaultText === undefined ? null : `${spec.label}: not stated, so the default is used (${spec.defaultText}).`;
  }
  const base = spec.defaultText === undefined ? 'not given' : `not stated, so the default is used (${spec.defaultText})`;
  return `${spec.label}: ${base}${rangeText} (${sourceText}).`;
}

function uniqueReferences(criteria: readonly CriterionResult[]): ReferenceKey[] {
  return [...new Set(criteria.flatMap((c) => c.references))];
}

function labelOf(row: ComparisonRow, id: string | null): string {
  return row.criteria.find((c) => c.id === id)?.label ?? id ?? 'no criterion';
}

function estimatedParagraph({ population, row, rank, count }: PopulationContext): Block {
  const measures = row.criteria.filter((c) => c.purpose === 'validation').length;
  return paragraph(
    `The validation in ${population.name} (ranked ${rank} of ${count} by required n) estimates how well the model predicts a ${population.outcome} outcome there. ` +
      `Its performance is to be estimated on ${measures === 1 ? 'one measure' : `${measures} measures`}, each to a stated precision; ` +
      'each criterion gives the smallest number of participants with an observed outcome for which the expected confidence interval meets its target.',
    'What is estimated.',
  );
}

function requiredParagraph({ population, row, project }: PopulationContext): Block {
  const lead = 'Required sample size.';
  if (row.requiredN === null) {
    if (row.binding === null)
      return paragraph(`None of the criteria could be sized for ${population.name}, so no sample size can be stated.`, lead);
    const failed = row.criteria.find((c) => c.id === row.binding);
    const why = failed?.reason === undefined ? '' : ` (${failed.reason})`;
    return paragraph(
      `No sample size can be stated for ${population.name}: the target of ${labelOf(row, row.binding)} cannot be reached${why}.`,
      lead,
    );
  }
  const split =
    project.updating.enabled && row.criteria.some((c) => c.purpose === 'development')
      ? (() => {
          const validation = requiredSize(row.criteria.filter((c) => c.purpose === 'validation')).requiredN;
          const development = requiredSize(row.criteria.filter((c) => c.purpose === 'development')).requiredN;
          return ` The validation criteria alone need ${formatCount(validation)} and the development minimums ${formatCount(development)}; the larger is taken.`;
        })()
      : '';
  return paragraph(
    `The required sample size for ${population.name} is the largest of these, ${formatCount(row.requiredN)} participants with an observed outcome, set by the binding criterion ${labelOf(row, row.binding)}.${split}`,
    lead,
  );
}

function worstCaseParagraph({ row }: PopulationContext): Block {
  const lead = 'Worst case over the assumption ranges.';
  const worst = row.worstCase;
  if (worst === null)
    return paragraph('No low–high ranges are stated for the anticipated values here, so no worst case is computed.', lead);
  const method = 'Varying each anticipated value across its stated range, one at a time with the others at their base values,';
  if (worst.requiredN === null) {
    return paragraph(
      `${method} the target of ${labelOf(row, worst.binding)} cannot be reached at one end (${worst.assumption}).`,
      lead,
    );
  }
  const more =
    row.requiredN !== null && worst.requiredN > row.requiredN
      ? `, ${formatCount(worst.requiredN - row.requiredN)} more than at the base values`
      : '';
  return paragraph(
    `${method} the largest requirement is ${formatCount(worst.requiredN)}${more} (${worst.assumption}; set by ${labelOf(row, worst.binding)}).`,
    lead,
  );
}

function enrolmentParagraph({ row }: PopulationContext): Block {
  const lead = 'Enrolment and missing outcomes.';
  if (row.enrolmentTarget === null || row.requiredN === null)
    return paragraph('Without a required n, no enrolment target can be set.', lead);
  if (row.missingOutcomeFraction === 0) {
    return paragraph(
      `No missing outcomes are anticipated, so the enrolment target equals the required n, ${formatCount(row.enrolmentTarget)}.`,
      lead,
    );
  }
  return paragraph(
    `Allowing for ${formatPercent(row.missingOutcomeFraction)} of enrolled participants having no observed outcome, ${formatCount(row.enrolmentTarget)} are to be enrolled: ` +
      `${formatCount(row.requiredN)} ÷ (1 − ${enteredNumber(row.missingOutcomeFraction)}), rounded up (common practice).`,
    lead,
  );
}

function recruitmentParagraph({ population, row, project }: PopulationContext): Block {
  const lead = 'Recruitment.';
  const r = population.recruitment;
  if (r.accrualPerMonth === undefined || row.perMonth === null) {
    return paragraph('No accrual rate is given for this site, so the time to recruit is not estimated.', lead);
  }
  const window = project.study.windowMonths;
  let text =
    `The site sees about ${enteredNumber(r.accrualPerMonth)} patients a month who could be screened; with ${formatPercent(r.eligibleFraction)} eligible and ` +
    `${formatPercent(r.consentFraction)} of those consenting, about ${formatSignificant(row.perMonth)} participants are enrolled a month`;
  if (row.months !== null && row.enrolmentTarget !== null)
    text += `, so enrolling ${formatCount(row.enrolmentTarget)} takes about ${formatMonths(row.months)}`;
  if (row.finishDate !== null && project.study.startDate !== undefined)
    text += `. Starting on ${project.study.startDate}, recruitment would end on about ${row.finishDate}`;
  if (window !== undefined && row.months !== null) {
    text +=
      row.feasibility === 'exceeds'
        ? `, ${formatMonths(row.months - window)} beyond the ${enteredNumber(window)}-month recruitment window`
        : `, within the ${enteredNumber(window)}-month recruitment window`;
  } else if (window === undefined) {
    text += ' (no recruitment window is set, so feasibility is not judged)';
  }
  return paragraph(`${text}.`, lead);
}

function precisionItem(p: PrecisionAtN): string {
  const verdict =
    p.meets === null ? 'cannot say whether it meets the target' : p.meets ? 'meets the target' : 'misses the target';
  const why = p.reason === undefined ? '' : ` (${p.reason})`;
  return `${p.label}: ${p.scale} ${p.achieved === null ? 'not computable' : formatSignificant(p.achieved)} against the target ${formatSignificant(p.targetValue)}, ${verdict}${why}.`;
}

function cohortBlocks({ row }: PopulationContext): Block[] {
  if (row.availableN === null || row.precisionAtAvailableN === null) return [];
  const enough =
    row.requiredN === null
      ? ''
      : row.availableN >= row.requiredN
        ? ` It is at least the required n of ${formatCount(row.requiredN)}.`
        : ` It is ${formatCount(row.requiredN - row.availableN)} short of the required n of ${formatCount(row.requiredN)}.`;
  return [
    paragraph(
      `A cohort of ${formatCount(row.availableN)} participants is already available.${enough} The precision it would give for each measure:`,
      'Existing cohort.',
    ),
    list(row.precisionAtAvailableN.map(precisionItem)),
  ];
}

/** The justification section of one population. */
export function populationJustification(ctx: PopulationContext): ReportSection {
  const { population, row, cite } = ctx;
  const id = anchorFor('population', population.id);
  if (row.problem !== null) {
    return { id, title: population.name, blocks: [paragraph(`${population.name} could not be planned: ${row.problem}`)] };
  }
  const anticipated = fieldsFor(population)
    .filter((spec) => spec.group === 'anticipated')
    .map((spec) => anticipatedItem(population, spec))
    .filter((item): item is string => item !== null);
  const validation = row.criteria.filter((c) => c.purpose === 'validation');
  const development = row.criteria.filter((c) => c.purpose === 'development');
  const blocks: Block[] = [
    estimatedParagraph(ctx),
    paragraph('', 'Anticipated values.'),
    list(anticipated),
    paragraph('', 'Precision targets and the n each criterion needs.'),
    list(validation.map((c) => criterionSentence(c, cite))),
  ];
  if (development.length > 0) {
    blocks.push(
      paragraph(
        `Because the model will be updated locally, the minimums for developing a model also apply ${cite(uniqueReferences(development))}:`,
        'Development minimums.',
      ),
      list(development.map((c) => criterionSentence(c, cite))),
    );
  }
  blocks.push(
    requiredParagraph(ctx),
    worstCaseParagraph(ctx),
    enrolmentParagraph(ctx),
    recruitmentParagraph(ctx),
    ...cohortBlocks(ctx),
  );
  return { id, title: population.name, blocks };
}
