import type { ProjectPlan } from '@shared/engine/plan/plan-project';
import type { CriterionResult, PrecisionAtN } from '@shared/engine/types';
import { formatCount, formatMonths, formatPercent, formatSignificant } from '@shared/format/numbers';
import type { Project } from '@shared/model/project';
import type { ComparisonRow } from '@shared/summary/comparison';
import { CAUTIONS_ONE_LINE } from '@shared/text/cautions';

const STATUS_WORDS: Readonly<Record<CriterionResult['status'], string>> = {
  ok: '',
  'always-met': 'always met',
  'not-assessable': 'not assessable',
  'not-converged': 'not reached',
};

function pad(text: string, width: number, right = false): string {
  const gap = ' '.repeat(Math.max(0, width - [...text].length));
  return right ? gap + text : text + gap;
}

function criterionLine(c: CriterionResult, binding: string | null, labelWidth: number): string {
  const mark = c.id === binding ? '▶' : ' ';
  const n = c.n === null ? '—' : formatCount(c.n);
  const status = STATUS_WORDS[c.status];
  const tail = c.reason === undefined ? '' : ` (${c.reason})`;
  return `  ${mark} ${pad(c.label, labelWidth)} ${pad(n, 9, true)}   ${c.target}${status === '' ? '' : ` — ${status}`}${tail}`;
}

function precisionLine(p: PrecisionAtN, labelWidth: number): string {
  const verdict = p.meets === null ? 'cannot say' : p.meets ? 'meets the target' : 'misses the target';
  const achieved = p.achieved === null ? '—' : formatSignificant(p.achieved);
  const tail = p.reason === undefined ? '' : ` (${p.reason})`;
  return `    ${pad(p.label, labelWidth)} ${p.scale}: ${achieved} against ${formatSignificant(p.targetValue)} — ${verdict}${tail}`;
}

function recruitmentLine(row: ComparisonRow): string | null {
  if (row.enrolmentTarget === null) return null;
  const missing = row.missingOutcomeFraction > 0 ? ` allowing ${formatPercent(row.missingOutcomeFraction)} missing outcomes` : '';
  const pace =
    row.months === null || row.perMonth === null
      ? ''
      : `; about ${formatMonths(row.months)} at ${formatSignificant(row.perMonth, 3)} a month`;
  const fit =
    row.feasibility === 'exceeds'
      ? ' — longer than the study window'
      : row.feasibility === 'fits'
        ? ' — fits the study window'
        : '';
  return `  Enrol ${formatCount(row.enrolmentTarget)}${missing}${pace}${fit}`;
}

/** Whether the development minimums are included, with the settings they use. */
function updatingLine(project: Project): string {
  const u = project.updating;
  if (!u.enabled) return 'Model updating off: validation criteria only';
  const p = `P = ${u.predictorParameters ?? 'not given'}`;
  const given = (value: number | undefined): string => (value === undefined ? 'not given' : formatSignificant(value));
  return project.outcome === 'binary'
    ? `Model updating on: development minimums included (${p}, anticipated Cox–Snell R² ${given(u.anticipatedCoxSnellR2)}, target shrinkage ${formatSignificant(u.targetShrinkage)}, allowed optimism in Nagelkerke R² ${formatSignificant(u.optimismMargin)})`
    : `Model updating on: development minimums included (${p}, anticipated adjusted R² ${given(u.anticipatedAdjustedRSquared)}, shrinkage form ${u.shrinkageForm})`;
}

/** Binary outcomes: the events expected at the required n (planners think in events). */
function eventsLine(
  events: { readonly exact: number; readonly whole: number } | null,
  perParameter: number | null,
): string | null {
  if (events === null) return null;
  const epp = perParameter === null ? '' : `; ${formatSignificant(perParameter, 3)} events per predictor parameter`;
  return `  Expected events at the required n: ${formatCount(events.whole)} (${formatSignificant(events.exact)} exactly)${epp}`;
}

/** The default output: a readable block per population, the total and the cautions line. */
export function formatTable(project: Project, plan: ProjectPlan, rows: readonly ComparisonRow[]): string {
  const lines: string[] = [project.name];
  if (project.outcome === 'binary') lines.push('Outcome type: binary (O/E, calibration slope, C-statistic, net benefit)');
  lines.push(updatingLine(project));
  const labelWidth = Math.max(10, ...plan.populations.flatMap((p) => p.criteria.map((c) => [...c.label].length)));
  plan.populations.forEach((p, i) => {
    lines.push('');
    const binding = p.criteria.find((c) => c.id === p.binding);
    const required =
      p.requiredN === null ? (binding === undefined ? 'no criterion could be sized' : 'out of reach') : formatCount(p.requiredN);
    lines.push(`${p.name} — required n ${required}${binding === undefined ? '' : ` (set by ${binding.label})`}`);
    lines.push(`  ${pad('', 2)}${pad('criterion', labelWidth)} ${pad('n', 9, true)}   target`);
    for (const c of p.criteria) lines.push(criterionLine(c, p.binding, labelWidth));
    for (const problem of p.problems) lines.push(`  ! ${problem}`);
    const events = eventsLine(p.events ?? null, p.eventsPerParameter ?? null);
    if (events !== null) lines.push(events);
    for (const warning of p.warnings ?? []) lines.push(`  ⚠ ${warning}`);
    if (p.worstCase !== null) {
      const worst = p.worstCase.requiredN === null ? 'out of reach' : formatCount(p.worstCase.requiredN);
      lines.push(`  Worst case across the ranges: ${worst} (${p.worstCase.assumption})`);
    }
    const row = rows[i];
    const recruitment = row === undefined ? null : recruitmentLine(row);
    if (recruitment !== null) lines.push(recruitment);
    if (p.precisionAtAvailableN !== null && p.availableN !== null) {
      lines.push(`  At the available n of ${formatCount(p.availableN)}:`);
      for (const x of p.precisionAtAvailableN) lines.push(precisionLine(x, labelWidth));
    }
  });
  lines.push('');
  const count = plan.populations.length === 1 ? '1 population' : `${plan.populations.length} populations`;
  lines.push(
    `Total required n: ${plan.totalRequiredN === null ? 'unknown (a target is out of reach)' : formatCount(plan.totalRequiredN)} across ${count}`,
  );
  lines.push(CAUTIONS_ONE_LINE);
  return `${lines.join('\n')}\n`;
}
