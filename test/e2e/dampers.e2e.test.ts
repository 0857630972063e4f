import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import type { HandlerInput, HandlerName, HandlerOutput } from '../../app/api/contract';
import { benchRunDampingRatios } from '../../app/renderer/damper-model';
import { PROJECT_ROOT, appServe, browserOpen, e2eChromium, type ServedApp } from './browser';
import { demoShopOpen, screenOpen, screenshotSave, tabOrder, unlabelledControls } from './demo-shop';

const chromium = e2eChromium();

const legend = (page: Page) =>
  page.locator('figure[data-plot^="force-velocity"] .recharts-legend-item-text').allInnerTexts();

describe.skipIf(!chromium)('Dampers, in Chromium against the served app', () => {
  let app: ServedApp;
  let browser: Awaited<ReturnType<typeof browserOpen>>;
  let page: Page;

  /** The served API, called as the page calls it, for the figures a test checks the screen against. */
  const api = async <N extends HandlerName>(name: N, input: HandlerInput<N>): Promise<HandlerOutput<N>> => {
    const res = await fetch(`${app.origin}/api/call/${name}`, {
      method: 'POST',
      headers: { 'content-type': 'application/json', 'x-rideledger-token': app.token },
      body: JSON.stringify(input),
    });
    expect(res.status).toBe(200);
    return ((await res.json()) as { value: HandlerOutput<N> }).value;
  };

  beforeAll(async () => {
    app = await appServe();
    browser = await browserOpen(chromium as string);
    page = browser.page;
    await demoShopOpen(page, app.url);
    await screenOpen(page, 'Dampers');
  });

  afterAll(async () => {
    await browser?.close();
    await app?.stop();
  });

  it('lists the damper units and a unit’s runs with their bench details', async () => {
    const units = page.getByRole('complementary', { name: 'Damper units' });
    await expect.poll(() => units.getByRole('button').allInnerTexts()).toContain('Import a bench file…');
    expect(await units.getByRole('button', { name: /MB-DA-1/ }).getAttribute('aria-current')).toBe('true');
    const rows = page.locator('table.runs-table tbody tr');
    await expect.poll(() => rows.count()).toBe(25);
    const first = await rows.first().innerText();
    // The demo sweep: 50 mm stroke at 30 °C, 22 points a setting.
    expect(first).toMatch(/bump 0 rebound 0\s+2025-02-15\s+50\.0 mm\s+—\s+30\.0 °C\s+22/);
  });

  it('draws the measured points and the fitted curve of each run picked, told apart in the legend', async () => {
    await expect.poll(() => legend(page)).toHaveLength(8);
    const names = await legend(page);
    expect(names).toContain('#1 bump 0 rebound 0 measured');
    expect(names).toContain('#1 bump 0 rebound 0 fitted');
    await page.getByLabel('Show run #25 bump 12 rebound 12 on the plot').check();
    await expect.poll(() => legend(page)).toContain('#25 bump 12 rebound 12 fitted');
    expect(await page.locator('figure[data-plot^="force-velocity"]').innerText()).toContain(
      'Shaft velocity, compression + (m/s)',
    );
    // Markers for the measured points: one symbol a point of each run shown (22 a run).
    await expect
      .poll(() => page.locator('figure[data-plot^="force-velocity"] .recharts-scatter-symbol').count())
      .toBe(5 * 22);
    await screenshotSave(page, 'dampers-si');
  });

  it('gives ζ per run at a corner entered by hand, as c·MRd² / 2√(kw·ms)', async () => {
    await page.getByLabel('A corner entered here').check();
    for (const [label, value] of [
      ['Corner mass', '300'],
      ['Unsprung mass', '40'],
      ['Spring rate', '70'],
      ['Spring motion ratio', '0.9'],
    ] as const)
      await page.getByLabel(label, { exact: true }).fill(value);
    const { runs } = await api('benchList', { damper: 'MB-DA-1' });
    const run = runs[0] as (typeof runs)[number];
    const z = benchRunDampingRatios(run.fit, {
      cornerMass: 300,
      unsprungMass: 40,
      springRate: 70_000,
      springMotionRatio: 0.9,
      damperMotionRatio: 0.9,
    });
    const row = page.locator(`table[aria-label="Damping ratio per run"] tr[data-run="${run.id}"]`);
    await expect
      .poll(() => row.locator('td').allInnerTexts())
      .toEqual([
        `${z.bump?.zeta.toFixed(2)} (${z.bump?.class})`,
        z.bumpHighSpeed?.zeta.toFixed(2),
        `${z.rebound?.zeta.toFixed(2)} (${z.rebound?.class})`,
        z.reboundHighSpeed?.zeta.toFixed(2),
      ]);
    await page.getByLabel('Spring rate', { exact: true }).fill('0');
    await expect.poll(() => page.locator('#zeta-springRate-error').innerText()).toMatch(/greater than zero/);
  });

  it('imports a bench trace through the mapping step, and lists the new run', async () => {
    const chooser = page.waitForEvent('filechooser');
    await page.getByRole('button', { name: 'Import a bench file…' }).click();
    await (await chooser).setFiles(join(PROJECT_ROOT, 'assets/demo/bench/mb-sa-1-trace-rebound-4.csv'));
    const panel = page.getByRole('region', { name: 'Import a bench file' });
    await panel.waitFor();
    // The preview: the header and the first rows as the file writes them.
    const preview = panel.getByRole('table', { name: 'First rows of the file' });
    expect(await preview.locator('thead th').allInnerTexts()).toEqual([
      'time [ms]',
      'displacement [mm]',
      'force [N]',
    ]);
    expect(await preview.locator('tbody tr').count()).toBe(8);
    expect(await panel.getByLabel('A raw trace (time, displacement, force)').isChecked()).toBe(true);
    expect(await panel.locator('#bench-unit-displacement').innerText()).toBe('mm (from the header)');
    // A wrong field is named beside it, and the import waits for it.
    await panel.getByLabel('Damper unit (existing or new) *').fill('MB-SA-5');
    await panel.getByLabel('Date').fill('2025-02-30');
    await expect
      .poll(() => panel.locator('#bench-date-error').innerText())
      .toMatch(/not a day of the calendar/);
    expect(await panel.getByRole('button', { name: 'Import', exact: true }).isDisabled()).toBe(true);
    await panel.getByLabel('Date').fill('2025-02-22');
    await panel.getByLabel('Compression is negative (bump values below zero)').check();
    await panel.getByLabel('Clicks').fill('rebound 4');
    await panel.getByLabel('Stroke').fill('50');
    await panel.getByLabel('Temperature').fill('32');
    await expect
      .poll(() => panel.getByTestId('bench-check').innerText())
      .toBe('Reads as 1 run: rebound 4 (48 points, fitted in bump and rebound).');
    await screenshotSave(page, 'dampers-import-mapping');
    await panel.getByRole('button', { name: 'Import', exact: true }).click();
    await expect
      .poll(() => page.getByTestId('bench-imported').innerText(), { timeout: 20_000 })
      .toMatch(/^Stored 1 run for MB-SA-5 \(a new unit\): #\d+ rebound 4\.$/);
    const units = page.getByRole('complementary', { name: 'Damper units' });
    expect(await units.getByRole('button', { name: /MB-SA-5/ }).getAttribute('aria-current')).toBe('true');
    const rows = page.locator('table.runs-table tbody tr');
    await expect.poll(() => rows.count()).toBe(1);
    expect(await rows.first().innerText()).toMatch(
      /rebound 4\s+2025-02-22\s+50\.0 mm\s+—\s+32\.0 °C\s+48 \(from 2500 trace samples\)/,
    );
    await expect
      .poll(() => legend(page))
      .toEqual(expect.arrayContaining([expect.stringMatching(/^#\d+ rebound 4 measured$/)]));
    // Stored as the check said: one run of the new unit.
    const stored = await api('benchList', { damper: 'MB-SA-5' });
    expect(stored.runs.map((r) => [r.clicks, r.pointCount, r.temperature])).toEqual([
      [{ rebound: 4 }, 48, 305.15],
    ]);
    await screenshotSave(page, 'dampers-imported');
  });

  it('cancels a long import of a large trace, and stores nothing', async () => {
    // An invented 2 Hz, 50 mm sine trace sampled at 100 kHz for 5 s: 500 000 rows, about 12 MB —
    // long enough to read that the Cancel button is pressed while it runs.
    const rows = ['time [s],displacement [mm],force [N]'];
    for (let i = 0; i < 500_000; i++) {
      const t = i / 100_000;
      const x = 25 * Math.sin(2 * Math.PI * 2 * t);
      const v = 25 * 2 * Math.PI * 2 * Math.cos(2 * Math.PI * 2 * t);
      rows.push(`${t.toFixed(6)},${x.toFixed(4)},${(3 * v).toFixed(2)}`);
    }
    const dir = mkdtempSync(join(tmpdir(), 'rideledger-bench-'));
    const big = join(dir, 'long-trace.csv');
    writeFileSync(big, rows.join('\n'));
    try {
      const chooser = page.waitForEvent('filechooser');
      await page.getByRole('button', { name: 'Import a bench file…' }).click();
      await (await chooser).setFiles(big);
      const panel = page.getByRole('region', { name: 'Import a bench file' });
      await expect
        .poll(() => panel.getByTestId('bench-check').innerText())
        .toBe('This file is large: it is checked when imported.');
      await panel.getByLabel('Damper unit (existing or new) *').fill('MB-LONG-1');
      await panel.getByRole('button', { name: 'Import', exact: true }).click();
      await panel.getByRole('status').filter({ hasText: 'Importing' }).waitFor();
      await panel.getByRole('button', { name: 'Cancel' }).click();
      await expect
        .poll(() => panel.getByRole('alert').allInnerTexts())
        .toContain('Import cancelled: nothing was stored.');
      const { dampers } = await api('benchList', {});
      expect(dampers.map((d) => d.label)).not.toContain('MB-LONG-1');
      await panel.getByRole('button', { name: 'Close without importing' }).click();
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('saves the force–velocity data as CSV in US units', async () => {
    await page.getByLabel('US', { exact: true }).check();
    const figure = page.locator('figure[data-plot="force-velocity-MB-SA-5"]');
    await expect.poll(() => figure.innerText()).toContain('Shaft velocity, compression + (in/s)');
    const download = page.waitForEvent('download');
    await figure.getByRole('button', { name: /Save data \(CSV\)/ }).click();
    const file = await download;
    expect(file.suggestedFilename()).toBe('force-velocity-MB-SA-5.csv');
    const [header, first] = readFileSync((await file.path()) as string, 'utf8').split('\r\n');
    // The labels hold commas, so the CSV quotes them (RFC 4180).
    expect(header).toMatch(
      /^"#\d+ rebound 4 measured: Shaft velocity, compression \+ \(in\/s\)","#\d+ rebound 4 measured: Damper force, compression \+ \(lbf\)","#\d+ rebound 4 fitted: Shaft velocity/,
    );
    expect(first?.split(',').every((c) => c === '' || Number.isFinite(Number(c)))).toBe(true);
    const png = page.waitForEvent('download');
    await figure.getByRole('button', { name: /Save PNG/ }).click();
    const image = readFileSync((await (await png).path()) as string);
    // The PNG signature (ISO/IEC 15948 [pub]).
    expect([...image.subarray(0, 4)]).toEqual([0x89, 0x50, 0x4e, 0x47]);
    writeFileSync(join(PROJECT_ROOT, 'test-results', 'dampers-saved-plot.png'), image);
    await screenshotSave(page, 'dampers-us');
  });

  it('labels every control and reaches the import and the run choices by keyboard', async () => {
    expect(await unlabelledControls(page)).toEqual([]);
    const order = await tabOrder(page, 30);
    expect(order).toContain('button:Import a bench file…');
    expect(order.some((o) => o.startsWith('input:Show run #'))).toBe(true);
    expect(await page.locator('table.runs-table th[scope="col"]').count()).toBe(9);
  });
});
