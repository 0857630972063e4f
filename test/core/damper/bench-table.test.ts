import { describe, expect, it } from 'vitest';
import { benchHeaderCellParse, benchTableRead } from '../../../core/damper/bench-table';
import { inputErrorOf } from '../../input-error-fixture';

const problem = (fn: () => unknown): string => inputErrorOf(fn).message;

// NIST SP 811 (2008) Appendix B [pub]: 1 in = 0.0254 m and 1 lbf = 4.4482216152605 N, exactly.
const INCH = 0.0254;
const LBF = 4.4482216152605;

describe('benchHeaderCellParse', () => {
  it('splits the name, the unit in brackets and the clicker setting in parentheses', () => {
    expect(benchHeaderCellParse('Velocity [in/s] (bump 3 rebound 6)')).toEqual({
      text: 'Velocity [in/s] (bump 3 rebound 6)',
      name: 'velocity',
      unit: 'in/s',
      setting: 'bump 3 rebound 6',
    });
    expect(benchHeaderCellParse('force')).toEqual({ text: 'force', name: 'force' });
  });
});

describe('benchHeaderCellParse, in the forms bench software writes', () => {
  const forms: [string, Record<string, string>][] = [
    ['Velocity (in/s)', { name: 'velocity', unit: 'in/s' }],
    ['Force (lbf)', { name: 'force', unit: 'lbf' }],
    ['Velocity [in/s] B0 R0', { name: 'velocity', unit: 'in/s', setting: 'bump 0 rebound 0' }],
    ['velocity_in_s', { name: 'velocity', unit: 'in/s' }],
    ['Force_lbf', { name: 'force', unit: 'lbf' }],
    ['velocity_m_s', { name: 'velocity', unit: 'm/s' }],
    ['force_N', { name: 'force', unit: 'N' }],
    ['time_ms', { name: 'time', unit: 'ms' }],
    ['Velocity (in/s) bump 3 rebound 6', { name: 'velocity', unit: 'in/s', setting: 'bump 3 rebound 6' }],
    ['Force [lbf] (C3 R6)', { name: 'force', unit: 'lbf', setting: 'bump 3 rebound 6' }],
    ['velocity (LSC 4 HSC 2)', { name: 'velocity', setting: 'bump 4 bump-high 2' }],
    ['Shaft velocity', { name: 'shaft velocity' }],
  ];
  for (const [text, parts] of forms)
    it(`reads "${text}"`, () => {
      expect(benchHeaderCellParse(text)).toEqual({ text, ...parts });
    });

  it('leaves parentheses that are neither clicks nor a unit to the clicks reader, which names them', () => {
    expect(benchHeaderCellParse('velocity (bmp 3)').setting).toBe('bmp 3');
    expect(problem(() => benchTableRead('velocity (bmp 3),force (bmp 3)\n0.1,1\n'))).toMatch(
      /"bmp" is not a clicker adjuster/,
    );
  });

  it('reads each header style of one sweep to the same SI points', () => {
    const files = [
      'Velocity (in/s),Force (lbf)',
      'velocity_in_s,Force_lbf',
      'Velocity [in/s] B0 R0,Force [lbf] B0 R0',
      'Velocity (in/s) bump 3 rebound 6,Force (lbf) bump 3 rebound 6',
    ].map((h) => benchTableRead(`${h}\n1,50\n4,150\n-2,-120\n`));
    for (const [run] of files) {
      // 4 in/s = 0.1016 m/s, 150 lbf = 667.23 N [pub: NIST SP 811 factors above].
      expect(Array.from(run?.points.velocity ?? [])).toEqual([1 * INCH, 4 * INCH, -2 * INCH]);
      expect(run?.points.force[1]).toBeCloseTo(150 * LBF, 9);
    }
    expect(files.map(([run]) => run?.clicks)).toEqual([
      {},
      {},
      { bump: 0, rebound: 0 },
      { bump: 3, rebound: 6 },
    ]);
  });
});

describe('benchTableRead', () => {
  it('names a file of readings at zero speed as such, not as a sign mistake', () => {
    expect(problem(() => benchTableRead('velocity,force\n0,120\n'))).toMatch(
      /^file: its one row is at zero speed: a reading at rest is the gas force, not damping/,
    );
    expect(problem(() => benchTableRead('velocity,force\n0,120\n0,-80\n0,0\n'))).toMatch(
      /^file: all 3 rows are at zero speed/,
    );
  });

  it('writes the times of a trace that goes back as people write them', () => {
    const rows = [
      'time [ms],displacement,force',
      '0,0,0',
      '3,1,1',
      '6,2,2',
      '9,3,3',
      '9,4,4',
      '12,5,5',
      '15,6,6',
    ];
    expect(problem(() => benchTableRead(rows.join('\n')))).toMatch(
      /line 6, column "time": time 0\.009 s is not after the previous row's 0\.009 s;/,
    );
  });

  it('reads a one-run point table in SI', () => {
    const [run, ...rest] = benchTableRead('velocity,force\n-0.1,-500\n0.1,300\n');
    expect(rest).toEqual([]);
    expect(run?.source).toBe('points');
    expect(Array.from(run?.points.velocity ?? [])).toEqual([-0.1, 0.1]);
    expect(run?.clicks).toEqual({});
  });

  it('reads one run per column pair, with the clicks from the headers merged with those given', () => {
    const text =
      'velocity (bump 0),force (bump 0),velocity (bump 6),force (bump 6)\n0.1,400,0.1,250\n-0.1,-700,-0.1,-700\n0.2,600,,\n';
    const runs = benchTableRead(text, { clicks: { rebound: 4 } });
    expect(runs.map((r) => [r.column, r.clicks, r.points.velocity.length])).toEqual([
      ['bump 0', { rebound: 4, bump: 0 }, 3],
      ['bump 6', { rebound: 4, bump: 6 }, 2],
    ]);
  });

  it('converts units given in the header or as options, and applies the compression sign', () => {
    const header = benchTableRead('velocity [in/s],force [lbf]\n1,10\n-1,-20\n')[0];
    expect(header?.points.velocity[0]).toBeCloseTo(INCH, 15);
    expect(header?.points.force[1]).toBeCloseTo(-20 * LBF, 12);
    const options = benchTableRead('v,f\n-2,-10\n3,40\n', {
      columns: { velocity: 'v', force: 'f' },
      units: { velocity: 'in/s', force: 'lbf' },
      compression: 'negative',
    })[0];
    expect(options?.points.velocity[0]).toBeCloseTo(2 * INCH, 15);
    expect(options?.points.force[1]).toBeCloseTo(-40 * LBF, 12);
  });

  it('reads a trace: compression negative, ms and mm, to binned points and the raw samples in SI', () => {
    const lines = ['time [ms],displacement [mm],force [N]'];
    for (let i = 0; i < 2000; i++) {
      const t = i; // ms
      const x = 25 * Math.sin((2 * Math.PI * 2 * t) / 1000); // mm, compression positive
      const v = (25e-3 * 2 * Math.PI * 2 * Math.cos((2 * Math.PI * 2 * t) / 1000)) as number;
      lines.push(`${t},${-x},${-2000 * v}`);
    }
    const [run] = benchTableRead(lines.join('\n'), { compression: 'negative', clicks: { rebound: 4 } });
    expect(run?.source).toBe('trace');
    expect(run?.trace?.time[1]).toBeCloseTo(0.001, 15);
    expect(run?.trace?.displacement.length).toBe(2000);
    expect(run?.clicks).toEqual({ rebound: 4 });
    const points = run?.points;
    expect(points && points.velocity.length).toBeGreaterThan(30);
    // A linear 2000 N·s/m damper: every binned point lies on F = c·v.
    // (The bin's mean velocity carries the differentiator's ~1e-4 error; its mean force is exact.)
    points?.velocity.forEach((v, i) =>
      expect(Math.abs((points.force[i] as number) - 2000 * v)).toBeLessThan(1e-3 * 2000 * Math.abs(v)),
    );
    // Reference notes §6 [calc]: peak velocity π·f·S = π·2·0.05 = 0.314 m/s.
    expect(Math.max(...(points?.velocity ?? []))).toBeGreaterThan(0.3);
    expect(Math.max(...(points?.velocity ?? []))).toBeLessThan(0.315);
  });

  const corpus: [string, string, Parameters<typeof benchTableRead>[1], RegExp][] = [
    ['header only', 'velocity,force\n', {}, /has a header but no rows/],
    ['neither table nor trace', 'speed,load\n1,2\n', {}, /found neither velocity and force columns/],
    [
      'a force without velocity',
      'velocity,force,force (bump 3)\n1,2,3\n',
      {},
      /has no velocity column with the same clicker setting \(bump 3\)/,
    ],
    ['a velocity without force', 'velocity,force,velocity (bump 3)\n1,2,3\n', {}, /has no force column/],
    ['a duplicate column', 'velocity,force,force\n1,2,3\n', {}, /"force" appears twice/],
    ['a duplicate column in other case', 'velocity,Force,force\n1,2,3\n', {}, /appears twice/],
    [
      'clicks that are neither clicks nor a unit',
      'velocity (fast),force (fast)\n1,2\n',
      {},
      /clicker positions are written as \(bump 3 rebound 6\) or B3 R6/,
    ],
    ['a wrong unit in the header', 'velocity [kg],force\n1,2\n', {}, /"kg" is not a unit of velocity/],
    [
      'a wrong unit option',
      'velocity,force\n1,2\n',
      { units: { force: 'm/s' } },
      /--force-unit: "m\/s" is not a unit of force/,
    ],
    [
      'a unit given twice differently',
      'velocity [in/s],force\n1,2\n',
      { units: { velocity: 'mm/s' } },
      /says "mm\/s" but the header/,
    ],
    [
      'a unit option for another kind of file',
      'velocity,force\n1,2\n',
      { units: { time: 'ms' } },
      /--time-unit: does not apply/,
    ],
    [
      'a column that is not there',
      'velocity,force\n1,2\n',
      { columns: { velocity: 'Vel' } },
      /no column "Vel"/,
    ],
    [
      'clicks that contradict the header',
      'velocity (bump 3),force (bump 3)\n0.1,2\n0.2,3\n',
      { clicks: { bump: 4 } },
      /header says bump 3 but the clicks given say bump 4/,
    ],
    ['half a point', 'velocity,force\n0.1,\n', {}, /column "force": is empty while "velocity" has a value/],
    ['the wrong sign convention', 'velocity,force\n0.1,-300\n0.2,-500\n-0.1,400\n', {}, /opposite signs/],
    [
      'a trace with time going back',
      'time,displacement,force\n0,0,0\n1,1,1\n0.5,2,2\n3,3,3\n4,4,4\n5,5,5\n6,6,6\n7,7,7\n',
      {},
      /line 4, column "time": time 0.5 s is not after/,
    ],
    ['a trace too short', 'time,displacement,force\n0,0,0\n1,1,1\n', {}, /at least 7 rows/],
    ['a bad smoothing window', 'velocity,force\n1,2\n', { halfWindow: 0 }, /--smoothing/],
    ['bad bins', 'velocity,force\n1,2\n', { bins: 1 }, /--bins/],
  ];
  for (const [what, text, options, message] of corpus) {
    it(`refuses ${what}, saying what is wrong`, () => {
      expect(problem(() => benchTableRead(text, options))).toMatch(message);
    });
  }

  it('reads a file with unicode column names through the column options', () => {
    const [run] = benchTableRead('Geschw. [mm/s];Kraft [kN]\n100;0,3\n', {
      columns: { velocity: 'Geschw. [mm/s]', force: 'Kraft [kN]' },
    });
    expect(run?.points.velocity[0]).toBeCloseTo(0.1, 12);
    expect(run?.points.force[0]).toBeCloseTo(300, 9);
  });
});
