import type { ApiContext } from '../../app/api/context';
import { freshStore } from '../db/store-fixture';

/** A context over a fresh in-memory database with every migration applied. */
export function freshContext(): ApiContext {
  return { store: freshStore() };
}
