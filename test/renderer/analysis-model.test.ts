import { readFileSync } from 'node:fs';
import { EigenvalueDecomposition, Matrix } from 'ml-matrix';
import { describe, expect, it } from 'vitest';
import { analysisCornersOf, setupAnalyze } from '../../app/renderer/analysis-result';
import { analysisFigureGroups } from '../../app/renderer/analysis-figures';
import {
  analysisOptionTextsConvert,
  analysisOptionTextsDefault,
  analysisOptionsRead,
  type AnalysisOptions,
} from '../../app/renderer/analysis-options';
import { analysisPlots } from '../../app/renderer/analysis-plots';
import type { CornerInput } from '../../core/corner/corner';
import { InputError } from '../../core/units/input-error';
import { WORKED_CORNER, fourOf } from './worked-corner';

const demoFile = (name: string) =>
  JSON.parse(readFileSync(new URL(`../../assets/demo/setups/${name}`, import.meta.url), 'utf8')) as Record<
    string,
    unknown
  >;

const WORKED = WORKED_CORNER;

const optionsOf = (
  texts: Parameters<typeof analysisOptionsRead>[0],
  system: 'si' | 'us',
): AnalysisOptions => {
  const r = analysisOptionsRead(texts, system);
  if (!('options' in r)) throw new Error(`unexpected problems: ${[...r.problems].join('; ')}`);
  return r.options;
};

const problemsOf = (texts: Parameters<typeof analysisOptionsRead>[0], system: 'si' | 'us') => {
  const r = analysisOptionsRead(texts, system);
  if (!('problems' in r)) throw new Error('expected problems');
  return r.problems;
};

describe('the road and bump options', () => {
  it('defaults to ISO 8608 class C and round numbers in each unit system', () => {
    const si = optionsOf(analysisOptionTextsDefault('si'), 'si');
    // NIST SP 811 [pub]: 1 km/h = 1/3.6 m/s; 1 mi = 1609.344 m; 1 in = 0.0254 m.
    expect(si.road).toEqual({ roadClass: 'C', speed: 80 / 3.6 });
    expect(si.bump.height).toBeCloseTo(0.025, 12);
    expect(si.bump.length).toBeCloseTo(0.5, 12);
    expect(si.bump.speed).toBeCloseTo(50 / 3.6, 12);
    const us = optionsOf(analysisOptionTextsDefault('us'), 'us');
    expect(us.road.speed).toBeCloseTo((50 * 1609.344) / 3600, 10);
    expect(us.bump.height).toBeCloseTo(0.0254, 12);
    expect(us.bump.length).toBeCloseTo(20 * 0.0254, 12);
  });

  it('reads a bare number in the unit shown and a typed unit as typed', () => {
    const o = optionsOf(
      { ...analysisOptionTextsDefault('si'), roadSpeed: '30 mi/h', bumpHeight: '1 in' },
      'si',
    );
    expect(o.road.speed).toBeCloseTo((30 * 1609.344) / 3600, 10);
    expect(o.bump.height).toBeCloseTo(0.0254, 12);
  });

  it('marks every wrong field at once, with core’s message', () => {
    const p = problemsOf(
      { roadClass: 'C', roadSpeed: '', bumpHeight: 'abc', bumpLength: '-5', bumpSpeed: '25 kg' },
      'si',
    );
    expect(p.get('roadSpeed')).toBe('is needed');
    expect(p.get('bumpHeight')).toMatch(/could not read "abc"/);
    expect(p.get('bumpLength')).toMatch(/greater than zero/);
    expect(p.get('bumpSpeed')).toMatch(/a mass.*expected a speed/);
  });

  it('refuses zero, NaN, a huge number and a class outside A–H', () => {
    const d = analysisOptionTextsDefault('si');
    expect(problemsOf({ ...d, bumpSpeed: '0' }, 'si').get('bumpSpeed')).toMatch(/greater than zero/);
    expect(problemsOf({ ...d, roadSpeed: 'NaN' }, 'si').get('roadSpeed')).toBeDefined();
    expect(problemsOf({ ...d, bumpHeight: '1e400' }, 'si').get('bumpHeight')).toMatch(/finite/);
    expect(problemsOf({ ...d, roadClass: 'Z' }, 'si').get('roadClass')).toMatch(/ISO 8608 class/);
  });

  it('switches untouched defaults to the other system’s round defaults, and converts typed values', () => {
    const d = analysisOptionTextsDefault('si');
    expect(analysisOptionTextsConvert(d, 'si', 'us')).toEqual(analysisOptionTextsDefault('us'));
    const typed = analysisOptionTextsConvert({ ...d, roadSpeed: '100', bumpHeight: 'oops' }, 'si', 'us');
    // NIST SP 811 [pub]: 100 km/h = 62.1371 mph, written as a shop does; read back, it is exactly 100 km/h.
    expect(typed.roadSpeed).toBe('62.1');
    const back = analysisOptionsRead({ ...typed, bumpHeight: '1' }, 'us');
    expect('options' in back && back.options.road.speed).toBeCloseTo(100 / 3.6, 12);
    expect(analysisOptionTextsConvert(typed, 'us', 'si').roadSpeed).toBe('100');
    expect(typed.bumpHeight).toBe('oops');
    expect(analysisOptionTextsConvert(d, 'si', 'si')).toBe(d);
  });
});

describe('setupAnalyze', () => {
  const worked = setupAnalyze(
    fourOf(WORKED),
    optionsOf({ ...analysisOptionTextsDefault('si'), roadSpeed: '72' }, 'si'),
  );
  const fl = worked.corners.FL;

  it('reproduces the worked random-road case at class C, 72 km/h (20 m/s), to 0.1 %', () => {
    // REFERENCES §5 [calc, Lyapunov closed form and spectral integration]
    expect(fl.randomRoad.bodyAccelRms).toBeCloseTo(1.372, 3);
    expect(fl.randomRoad.bodyAccelWeightedRms / 1.1399).toBeCloseTo(1, 3);
    expect(fl.randomRoad.travelRms / 0.011998).toBeCloseTo(1, 3);
    expect(fl.randomRoad.tireLoadRmsRatio / 0.2476).toBeCloseTo(1, 3);
  });

  it('finds the modes ml-matrix finds in the state matrix', () => {
    const [ms, mu, k, c, kt] = [250, 35, 16_000, 1000, 160_000];
    // The state matrix written out here from the equations of motion, states [zs, zu, vs, vu].
    const a = new Matrix([
      [0, 0, 1, 0],
      [0, 0, 0, 1],
      [-k / ms, k / ms, -c / ms, c / ms],
      [k / mu, -(k + kt) / mu, c / mu, -c / mu],
    ]);
    const e = new EigenvalueDecomposition(a);
    const pairs = e.realEigenvalues
      .map((re, i) => ({ re, im: e.imaginaryEigenvalues[i] as number }))
      .filter((l) => l.im > 0)
      .map((l) => ({ f: Math.hypot(l.re, l.im) / (2 * Math.PI), zeta: -l.re / Math.hypot(l.re, l.im) }))
      .sort((x, y) => x.f - y.f);
    // ml-matrix EigenvalueDecomposition [calc: independent library]
    expect(fl.modes.body?.frequencyHz).toBeCloseTo(pairs[0]?.f as number, 9);
    expect(fl.modes.body?.dampingRatio).toBeCloseTo(pairs[0]?.zeta as number, 9);
    expect(fl.modes.wheelHop?.frequencyHz).toBeCloseTo(pairs[1]?.f as number, 9);
  });

  it('starts the linear step with no body acceleration and the tyre squeezed by the whole step', () => {
    // REFERENCES §4 [calc]: zs″(0⁺) = 0; with ct = 0 the tyre takes kt·h at once (h = 10 mm).
    const s = fl.stepHistory;
    expect(s.time[0]).toBe(0);
    expect(s.bodyAccel[0]).toBeCloseTo(0, 9);
    expect(s.tireLoad[0]).toBeCloseTo(160_000 * 0.01, 6);
    // … and it has settled by the end of the window: no travel and no dynamic load left.
    const last = s.time.length - 1;
    expect(Math.abs(s.travel[last] as number)).toBeLessThan(2e-4);
    expect(s.time[last]).toBeCloseTo(worked.stepWindow, 12);
    expect(worked.stepWindow).toBeGreaterThanOrEqual(1.5);
    expect(worked.stepWindow).toBeLessThanOrEqual(5);
  });

  it('plots a bump history whose peak agrees with the event metrics', () => {
    const h = fl.bumpHistory;
    let peak = 0;
    for (const a of h.bodyAccel) peak = Math.max(peak, Math.abs(a));
    // The metrics refine the peak on the dense output; 600 samples over 1.5 s come within a few %.
    expect(peak).toBeLessThanOrEqual(fl.bump.peakBodyAccel * (1 + 1e-9));
    expect(peak).toBeGreaterThan(fl.bump.peakBodyAccel * 0.95);
    expect(h.time[h.time.length - 1]).toBeCloseTo(1.5, 12);
  });

  it('reports progress corner by corner, ending at 1', () => {
    const seen: number[] = [];
    setupAnalyze(fourOf(WORKED), worked.options, (f) => seen.push(f));
    expect(seen[0]).toBe(0);
    expect(seen[seen.length - 1]).toBe(1);
    expect([...seen].sort((x, y) => x - y)).toEqual(seen);
  });
});

describe('the figures table', () => {
  const corners = analysisCornersOf(demoFile('coupe-27/01-baseline.json'));
  const result = setupAnalyze(corners, optionsOf(analysisOptionTextsDefault('si'), 'si'));

  it('shows each value with its unit in the unit system picked', () => {
    const row = (units: 'si' | 'us', key: string) =>
      analysisFigureGroups(result, units)
        .flatMap((g) => g.rows)
        .find((r) => r.key === key);
    // Wheel rate = 70 N/mm × 0.9² = 56.7 N/mm [calc]; 1 lbf/in = 175.1268 N/m (NIST SP 811 [pub]) → 324 lbf/in.
    expect(row('si', 'wheelRate')?.cells.FL).toBe('56.7 N/mm');
    expect(row('us', 'wheelRate')?.cells.FL).toBe('324 lbf/in');
    expect(row('si', 'rideFrequency')?.cells.FL).toMatch(/^\d\.\d\d Hz$/);
    expect(row('us', 'bumpMaxCompression')?.cells.FL).toMatch(/ in$/);
    expect(row('si', 'zetaBump')?.cells.FL).toMatch(
      /^0\.\d\d \((underdamped|overdamped|critically damped)\)$/,
    );
    expect(row('si', 'roadTireLoad')?.cells.FL).toMatch(/ %$/);
  });

  it('names the road and the bump in the group titles, in the unit system picked', () => {
    const titles = analysisFigureGroups(result, 'us').map((g) => g.title);
    expect(titles).toContain('Road step of 0.394 in (linear model)'); // 10 mm [calc]
    expect(titles.some((t) => t.includes('ISO 8608 class C at 49.7 mph'))).toBe(true);
    expect(titles.some((t) => t.startsWith('Bump: 0.984 in high'))).toBe(true); // 25 mm [calc]
  });

  it('puts each warning beside the figure it concerns', () => {
    const soft: CornerInput = {
      ...WORKED,
      damper: { bump: { kind: 'linear', coefficient: 150 }, rebound: { kind: 'linear', coefficient: 1000 } },
    };
    const r = setupAnalyze(fourOf(soft), result.options);
    const rows = analysisFigureGroups(r, 'si').flatMap((g) => g.rows);
    const zetaBump = rows.find((row) => row.key === 'zetaBump');
    expect(zetaBump?.warnings.FL.map((w) => w.code)).toContain('damping-low-bump');
    // A warning not concerning a row is not put on it.
    expect(rows.find((row) => row.key === 'wheelRate')?.warnings.FL).toEqual([]);
    // Every warning of the corner is still listed for it.
    expect(r.corners.FL.warnings.si.map((w) => w.code)).toContain('damping-low-bump');
  });

  it('marks tyre lift-off on the time off the road when the bump lifts the wheel', () => {
    const big = setupAnalyze(corners, {
      ...result.options,
      bump: { height: 0.05, length: 0.3, speed: 25 },
    });
    const airborne = analysisFigureGroups(big, 'si')
      .flatMap((g) => g.rows)
      .find((r) => r.key === 'bumpAirborne');
    expect(big.corners.FL.bump.airborneTime).toBeGreaterThan(0);
    expect(airborne?.warnings.FL.map((w) => w.code)).toContain('tire-lift-off');
    // The same warning in US units, on the same row, without running anything again.
    const us = analysisFigureGroups(big, 'us')
      .flatMap((g) => g.rows)
      .find((r) => r.key === 'bumpAirborne');
    const liftOff = us?.warnings.FL.find((w) => w.code === 'tire-lift-off');
    expect(liftOff?.message).toMatch(
      /over the 1\.97 in bump, 11\.8 in long, at 55\.9 mph.* lbf of tyre load/,
    );
    expect(big.corners.FL.warnings.us.map((w) => w.code)).toEqual(
      big.corners.FL.warnings.si.map((w) => w.code),
    );
  });
});

describe('the plots', () => {
  const result = setupAnalyze(fourOf(WORKED), optionsOf(analysisOptionTextsDefault('si'), 'si'));

  it('has a series per corner and axis labels with units', () => {
    const p = analysisPlots(result, 'si');
    expect(p.step.map((x) => x.id)).toEqual(['step-body-accel', 'step-travel', 'step-tire-load']);
    expect(p.bump.map((x) => x.id)).toEqual(['bump-body-accel', 'bump-travel', 'bump-tire-load']);
    for (const plot of [...p.step, ...p.bump, ...p.frf]) {
      expect(plot.series.map((s) => s.name)).toEqual(['FL', 'FR', 'RL', 'RR']);
      expect(plot.xLabel).toMatch(/\((s|Hz)\)$/);
      expect(plot.yLabel.length).toBeGreaterThan(3);
    }
    expect(p.step[1]?.yLabel).toBe('Travel (mm)');
    expect(p.step[0]?.title).toContain('linear model');
    expect(p.bump[0]?.title).toContain('nonlinear model');
    expect(p.frf.every((x) => x.xLog && x.yLog)).toBe(true);
    expect(p.randomRoad.map((b) => b.categories)).toEqual([
      ['FL', 'FR', 'RL', 'RR'],
      ['FL', 'FR', 'RL', 'RR'],
      ['FL', 'FR', 'RL', 'RR'],
    ]);
  });

  it('scales the same result into US units: inches, pound-force', () => {
    const si = analysisPlots(result, 'si');
    const us = analysisPlots(result, 'us');
    // NIST SP 811 [pub]: 1 in = 25.4 mm; 1 lbf = 4.4482216152605 N.
    const k = (a: ArrayLike<number>, b: ArrayLike<number>, i: number) => (b[i] as number) / (a[i] as number);
    expect(k(si.bump[1]?.series[0]?.y ?? [], us.bump[1]?.series[0]?.y ?? [], 200)).toBeCloseTo(1 / 25.4, 10);
    expect(k(si.bump[2]?.series[0]?.y ?? [], us.bump[2]?.series[0]?.y ?? [], 200)).toBeCloseTo(
      1 / 4.4482216152605,
      10,
    );
    expect(us.bump[1]?.yLabel).toBe('Travel (in)');
    expect(us.frf[1]?.yLabel).toBe('lbf per in of road');
    // Travel per road height has no unit: the same in both systems.
    expect(us.frf[2]?.series[0]?.y).toEqual(si.frf[2]?.series[0]?.y);
    // The tyre-load gain per mm of road is the N/m gain ÷ 1000.
    expect((si.frf[1]?.series[0]?.y[0] as number) * 1000).toBeCloseTo(
      result.corners.FL.frf[0]?.tireLoad as number,
      6,
    );
  });

  it('gives the random-road bars in percent of static load and display lengths', () => {
    const [accel, load, travel] = analysisPlots(result, 'si').randomRoad;
    expect(accel?.series.map((s) => s.name)).toEqual(['Body acceleration RMS', 'Wk-weighted (ISO 2631-1)']);
    expect(load?.series[0]?.values[0]).toBeCloseTo(result.corners.FL.randomRoad.tireLoadRmsRatio * 100, 10);
    expect(travel?.series[0]?.values[0]).toBeCloseTo(result.corners.FL.randomRoad.travelRms * 1000, 10);
  });
});

describe('analysisCornersOf', () => {
  it('reads every corner of a stored setup file', () => {
    const c = analysisCornersOf(demoFile('single-seater-9/01-baseline.json'));
    expect(Object.keys(c)).toEqual(['FL', 'FR', 'RL', 'RR']);
    expect(c.FL.cornerMass).toBeGreaterThan(c.FL.unsprungMass);
  });

  it('names the field when the file is wrong, and refuses an empty one', () => {
    const file = demoFile('coupe-27/01-baseline.json');
    const corners = file.corners as Record<string, { corner: Record<string, unknown> }>;
    (corners.RL as { corner: Record<string, unknown> }).corner.springRate = '60 kg';
    expect(() => analysisCornersOf(file)).toThrow(InputError);
    expect(() => analysisCornersOf(file)).toThrow(/corners\.RL\.corner\.springRate/);
    expect(() => analysisCornersOf({})).toThrow(/format/);
    expect(() => analysisCornersOf(null)).toThrow(InputError);
  });
});
