// Playwright fixtures: each test gets its own data folders and its own loopback host serving the
// built renderer and the real main-process handlers, reached through the host's stand-in bridge.
import { mkdirSync } from 'node:fs';
import path from 'node:path';
import { test as base, expect, type Page } from '@playwright/test';
import { startLoopbackHost, type LoopbackHost } from '../../../src-main/loopback/server';
import { chromiumPrinter } from '../../../src-main/report/chromium-pdf';

export interface Folders {
  readonly userDataDir: string;
  readonly documentsDir: string;
}

interface Fixtures {
  folders: Folders;
  host: LoopbackHost;
  pageErrors: string[];
  appPage: Page;
}

export const REPO_ROOT = path.resolve(import.meta.dirname, '..', '..', '..');

export const test = base.extend<Fixtures>({
  // Playwright requires an object pattern for a fixture without dependencies.
  // eslint-disable-next-line no-empty-pattern
  folders: async ({}, use, testInfo) => {
    const folders = { userDataDir: testInfo.outputPath('user data'), documentsDir: testInfo.outputPath('Documents ü') };
    mkdirSync(folders.userDataDir, { recursive: true });
    mkdirSync(folders.documentsDir, { recursive: true });
    await use(folders);
  },
  host: async ({ folders }, use) => {
    const host = await startLoopbackHost({
      rendererDir: path.join(REPO_ROOT, 'out', 'renderer'),
      ctx: {
        appName: 'Plumbline',
        appVersion: 'e2e',
        runtime: 'browser',
        demoDir: path.join(REPO_ROOT, 'demo'),
        instanceId: 'e2e-instance',
        printToPdf: chromiumPrinter(),
        ...folders,
      },
    });
    await use(host);
    await host.close();
  },
  pageErrors: async ({ page }, use) => {
    const errors: string[] = [];
    page.on('pageerror', (e) => errors.push(`pageerror: ${e.message}`));
    page.on('console', (m) => {
      if (m.type() === 'error') errors.push(`console.error: ${m.text()}`);
    });
    await use(errors);
    expect(errors, 'no page errors or console errors').toEqual([]);
  },
  appPage: async ({ page, host, pageErrors }, use) => {
    void pageErrors;
    await page.goto(host.url);
    await use(page);
  },
});

export { expect };
