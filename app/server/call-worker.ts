// One thread of the call pool (see call-pool.ts): reads and runs the API calls it is sent, one
// at a time, on its own connection to the database, with the same checks as the server's.
import { parentPort, workerData } from 'node:worker_threads';
import { storeOpen } from '../../db/store';
import { apiCall } from '../api/call';
import { apiFailureOf } from './api-failure';
import type { CallReply, CallRequest } from './call-pool';
import { BAD_JSON } from './http-server';
import { handlerInputCheck } from './policy';

const { storePath } = workerData as { storePath: string };
const store = storeOpen(storePath);
const post = (reply: CallReply) => parentPort?.postMessage(reply);
post({ ready: true });

parentPort?.on('message', (m: CallRequest) => {
  void (async () => {
    let reply: CallReply;
    try {
      let input: unknown;
      try {
        input = m.body === '' ? {} : JSON.parse(m.body);
      } catch {
        post({ id: m.id, ok: false, failure: { status: 400, message: BAD_JSON }, message: BAD_JSON });
        return;
      }
      handlerInputCheck(m.name, input);
      reply = { id: m.id, ok: true, value: await apiCall(m.name, input, { store }) };
    } catch (e) {
      const failure = apiFailureOf(e);
      reply = failure
        ? { id: m.id, ok: false, failure, message: failure.message }
        : { id: m.id, ok: false, message: (e as Error)?.message ?? String(e), stack: (e as Error)?.stack };
    }
    try {
      post(reply);
    } catch (e) {
      // A value that cannot cross back to the server's thread: an internal error, reported.
      post({ id: m.id, ok: false, message: (e as Error).message, stack: (e as Error).stack });
    }
  })();
});
