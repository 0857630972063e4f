// Start-up of the program as a user meets it, each figure a whole process started afresh
// several times: the median wall time, the median CPU time (user + system: what the process
// itself cost, less sensitive to a busy machine) and the largest peak resident memory.
// Targets (issue 12): --help under 0.15 s; analyze of the demo corner under 0.3 s and 80 MiB;
// setup history on the demo shop under 0.3 s; `npm run serve` answering its first page
// under 2 s. Measured, never asserted: `npm run bench` prints them.
import { spawn, spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync } from 'node:fs';
import { request } from 'node:http';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';

const ROOT = fileURLToPath(new URL('../..', import.meta.url));
const BIN = join(ROOT, 'app', 'cli', 'bin.js');
const DEMO_CORNER = join(ROOT, 'assets', 'demo', 'club-coupe-front-left.json');
const RUNS = Number(process.env.RIDELEDGER_BENCH_RUNS ?? 7);
/** GNU time reports a child's peak memory and CPU; without it, only wall time is measured. */
const GNU_TIME = existsSync('/usr/bin/time') ? '/usr/bin/time' : null;

type Sample = { wallS: number; cpuS: number | null; peakMiB: number | null };

const median = (xs: number[]) => {
  const s = [...xs].sort((a, b) => a - b);
  const m = Math.floor(s.length / 2);
  return s.length % 2 ? (s[m] as number) : ((s[m - 1] as number) + (s[m] as number)) / 2;
};

/** One run of `node args…` to its end. */
function processRun(args: string[], scratch: string): Sample {
  const report = join(scratch, 'time.txt');
  const [cmd, cmdArgs] = GNU_TIME
    ? [GNU_TIME, ['-o', report, '-f', '%U %S %M', process.execPath, ...args]]
    : [process.execPath, args];
  const started = performance.now();
  const r = spawnSync(cmd, cmdArgs, { cwd: ROOT, encoding: 'utf8', stdio: ['ignore', 'ignore', 'pipe'] });
  const wallS = (performance.now() - started) / 1000;
  if (r.status !== 0) throw new Error(`node ${args.join(' ')} exited ${r.status}: ${r.stderr}`);
  if (!GNU_TIME) return { wallS, cpuS: null, peakMiB: null };
  const [user, system, peakKiB] = readFileSync(report, 'utf8').trim().split(/\s+/).slice(-3).map(Number);
  return { wallS, cpuS: (user as number) + (system as number), peakMiB: (peakKiB as number) / 1024 };
}

/** GET `url`; resolves with the status once the whole answer has arrived. */
function pageGet(url: string): Promise<number> {
  return new Promise((resolve, reject) => {
    request(url, (res) => {
      res.resume();
      res.on('end', () => resolve(res.statusCode ?? 0));
    })
      .on('error', reject)
      .end();
  });
}

/**
 * CPU seconds of the processes of group `group` so far, with their waited-for children's
 * (Linux's /proc; null elsewhere): what a started server cost, whatever else the machine runs.
 */
function groupCpuSeconds(group: number): number | null {
  if (!existsSync('/proc/self/stat')) return null;
  let ticks = 0;
  for (const pid of readdirSync('/proc').filter((d) => /^\d+$/.test(d))) {
    let stat: string;
    try {
      stat = readFileSync(`/proc/${pid}/stat`, 'utf8');
    } catch {
      continue;
    }
    // Fields after the command name (which may hold spaces): state is field 3, pgrp 5, utime 14 … cstime 17.
    const f = stat.slice(stat.lastIndexOf(')') + 2).split(' ');
    if (Number(f[2]) !== group) continue;
    ticks += Number(f[11]) + Number(f[12]) + Number(f[13]) + Number(f[14]);
  }
  // USER_HZ is 100 on Linux.
  return ticks / 100;
}

/** Starts `command args…`, waits for the address it prints, and times until its first page has arrived. */
async function serveFirstPage(command: string, args: string[], db: string): Promise<Sample> {
  const started = performance.now();
  const child = spawn(command, [...args, '--db', db, '--port', '0'], {
    cwd: ROOT,
    stdio: ['ignore', 'pipe', 'pipe'],
    detached: true,
  });
  try {
    const origin = await new Promise<string>((resolve, reject) => {
      let out = '';
      child.stdout.on('data', (chunk: Buffer) => {
        out += chunk.toString();
        const m = /http:\/\/127\.0\.0\.1:\d+/.exec(out);
        if (m) resolve(m[0]);
      });
      child.once('exit', (code) => reject(new Error(`${command} exited ${code} before it listened`)));
    });
    const status = await pageGet(`${origin}/`);
    if (status !== 200) throw new Error(`the first page answered ${status}`);
    const wallS = (performance.now() - started) / 1000;
    return { wallS, cpuS: child.pid === undefined ? null : groupCpuSeconds(child.pid), peakMiB: null };
  } finally {
    // npm runs the server under a shell: end the whole group this bench started.
    if (child.pid !== undefined) process.kill(-child.pid, 'SIGTERM');
    await new Promise((resolve) => (child.exitCode === null ? child.once('exit', resolve) : resolve(null)));
  }
}

function line(name: string, target: string, samples: Sample[]): void {
  const wall = median(samples.map((s) => s.wallS));
  const cpu = samples.every((s) => s.cpuS !== null) ? median(samples.map((s) => s.cpuS as number)) : null;
  const peak = samples.every((s) => s.peakMiB !== null)
    ? Math.max(...samples.map((s) => s.peakMiB as number))
    : null;
  console.log(
    `${name.padEnd(34)} median ${wall.toFixed(3)} s wall` +
      (cpu === null ? '' : `, ${cpu.toFixed(3)} s CPU`) +
      (peak === null ? '' : `, peak ${peak.toFixed(1)} MiB`) +
      `   (target ${target}; ${samples.length} runs)`,
  );
}

async function startupBench(): Promise<void> {
  // The figures are of the built program: build it first if a source changed.
  const built = spawnSync(
    process.execPath,
    [join(ROOT, 'app', 'node-build.js'), '--if-stale', '--renderer'],
    {
      cwd: ROOT,
      stdio: 'inherit',
    },
  );
  if (built.status !== 0) throw new Error('the build failed');
  const scratch = mkdtempSync(join(tmpdir(), 'rideledger-startup-'));
  try {
    const shop = join(scratch, 'demo.sqlite');
    processRun([BIN, 'demo', '--db', shop], scratch);
    const runs = (args: string[]) => Array.from({ length: RUNS }, () => processRun(args, scratch));
    console.log(`start-up, whole processes (node ${process.version})`);
    line('rideledger --help', '< 0.15 s', runs([BIN, '--help']));
    line('rideledger analyze (demo corner)', '< 0.3 s, < 80 MiB', runs([BIN, 'analyze', DEMO_CORNER]));
    line(
      'rideledger setup history (demo)',
      '< 0.3 s',
      runs([BIN, 'setup', 'history', 'Millbrook coupe #27', '--db', shop]),
    );
    const serveRuns = Math.min(RUNS, 5);
    const npm = process.platform === 'win32' ? 'npm.cmd' : 'npm';
    const serve: Sample[] = [];
    for (let i = 0; i < serveRuns; i++)
      serve.push(await serveFirstPage(npm, ['run', '--silent', 'serve', '--'], shop));
    line('npm run serve → first page', '< 2 s', serve);
    const server: Sample[] = [];
    for (let i = 0; i < serveRuns; i++)
      server.push(await serveFirstPage(process.execPath, [join(ROOT, 'dist', 'node', 'server.js')], shop));
    line('  of which the server → first page', '', server);
  } finally {
    rmSync(scratch, { recursive: true, force: true });
  }
}

await startupBench();
