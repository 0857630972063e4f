// Entry of a sweep worker thread: the worker is TypeScript, run through tsx's loader as the
// command is. mathjs goes first, outside the loader: through it, its thousand modules take
// about twice as long to load, and a worker's start is the cost of a short sweep.
await import('mathjs');
const { register } = await import('tsx/esm/api');
register();
await import('./valving-worker.ts');
