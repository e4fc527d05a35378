import { readFile } from 'node:fs/promises';
import path from 'node:path';
import { expect, REPO_ROOT, test } from './harness/fixtures';
import { CHANNELS } from '../../shared/model/channels';

test('the built renderer loads the demo plan from disk through the bridge and shows it', async ({ appPage: page, host }) => {
  const demo = JSON.parse(await readFile(path.join(REPO_ROOT, 'demo', 'consortium-continuous.plumb'), 'utf8')) as {
    name: string;
    populations: { name: string }[];
  };
  await expect(page.getByRole('heading', { level: 1, name: 'Plumbline' })).toBeVisible();
  await expect(page.getByTestId('plan-title')).toContainText(demo.name);
  for (const population of demo.populations) await expect(page.getByTestId('comparison-table')).toContainText(population.name);
  expect(host.calls).toEqual(expect.arrayContaining(['appInfo', 'loadDemo']));
  await expect(page.locator('p.cautions')).toContainText('Statistical precision only');
});

test('the renderer cannot reach Node, and sees exactly the contract on window.api', async ({ appPage: page }) => {
  await expect(page.getByRole('heading', { level: 1, name: 'Plumbline' })).toBeVisible();
  const probe = await page.evaluate(() => ({
    require: typeof (globalThis as Record<string, unknown>)['require'],
    process: typeof (globalThis as Record<string, unknown>)['process'],
    module: typeof (globalThis as Record<string, unknown>)['module'],
    apiKeys: Object.keys((window as unknown as { api: object }).api).sort(),
    frozen: Object.isFrozen((window as unknown as { api: object }).api),
  }));
  expect(probe).toEqual({
    require: 'undefined',
    process: 'undefined',
    module: 'undefined',
    apiKeys: [...CHANNELS].sort(),
    frozen: true,
  });
});

// This test provokes CSP violations on purpose, so it does not use the fixture that fails on console errors.
test('the CSP blocks a remote origin and inline script in the page', async ({ page, host }) => {
  await page.goto(host.url);
  await expect(page.getByRole('heading', { level: 1, name: 'Plumbline' })).toBeVisible();
  const outcome = await page.evaluate(async () => {
    const violations: string[] = [];
    document.addEventListener('securitypolicyviolation', (e) => violations.push(e.effectiveDirective));
    let fetched = 'allowed';
    try {
      await fetch('http://198.51.100.7/ping');
    } catch {
      fetched = 'blocked';
    }
    const script = document.createElement('script');
    script.textContent = 'document.body.dataset.injected = "ran"';
    document.head.append(script);
    await new Promise((r) => setTimeout(r, 100));
    return { fetched, injected: document.body.dataset['injected'] ?? 'blocked', violations };
  });
  expect(outcome.fetched).toBe('blocked');
  expect(outcome.injected).toBe('blocked');
  expect(outcome.violations).toEqual(expect.arrayContaining(['connect-src', 'script-src-elem']));
});

test('the loopback host refuses requests without the token, with a foreign Host header, or breaking a schema', async ({
  host,
  request,
}) => {
  const noToken = await request.get(`${host.origin}/index.html`);
  expect(noToken.status()).toBe(403);
  const wrongHost = await request.get(`${host.origin}/`, { headers: { host: 'evil.example:80' } });
  expect(wrongHost.status()).toBe(421);
  const ipcWithoutToken = await request.post(`${host.origin}/__ipc/appInfo`, { data: {} });
  expect(ipcWithoutToken.status()).toBe(403);
  const cookie = `plumbline-token=${host.token}`;
  const headers = { cookie, 'x-plumbline-token': host.token, 'content-type': 'application/json' };
  const broken = await request.post(`${host.origin}/__ipc/loadDemo`, { headers, data: { which: 'nonsense' } });
  expect(broken.status()).toBe(200);
  expect(await broken.json()).toMatchObject({ ok: false, error: { code: 'invalid-request' } });
  const unknown = await request.post(`${host.origin}/__ipc/readAnyFile`, { headers, data: { path: '/etc/passwd' } });
  expect(await unknown.json()).toMatchObject({ ok: false, error: { code: 'unknown-channel' } });
});
