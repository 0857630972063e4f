import { mkdirSync } from 'node:fs';
import { join } from 'node:path';
import type { Page } from 'playwright-core';
import { PROJECT_ROOT } from './browser';

/** Where the end-to-end suite leaves its screenshots for review. */
export const SCREENSHOT_DIR = join(PROJECT_ROOT, 'test-results');

/** Opens the app as a first-time user: acknowledges the caution notice and loads the demo shop. */
export async function demoShopOpen(page: Page, url: string): Promise<void> {
  await page.goto(url);
  await page.getByRole('dialog', { name: 'Before you use RideLedger' }).waitFor();
  await page.getByRole('button', { name: 'I understand' }).click();
  await page.getByRole('button', { name: 'Load the demo shop' }).click();
  await page.getByRole('button', { name: /Millbrook coupe #27/ }).waitFor();
}

/** Goes to a screen by the header's navigation. */
export async function screenOpen(page: Page, label: string): Promise<void> {
  await page.getByRole('navigation', { name: 'Screens' }).getByRole('button', { name: label }).click();
}

/** Saves a full-page screenshot as test-results/NAME.png. */
export async function screenshotSave(page: Page, name: string): Promise<void> {
  mkdirSync(SCREENSHOT_DIR, { recursive: true });
  await page.screenshot({ path: join(SCREENSHOT_DIR, `${name}.png`), fullPage: true });
}

/** Form controls that have no accessible label (a <label for>, a wrapping label, or aria-label). */
export async function unlabelledControls(page: Page): Promise<string[]> {
  return page.evaluate(() =>
    [
      ...document.querySelectorAll<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>(
        'input, select, textarea',
      ),
    ]
      .filter((el) => el.type !== 'hidden' && el.offsetParent !== null)
      .filter(
        (el) =>
          (el.labels?.length ?? 0) === 0 &&
          !el.getAttribute('aria-label') &&
          !el.getAttribute('aria-labelledby'),
      )
      .map((el) => el.outerHTML.slice(0, 120)),
  );
}

/**
 * Tabs through the page from the top and returns the accessible names of what got focus, so a
 * test can check that the keyboard reaches a control.
 */
export async function tabOrder(page: Page, presses: number): Promise<string[]> {
  // A click on the title puts the start of keyboard navigation at the top of the page.
  await page.locator('header h1').click();
  const seen: string[] = [];
  for (let i = 0; i < presses; i++) {
    await page.keyboard.press('Tab');
    seen.push(
      await page.evaluate(() => {
        const el = document.activeElement as HTMLElement | null;
        if (!el) return '';
        const labelled = (el as HTMLInputElement).labels?.[0]?.textContent ?? '';
        return `${el.tagName.toLowerCase()}:${el.getAttribute('aria-label') ?? (labelled || el.textContent || '')}`.trim();
      }),
    );
  }
  return seen;
}
