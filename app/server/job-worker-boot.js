// A job's thread starts here: tsx's loader is registered in the thread, then the TypeScript
// worker runs (a worker thread does not inherit the loader of the process that starts it).
import { register } from 'tsx/esm/api';

register();
await import('./job-worker.ts');
