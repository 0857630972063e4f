import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { cliMain } from '../../app/cli/main';

/** Runs the command in-process, capturing what it writes. */
export async function runCli(args: string[]): Promise<{ code: number; stdout: string; stderr: string }> {
  let stdout = '';
  let stderr = '';
  const code = await cliMain(args, {
    stdout: (t) => (stdout += t),
    stderr: (t) => (stderr += t),
  });
  return { code, stdout, stderr };
}

export const PROJECT_ROOT = fileURLToPath(new URL('../..', import.meta.url));

let buildChecked = false;

/**
 * Brings dist/node up to date once a test process, so that the command's processes, which run
 * the build, do not each find it stale and rebuild it at once.
 */
function builtProgramEnsure(): void {
  if (buildChecked) return;
  const r = spawnSync(process.execPath, [`${PROJECT_ROOT}app/node-build.js`, '--if-stale'], {
    cwd: PROJECT_ROOT,
    encoding: 'utf8',
  });
  if (r.status !== 0) throw new Error(`building dist/node failed:\n${r.stderr}`);
  buildChecked = true;
}

/** Runs the installed `rideledger` command as a user would, in its own process: the built program (dist/node). */
export function runBin(args: string[], env: Record<string, string> = {}) {
  builtProgramEnsure();
  const r = spawnSync(process.execPath, [`${PROJECT_ROOT}app/cli/bin.js`, ...args], {
    cwd: PROJECT_ROOT,
    encoding: 'utf8',
    env: { ...process.env, ...env },
  });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}
