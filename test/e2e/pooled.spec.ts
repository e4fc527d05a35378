import { readFile } from 'node:fs/promises';
import AxeBuilder from '@axe-core/playwright';
import path from 'node:path';
import { expect, REPO_ROOT, test } from './harness/fixtures';
import { formatCount } from '../../shared/format/numbers';
import { parsePlanText } from '../../shared/model/plan-file';
import type { Project } from '../../shared/model/project';
import { formatPooledWidth } from '../../shared/summary/pooled-paragraph';
import { baseCase, pooledSummary } from '../../shared/summary/pooled-summary';

async function demoProject(): Promise<Project> {
  const parsed = parsePlanText(await readFile(path.join(REPO_ROOT, 'demo', 'consortium-continuous.plumb'), 'utf8'));
  if (!parsed.ok) throw new Error(parsed.error.message);
  return parsed.project;
}

const SLOPE = { tau: 0.05, tauRange: { low: 0.02, high: 0.1 }, summaryCiWidth: 0.15, predictionIntervalWidth: 0.5 };

test('switching the demo to the pooled aim and entering τ and targets shows the engine’s figures and proposal, with no serious accessibility violation', async ({
  appPage: page,
}) => {
  const panel = page.getByTestId('pooled-panel');
  await expect(panel).toBeVisible();
  await expect(page.getByTestId('pooled-aim-site-specific')).toBeChecked();
  await page.getByTestId('pooled-aim-pooled').check();
  await expect(page.getByTestId('pooled-aim-pooled')).toBeChecked();

  const enter = async (testId: string, text: string): Promise<void> => {
    const field = page.getByTestId(testId);
    await field.fill(text);
    await field.press('Enter');
    await expect(field).toHaveAttribute('aria-invalid', 'false');
  };
  await enter('pooled-slope-tau', '0.05');
  await expect(page.getByTestId('pooled-notes')).toContainText('not pooled until the target summary CI width is given');
  await enter('pooled-slope-summary', '0.15');
  await enter('pooled-slope-prediction', '0.5');
  await enter('pooled-slope-tau-low', '0.02');
  await enter('pooled-slope-tau-high', '0.1');

  const demo = await demoProject();
  const expected = pooledSummary({
    ...demo,
    pooled: { aim: 'pooled', objective: 'fewest-participants', confidence: 0.95, measures: { slope: SLOPE } },
  });
  const slope = expected.measures[0];
  const base = baseCase(slope?.atPlanned ?? null)?.precision;
  if (slope === undefined || base === undefined || expected.proposal === null)
    throw new Error('the engine gave no pooled figures');

  const figures = page.getByTestId('pooled-figures');
  await expect(figures.locator('tbody tr')).toHaveCount(3); // low, base and high τ
  const baseRow = figures.locator('tr[data-measure="slope"][data-tau="base"]');
  await expect(baseRow.locator('td[data-column="summary-width"]')).toHaveText(formatPooledWidth(base.summaryCiWidth));
  await expect(baseRow.locator('td[data-column="prediction-width"]')).toHaveText(formatPooledWidth(base.predictionIntervalWidth));
  await expect(page.getByTestId('pooled-floors-slope')).toContainText(formatPooledWidth(base.summaryFloorWidth));

  expect(expected.proposal.status).toBe('feasible');
  const proposal = page.getByTestId('pooled-proposal');
  await expect(proposal.locator('h3')).toContainText(`${formatCount(expected.proposal.totalN)} participants with an outcome`);
  for (const site of expected.proposal.sites) {
    expect(site.n).not.toBeNull();
    expect(site.n ?? Number.POSITIVE_INFINITY).toBeLessThanOrEqual(site.capacity ?? -1);
    await expect(proposal.locator(`tr[data-site="${site.siteId}"] td[data-column="proposed"]`)).toHaveText(formatCount(site.n));
  }
  await expect(page.getByTestId('pooled-chart').locator('path.recharts-line-curve')).toHaveCount(4);
  await expect(page.getByTestId('pooled-comparison')).toContainText('one more site with');
  await expect(page.getByTestId('pooled-cautions')).toContainText('τ is an anticipated value');
  await page.getByTestId('pooled-paragraph').locator('summary').click();
  await expect(page.getByTestId('pooled-paragraph')).toContainText(`τ = 0.05 (plausible range 0.02 to 0.1)`);

  const results = await new AxeBuilder({ page }).include('[data-testid="pooled-panel"]').analyze();
  const serious = results.violations.filter((v) => v.impact === 'serious' || v.impact === 'critical');
  expect(serious.map((v) => `${v.id}: ${v.help} (${v.nodes.length}) ${v.nodes[0]?.target.join(' ') ?? ''}`)).toEqual([]);
});

test('a bad pooled entry is marked on its field with the allowed range, the rest keeps working, and Undo takes back the aim', async ({
  appPage: page,
}) => {
  await page.getByTestId('pooled-aim-both').check();
  const tau = page.getByTestId('pooled-rSquared-tau');
  await tau.fill('0.7');
  await tau.press('Enter');
  await expect(tau).toHaveAttribute('aria-invalid', 'true');
  await expect(page.getByRole('alert').filter({ hasText: 'Between-site SD τ' })).toContainText(
    'between-site SD τ of the R² must be at least 0 and at most 0.5',
  );
  await expect(page.getByTestId('pooled-aim-both')).toBeChecked();
  await expect(page.getByTestId('comparison-table')).toBeVisible();
  await tau.press('Escape');
  await page.getByRole('button', { name: 'Undo' }).click();
  await expect(page.getByTestId('pooled-aim-site-specific')).toBeChecked();
});
