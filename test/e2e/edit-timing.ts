import type { Page } from 'playwright-core';

/**
 * Timing of an edit in the page, by the browser's own clocks: a mark at each `input` event of
 * the edit, the moment a watched table cell shows another text (a MutationObserver, then the next
 * animation frame, so the figure is painted), and every long task (> 50 ms on the page's
 * thread, PerformanceObserver 'longtask') in between.
 */
export type EditTiming = {
  /** Edit to each watched figure on screen (ms), by the watch's name; null when it never changed. */
  shown: Record<string, number | null>;
  /**
   * Long tasks from the edit to the last figure: count, total and longest (ms), and how many
   * of them fell while keys were still being pressed.
   */
  longTasks: { count: number; totalMs: number; longestMs: number; whileTyping: number };
};

/** Installs the long-task observer and the edit mark; call before the page loads. */
export async function editTimingInstall(page: Page): Promise<void> {
  // Run through tsx (npm run bench:page), functions sent to the page carry esbuild's name helper.
  await page.addInitScript({ content: 'window.__name = (f) => f;' });
  await page.addInitScript(() => {
    const w = window as unknown as { __editTiming: { longTasks: { start: number; duration: number }[] } };
    w.__editTiming = { longTasks: [] };
    new PerformanceObserver((list) => {
      for (const e of list.getEntries())
        w.__editTiming.longTasks.push({ start: e.startTime, duration: e.duration });
    }).observe({ type: 'longtask', buffered: true });
    document.addEventListener('input', () => performance.mark('rideledger-edit'), true);
    document.addEventListener('change', () => performance.mark('rideledger-edit'), true);
  });
}

/**
 * Times `edit` (a fill, a selection or typing) until each of `watch`'s cells (CSS selectors)
 * shows a text other than before — or, for "selector ~ words", a text with those words — or
 * `timeoutMs` passes.
 */
export async function editTime(
  page: Page,
  watch: Record<string, string>,
  edit: () => Promise<void>,
  timeoutMs = 15_000,
): Promise<EditTiming> {
  await page.evaluate(
    ({ watch, timeoutMs }) => {
      performance.clearMarks('rideledger-edit');
      const w = window as unknown as {
        __editTiming: { longTasks: { start: number; duration: number }[]; done?: Promise<unknown> };
      };
      const before = Object.fromEntries(
        Object.entries(watch).map(([k, sel]) => [
          k,
          document.querySelector(sel.split(' ~ ')[0] as string)?.textContent ?? null,
        ]),
      );
      const waits = Object.entries(watch).map(
        ([k, sel]) =>
          new Promise<[string, number | null]>((done) => {
            const timer = setTimeout(() => {
              observer.disconnect();
              done([k, null]);
            }, timeoutMs);
            // "selector ~ words": wait for the cell to read those words (the figures of the final
            // value of a typed edit), not merely for a change.
            const [css, words] = sel.split(' ~ ') as [string, string | undefined];
            const check = () => {
              const text = document.querySelector(css)?.textContent ?? null;
              if (text === null || text === before[k] || (words !== undefined && !text.includes(words)))
                return;
              observer.disconnect();
              clearTimeout(timer);
              requestAnimationFrame(() => done([k, performance.now()]));
            };
            const observer = new MutationObserver(check);
            observer.observe(document.body, { subtree: true, childList: true, characterData: true });
          }),
      );
      w.__editTiming.done = Promise.all(waits);
    },
    { watch, timeoutMs },
  );
  await edit();
  return page.evaluate(async () => {
    const w = window as unknown as {
      __editTiming: {
        longTasks: { start: number; duration: number }[];
        done: Promise<[string, number | null][]>;
      };
    };
    const seen = await w.__editTiming.done;
    const marks = performance.getEntriesByName('rideledger-edit', 'mark');
    // Figures are timed from the last keystroke (the edit that completes the value); long tasks
    // are counted from the first, so typing's own are in.
    const first = marks[0]?.startTime ?? 0;
    const start = marks[marks.length - 1]?.startTime ?? 0;
    const end = Math.max(start, ...seen.map(([, t]) => t ?? 0));
    const tasks = w.__editTiming.longTasks.filter((t) => t.start + t.duration >= first && t.start <= end);
    // While keys are still being pressed (first to last input of a typed edit).
    const typing = w.__editTiming.longTasks.filter((t) => t.start + t.duration >= first && t.start <= start);
    return {
      shown: Object.fromEntries(seen.map(([k, t]) => [k, t === null ? null : t - start])),
      longTasks: {
        count: tasks.length,
        totalMs: tasks.reduce((s, t) => s + t.duration, 0),
        longestMs: Math.max(0, ...tasks.map((t) => t.duration)),
        whileTyping: typing.length,
      },
    };
  });
}

/** One line of an edit's timing, for a log. */
export function editTimingText(what: string, t: EditTiming): string {
  const shown = Object.entries(t.shown)
    .map(([k, ms]) => `${k} ${ms === null ? 'never' : `${ms.toFixed(0)} ms`}`)
    .join(', ');
  return `${what}: ${shown}; long tasks ${t.longTasks.count} (${t.longTasks.totalMs.toFixed(0)} ms, longest ${t.longTasks.longestMs.toFixed(0)} ms; ${t.longTasks.whileTyping} while typing)`;
}

const figure = (key: string, corner = 'FL') =>
  `table.analysis-figures tr[data-figure="${key}"] td[data-corner="${corner}"]`;

/** Opens the Ride figures of the demo coupe's revision 2 and waits for its figures. */
export async function rideFiguresOpen(page: Page): Promise<void> {
  await page.getByRole('button', { name: /Millbrook coupe #27/ }).click();
  await page.locator('.timeline li[data-revision="2"]').getByRole('button', { name: 'Ride figures' }).click();
  await page.locator(figure('bumpPeakAccel')).waitFor();
}

/**
 * The edits a user makes on Ride figures, timed in the browser: a new road speed (the linear
 * model's random-road figures), a new bump height (the nonlinear event's), and a road speed
 * typed key by key. The figures are measured and printed; only generous bounds are asserted,
 * since the machine's load sets the times (the goal: under 150 ms for the linear figures,
 * under 1 s for the events, no long task while typing).
 */
export async function rideFiguresEditTimings(
  page: Page,
  log?: (line: string) => void,
): Promise<Record<string, EditTiming>> {
  const speed = page.getByLabel('Road speed');
  const height = page.getByLabel('Bump height');
  const out: Record<string, EditTiming> = {};
  const timed = async (what: string, watch: Record<string, string>, edit: () => Promise<void>) => {
    out[what] = await editTime(page, watch, edit);
    log?.(editTimingText(what, out[what]));
  };
  // Once to warm the page's workers and the JIT: a first analysis is not what a user waits for again.
  await editTime(page, { road: figure('roadBodyAccel') }, () => speed.fill('90'));
  await timed('road speed 90 → 100 km/h', { road: figure('roadBodyAccel') }, () => speed.fill('100'));
  await timed('bump height 25 → 40 mm', { bump: figure('bumpPeakAccel') }, () => height.fill('40'));
  await timed('bump height 40 → 30 mm', { bump: figure('bumpPeakAccel') }, () => height.fill('30'));
  const roadTitle = 'table.analysis-figures tbody[data-group="road"] tr.group-row th ~ at 120.0 km/h';
  await timed('road speed typed key by key: 1, 12, 120 km/h', { road: roadTitle }, async () => {
    await speed.fill('');
    await speed.pressSequentially('120', { delay: 150 });
  });
  return out;
}
