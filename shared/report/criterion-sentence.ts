// One criterion in words: what it asks for, the n it gives, the formula and the sources.
import type { CriterionResult } from '../engine/types';
import { formatCount, formatSignificant } from '../format/numbers';
import type { Cite } from './reference-register';

/** The intermediate quantities behind a criterion, e.g. "σ²_CITL = 0.4352, SE* = 0.03827". */
export function intermediatesText(criterion: CriterionResult): string {
  return criterion.intermediates.map((i) => `${i.name} = ${formatSignificant(i.value)}`).join(', ');
}

/** What the criterion's status means for its n, in words. */
function outcomeWords(criterion: CriterionResult): string {
  const why = criterion.reason === undefined ? '' : ` (${criterion.reason})`;
  switch (criterion.status) {
    case 'ok':
      return `n = ${formatCount(criterion.n)}`;
    case 'always-met':
      return `met at every admissible n, so its smallest admissible n, ${formatCount(criterion.n)}, is used${why}`;
    case 'not-assessable':
      return `not assessed${why}`;
    case 'not-converged':
      return `not reached${why}; no sample size can be stated for it`;
  }
}

/**
 * "Precise R² (target: 95% CI width for R² ≤ 0.1): n = 879, by the formula n = …, with SE* = 0.0255 [1, 2]."
 * Any CriterionResult reads this way, whatever its outcome type.
 */
export function criterionSentence(criterion: CriterionResult, cite: Cite): string {
  const computed = criterion.status === 'ok' || criterion.status === 'always-met';
  const formula = computed && criterion.formula !== '' ? `, by the formula ${criterion.formula}` : '';
  const quantities = computed && criterion.intermediates.length > 0 ? `, with ${intermediatesText(criterion)}` : '';
  const mark = cite(criterion.references);
  return `${criterion.label} (target: ${criterion.target}): ${outcomeWords(criterion)}${formula}${quantities}${mark === '' ? '' : ` ${mark}`}.`;
}
