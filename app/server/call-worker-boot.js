// A thread of the call pool (call-pool.ts). On Node 20 a worker thread does not get the
// parent's tsx loader, so it registers its own before loading the TypeScript worker.
import { register } from 'tsx/esm/api';

register();
await import('./call-worker.ts');
