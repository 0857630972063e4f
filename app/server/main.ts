// The backend process: the API contract over HTTP on 127.0.0.1 behind a per-start token, and
// the built renderer. `npm run serve` runs it for a browser; the desktop shell starts it with
// --ready-line and opens its window on the address it reports.
import { existsSync } from 'node:fs';
import { homedir } from 'node:os';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { storeClose, storeOpen } from '../../db/store';
import { storePathResolve } from '../../db/store-path';
import { BUILT_DIR } from '../api/built-output';
import { apiCall } from '../api/call';
import { READY_PREFIX } from '../main/backend-process';
import { apiFailureOf } from './api-failure';
import { CallPool, OFF_THREAD } from './call-pool';
import { serverStart } from './http-server';
import { JobRunner } from './jobs';
import { handlerInputCheck, handlerNameCheck } from './policy';

const USAGE = `npm run serve -- [--db FILE] [--port N]

  Serves RideLedger to a browser on this machine only (127.0.0.1) and prints the address to
  open; the address carries this start's access token. The database is --db FILE, else
  $RIDELEDGER_DB, else the per-user application-data folder — the same one the desktop app and
  the command use. Stop with Ctrl+C.`;

async function serverMain(argv: string[]): Promise<void> {
  const { values } = parseArgs({
    args: argv,
    options: {
      db: { type: 'string' },
      port: { type: 'string' },
      'ready-line': { type: 'boolean' },
      help: { type: 'boolean', short: 'h' },
    },
  });
  if (values.help) {
    console.log(USAGE);
    return;
  }
  const port = values.port === undefined ? 0 : Number(values.port);
  if (!Number.isInteger(port) || port < 0 || port > 65535) {
    console.error(`rideledger serve: --port: got "${values.port}"; expected a port number from 0 to 65535`);
    process.exitCode = 2;
    return;
  }
  const path = storePathResolve(values.db, { platform: process.platform, env: process.env, home: homedir() });
  const store = storeOpen(path);
  if (store.created) console.error(`rideledger serve: made a new database at ${path}`);
  const staticDir = fileURLToPath(new URL('../../dist/renderer/', import.meta.url));
  if (!existsSync(staticDir))
    console.error('rideledger serve: the renderer is not built; run `npm run build:renderer`');
  // The server's own boundary answers every request; anything that still escapes (a stray
  // callback's error) is logged and the backend keeps serving.
  process.on('unhandledRejection', (e: unknown) =>
    console.error(`rideledger serve: unexpected error, still serving: ${(e as Error)?.stack ?? String(e)}`),
  );
  process.on('uncaughtException', (e: Error) =>
    console.error(`rideledger serve: unexpected error, still serving: ${e.stack ?? String(e)}`),
  );
  // Run from the build, the threads run the built workers too, not the sources through tsx.
  const jobs = new JobRunner(path, BUILT_DIR && { workerUrl: new URL('job-worker.js', BUILT_DIR) });
  // Calls whose cost grows with their input run on kept threads, never on the server's.
  const pool = new CallPool(path, BUILT_DIR && { workerUrl: new URL('call-worker.js', BUILT_DIR) });
  const server = await serverStart({
    staticDir,
    port,
    dispatch: (name, input) => {
      const handler = handlerNameCheck(name);
      handlerInputCheck(handler, input);
      // A sweep asked for outright runs on the jobs' kept pool too, off this thread.
      return apiCall(handler, input, { store, valvingPool: jobs.valvingPool });
    },
    // Calls whose cost grows with their input go to the pool as text, read and run there.
    dispatchText: (name, body) => {
      const handler = handlerNameCheck(name);
      // Where its threads could not start, the call runs here rather than not at all.
      return OFF_THREAD.has(handler) && pool.available ? pool.run(handler, body) : undefined;
    },
    describeError: apiFailureOf,
    jobs: {
      start: (name, input) => {
        const handler = handlerNameCheck(name);
        handlerInputCheck(handler, input);
        return jobs.start(handler, input);
      },
      get: (id) => jobs.get(id),
      cancel: (id) => jobs.cancel(id),
    },
    log: (line) => console.error(line),
  });
  if (values['ready-line']) {
    console.log(
      READY_PREFIX +
        JSON.stringify({ origin: server.origin, port: server.port, token: server.token, url: server.url }),
    );
  } else {
    console.log(
      `RideLedger is running. Open this address in a browser on this machine:\n\n  ${server.url}\n\nDatabase: ${path}\nStop with Ctrl+C.`,
    );
  }
  const stop = async () => {
    await Promise.all([jobs.closeAll(), pool.close()]);
    await server.close();
    storeClose(store);
    process.exit(0);
  };
  process.on('SIGINT', () => void stop());
  process.on('SIGTERM', () => void stop());
}

serverMain(process.argv.slice(2)).catch((e: unknown) => {
  console.error(`rideledger serve: ${(e as Error).message}`);
  process.exitCode = (e as { field?: unknown }).field !== undefined ? 2 : 1;
});
