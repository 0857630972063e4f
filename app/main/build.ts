// Bundles Electron main and the preload to CommonJS in dist/desktop/: Electron runs plain
// JavaScript, and a sandboxed preload may require nothing but electron itself.
import { build } from 'esbuild';
import { fileURLToPath } from 'node:url';

const root = fileURLToPath(new URL('../..', import.meta.url));
const common = {
  bundle: true,
  platform: 'node' as const,
  format: 'cjs' as const,
  target: 'node22',
  external: ['electron'],
  sourcemap: true,
  logLevel: 'warning' as const,
  absWorkingDir: root,
};
await build({ ...common, entryPoints: ['app/main/index.ts'], outfile: 'dist/desktop/main.cjs' });
await build({ ...common, entryPoints: ['app/preload/preload.ts'], outfile: 'dist/desktop/preload.cjs' });
console.log('built dist/desktop/main.cjs and dist/desktop/preload.cjs');
