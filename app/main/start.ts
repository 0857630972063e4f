// `npm start`: the desktop window, on the bundle `npm run build` wrote. Electron's program is
// fetched the first time the package is required; where it cannot be, say so and what to do
// instead of leaving a stack trace.
import { spawn } from 'node:child_process';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';

const MAIN = fileURLToPath(new URL('../../dist/desktop/main.cjs', import.meta.url));

export type DesktopStartDeps = {
  /** Resolves Electron's program (the `electron` package's export, a path). */
  electronPath: () => string;
  /** Starts the program; resolves with its exit code. */
  run: (program: string, args: string[]) => Promise<number>;
  stderr: (text: string) => void;
};

/** The words for a machine where Electron's program could not be fetched. */
export function electronMissingText(cause: string): string {
  return [
    `rideledger: the desktop window needs Electron's program, which is fetched the first time it starts, and it could not be here: ${cause}`,
    '  The same app runs in a browser on this machine: npm run serve',
    "  Or, once Electron's download host can be reached: delete node_modules/electron, run npm ci, then npm start again.",
    '',
  ].join('\n');
}

/** Opens the desktop window with `args`; exit code 1 and a clear message without Electron. */
export async function desktopStart(args: string[], deps: DesktopStartDeps): Promise<number> {
  let program: string;
  try {
    program = deps.electronPath();
  } catch (e) {
    const cause = (e instanceof Error ? e.message : String(e)).split('\n')[0] ?? '';
    deps.stderr(electronMissingText(cause));
    return 1;
  }
  return deps.run(program, [MAIN, ...args]);
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const require = createRequire(import.meta.url);
  process.exitCode = await desktopStart(process.argv.slice(2), {
    electronPath: () => require('electron') as string,
    run: (program, args) =>
      new Promise((resolve) => {
        const child = spawn(program, args, { stdio: 'inherit' });
        child.on('error', () => resolve(1));
        child.on('exit', (code, signal) => resolve(code ?? (signal ? 1 : 0)));
      }),
    stderr: (text) => process.stderr.write(text),
  });
}
