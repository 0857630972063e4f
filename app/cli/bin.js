#!/usr/bin/env node
// The installed `rideledger` command: TypeScript sources run through tsx's loader.
import { register } from 'tsx/esm/api';

register();
const { cliMain } = await import('./main.ts');
process.exitCode = await cliMain(process.argv.slice(2), {
  stdout: (text) => process.stdout.write(text),
  stderr: (text) => process.stderr.write(text),
});
