// The assumptions behind every number: each population's anticipated values (with range and
// source), precision targets and recruitment figures, one table per population, and the
// plan-wide settings.
import type { Population, Project } from '../model/project';
import type { ReportTable } from './document';
import { enteredNumber, fieldsFor, rangeOf, sourceOf, valueAt, withUnit } from './population-values';

const GROUP_WORDS = { anticipated: 'anticipated', precision: 'target', recruitment: 'recruitment' } as const;

function populationRows(population: Population): string[][] {
  return fieldsFor(population).flatMap((spec) => {
    const value = valueAt(population, spec.path);
    const range = rangeOf(population, spec);
    const source = sourceOf(population, spec);
    if (typeof value !== 'number' && range === undefined && source === null && spec.defaultText === undefined) return [];
    const shown = typeof value === 'number' ? withUnit(value, spec.unit) : `default: ${spec.defaultText ?? 'none'}`;
    const rangeText = range === undefined ? '' : `${enteredNumber(range.low)} to ${enteredNumber(range.high)}`;
    // A default follows from the rules of the method, not from a source the authors must give.
    const stated = typeof value === 'number' || range !== undefined;
    const sourceText = spec.group !== 'anticipated' ? '' : (source ?? (stated ? 'source not stated' : 'default'));
    return [[spec.label, GROUP_WORDS[spec.group], shown, rangeText, sourceText]];
  });
}

/** Table: every stated value of one population, with the default where none was entered. */
export function assumptionsTable(population: Population): ReportTable {
  return {
    caption: `Assumptions for ${population.name}`,
    header: ['Quantity', 'Kind', 'Value', 'Low to high', 'Source'],
    numeric: [false, false, true, true, false],
    rows: populationRows(population),
  };
}

/** The note under the last assumptions table. */
export const ASSUMPTIONS_NOTE =
  'Values are as entered in the plan; a default applies where none was entered. Sources are as stated by the plan’s authors.';

/** Table: the plan-wide settings (model, updating, study dates). */
export function settingsTable(project: Project): ReportTable {
  const u = project.updating;
  const rows: [string, string][] = [
    ['Model', project.model.name.trim() === '' ? 'not named' : project.model.name],
    [
      'Reported development performance',
      project.model.reportedPerformance.trim() === '' ? 'not stated' : project.model.reportedPerformance,
    ],
    ...(project.model.reportedRSquared === undefined
      ? []
      : [['Reported R²', enteredNumber(project.model.reportedRSquared)] as [string, string]]),
    ['Model updating', u.enabled ? 'on: development minimums apply' : 'off: validation criteria only'],
  ];
  if (u.enabled) {
    rows.push(
      ['Predictor parameters', u.predictorParameters === undefined ? 'not given' : enteredNumber(u.predictorParameters)],
      [
        'Anticipated adjusted R²',
        u.anticipatedAdjustedRSquared === undefined ? 'not given' : enteredNumber(u.anticipatedAdjustedRSquared),
      ],
      ['Target shrinkage factor', enteredNumber(u.targetShrinkage)],
      ['Allowed optimism in R²', enteredNumber(u.optimismMargin)],
      ['Form of the shrinkage criterion', u.shrinkageForm],
    );
  }
  rows.push(
    ['Study start', project.study.startDate ?? 'not set'],
    [
      'Recruitment window',
      project.study.windowMonths === undefined ? 'not set' : `${enteredNumber(project.study.windowMonths)} months`,
    ],
  );
  return { caption: 'Plan-wide settings', header: ['Setting', 'Value'], numeric: [false, false], rows };
}
