import { _electron as electron } from '@playwright/test';
import { expect, REPO_ROOT, test } from './harness/fixtures';
import { electronBinary } from '../../scripts/electron-runtime.mjs';

const runtime = electronBinary();

test('the desktop window opens on the demo plan (needs the Electron runtime)', async () => {
  test.skip(
    !runtime.available,
    `Skipped: ${runtime.reason ?? ''}. The Electron runtime cannot be downloaded on offline hosts; the same UI and handlers are tested in Chromium through the loopback host.`,
  );
  const app = await electron.launch({ executablePath: runtime.binary, args: [REPO_ROOT] });
  const window = await app.firstWindow();
  await expect(window.getByRole('heading', { level: 1, name: 'Plumbline' })).toBeVisible();
  expect(await window.evaluate(() => typeof (globalThis as Record<string, unknown>)['require'])).toBe('undefined');
  await app.close();
});
