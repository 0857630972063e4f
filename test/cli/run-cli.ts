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

/** Runs the installed `rideledger` command as a user would, in its own process. */
export function runBin(args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(process.execPath, [`${PROJECT_ROOT}app/cli/bin.js`, ...args], {
    cwd: PROJECT_ROOT,
    encoding: 'utf8',
    env: { ...process.env, ...env },
  });
  return { code: r.status, stdout: r.stdout, stderr: r.stderr };
}
