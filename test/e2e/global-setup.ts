import { build } from 'vite';
import { fileURLToPath } from 'node:url';

/**
 * Builds the renderer once before the tests, so that the end-to-end suite drives the same
 * files `npm run serve` serves.
 */
export default async function setup(): Promise<void> {
  await build({
    configFile: fileURLToPath(new URL('../../app/renderer/vite.config.ts', import.meta.url)),
    logLevel: 'warn',
  });
}
