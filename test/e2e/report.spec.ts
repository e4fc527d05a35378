import { readFileSync } from 'node:fs';
import path from 'node:path';
import { expect, test } from './harness/fixtures';

test('the Report dialog saves the PDF report through the browser host and copies the justification', async ({
  appPage: page,
  folders,
  context,
}) => {
  await expect(page.getByTestId('comparison-table')).toBeVisible();
  await page.getByRole('button', { name: 'Report…' }).click();
  const dialog = page.getByTestId('report-dialog');
  await expect(dialog).toBeVisible();

  await context.grantPermissions(['clipboard-read', 'clipboard-write']);
  await dialog.getByRole('button', { name: 'Copy as plain text' }).click();
  await expect(dialog.getByTestId('report-status')).toContainText('copied as plain text');
  const copied = await page.evaluate(() => navigator.clipboard.readText());
  expect(copied).toContain('Sample size justification');
  expect(copied).toContain('source not stated');

  await dialog.getByRole('button', { name: 'Save PDF…' }).click();
  const picker = page.getByTestId('file-picker');
  await expect(picker).toBeVisible();
  await expect(picker.locator('#picker-name')).toHaveValue(/report\.pdf$/);
  await picker.locator('#picker-name').fill('coastal report ü');
  await picker.getByRole('button', { name: 'Save', exact: true }).click();
  const file = path.join(folders.documentsDir, 'coastal report ü.pdf');
  await expect(dialog.getByTestId('report-status')).toContainText(`The report was saved to ${file}.`, { timeout: 60_000 });
  const pdf = readFileSync(file);
  expect(pdf.subarray(0, 5).toString('latin1')).toBe('%PDF-');
  expect(pdf.length).toBeGreaterThan(20_000);
});
