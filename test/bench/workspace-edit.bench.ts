/// <reference lib="dom" />
// How long an edit takes to update the table and charts with 200 populations, measured in Debian's
// Chromium on the built renderer through the loopback host: from the key press that commits a new
// anticipated R² until the table, the charts and the layout have been updated (forced layout, no
// paint). Target: median under 50 ms.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, writeFileSync } from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { chromium } from '@playwright/test';
import { startLoopbackHost } from '../../src-main/loopback/server';
import { projectSchema, type Project } from '../../shared/model/project';

const POPULATIONS = 200;
const EDITS = 31;
const TARGET_MS = 50;

function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = Math.floor(sorted.length / 2);
  return sorted.length % 2 === 1 ? (sorted[middle] ?? NaN) : ((sorted[middle - 1] ?? NaN) + (sorted[middle] ?? NaN)) / 2;
}

/** 200 populations made from the demo's five, with values spread deterministically. */
function bigPlan(root: string): Project {
  const demo = projectSchema.parse(JSON.parse(readFileSync(path.join(root, 'demo', 'consortium-continuous.plumb'), 'utf8')));
  const populations = Array.from({ length: POPULATIONS }, (_, i) => {
    const base = demo.populations[i % demo.populations.length];
    if (base === undefined) throw new Error('the demo has no populations');
    const r2 = 0.2 + ((i * 37) % 60) / 100;
    return {
      ...base,
      id: `site-${i + 1}`,
      name: `Site ${i + 1}`,
      anticipated: { ...base.anticipated, rSquared: r2 },
      ranges: { rSquared: { low: Math.max(0.05, r2 - 0.1), high: Math.min(0.95, r2 + 0.1) } },
    };
  });
  return projectSchema.parse({ ...demo, name: 'Two hundred sites', populations });
}

export async function bench(): Promise<readonly string[]> {
  const root = path.resolve(import.meta.dirname, '..', '..');
  const built = spawnSync(process.execPath, [path.join(root, 'scripts', 'build-if-stale.mjs')], {
    stdio: ['ignore', 'ignore', 'inherit'],
  });
  if (built.status !== 0) throw new Error('the app could not be built');
  const work = mkdtempSync(path.join(os.tmpdir(), 'plumbline-bench-'));
  const planPath = path.join(work, 'two hundred.plumb');
  writeFileSync(planPath, JSON.stringify(bigPlan(root)));
  const host = await startLoopbackHost({
    rendererDir: path.join(root, 'out', 'renderer'),
    ctx: {
      appName: 'Plumbline',
      appVersion: 'bench',
      runtime: 'browser',
      userDataDir: path.join(work, 'user'),
      documentsDir: work,
      demoDir: path.join(root, 'demo'),
      instanceId: 'bench',
    },
  });
  const browser = await chromium.launch({
    executablePath: process.env['CHROMIUM_PATH'] ?? '/usr/bin/chromium',
    args: ['--no-sandbox', '--disable-gpu', '--disable-background-networking', '--disable-component-update', '--no-first-run'],
  });
  try {
    const page = await browser.newPage({ viewport: { width: 1400, height: 950 } });
    await page.goto(host.url);
    await page.getByRole('button', { name: 'Open…' }).click();
    await page.locator('#picker-name').fill(planPath);
    await page.getByTestId('file-picker').getByRole('button', { name: 'Open', exact: true }).click();
    await page
      .getByTestId('comparison-table')
      .locator('tbody tr')
      .nth(POPULATIONS - 1)
      .waitFor();
    await page.getByTestId('comparison-table').locator('tbody tr', { hasText: 'Site 7' }).first().click();

    // The time from the key press that commits the edit until the last DOM change it causes in the
    // workspace (table, charts, editor), each change followed by a forced layout.
    const times = await page.evaluate(async (edits) => {
      const input = document.querySelector<HTMLInputElement>('[data-testid="field-anticipated.rSquared"]');
      const main = document.querySelector('main');
      if (input === null || main === null) throw new Error('no R² field');
      const setValue = (element: HTMLInputElement, value: string): void => {
        Object.getOwnPropertyDescriptor(HTMLInputElement.prototype, 'value')?.set?.call(element, value);
      };
      const out: { table: number; all: number }[] = [];
      let previous = '';
      for (let i = 0; i < edits; i++) {
        setValue(input, i % 2 === 0 ? '0.41' : '0.43');
        input.dispatchEvent(new Event('input', { bubbles: true }));
        await new Promise((r) => setTimeout(r, 50));
        let last = Number.NaN;
        let tableAt = Number.NaN;
        const before = document.querySelector('tr.selected td[data-column="required"]')?.textContent ?? '';
        const observer = new MutationObserver(() => {
          void document.body.offsetHeight;
          last = performance.now();
          if (
            Number.isNaN(tableAt) &&
            (document.querySelector('tr.selected td[data-column="required"]')?.textContent ?? '') !== before
          )
            tableAt = last;
        });
        observer.observe(main, { subtree: true, childList: true, attributes: true, characterData: true });
        const start = performance.now();
        input.dispatchEvent(new KeyboardEvent('keydown', { key: 'Enter', bubbles: true }));
        await new Promise((r) => setTimeout(r, 600));
        observer.disconnect();
        if (Number.isNaN(last)) throw new Error(`edit ${i} changed nothing on the page`);
        const shown = document.querySelector('tr.selected td[data-column="required"]')?.textContent ?? '';
        if (shown === previous) throw new Error(`edit ${i} did not change the selected row's required n (${shown})`);
        previous = shown;
        out.push({ table: tableAt - start, all: last - start });
      }
      return out;
    }, EDITS);
    const warm = times.slice(1);
    const line = (what: string, values: number[]): string => {
      const m = median(values);
      return `${what}: median ${m.toFixed(1)} ms (min ${Math.min(...values).toFixed(1)}, max ${Math.max(...values).toFixed(1)}); target < ${TARGET_MS} ms; median/target = ${(m / TARGET_MS).toFixed(2)}`;
    };
    return [
      `${POPULATIONS} populations, ${warm.length} edits of one anticipated R² in Chromium (forced layout after each DOM change)`,
      line(
        'edit → table updated',
        warm.map((t) => t.table),
      ),
      line(
        'edit → table and charts updated',
        warm.map((t) => t.all),
      ),
    ];
  } finally {
    await browser.close();
    await host.close();
  }
}
