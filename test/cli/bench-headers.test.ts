import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import { cli, fileDigest } from './cli-fixture';

const dir = mkdtempSync(join(tmpdir(), 'rideledger-bench-headers-'));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

/** A file of one header style, the same sweep in in/s and lbf; `eol` ends its lines. */
function benchFile(name: string, header: string, eol = '\n'): string {
  const path = join(dir, name);
  writeFileSync(path, [header, '1,50', '2,90', '4,150', '-1,-70', '-2,-120', '-4,-200', ''].join(eol));
  return path;
}

describe('bench import reads the headers bench software writes', () => {
  const styles: [string, string, RegExp][] = [
    ['units in parentheses', 'Velocity (in/s),Force (lbf)', / — +points +6 /],
    ['units joined by underscores', 'velocity_in_s,Force_lbf', / — +points +6 /],
    [
      'units in brackets and clicks after them',
      'Velocity [in/s] B0 R0,Force [lbf] B0 R0',
      / bump 0 rebound 0 +points +6 /,
    ],
    [
      'units in parentheses and clicks in words',
      'Velocity (in/s) bump 3 rebound 6,Force (lbf) bump 3 rebound 6',
      / bump 3 rebound 6 +points +6 /,
    ],
  ];
  styles.forEach(([what, header, row], i) => {
    it(`imports ${what}: ${header}`, async () => {
      const db = join(dir, `styles-${i}.sqlite`);
      const r = await cli(
        'bench',
        'import',
        benchFile(`style-${i}.csv`, header),
        '--damper',
        'HDR-1',
        '--db',
        db,
      );
      expect(r.stderr.replace(/rideledger: made a new database at .*\n/, '')).toBe('');
      expect(r.code).toBe(0);
      expect(r.stdout).toMatch(/^Imported 1 run for damper HDR-1 \(new in the library\)/);
      expect(r.stdout).toMatch(row);
      // 4 in/s and 150 lbf are 0.1016 m/s and 667.2 N [pub: NIST SP 811 App. B, 1 in = 0.0254 m, 1 lbf = 4.4482216152605 N].
      const shown = await cli('bench', 'show', '1', '--points', '--json', '--db', db);
      const points = (JSON.parse(shown.stdout) as { points: [number, number][] }).points;
      expect(points).toHaveLength(6);
      const fastest = points.reduce((p, q) => (q[0] > p[0] ? q : p));
      expect(fastest[0]).toBeCloseTo(0.1016, 12);
      expect(fastest[1]).toBeCloseTo(667.2332, 3);
    });
  });

  it('reads a file whose lines end with CR alone', async () => {
    const db = join(dir, 'cr.sqlite');
    const r = await cli(
      'bench',
      'import',
      benchFile('cr.csv', 'velocity [in/s],force [lbf]', '\r'),
      '--damper',
      'CR-1',
      '--db',
      db,
    );
    expect(r.code).toBe(0);
    expect(r.stdout).toMatch(/^Imported 1 run for damper CR-1/);
  });

  it('names a file of readings at rest as such, and stores nothing', async () => {
    const db = join(dir, 'rest.sqlite');
    await cli('vehicle', 'add', 'Keep', '--db', db);
    const before = fileDigest(db);
    const path = join(dir, 'rest.csv');
    writeFileSync(path, 'velocity [m/s],force [N]\n0,120\n');
    const r = await cli('bench', 'import', path, '--damper', 'REST-1', '--db', db);
    expect(r.code).toBe(2);
    expect(r.stderr).toBe(
      'rideledger bench: rest.csv: its one row is at zero speed: a reading at rest is the gas force, not damping; a curve needs rows at shaft speeds above zero\n',
    );
    expect(fileDigest(db)).toBe(before);
  });
});
