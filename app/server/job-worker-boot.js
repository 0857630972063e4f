// The thread a job runs in. On Node 20 a worker thread does not get the parent's tsx loader
// (neither from the parent nor from --import in execArgv), so it registers its own before
// loading the TypeScript worker.
import { register } from 'tsx/esm/api';

register();
await import('./job-worker.ts');
