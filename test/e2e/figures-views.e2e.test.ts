import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { PROJECT_ROOT, appServe, browserOpen, e2eChromium, type ServedApp } from './browser';
import { demoShopOpen, screenOpen, screenshotSave } from './demo-shop';

const chromium = e2eChromium();
const COUPE = 'Millbrook coupe #27';

/**
 * The views of issue-sized fixes, in Chromium on the served app: the damping heat map of a
 * damper measured at only some clicks, two revisions with identical figures compared, and a
 * setup sheet switched to US units. Screenshots are left in test-results/ to be looked at.
 */
describe.skipIf(!chromium)('heat map, compare and the US sheet, in Chromium', () => {
  let app: ServedApp;
  let browser: Awaited<ReturnType<typeof browserOpen>>;
  let page: Page;
  const dir = mkdtempSync(join(tmpdir(), 'rideledger-views-'));
  const cli = (...args: string[]) =>
    execFileSync(process.execPath, ['app/cli/bin.js', ...args, '--db', app.dbPath], {
      cwd: PROJECT_ROOT,
      encoding: 'utf8',
    });

  beforeAll(async () => {
    app = await appServe();
    browser = await browserOpen(chromium as string);
    page = browser.page;
    page.setDefaultTimeout(30_000);
    await demoShopOpen(page, app.url);
  });

  afterAll(async () => {
    await browser?.close();
    await app?.stop();
    rmSync(dir, { recursive: true, force: true });
  });

  it(
    'places each cell of a damper measured at bump 6 / rebound 6 and 12 / 12 in its own row and column',
    { timeout: 120_000 },
    async () => {
      // Two runs of the demo damper's sweep, as a unit measured at those two settings only:
      // each file's columns of that setting, with its header (and so its units) as it is.
      const run = (file: string, clicks: string, out: string) => {
        const [, header, ...rows] = readFileSync(join(PROJECT_ROOT, 'assets/demo/bench', file), 'utf8')
          .trim()
          .split(/\r?\n/);
        const names = (header as string).split(',').map((n) => n.trim());
        const keep = names.flatMap((n, i) => (n.endsWith(`(${clicks})`) ? [i] : []));
        const lines = [keep.map((i) => names[i]).join(',')];
        for (const r of rows) lines.push(keep.map((i) => r.trim().split(',')[i]).join(','));
        writeFileSync(join(dir, out), lines.join('\n'));
        cli('bench', 'import', join(dir, out), '--damper', 'SPARSE-1');
      };
      run('mb-da-1-bump-6.csv', 'bump 6 rebound 6', 'six.csv');
      run('mb-da-1-bump-12.csv', 'bump 12 rebound 12', 'twelve.csv');
      await page.reload();
      await screenOpen(page, 'Valving');
      await page.getByLabel('Vehicle').selectOption(COUPE);
      const map = page.locator('[data-testid="heat-map"][data-vehicle="Millbrook coupe #27"]');
      // The vehicle's own damper unit is chosen first; then the sparse one.
      await map.waitFor();
      await page.getByLabel('Damper').selectOption('SPARSE-1');
      await expect
        .poll(() => map.locator('caption').innerText(), { timeout: 30_000 })
        .toMatch(/with SPARSE-1/);
      const cellText = (row: number, col: number) =>
        map.locator(`tbody tr:nth-child(${row}) td:nth-child(${col + 1})`).getAttribute('title');
      // Rows and columns 6 and 12; the measured cells on the diagonal, nothing off it.
      expect(await map.locator('tbody th').allInnerTexts()).toEqual(['6', '12']);
      expect(await cellText(1, 1)).toBe('bump 6, rebound 6');
      expect(await cellText(2, 2)).toBe('bump 12, rebound 12');
      expect(await map.locator('tbody tr:nth-child(1) td:nth-child(3)').innerText()).toBe('—');
      expect(await map.locator('tbody tr:nth-child(2) td:nth-child(2)').innerText()).toBe('—');
      await screenshotSave(page, 'views-sparse-heat-map');
    },
  );

  it(
    'compares two revisions with identical figures: changes shown, the rule stated, both curves seen',
    { timeout: 180_000 },
    async () => {
      // Revision 1 saved again with another note only: the same figures under a new number.
      const file = JSON.parse(cli('setup', 'show', `${COUPE}@1`, '--file')) as Record<string, unknown>;
      file.notes = 'Baseline again, to compare with itself.';
      file.name = 'Baseline again';
      writeFileSync(join(dir, 'again.json'), JSON.stringify(file));
      cli('setup', 'save', join(dir, 'again.json'), '--based-on', '6');
      await page.reload();
      await screenOpen(page, 'Compare');
      const add = page.getByRole('group', { name: 'Add a revision' });
      for (const revision of ['1', '7']) {
        await add.getByLabel('Vehicle').selectOption(COUPE);
        await add.getByLabel('Revision').selectOption(revision);
        await add.getByRole('button', { name: 'Add to the comparison' }).click();
      }
      const table = page.getByTestId('compare-table');
      await table.waitFor({ timeout: 120_000 });
      expect(await page.getByTestId('verdict-rule').innerText()).toMatch(/nearer the middle of its band/);
      expect(await table.locator('tr[data-figure="score"]').innerText()).toMatch(/Score/);
      await expect
        .poll(() => page.getByTestId('curve-note').innerText())
        .toMatch(/give[s]? the baseline’s figures exactly/);
      await page.locator('figure[data-plot^="compare-bump-travel"]').scrollIntoViewIfNeeded();
      await screenshotSave(page, 'views-compare-identical');
    },
  );

  it(
    'writes a sheet switched to US units as a shop does, and back in SI as entered',
    { timeout: 120_000 },
    async () => {
      await screenOpen(page, 'Vehicles');
      await page.getByRole('button', { name: new RegExp(COUPE) }).click();
      await page
        .locator('.timeline li[data-revision="2"]')
        .getByRole('button', { name: 'New revision from this' })
        .click();
      const card = page.getByRole('group', { name: /\(FL\)$/ });
      const spring = card.getByLabel('Spring rate *');
      await spring.waitFor();
      const si = await spring.inputValue();
      await page.getByRole('radio', { name: 'US' }).check();
      // Three significant figures at most below 1000: no 456.816-style conversions.
      await expect.poll(() => spring.inputValue()).toMatch(/^\d{1,4}(\.\d{1,2})?$/);
      const mass = await card.getByLabel('Corner mass *').inputValue();
      expect(mass.replace('.', '').replace(/^0+/, '').length).toBeLessThanOrEqual(4);
      await screenshotSave(page, 'views-us-sheet');
      await page.getByRole('radio', { name: 'SI' }).check();
      await expect.poll(() => spring.inputValue()).toBe(si);
    },
  );
});
