// Run by `npm install` / `npm ci` (the "prepare" script, after app/node-build.js): links the
// `rideledger` command into node_modules/.bin, as npm does for a dependency's commands but not
// for the project's own, so that `npx rideledger` and tools that look in node_modules/.bin find it.
import { existsSync, mkdirSync, readlinkSync, rmSync, symlinkSync, writeFileSync } from 'node:fs';
import { dirname, join, relative } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..', '..');
const binDir = join(root, 'node_modules', '.bin');
const target = join(root, 'app', 'cli', 'bin.js');
if (existsSync(join(root, 'node_modules'))) {
  mkdirSync(binDir, { recursive: true });
  if (process.platform === 'win32') {
    writeFileSync(join(binDir, 'rideledger.cmd'), `@node "%~dp0\\${relative(binDir, target)}" %*\r\n`);
  } else {
    const link = join(binDir, 'rideledger');
    const wanted = relative(binDir, target);
    let current = null;
    try {
      current = readlinkSync(link);
    } catch {
      // No link yet.
    }
    // Left alone when right already: a command started meanwhile always finds it.
    if (current !== wanted) {
      rmSync(link, { force: true });
      symlinkSync(wanted, link);
    }
  }
}
