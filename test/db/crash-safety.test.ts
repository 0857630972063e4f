import { spawn } from 'node:child_process';
import { existsSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { describe, expect, it } from 'vitest';
import { storeCheck } from '../../db/check';
import { storeClose, storeOpen } from '../../db/store';
import { seededRandom } from '../seeded-random';
import { tempFolder } from './store-fixture';

const BIN = fileURLToPath(new URL('../../app/cli/bin.js', import.meta.url));
const ROWS = 175_000;
/** Four runs in one file, one column pair per rebound setting: 700 000 points in all. */
const SETTINGS = [0, 4, 8, 12];
const KILLS = 20;

function bigBenchFile(path: string): void {
  const lines = [SETTINGS.flatMap((r) => [`velocity (rebound ${r})`, `force (rebound ${r})`]).join(',')];
  for (let i = 0; i < ROWS; i++) {
    const v = -0.5 + (i + 0.5) / ROWS;
    const cells = SETTINGS.flatMap((r) => [
      v.toFixed(7),
      (v > 0 ? 3000 * v : (6000 - 300 * r) * v).toFixed(3),
    ]);
    lines.push(cells.join(','));
  }
  writeFileSync(path, `${lines.join('\n')}\n`);
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

type ChildRun = { exited: 'killed' | 'finished'; importMs: number; code: number | null };

/**
 * Runs `rideledger bench import` in a child process. Once the child has opened the database
 * (its write-ahead log appears: start-up is over and the import begins), it is SIGKILLed
 * after `killAfterMs`, or left to finish when that is undefined.
 */
async function importChild(csv: string, db: string, killAfterMs?: number): Promise<ChildRun> {
  const child = spawn(
    process.execPath,
    [BIN, 'bench', 'import', csv, '--damper', 'CRASH', '--again', '--db', db],
    {
      stdio: ['ignore', 'ignore', 'pipe'],
    },
  );
  let stderr = '';
  child.stderr.on('data', (d: Buffer) => (stderr += d.toString()));
  const exited = new Promise<number | null>((resolve) => child.on('exit', (code) => resolve(code)));
  let done = false;
  void exited.then(() => (done = true));
  while (!done && !existsSync(`${db}-wal`)) await sleep(2);
  const opened = Date.now();
  if (killAfterMs !== undefined && !done) {
    await Promise.race([sleep(killAfterMs), exited]);
    if (!done) child.kill('SIGKILL');
  }
  const code = await exited;
  if (code !== 0 && code !== null) throw new Error(`the import child failed (${code}): ${stderr}`);
  return { exited: code === null ? 'killed' : 'finished', importMs: Date.now() - opened, code };
}

describe('crash safety of the bench import', () => {
  it(`leaves a file's runs wholly there or wholly absent, and the database whole, when killed ${KILLS} times at random`, async () => {
    const dir = tempFolder();
    const csv = join(dir, 'big.csv');
    const db = join(dir, 'shop.sqlite');
    bigBenchFile(csv);
    const full = await importChild(csv, db);
    expect(full.exited).toBe('finished');
    const seed = Date.now() % 100_000;
    const next = seededRandom(seed);
    let runs = SETTINGS.length;
    const outcomes: string[] = [];
    for (let k = 0; k < KILLS; k++) {
      // Uniform over the import, from the moment the database is open to a little past its end.
      const delay = Math.round(next() * 1.1 * full.importMs);
      const r = await importChild(csv, db, delay);
      const store = storeOpen(db);
      const report = storeCheck(store);
      const counts = store.db
        .prepare(
          "SELECT b.point_count FROM bench_run b JOIN damper_unit d ON d.id = b.damper_unit_id WHERE d.label = 'CRASH'",
        )
        .pluck()
        .all() as number[];
      storeClose(store);
      const where = `seed ${seed}, kill ${k + 1} after ${delay} ms (${r.exited})`;
      expect(report.problems, where).toEqual([]);
      expect(
        counts.every((c) => c === ROWS),
        where,
      ).toBe(true);
      // All four runs of the file, or none of them.
      expect([runs, runs + SETTINGS.length], where).toContain(counts.length);
      outcomes.push(counts.length > runs ? 'there' : 'absent');
      runs = counts.length;
    }
    // Most kills land inside the import: its runs are then absent, never some of them.
    const absent = outcomes.filter((o) => o === 'absent').length;
    console.info(
      `crash safety: ${KILLS} kills (seed ${seed}), import ${full.importMs} ms: ${absent} absent, ${KILLS - absent} there`,
    );
    expect(absent).toBeGreaterThan(KILLS / 4);
  }, 150_000);
});
