import { formatSignificant } from '@shared/format/numbers';
import { resolveLp } from '@shared/engine/binary/resolve-lp';
import type { BinaryAnticipated } from '@shared/model/project';

/**
 * The distribution of the linear predictor the slope, C-statistic and net-benefit criteria use:
 * the given mean and SD, or those fitted to the outcome proportion and C-statistic (as if the model
 * were well calibrated), shown so the user can check them.
 */
export function LpNote({ anticipated }: { readonly anticipated: BinaryAnticipated }) {
  let text: string;
  let failed = false;
  try {
    const lp = resolveLp(anticipated);
    if (lp.kind === 'fitted') {
      text = `Linear predictor fitted to the outcome proportion and C-statistic: mean μ = ${formatSignificant(lp.lp.mean)}, SD σ = ${formatSignificant(lp.lp.sd)} (log-odds).`;
    } else if (lp.kind === 'given') {
      text = `Linear predictor as given: mean μ = ${formatSignificant(lp.lp.mean)}, SD σ = ${formatSignificant(lp.lp.sd)} (log-odds).`;
    } else {
      text = `Linear predictor: ${lp.reason}.`;
      failed = lp.kind === 'not-converged';
    }
  } catch (error) {
    text = `Linear predictor: ${error instanceof Error ? error.message : String(error)}`;
    failed = true;
  }
  return (
    <p className={failed ? 'field-error' : 'hint'} data-testid="lp-note">
      {text}
    </p>
  );
}
