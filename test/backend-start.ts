import { spawn, type ChildProcess } from 'node:child_process';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createInterface } from 'node:readline';
import { fileURLToPath } from 'node:url';
import { backendReadyParse, type BackendReady } from '../app/main/backend-process';

const PROJECT_ROOT = fileURLToPath(new URL('..', import.meta.url));

/** The real backend (app/server/main.ts) in its own process, on a fresh temp database. */
export type BackendChild = BackendReady & {
  child: ChildProcess;
  dbPath: string;
  /** What it wrote on stderr so far. */
  log: () => string;
  /** Still running: no request ended it. */
  alive: () => boolean;
  stop: () => Promise<void>;
};

export async function backendChildStart(): Promise<BackendChild> {
  const dir = mkdtempSync(join(tmpdir(), 'rideledger-backend-'));
  const dbPath = join(dir, 'shop.sqlite');
  const child = spawn(
    process.execPath,
    ['--import', 'tsx', 'app/server/main.ts', '--ready-line', '--db', dbPath],
    { cwd: PROJECT_ROOT, stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, RIDELEDGER_DB: '' } },
  );
  let log = '';
  child.stderr?.on('data', (d: Buffer) => (log += d.toString()));
  const ready = await new Promise<BackendReady>((done, fail) => {
    const timer = setTimeout(() => fail(new Error(`the server did not start: ${log}`)), 60_000);
    const lines = createInterface({ input: child.stdout as NodeJS.ReadableStream });
    lines.on('line', (line) => {
      const r = backendReadyParse(line);
      if (r) {
        clearTimeout(timer);
        done(r);
      }
    });
    child.once('exit', (code) => fail(new Error(`the server exited (${code}): ${log}`)));
  });
  return {
    ...ready,
    child,
    dbPath,
    log: () => log,
    alive: () => child.exitCode === null && child.signalCode === null,
    stop: async () => {
      if (child.exitCode === null && child.signalCode === null) {
        const exited = new Promise((r) => child.once('exit', r));
        child.kill('SIGTERM');
        await exited;
      }
      rmSync(dir, { recursive: true, force: true });
    },
  };
}
