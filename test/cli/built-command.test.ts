import { existsSync, mkdtempSync, readFileSync, rmSync, statSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { nodeBuildStale } from '../../app/node-build.js';
import { PROJECT_ROOT, runBin, runCli } from './run-cli';

const DEMO = 'assets/demo/club-coupe-front-left.json';

describe('the built command (dist/node)', () => {
  it('prints the same analyze --json as the sources run in-process, on the demo corner', async () => {
    const built = runBin(['analyze', DEMO, '--json']);
    const sources = await runCli(['analyze', DEMO, '--json']);
    expect(built.code).toBe(0);
    expect(sources.code).toBe(0);
    // The process ran the build, and the build is of these sources.
    expect(existsSync(`${PROJECT_ROOT}dist/node/cli.js`)).toBe(true);
    expect(nodeBuildStale()).toBeNull();
    expect(JSON.parse(built.stdout)).toEqual(JSON.parse(sources.stdout));
    // Same code, same arithmetic: the very same text, to the last digit.
    expect(built.stdout).toBe(sources.stdout);
    expect(built.stderr).toBe('');
  });

  it('prints the same readable report in US units as the sources', async () => {
    const built = runBin(['analyze', DEMO, '--units', 'us']);
    const sources = await runCli(['analyze', DEMO, '--units', 'us']);
    expect(built.code).toBe(0);
    expect(built.stdout).toBe(sources.stdout);
  });

  it('finds its build stale when a source is saved after it', () => {
    runBin(['--help']);
    // Judged on a copy of the build's record, so that no source is touched while other test
    // files run the command beside this one.
    const built = JSON.parse(readFileSync(`${PROJECT_ROOT}dist/node/build.json`, 'utf8')) as {
      inputs: Record<string, string>;
    };
    const dir = mkdtempSync(join(tmpdir(), 'rideledger-build-record-'));
    const copy = join(dir, 'build.json');
    try {
      const source = statSync(`${PROJECT_ROOT}core/units/units.ts`);
      built.inputs['core/units/units.ts'] = `${source.size}:${Math.floor(source.mtimeMs)}`;
      writeFileSync(copy, JSON.stringify(built));
      expect(nodeBuildStale(copy)).toBeNull();
      // As if the build were made before an editor's save: an older modification time recorded.
      built.inputs['core/units/units.ts'] = `${source.size}:${Math.floor(source.mtimeMs) - 2000}`;
      writeFileSync(copy, JSON.stringify(built));
      expect(nodeBuildStale(copy)).toBe('core/units/units.ts changed since the last build');
    } finally {
      rmSync(dir, { recursive: true, force: true });
    }
  });

  it('is rebuilt before it runs when its build is older than a source', async () => {
    runBin(['--help']);
    const record = `${PROJECT_ROOT}dist/node/build.json`;
    const built = JSON.parse(readFileSync(record, 'utf8')) as { inputs: Record<string, string> };
    // The record of a build made before core/units/units.ts was last saved.
    built.inputs['core/units/units.ts'] = '0:0';
    writeFileSync(record, JSON.stringify(built));
    expect(nodeBuildStale()).toBe('core/units/units.ts changed since the last build');
    const r = runBin(['analyze', DEMO, '--json']);
    expect(r.code).toBe(0);
    expect(r.stderr).toBe('');
    expect(r.stdout).toBe((await runCli(['analyze', DEMO, '--json'])).stdout);
    expect(nodeBuildStale()).toBeNull();
  }, 60_000);
});
