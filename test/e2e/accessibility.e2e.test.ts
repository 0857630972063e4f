import type { Page } from 'playwright-core';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { appServe, browserOpen, e2eChromium, type ServedApp } from './browser';

const chromium = e2eChromium();

/** Controls on the page that have no accessible name (no label, aria-label or aria-labelledby). */
async function unlabelled(page: Page): Promise<string[]> {
  return page.evaluate(() => {
    const out: string[] = [];
    for (const el of document.querySelectorAll<HTMLElement>('input, select, textarea')) {
      if ((el as HTMLInputElement).type === 'hidden' || el.offsetParent === null) continue;
      const labelled =
        ((el as HTMLInputElement).labels?.length ?? 0) > 0 ||
        (el.getAttribute('aria-label') ?? '').trim() !== '' ||
        (el.getAttribute('aria-labelledby') ?? '').trim() !== '';
      if (!labelled) out.push(el.outerHTML.slice(0, 120));
    }
    for (const el of document.querySelectorAll<HTMLElement>('button')) {
      if (el.offsetParent === null) continue;
      if ((el.textContent ?? '').trim() === '' && (el.getAttribute('aria-label') ?? '').trim() === '')
        out.push(el.outerHTML.slice(0, 120));
    }
    return out;
  });
}

/** Tabs through the page and reports the visible, enabled controls that Tab never reached. */
async function unreachable(page: Page): Promise<string[]> {
  await page.evaluate(() => {
    let n = 0;
    for (const el of document.querySelectorAll<HTMLElement>(
      'button, input, select, textarea, a[href], summary',
    )) {
      el.dataset.a11yId = String(n++);
    }
    // Start at the first control, so that one pass of Tab forward covers the page.
    document.querySelector<HTMLElement>('[data-a11y-id="0"]')?.focus();
  });
  // Charts and other widgets add Tab stops of their own; go round the whole page once, from
  // wherever the browser's focus starting point is, and then some.
  const stops = await page.evaluate(
    () =>
      document.querySelectorAll(
        'button, input, select, textarea, a[href], summary, [tabindex]:not([tabindex="-1"])',
      ).length,
  );
  const reached = new Set<string>(['0']);
  for (let i = 0; i < 2 * stops + 10; i++) {
    await page.keyboard.press('Tab');
    const id = await page.evaluate(
      () => (document.activeElement as HTMLElement | null)?.dataset.a11yId ?? '',
    );
    if (id) reached.add(id);
  }
  return page.evaluate(
    (seen) => {
      const missed: string[] = [];
      for (const el of document.querySelectorAll<HTMLElement>('[data-a11y-id]')) {
        const visible = el.offsetParent !== null;
        const disabled = (el as HTMLButtonElement).disabled === true;
        // Radio groups take one Tab stop for the group, as browsers do.
        const radioSibling = el instanceof HTMLInputElement && el.type === 'radio';
        if (visible && !disabled && !radioSibling && !seen.includes(el.dataset.a11yId ?? ''))
          missed.push(el.outerHTML.slice(0, 120));
      }
      return missed;
    },
    [...reached],
  );
}

describe.skipIf(!chromium)('accessibility basics in a real Chromium', () => {
  let app: ServedApp;
  let browser: Awaited<ReturnType<typeof browserOpen>>;
  let page: Page;

  beforeAll(async () => {
    app = await appServe();
    browser = await browserOpen(chromium as string);
    page = browser.page;
    page.setDefaultTimeout(20_000); // generous: the suite shares two cores with the unit tests
    await page.goto(app.url);
  });
  afterAll(async () => {
    await browser?.close();
    await app?.stop();
  });

  it('can acknowledge the notice and load the demo from the keyboard alone', async () => {
    await page.getByRole('dialog', { name: 'Before you use RideLedger' }).waitFor();
    // Focus starts inside the dialog, on its button.
    await page.keyboard.press('Enter');
    await page.getByRole('dialog', { name: 'Start with the demo shop?' }).waitFor();
    await page.keyboard.press('Enter');
    await page.getByRole('button', { name: /Millbrook coupe #27/ }).waitFor();
  });

  const screens = ['Vehicles', 'Setup sheet', 'Ride figures', 'Compare', 'Dampers', 'Valving'];
  it.each(screens)('labels every input and reaches every control by Tab on "%s"', async (screen) => {
    if (screen === 'Vehicles') {
      await page
        .getByRole('navigation', { name: 'Screens' })
        .getByRole('button', { name: 'Vehicles' })
        .click();
      await page.getByRole('button', { name: /Millbrook coupe #27/ }).click();
      await page.getByRole('list', { name: 'Revisions, oldest first' }).waitFor();
    } else if (screen === 'Setup sheet') {
      await page.getByRole('button', { name: /New revision from #6/ }).click();
      await page.getByRole('group', { name: /\(RR\)$/ }).waitFor();
    } else {
      await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: screen }).click();
      await page.waitForTimeout(300);
    }
    expect(await unlabelled(page)).toEqual([]);
    expect(await unreachable(page)).toEqual([]);
  });
});
