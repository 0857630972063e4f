import type { Store } from '../../db/store';

/**
 * What a handler runs against: the open database. The command passes the store it opened;
 * the loopback server and Electron IPC pass theirs, so every caller runs the same handlers.
 */
export type ApiContext = { store: Store };
