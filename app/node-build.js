// The program Node runs, built with esbuild from the TypeScript sources into dist/node/: the
// `rideledger` command (cli.js), the backend of `npm run serve` and of the desktop window
// (server.js), the thread of a long job (job-worker.js), the threads of heavy calls (call-worker.js) and the valving sweep's worker
// (valving-worker.cjs). `npm ci` builds it (the "prepare" script); `node app/node-build.js`
// builds it again, `--if-stale` only when a source changed since, `--renderer` also the page
// (dist/renderer/) when its sources changed.
//
// Plain JavaScript, so that the command can check its build without a TypeScript loader: the
// check (nodeBuildStale) reads dist/node/build.json, which lists every source file the build
// read with its size and modification time; any difference means the build is stale.
import {
  existsSync,
  mkdirSync,
  readdirSync,
  readFileSync,
  renameSync,
  rmSync,
  statSync,
  writeFileSync,
} from 'node:fs';
import { dirname, join, relative, sep } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..');
const OUT_DIR = join(ROOT, 'dist', 'node');
const RECORD = join(OUT_DIR, 'build.json');
/** Files that shape the build without being bundled: the build's own settings and the lock. */
const BUILD_FILES = ['app/node-build.js', 'package.json', 'package-lock.json'];
/** Stays a plain import: a native module, and the bundler itself (the sweep's fallback uses it). */
const EXTERNAL = ['better-sqlite3', 'esbuild'];
/** The module the build swaps for one that says where the built program is (see built-output.ts). */
const BUILT_OUTPUT_MODULE = join(ROOT, 'app', 'api', 'built-output.ts');
/** What the page is built from, and the file the page's build writes last. */
const RENDERER_SOURCES = ['app/renderer', 'app/api', 'core', 'package.json', 'package-lock.json'];
const RENDERER_STAMP = join(ROOT, 'dist', 'renderer', 'index.html');

/** Size and modification time of a file, as the record keeps them; null when it is missing. */
function fileMark(path) {
  try {
    const s = statSync(path);
    return `${s.size}:${Math.floor(s.mtimeMs)}`;
  } catch {
    return null;
  }
}

/**
 * Why the build in dist/node cannot be run as it is (no build, or the first source that
 * changed since it was made), or null when it is up to date. A few milliseconds: one stat a source.
 * `recordPath`: the build's record to judge (a test judges a copy, never touching a source).
 */
export function nodeBuildStale(recordPath = RECORD) {
  let record;
  try {
    record = JSON.parse(readFileSync(recordPath, 'utf8'));
  } catch {
    return 'there is no build in dist/node';
  }
  for (const [file, mark] of Object.entries(record.inputs ?? {})) {
    if (fileMark(join(ROOT, file)) !== mark) return `${file} changed since the last build`;
  }
  return null;
}

/**
 * Rewrites `import.meta.url` of a bundled source to that source's own address, so files found
 * beside the sources (the migrations, the demo shop, the built page) are found from the build too.
 */
function sourceUrlPlugin() {
  return {
    name: 'source-url',
    setup(build) {
      build.onLoad({ filter: /\.(ts|tsx|js)$/ }, (args) => {
        if (args.path.split(sep).includes('node_modules')) return undefined;
        const loader = args.path.endsWith('.tsx') ? 'tsx' : args.path.endsWith('.ts') ? 'ts' : 'js';
        if (args.path === BUILT_OUTPUT_MODULE) {
          // The build's own folder: where the built workers are.
          return {
            loader,
            contents: "export const BUILT_DIR: URL | undefined = new URL('./', import.meta.url);",
          };
        }
        const text = readFileSync(args.path, 'utf8');
        if (!text.includes('import.meta.url')) return { loader, contents: text };
        const fromOut = relative(OUT_DIR, args.path).split(sep).join('/');
        const contents = text.replaceAll(
          'import.meta.url',
          `new URL(${JSON.stringify(fromOut)}, import.meta.url).href`,
        );
        return { loader, contents };
      });
    },
  };
}

/** Writes a file whole or not at all: a command starting meanwhile reads the old one or the new. */
function fileWriteAtomic(path, contents) {
  mkdirSync(dirname(path), { recursive: true });
  const temp = `${path}.${process.pid}.tmp`;
  writeFileSync(temp, contents);
  renameSync(temp, path);
}

/** A command started before a rebuild may still load the chunks of its own build, for a while. */
const CHUNK_KEEP_MS = 10 * 60 * 1000;

/** Removes chunks of earlier builds that no command started in the last minutes can still load. */
function chunksOldRemove(current) {
  const now = Date.now();
  for (const name of readdirSync(OUT_DIR)) {
    const path = join(OUT_DIR, name);
    if (!/^chunk-.*\.js$/.test(name) || current.has(path)) continue;
    const s = statSync(path, { throwIfNoEntry: false });
    if (s && now - s.mtimeMs > CHUNK_KEEP_MS) rmSync(path, { force: true });
  }
}

/**
 * Builds dist/node from the sources and records what it read. `clean` removes files of an
 * earlier build first (not done when a command rebuilds on demand: another one may be running).
 */
export async function nodeBuild({ clean = false } = {}) {
  const { build } = await import('esbuild');
  const started = Date.now();
  const common = {
    absWorkingDir: ROOT,
    bundle: true,
    platform: 'node',
    target: 'node20',
    external: EXTERNAL,
    plugins: [sourceUrlPlugin()],
    metafile: true,
    write: false,
    logLevel: 'warning',
    legalComments: 'none',
  };
  const program = await build({
    ...common,
    entryPoints: {
      cli: 'app/cli/main.ts',
      server: 'app/server/main.ts',
      'job-worker': 'app/server/job-worker.ts',
      'call-worker': 'app/server/call-worker.ts',
    },
    outdir: OUT_DIR,
    format: 'esm',
    splitting: true,
    chunkNames: 'chunk-[hash]',
    // Bundled CommonJS packages may require Node's own modules.
    banner: {
      js: "import { createRequire as __createRequire } from 'node:module'; const require = __createRequire(import.meta.url);",
    },
  });
  // Evaluated as a script by the sweep's worker threads (valving-pool.ts), so CommonJS and whole.
  const worker = await build({
    ...common,
    entryPoints: ['app/api/valving-worker.ts'],
    outfile: join(OUT_DIR, 'valving-worker.cjs'),
    format: 'cjs',
  });
  if (clean) rmSync(OUT_DIR, { recursive: true, force: true });
  const outputs = [...program.outputFiles, ...worker.outputFiles];
  for (const f of outputs) fileWriteAtomic(f.path, f.contents);
  chunksOldRemove(new Set(outputs.map((f) => f.path)));
  const sources = new Set(BUILD_FILES);
  for (const r of [program, worker])
    for (const input of Object.keys(r.metafile.inputs))
      if (!input.split('/').includes('node_modules') && !input.includes(':')) sources.add(input);
  const inputs = {};
  for (const file of [...sources].sort()) {
    // A source saved while the build read it may be in the build as it was before: left
    // unmarked, so that the next start builds again.
    const changedMeanwhile = (statSync(join(ROOT, file), { throwIfNoEntry: false })?.mtimeMs ?? 0) >= started;
    inputs[file] = changedMeanwhile ? 'changed during the build' : fileMark(join(ROOT, file));
  }
  // What each output holds, for esbuild's bundle analyzer when a start-up grows.
  fileWriteAtomic(join(OUT_DIR, 'meta.json'), JSON.stringify(program.metafile));
  fileWriteAtomic(RECORD, `${JSON.stringify({ inputs }, null, 1)}\n`);
}

/** Newest modification time under `path` (folders too: adding or removing a file changes them). */
function newestMtime(path) {
  const s = statSync(path);
  let newest = s.mtimeMs;
  if (s.isDirectory()) {
    for (const name of readdirSync(path)) newest = Math.max(newest, newestMtime(join(path, name)));
  }
  return newest;
}

/** True when dist/renderer is older than a file the page is built from. */
export function rendererBuildStale() {
  if (!existsSync(RENDERER_STAMP)) return true;
  const built = statSync(RENDERER_STAMP).mtimeMs;
  return RENDERER_SOURCES.some((p) => newestMtime(join(ROOT, p)) > built);
}

async function nodeBuildMain(argv) {
  const ifStale = argv.includes('--if-stale');
  const started = performance.now();
  if (!ifStale || nodeBuildStale() !== null) {
    await nodeBuild({ clean: !ifStale });
    console.error(`built dist/node in ${((performance.now() - started) / 1000).toFixed(2)} s`);
  }
  if (argv.includes('--renderer') && (!ifStale || rendererBuildStale())) {
    const { spawnSync } = await import('node:child_process');
    const vite = join(ROOT, 'node_modules', 'vite', 'bin', 'vite.js');
    const r = spawnSync(process.execPath, [vite, 'build', '--config', 'app/renderer/vite.config.ts'], {
      cwd: ROOT,
      stdio: 'inherit',
    });
    if (r.status !== 0) process.exitCode = r.status ?? 1;
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  nodeBuildMain(process.argv.slice(2)).catch((e) => {
    console.error(`node-build: ${e instanceof Error ? e.message : String(e)}`);
    process.exitCode = 1;
  });
}
