// The simulation check in the built app: a module worker under the app's CSP, progress, the
// verdict beside the closed form, cancel keeping the partial result, storing it in the plan file.
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import type { Page } from '@playwright/test';
import { expect, REPO_ROOT, test } from './harness/fixtures';
import { isContinuousPopulation } from '../../shared/engine/plan/plan-project';
import { planPopulation } from '../../shared/engine/plan/plan-population';
import { createSimulation, simulationVerdict } from '../../shared/engine/simulation';
import { parsePlanText } from '../../shared/model/plan-file';
import type { ContinuousPopulation, Project } from '../../shared/model/project';
import { closedFormAtN, simulatedInputsOf, simulationConfigOf, verdictReferences } from '../../shared/summary/simulation-check';

async function demo(): Promise<{ project: Project; first: ContinuousPopulation }> {
  const parsed = parsePlanText(await readFile(path.join(REPO_ROOT, 'demo', 'consortium-continuous.plumb'), 'utf8'));
  if (!parsed.ok) throw new Error(parsed.error.message);
  const first = parsed.project.populations[0];
  if (first === undefined || !isContinuousPopulation(first)) throw new Error('the demo starts with a continuous population');
  return { project: parsed.project, first };
}

async function setField(page: Page, testId: string, value: string): Promise<void> {
  const field = page.getByTestId(testId);
  await field.fill(value);
  await field.press('Enter');
}

async function select(page: Page, name: string): Promise<void> {
  await page.getByTestId('comparison-table').locator('tbody tr', { hasText: name }).click();
  await expect(page.locator('#population-name')).toHaveValue(name);
}

async function progressDone(page: Page): Promise<number> {
  return Number((await page.getByTestId('simulation-progress').getAttribute('data-done')) ?? 'NaN');
}

test('a small check of one demo population runs in a module worker under the CSP, shows the verdict as the engine gives it, is undoable and is saved in the plan file', async ({
  appPage: page,
  folders,
}) => {
  const { project, first } = await demo();
  const requiredN = planPopulation(first, project).requiredN;
  if (requiredN === null) throw new Error('the demo population has a required n');
  const workers: string[] = [];
  page.on('worker', (w) => workers.push(w.url()));

  await select(page, first.name);
  const panel = page.getByTestId('simulation-panel');
  await expect(panel).toBeVisible();
  await setField(page, 'simulation-replicates', '400');
  await setField(page, 'simulation-seed', '20260302');
  await panel.getByTestId('simulation-run').click();

  const verdict = panel.getByTestId('simulation-verdict');
  await expect(verdict).toContainText(`400 simulated studies of n = ${requiredN.toLocaleString('en-GB')} (seed 20260302)`);
  // The worker is the bundled module, served by the app itself (worker-src 'self').
  expect(workers).toHaveLength(1);
  expect(workers[0]).toMatch(/\/assets\/simulation\.worker-[\w-]+\.js$/);

  // Same seed, same numbers: the engine run here in Node gives the verdict the worker gave.
  const inputs = simulatedInputsOf(first);
  if (!inputs.ok) throw new Error(inputs.reason);
  const sim = createSimulation(simulationConfigOf(inputs.inputs, requiredN, 400, 20260302));
  while (!sim.step(Infinity).done);
  const expected = simulationVerdict(
    sim.result(),
    verdictReferences(closedFormAtN(first, planPopulation(first, project), requiredN)),
  );
  await expect(verdict).toHaveText(expected.headline);
  await expect(panel.locator('.simulation-verdicts li')).toHaveText(expected.measures.map((m) => m.text));
  await expect(panel.getByTestId('simulation-table').locator('tbody tr')).toHaveCount(6);
  await expect(panel.getByTestId('simulation-table').locator('tr[data-measure="r-squared"] td').first()).toHaveText(
    requiredN.toLocaleString('en-GB'),
  );
  await expect(panel).toContainText('statistical precision only');
  await expect(panel.getByTestId('simulation-meta')).toContainText('Seed 20260302 · 400 of 400 replicates');
  await expect(page.getByTestId('dirty-mark')).toBeVisible();

  // Filed through the document's edit path: undo takes it away, redo brings it back.
  await page.locator('body').click({ position: { x: 5, y: 5 } });
  await page.keyboard.press('Control+z');
  await expect(panel.getByTestId('simulation-result')).toHaveCount(0);
  await page.keyboard.press('Control+Shift+z');
  await expect(verdict).toHaveText(expected.headline);

  await page.getByRole('button', { name: 'Save', exact: true }).click();
  const picker = page.getByTestId('file-picker');
  await picker.locator('#picker-name').fill('checked plan');
  await picker.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByTestId('status')).toContainText('Saved');
  const saved = parsePlanText(await readFile(path.join(folders.documentsDir, 'checked plan.plumb'), 'utf8'));
  if (!saved.ok) throw new Error(saved.error.message);
  const record = saved.project.simulations?.[first.id];
  expect(record).toMatchObject({
    basis: 'required-n',
    n: requiredN,
    seed: 20260302,
    replicatesRequested: 400,
    replicatesDone: 400,
    engineVersion: sim.result().engineVersion,
  });
  // The stored numbers are the engine's to within the last few bits: Chromium's and Node's V8
  // round Math.exp/log differently in the last place, so the check allows 1e-12 relative (the
  // verdict above, at its printed precision, is identical).
  const stored = record?.measures ?? [];
  const fresh = sim.result().measures;
  expect(stored.map((m) => m.id)).toEqual(fresh.map((m) => m.id));
  fresh.forEach((m, i) => {
    for (const key of ['meanEstimate', 'empiricalSe', 'meanSize', 'shareMeetingTarget', 'coverage'] as const) {
      for (const part of ['value', 'mcse'] as const) {
        const expected = m[key]?.[part] ?? NaN;
        const got = stored[i]?.[key]?.[part] ?? NaN;
        expect(Math.abs(got - expected), `${m.id} ${key}.${part}: ${got} vs ${expected}`).toBeLessThanOrEqual(
          1e-12 * Math.max(1, Math.abs(expected)),
        );
      }
    }
  });
});

test('a long check shows progress and time left; Cancel stops it within 200 ms and keeps the partial result', async ({
  appPage: page,
}) => {
  const { project, first } = await demo();
  await select(page, first.name);
  const panel = page.getByTestId('simulation-panel');
  await setField(page, 'simulation-replicates', '1000000');
  await setField(page, 'simulation-seed', '7');
  await panel.getByTestId('simulation-run').click();

  await expect(panel.getByTestId('simulation-progress-text')).toContainText(/of 1,000,000 replicates · about .+ left/);
  await expect.poll(() => progressDone(page)).toBeGreaterThan(0);
  const seen = await progressDone(page);
  await expect.poll(() => progressDone(page)).toBeGreaterThan(seen);
  // Recorded, not asserted: the worker's throughput in this browser (observations per second).
  const bar = panel.getByTestId('simulation-progress');
  const [done, ms] = [Number(await bar.getAttribute('data-done')), Number(await bar.getAttribute('data-elapsed-ms'))];
  const n = planPopulation(first, project).requiredN ?? 0;
  test.info().annotations.push({ type: 'worker-observations-per-s', description: ((done * n) / (ms / 1000)).toExponential(3) });
  // The screen stays responsive while the worker runs: typing in another field is taken at once.
  await setField(page, 'simulation-seed', '8');
  await setField(page, 'simulation-seed', '7');

  // Click Cancel inside the page and time until the run's progress is gone (the worker has
  // answered with its completed replicates and they are filed).
  const elapsed = await page.evaluate(
    () =>
      new Promise<number>((resolve, reject) => {
        const running = document.querySelector('[data-testid="simulation-running"]');
        const cancel = document.querySelector<HTMLButtonElement>('[data-testid="simulation-cancel"]');
        if (running === null || cancel === null) return reject(new Error('no run in progress'));
        const start = performance.now();
        const observer = new MutationObserver(() => {
          if (!document.contains(running)) {
            observer.disconnect();
            resolve(performance.now() - start);
          }
        });
        observer.observe(document.body, { childList: true, subtree: true });
        cancel.click();
      }),
  );
  test.info().annotations.push({ type: 'cancel-ms', description: elapsed.toFixed(1) });
  expect(elapsed).toBeLessThan(200);

  const verdict = panel.getByTestId('simulation-verdict');
  await expect(verdict).toContainText(/^Partial result: [\d,]+ of 1,000,000 replicates completed \(seed 7\)\./);
  const meta = panel.getByTestId('simulation-meta');
  const kept = Number(/· ([\d,]+) of 1,000,000 replicates/.exec(await meta.innerText())?.[1]?.replace(/,/g, '') ?? 'NaN');
  expect(kept).toBeGreaterThanOrEqual(seen);
  expect(kept).toBeLessThan(1_000_000);
  // Nothing runs on: after a while the kept count is the same and no progress bar is back.
  await page.waitForTimeout(500);
  await expect(panel.getByTestId('simulation-running')).toHaveCount(0);
  await expect(meta).toContainText(`${kept.toLocaleString('en-GB')} of 1,000,000 replicates`);
  await expect(panel.getByTestId('simulation-run')).toBeEnabled();
});

test('checking every population runs them one after another; editing a population marks its check out of date', async ({
  appPage: page,
}) => {
  const { project, first } = await demo();
  await select(page, first.name);
  const panel = page.getByTestId('simulation-panel');
  await setField(page, 'simulation-replicates', '200');
  await panel.getByTestId('simulation-run-all').click();
  await expect(panel.getByTestId('simulation-running')).toHaveCount(0);
  for (const population of project.populations) {
    await select(page, population.name);
    await expect(panel.getByTestId('simulation-verdict')).toContainText('200 simulated studies');
  }
  await expect(panel.getByTestId('simulation-errors')).toHaveCount(0);

  await select(page, first.name);
  await expect(panel.getByTestId('simulation-stale')).toHaveCount(0);
  await setField(page, 'field-anticipated.rSquared', '0.3');
  await expect(panel.getByTestId('simulation-stale')).toContainText(
    'Out of date: the anticipated values or precision targets changed after it ran',
  );
});

test('a replicate count out of range is refused on its field with the allowed range', async ({ appPage: page }) => {
  const panel = page.getByTestId('simulation-panel');
  await setField(page, 'simulation-replicates', '1.5');
  await expect(panel.getByRole('alert')).toContainText('Replicates: 1.5 is not a whole number from 2 to 1,000,000');
  await setField(page, 'simulation-seed', '-3');
  await expect(panel.getByRole('alert').filter({ hasText: 'Seed' })).toContainText('a whole number from 0 to 4,294,967,295');
});
