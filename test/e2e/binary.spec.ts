// A binary-outcome plan built in the UI (new plan → binary outcome → populations → values) and the
// binary demo, each checked against the engine: the ranking, the required n, the events and the
// criterion columns; the binary editor passes axe-core's serious and critical rules.
import { readFile } from 'node:fs/promises';
import path from 'node:path';
import AxeBuilder from '@axe-core/playwright';
import type { Page } from '@playwright/test';
import { expect, REPO_ROOT, test } from './harness/fixtures';
import { parsePlanText } from '../../shared/model/plan-file';
import { projectSchema, type Project } from '../../shared/model/project';
import { enginePlanner } from '../../shared/summary/planner';
import { resolveLp } from '../../shared/engine/binary/resolve-lp';
import { formatSignificant } from '../../shared/format/numbers';

const table = (page: Page) => page.getByTestId('comparison-table');
const row = (page: Page, name: string) => table(page).locator('tbody tr', { hasText: name });

/** Name, required n and events of each population, ranked as the table ranks them (required n, largest first). */
function engineRanking(project: Project) {
  return project.populations
    .map((p) => ({ ...enginePlanner.plan(p, project), name: p.name }))
    .sort((a, b) => (b.requiredN ?? -1) - (a.requiredN ?? -1) || a.name.localeCompare(b.name))
    .map(({ name, requiredN, events }) => ({ name, requiredN, events: events ?? null }));
}

async function expectTableMatches(page: Page, project: Project): Promise<void> {
  const expected = engineRanking(project);
  await expect
    .poll(async () =>
      (await table(page).locator('tbody td[data-column="name"]').allInnerTexts()).map((t) => t.split('\n')[0]?.trim()),
    )
    .toEqual(expected.map((e) => e.name));
  for (const e of expected) {
    await expect(row(page, e.name).locator('td[data-column="required"]')).toContainText(
      (e.requiredN ?? 0).toLocaleString('en-GB'),
    );
    await expect(row(page, e.name).locator('td[data-column="events"]')).toContainText(
      (e.events?.whole ?? 0).toLocaleString('en-GB'),
    );
  }
}

async function enter(page: Page, testId: string, value: string): Promise<void> {
  const field = page.getByTestId(testId);
  await field.fill(value);
  await field.press('Enter');
  await expect(field).toHaveAttribute('aria-invalid', 'false');
}

test('a binary plan built in the UI shows the binary criteria and events, ranked as the engine ranks them', async ({
  appPage: page,
}) => {
  await expect(table(page)).toBeVisible();
  await page.getByRole('button', { name: 'New', exact: true }).click();
  await expect(page.getByTestId('plan-title')).toContainText('Untitled plan');

  // The outcome type is chosen once, while the plan is empty.
  await page.getByTestId('project-outcome').selectOption('binary');
  await page.getByRole('button', { name: 'Add population' }).click();
  await expect(page.locator('#population-name')).toHaveValue('Site 1');
  await expect(page.getByTestId('project-outcome')).toHaveText(/binary/);
  await expect(page.locator('select#project-outcome')).toHaveCount(0);

  await enter(page, 'field-anticipated.outcomeProportion', '0.05');
  await enter(page, 'field-anticipated.cStatistic', '0.8');
  // The fitted linear predictor is shown as the engine fits it.
  const lp = resolveLp({ outcomeProportion: 0.05, cStatistic: 0.8 });
  if (lp.kind !== 'fitted') throw new Error('the LP should be fitted');
  await expect(page.getByTestId('lp-note')).toContainText(
    `μ = ${formatSignificant(lp.lp.mean)}, SD σ = ${formatSignificant(lp.lp.sd)}`,
  );

  // The C-statistic must lie strictly between 0.5 and 1: the field says so, and the row is marked.
  const c = page.getByTestId('field-anticipated.cStatistic');
  await c.fill('0.5');
  await c.press('Enter');
  await expect(page.getByRole('alert').filter({ hasText: 'Anticipated C-statistic' })).toContainText(
    'must be greater than 0.5 and less than 1',
  );
  await expect(row(page, 'Site 1')).toContainText('input to fix');
  await enter(page, 'field-anticipated.cStatistic', '0.8');
  await expect(row(page, 'Site 1')).not.toContainText('input to fix');

  await page.getByRole('button', { name: 'Add population' }).click();
  await expect(page.locator('#population-name')).toHaveValue('Site 2');
  await enter(page, 'field-anticipated.outcomeProportion', '0.2');
  await enter(page, 'field-anticipated.cStatistic', '0.72');
  await page.getByRole('button', { name: 'Add a threshold' }).click();
  await expect(page.getByTestId('threshold-0-threshold')).toHaveValue('0.1');
  await page.getByTestId('oe-target').locator('select').selectOption('limits');
  await expect(page.getByTestId('oe-convention-text')).toContainText('(ln upper − ln lower) ÷ 2z');
  await enter(page, 'field-precision.oe.lower', '0.85');

  const project = projectSchema.parse({
    format: 'plumbline-plan',
    schemaVersion: 2,
    name: 'Untitled plan',
    outcome: 'binary',
    populations: [
      { id: 'site-1', name: 'Site 1', outcome: 'binary', anticipated: { outcomeProportion: 0.05, cStatistic: 0.8 } },
      {
        id: 'site-2',
        name: 'Site 2',
        outcome: 'binary',
        anticipated: { outcomeProportion: 0.2, cStatistic: 0.72, thresholds: [{ threshold: 0.1 }] },
        precision: { oe: { lower: 0.85, upper: 1.1 } },
      },
    ],
  });
  const head = table(page).locator('thead');
  for (const header of ['O/E', 'Slope', 'C', 'NB @0.1', 'Events at required n']) await expect(head).toContainText(header);
  await expect(head).not.toContainText('Dev. shrinkage');
  await expectTableMatches(page, project);
});

test('the binary demo opens from the toolbar with the engine ranking and events, and model updating adds the development columns', async ({
  appPage: page,
}) => {
  await expect(table(page)).toBeVisible();
  await page.getByRole('button', { name: 'New from binary demo' }).click();
  const parsed = parsePlanText(await readFile(path.join(REPO_ROOT, 'demo', 'consortium-binary.plumb'), 'utf8'));
  if (!parsed.ok) throw new Error(parsed.error.message);
  const demo = parsed.project;
  await expect(page.getByTestId('plan-title')).toContainText(demo.name);
  await expectTableMatches(page, demo);
  const head = table(page).locator('thead');
  await expect(head).toContainText('Dev. overall risk');
  await page.getByTestId('updating-toggle').uncheck();
  await expect(head).not.toContainText('Dev. overall risk');
  await expectTableMatches(page, { ...demo, updating: { ...demo.updating, enabled: false } });
  // The binary editor (thresholds, O/E convention, LP note) and settings pass axe-core's serious and critical rules.
  await row(page, demo.populations[0]?.name ?? '').click();
  await expect(page.getByTestId('threshold-list')).toBeVisible();
  const results = await new AxeBuilder({ page }).analyze();
  const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(serious.map((v) => `${v.id}: ${v.help} (${v.nodes.length}) ${v.nodes[0]?.target.join(' ') ?? ''}`)).toEqual([]);
});
