#!/usr/bin/env node
// The installed `rideledger` command: the built program (dist/node/cli.js, which `npm ci`
// builds). A checkout whose sources changed since the build is rebuilt first (about a second),
// so that the command never runs older code than the sources say.
import { nodeBuildStale } from '../node-build.js';

const stale = nodeBuildStale();
if (stale !== null) {
  const { nodeBuild } = await import('../node-build.js');
  // Said where a person watches; a script reading stderr sees only the command's own lines.
  if (process.stderr.isTTY) process.stderr.write(`rideledger: ${stale}; building it again\n`);
  try {
    await nodeBuild();
  } catch (e) {
    process.stderr.write(
      `rideledger: ${stale}, and building it again failed (esbuild's report is above): ${e instanceof Error ? e.message.split('\n')[0] : String(e)}\n`,
    );
    process.exit(1);
  }
}
const { cliMain } = await import('../../dist/node/cli.js');
process.exitCode = await cliMain(process.argv.slice(2), {
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
});
