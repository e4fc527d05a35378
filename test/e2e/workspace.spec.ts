import { readFile } from 'node:fs/promises';
import path from 'node:path';
import AxeBuilder from '@axe-core/playwright';
import type { Page } from '@playwright/test';
import { expect, REPO_ROOT, test } from './harness/fixtures';
import { projectSchema, type ContinuousPopulation, type Project } from '../../shared/model/project';
import { enginePlanner } from '../../shared/summary/planner';

async function demoProject(): Promise<Project> {
  return projectSchema.parse(JSON.parse(await readFile(path.join(REPO_ROOT, 'demo', 'consortium-continuous.plumb'), 'utf8')));
}

/** Population names in the order the engine ranks them (required n, largest first). */
function engineRanking(project: Project): { name: string; requiredN: number | null; binding: string | null }[] {
  return project.populations
    .map((p) => ({ ...enginePlanner.plan(p, project), name: p.name }))
    .sort((a, b) => (b.requiredN ?? -1) - (a.requiredN ?? -1))
    .map(({ name, requiredN, binding }) => ({ name, requiredN, binding }));
}

async function tableNames(page: Page): Promise<string[]> {
  return page.getByTestId('comparison-table').locator('tbody tr td[data-column="name"]').allInnerTexts();
}

async function requiredCell(page: Page, name: string): Promise<string> {
  return page
    .getByTestId('comparison-table')
    .locator('tbody tr', { hasText: name })
    .locator('td[data-column="required"]')
    .innerText();
}

test('the demo opens ranked by required n, exactly as the engine ranks it', async ({ appPage: page }) => {
  const project = await demoProject();
  const expected = engineRanking(project);
  await expect(page.getByTestId('comparison-table')).toBeVisible();
  expect((await tableNames(page)).map((n) => n.split('\n')[0]?.trim())).toEqual(expected.map((e) => e.name));
  for (const row of expected) {
    expect(await requiredCell(page, row.name)).toContain((row.requiredN ?? 0).toLocaleString('en-GB'));
  }
  // Different sites are bound by different criteria in the demo.
  expect(new Set(expected.map((e) => e.binding)).size).toBeGreaterThan(1);
});

test('editing a population re-ranks the table and changes its binding criterion; a bad value is marked on the field; undo restores', async ({
  appPage: page,
}) => {
  const project = await demoProject();
  const last = engineRanking(project).at(-1);
  if (last === undefined) throw new Error('the demo has no populations');
  const target = project.populations.find((p): p is ContinuousPopulation => p.name === last.name && p.outcome === 'continuous');
  if (target === undefined) throw new Error('population not found');

  await page.getByTestId('comparison-table').locator('tbody tr', { hasText: last.name }).click();
  await expect(page.locator('#population-name')).toHaveValue(last.name);

  const r2 = page.getByTestId('field-anticipated.rSquared');
  await r2.fill('0.12');
  await r2.press('Enter');
  const edited: Project = {
    ...project,
    populations: project.populations.map((p) =>
      p.id === target.id ? { ...target, anticipated: { ...target.anticipated, rSquared: 0.12 } } : p,
    ),
  };
  const after = engineRanking(edited);
  expect(after[0]?.name).toBe(last.name);
  expect(after[0]?.binding).not.toBe(last.binding);
  await expect.poll(async () => (await tableNames(page))[0]).toContain(last.name);
  await expect(page.getByTestId('dirty-mark')).toBeVisible();
  const bindingLabel =
    enginePlanner
      .plan(
        edited.populations.find((p) => p.id === target.id)!,
        edited,
      )
      .criteria.find((c) => c.id === after[0]?.binding)?.label ?? '';
  expect(await requiredCell(page, last.name)).toContain(bindingLabel);

  await r2.fill('1.5');
  await r2.press('Enter');
  await expect(page.getByRole('alert').filter({ hasText: 'Anticipated R²' })).toContainText(
    'must be greater than 0 and less than 1',
  );
  await expect(r2).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByTestId('comparison-table').locator('tbody tr', { hasText: last.name })).toContainText('input to fix');
  await expect.poll(async () => (await tableNames(page))[0]).toContain(last.name);

  await r2.press('Escape');
  await page.getByRole('button', { name: 'Undo' }).click();
  await expect(r2).toHaveValue(String(target.anticipated.rSquared));
  await expect.poll(async () => (await tableNames(page)).at(-1)).toContain(last.name);
});

test('the model-updating toggle adds and removes the development columns', async ({ appPage: page }) => {
  const table = page.getByTestId('comparison-table');
  await expect(table.locator('thead')).toContainText('Dev. shrinkage');
  await page.getByTestId('updating-toggle').uncheck();
  await expect(table.locator('thead')).not.toContainText('Dev. shrinkage');
  await expect(table.locator('thead')).toContainText('Resid. SD (slope)');
  await page.getByTestId('updating-toggle').check();
  await expect(table.locator('thead')).toContainText('Dev. intercept');
});

test('save, close and reopen a plan through the bridge, in a folder with spaces and non-ASCII characters', async ({
  appPage: page,
  folders,
}) => {
  await page.getByTestId('project-name').fill('Études plan ü');
  await page.getByTestId('project-name').press('Enter');
  await expect(page.getByTestId('plan-title')).toContainText('Études plan ü');
  await page.getByRole('button', { name: 'Save', exact: true }).click();
  const picker = page.getByTestId('file-picker');
  await expect(picker).toBeVisible();
  await picker.locator('#picker-name').fill('my plan ü');
  await picker.getByRole('button', { name: 'Save', exact: true }).click();
  await expect(page.getByTestId('status')).toContainText('Saved');
  await expect(page.getByTestId('dirty-mark')).toHaveCount(0);
  const file = path.join(folders.documentsDir, 'my plan ü.plumb');
  const saved = projectSchema.parse(JSON.parse(await readFile(file, 'utf8')));
  expect(saved.name).toBe('Études plan ü');

  await page.getByRole('button', { name: 'New', exact: true }).click();
  await expect(page.getByTestId('plan-title')).toContainText('Untitled plan');
  await page.getByRole('button', { name: 'Open…' }).click();
  await expect(picker).toBeVisible();
  await picker.getByRole('button', { name: /my plan ü\.plumb/ }).click();
  await picker.getByRole('button', { name: 'Open', exact: true }).click();
  await expect(page.getByTestId('plan-title')).toContainText('Études plan ü');
  await expect(page.getByTestId('comparison-table').locator('tbody tr')).toHaveCount(saved.populations.length);
});

test('an existing cohort shows the precision its fixed n gives and which targets it misses', async ({ appPage: page }) => {
  const project = await demoProject();
  const fixed = project.populations.find((p) => p.recruitment.availableN !== undefined);
  if (fixed === undefined) throw new Error('the demo should have a population with a fixed n');
  await page.getByTestId('comparison-table').locator('tbody tr', { hasText: fixed.name }).click();
  const plan = enginePlanner.plan(fixed, project);
  const panel = page.getByTestId('precision-table');
  await expect(panel.locator('tbody tr')).toHaveCount(plan.precisionAtAvailableN?.length ?? -1);
  const missed = (plan.precisionAtAvailableN ?? []).filter((p) => p.meets === false).length;
  await expect(panel.getByText('✗ missed')).toHaveCount(missed);
});

test('the workspace has no serious or critical accessibility violations (axe-core)', async ({ appPage: page }) => {
  await expect(page.getByTestId('comparison-table')).toBeVisible();
  const results = await new AxeBuilder({ page }).analyze();
  const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(serious.map((v) => `${v.id}: ${v.help} (${v.nodes.length}) ${v.nodes[0]?.target.join(' ') ?? ''}`)).toEqual([]);
});
