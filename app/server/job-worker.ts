// One long API call in its own thread, on its own connection to the database (see jobs.ts).
import { parentPort, workerData } from 'node:worker_threads';
import { storeClose, storeOpen } from '../../db/store';
import { apiCall } from '../api/call';
import type { HandlerName } from '../api/contract';
import { jobErrorOf } from './api-failure';
import type { JobMessage } from './jobs';

const { storePath, name, input } = workerData as { storePath: string; name: HandlerName; input: unknown };
const post = (m: JobMessage) => parentPort?.postMessage(m);

post({ kind: 'stage', stage: 'working' });
const store = storeOpen(storePath);
let lastPost = 0;
try {
  const value = await apiCall(name, input, {
    store,
    // Handlers that count their work report it; a few times a second is enough.
    onProgress: (done, total) => {
      const now = Date.now();
      if (now - lastPost < 100 && done < total) return;
      lastPost = now;
      post({ kind: 'stage', stage: `${done} of ${total}`, done, total });
    },
  });
  post({ kind: 'done', value });
} catch (e) {
  post({ kind: 'failed', error: jobErrorOf(e) });
} finally {
  storeClose(store);
}
