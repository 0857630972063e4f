import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { afterAll, describe, expect, it } from 'vitest';
import { cliMain } from '../../app/cli/main';

const DEMO = fileURLToPath(new URL('../../assets/demo/club-coupe-front-left.json', import.meta.url));
const dir = mkdtempSync(join(tmpdir(), 'rideledger-simulate-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

async function run(...argv: string[]): Promise<{ code: number; out: string; err: string }> {
  let out = '';
  let err = '';
  const code = await cliMain(argv, { stdout: (t) => (out += t), stderr: (t) => (err += t) });
  return { code, out, err };
}

describe('rideledger simulate', () => {
  it('prints the event figures, its warnings and the caution', async () => {
    const r = await run('simulate', DEMO, '--event', 'bump');
    expect(r.code).toBe(0);
    expect(r.out).toMatch(/Event: the 25\.0 mm bump/);
    expect(r.out).toMatch(/time in the air/);
    expect(r.out).toMatch(/The tyre leaves the road/);
    expect(r.out).toMatch(/Caution: Suspension changes alter/);
  });

  it('writes the time history as CSV with SI column names, and will not overwrite without --force', async () => {
    const path = join(dir, 'curb.csv');
    const first = await run('simulate', DEMO, '--event', 'curb', '--csv', path, '--points', '301');
    expect(first.code).toBe(0);
    const lines = readFileSync(path, 'utf8').trim().split('\n');
    expect(lines[0]).toBe(
      'time_s,road_height_m,body_displacement_m,wheel_displacement_m,travel_m,body_velocity_m_s,wheel_velocity_m_s,body_accel_m_s2,damper_velocity_m_s,tire_load_N,bump_stop_force_N',
    );
    expect(lines.length).toBe(302);
    expect(lines[301]?.startsWith('1.5,')).toBe(true);
    writeFileSync(path, 'kept\n');
    const again = await run('simulate', DEMO, '--event', 'curb', '--csv', path);
    expect(again.code).toBe(2);
    expect(again.err).toMatch(/already exists; add --force/);
    expect(readFileSync(path, 'utf8')).toBe('kept\n');
    expect((await run('simulate', DEMO, '--event', 'curb', '--csv', path, '--force')).code).toBe(0);
    expect(readFileSync(path, 'utf8').split('\n').length).toBe(1503);
  });

  it('runs every event, with sizes from options with units', async () => {
    for (const event of ['step', 'pothole', 'road']) {
      const r = await run(
        'simulate',
        DEMO,
        '--event',
        event,
        '--json',
        '--speed',
        '60 km/h',
        '--height',
        '30mm',
      );
      expect(r.code).toBe(0);
      const json = JSON.parse(r.out) as { event: string; metrics: { duration: number } };
      expect(json.event).toBe(event);
      expect(json.metrics.duration).toBe(1.5);
    }
    const seeded = async (seed: string) =>
      (
        JSON.parse((await run('simulate', DEMO, '--event', 'road', '--json', '--seed', seed)).out) as {
          metrics: { peakBodyAccel: number };
        }
      ).metrics.peakBodyAccel;
    expect(await seeded('4')).toBe(await seeded('4'));
    expect(await seeded('4')).not.toBe(await seeded('5'));
  });

  it('drives a measured road from a CSV of distance and elevation', async () => {
    const profile = join(dir, 'track.csv');
    writeFileSync(profile, 'distance_m,elevation_m\n0,0\n5,0\n5.2,0.03\n5.6,0.03\n5.8,0\n30,0\n');
    const r = await run('simulate', DEMO, '--event', 'road', '--profile', profile, '--json');
    expect(r.code).toBe(0);
    expect(
      (JSON.parse(r.out) as { metrics: { maxCompression: number } }).metrics.maxCompression,
    ).toBeGreaterThan(0.01);
    writeFileSync(profile, '0,0\n2,0\n1,0.01\n');
    const bad = await run('simulate', DEMO, '--event', 'road', '--profile', profile);
    expect(bad.code).toBe(2);
    expect(bad.err).toMatch(/track\.csv\[2\]: distance 1 m is not above/);
  });

  it('answers a bad command line with one line and exit 2', async () => {
    for (const [args, re] of [
      [['--event', 'jump'], /--event: got "jump"; expected one of bump, step, curb, pothole, road/],
      [[], /--event: got nothing/],
      [['--event', 'step', '--height', '3 kg'], /--height: got "3 kg" \(a mass\)/],
      [['--event', 'road', '--class', 'Z'], /--class: got "Z"/],
      [['--event', 'road', '--seed', '1.5'], /--seed: expected a whole number/],
      [['--event', 'bump', '--points', '1', '--csv', '-'], /--points: expected a whole number from 2/],
      [['--event', 'step', '--duration', '0 s'], /--duration: must be above zero/],
    ] as const) {
      const r = await run('simulate', DEMO, ...args);
      expect(r.code).toBe(2);
      expect(r.err.trim().split('\n').length).toBe(1);
      expect(r.err).toMatch(re);
    }
    const noFile = await run('simulate', join(dir, 'missing.json'), '--event', 'bump');
    expect(noFile.err).toMatch(/no such file/);
  });
});

describe('rideledger bench-sim', () => {
  it('prints the benchmark object (runs, seconds, rate, peak, steps)', async () => {
    const r = await run('bench-sim', DEMO, '--runs', '5', '--json');
    expect(r.code).toBe(0);
    const json = JSON.parse(r.out) as Record<string, number>;
    expect(Object.keys(json)).toEqual([
      'runs',
      'seconds',
      'simulationsPerSecond',
      'peakBodyAccel',
      'stepsPerSimulation',
    ]);
    expect(json.runs).toBe(5);
    expect(json.peakBodyAccel).toBeGreaterThan(0);
    expect(json.stepsPerSimulation).toBeGreaterThan(10);
    const human = await run('bench-sim', DEMO, '--runs', '2');
    expect(human.out).toMatch(/at relative tolerance 1e-10/);
    expect((await run('bench-sim', DEMO, '--runs', '0')).err).toMatch(/--runs: expected a whole number/);
  });
});
