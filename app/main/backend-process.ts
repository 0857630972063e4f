import { spawn, type ChildProcess } from 'node:child_process';
import { createInterface } from 'node:readline';

/** The line the backend prints once it listens: this prefix, then a JSON object. */
export const READY_PREFIX = 'RIDELEDGER_READY ';

/** What the backend says in its ready line. */
export type BackendReady = { origin: string; port: number; token: string; url: string };

export type BackendProcess = BackendReady & { child: ChildProcess; stop: () => void };

/** Reads a ready line; undefined when the line is anything else (the backend's own log). */
export function backendReadyParse(line: string): BackendReady | undefined {
  if (!line.startsWith(READY_PREFIX)) return undefined;
  let value: unknown;
  try {
    value = JSON.parse(line.slice(READY_PREFIX.length));
  } catch {
    return undefined;
  }
  const v = value as Partial<BackendReady>;
  if (
    typeof v.origin !== 'string' ||
    typeof v.port !== 'number' ||
    typeof v.token !== 'string' ||
    typeof v.url !== 'string'
  ) {
    return undefined;
  }
  // Only a loopback origin on the stated port is trusted, parsed, never pattern-matched.
  const origin = new URL(v.origin);
  if (origin.protocol !== 'http:' || origin.hostname !== '127.0.0.1' || origin.port !== String(v.port))
    return undefined;
  return { origin: v.origin, port: v.port, token: v.token, url: v.url };
}

/**
 * Starts the backend as its own process under a plain Node (the one that built the native
 * SQLite module) and waits for its ready line. The desktop shell never loads SQLite itself.
 */
export function backendSpawn(options: {
  nodePath: string;
  args: string[];
  cwd: string;
  env?: NodeJS.ProcessEnv;
  timeoutMs?: number;
  onLog?: (line: string) => void;
}): Promise<BackendProcess> {
  const child = spawn(options.nodePath, options.args, {
    cwd: options.cwd,
    env: options.env ?? process.env,
    stdio: ['ignore', 'pipe', 'inherit'],
  });
  const stop = () => {
    if (child.exitCode === null && child.signalCode === null) child.kill('SIGTERM');
  };
  return new Promise((done, fail) => {
    const timer = setTimeout(() => {
      stop();
      fail(new Error(`the backend did not report ready within ${options.timeoutMs ?? 30_000} ms`));
    }, options.timeoutMs ?? 30_000);
    let ready = false;
    const lines = createInterface({ input: child.stdout as NodeJS.ReadableStream });
    lines.on('line', (line) => {
      const r = ready ? undefined : backendReadyParse(line);
      if (r) {
        ready = true;
        clearTimeout(timer);
        done({ ...r, child, stop });
      } else options.onLog?.(line);
    });
    child.once('error', (e) => {
      clearTimeout(timer);
      fail(e);
    });
    child.once('exit', (code, signal) => {
      if (!ready) {
        clearTimeout(timer);
        fail(new Error(`the backend exited before it was ready (code ${code}, signal ${signal})`));
      }
    });
  });
}
