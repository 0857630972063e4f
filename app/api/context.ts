import type { Store } from '../../db/store';
import type { ValvingPool } from './valving-pool';

/**
 * What a handler runs against: the open database. The command passes the store it opened;
 * the loopback server and Electron IPC pass theirs, so every caller runs the same handlers.
 * Long work (a valving sweep) also takes, when the caller has them: a signal that stops it,
 * a progress callback, and a pool of worker threads kept between calls (else one is started
 * for the call and closed after).
 */
export type ApiContext = {
  store: Store;
  signal?: AbortSignal;
  onProgress?: (done: number, total: number) => void;
  valvingPool?: ValvingPool;
};
