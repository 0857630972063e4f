import fc from 'fast-check';
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { cornerAnalyze } from '../../../core/figures/corner-analysis';
import { cornerFileParse, cornerInputParse } from '../../../core/corner/corner-file';
import { eventBump, eventCurb, eventPothole, eventStep } from '../../../core/events/event';
import { InputError } from '../../../core/units/input-error';
import { numberRounded, quantityRounded } from '../../../core/units/number-text';
import {
  cornerInputWarnings,
  figuresFiniteCheck,
  PLAUSIBLE_RANGES,
  plausibleRangeText,
} from '../../../core/corner/plausible-range';
import { setupFileParse } from '../../../core/setup/setup-file';
import { inputErrorOf } from '../../input-error-fixture';
import { setupFileFixture } from '../setup-fixture';
import { testCorner } from '../test-corner';

const demo = JSON.parse(
  readFileSync(new URL('../../../assets/demo/club-coupe-front-left.json', import.meta.url), 'utf8'),
) as { corner: Record<string, unknown>; bump: Record<string, unknown>; road: Record<string, unknown> };

const cornerWith = (over: Record<string, unknown>) => ({ ...demo.corner, ...over });

describe('the README', () => {
  it('states every plausible range and its reason as the program has them', () => {
    const readme = readFileSync(new URL('../../../README.md', import.meta.url), 'utf8');
    const cell = (t: string) => ` ${t.replace(/[.*+?^${}()|[\]\\]/g, '\\$&')} +\\|`;
    for (const [key, r] of Object.entries(PLAUSIBLE_RANGES)) {
      const k = key as keyof typeof PLAUSIBLE_RANGES;
      const row = new RegExp(
        `\\|${cell(plausibleRangeText(k))}${cell(plausibleRangeText(k, true))}${cell(r.reason)}`,
      );
      expect(readme, key).toMatch(row);
    }
  });
});

describe('numberRounded', () => {
  it('writes a number as people do: at most 4 significant figures, no float noise', () => {
    expect(numberRounded(0.009000000000000001)).toBe('0.009');
    expect(numberRounded(0.1 + 0.2)).toBe('0.3');
    expect(numberRounded(1234.5678)).toBe('1235');
    expect(numberRounded(-0.00012346)).toBe('-0.0001235');
    expect(numberRounded(5000)).toBe('5000');
    expect(numberRounded(0)).toBe('0');
    expect(numberRounded(-0)).toBe('0');
    expect(numberRounded(1e300)).toBe('1e+300');
    expect(numberRounded(Number.NaN)).toBe('NaN');
  });

  it('rounds a quantity in its display unit', () => {
    expect(quantityRounded(0.009000000000000001, 'time')).toBe('0.009 s');
    expect(quantityRounded(70_000, 'stiffness')).toBe('70 N/mm');
    // 400 lbf/in = 70 050.6 N/m [calc: 400 × 4.4482216152605 N / 0.0254 m]
    expect(quantityRounded(70_050.7, 'stiffness', 'us')).toBe('400 lbf/in');
  });

  it('keeps to its figures for any finite number (property)', () => {
    fc.assert(
      fc.property(fc.double({ min: -1e300, max: 1e300, noNaN: true }), (x) => {
        const text = numberRounded(x);
        // Trailing zeros of a whole number hold its place, not its precision.
        const digits = text
          .replace(/^-/, '')
          .replace(/e.*$/, '')
          .replace('.', '')
          .replace(/^0+/, '')
          .replace(/0+$/, '');
        expect(digits.length).toBeLessThanOrEqual(4);
        // Within rounding to 4 significant figures [calc: half a unit in the 4th figure].
        if (x !== 0) expect(Math.abs(Number(text) - x) / Math.abs(x)).toBeLessThanOrEqual(5e-4);
      }),
    );
  });
});

describe('plausible ranges', () => {
  it('states each range with its reason, inside which the usual range lies', () => {
    for (const [key, r] of Object.entries(PLAUSIBLE_RANGES)) {
      expect(r.low, key).toBeLessThanOrEqual(r.usualLow);
      expect(r.usualLow, key).toBeLessThan(r.usualHigh);
      expect(r.usualHigh, key).toBeLessThanOrEqual(r.high);
      expect(r.reason.length, key).toBeGreaterThan(10);
    }
    expect(plausibleRangeText('cornerMass')).toBe('5–5000 kg');
    expect(plausibleRangeText('camber')).toBe('-15 to 15 °');
    expect(plausibleRangeText('motionRatio')).toBe('0.2–2');
  });

  const absurd: [string, Record<string, unknown>, RegExp][] = [
    ['a corner mass of 1e300 kg', { cornerMass: 1e300 }, /^corner\.cornerMass: corner mass 1e\+300 kg/],
    [
      'a spring of 1e-300 N/mm',
      { springRate: '1e-300 N/mm' },
      /^corner\.springRate: spring rate 1e-300 N\/mm/,
    ],
    [
      'a spring of 1e300 N/mm',
      { springRate: '1e300 N/mm' },
      /^corner\.springRate: spring rate 1e\+300 N\/mm/,
    ],
    [
      'masses of 1e-9 kg',
      { cornerMass: 1e-9, unsprungMass: 1e-10 },
      /^corner\.cornerMass: corner mass 1e-9 kg/,
    ],
    [
      'a motion ratio of 3',
      { springMotionRatio: 3 },
      /^corner\.springMotionRatio: motion ratio 3 is outside/,
    ],
    [
      'a damper motion ratio of 0.1',
      { damperMotionRatio: 0.1 },
      /^corner\.damperMotionRatio: motion ratio 0\.1/,
    ],
    [
      'a tyre of 1 N/mm',
      { tireRate: '1 N/mm' },
      /^corner\.tireRate: tyre rate 1 N\/mm is outside the plausible 20–5000 N\/mm/,
    ],
    [
      'an unsprung mass of 2000 kg',
      { cornerMass: 4000, unsprungMass: 2000 },
      /^corner\.unsprungMass: unsprung mass 2000 kg/,
    ],
    [
      'a sprung mass of 0.5 kg',
      { cornerMass: 5.5, unsprungMass: 5 },
      /^corner\.unsprungMass: sprung mass .* 0\.5 kg/,
    ],
    [
      'damping of 1e6 N·s/m',
      { damper: { bump: { lowSpeed: 1e6 }, rebound: { lowSpeed: 3000 } } },
      /^corner\.damper\.bump\.lowSpeed: damping coefficient 1000000 N·s\/m is outside the plausible 10–200000 N·s\/m/,
    ],
    [
      'a bump stop of 1e12 N/mm',
      { bumpStop: { gap: '30 mm', rate: '1e12 N/mm' } },
      /^corner\.bumpStop\.rate: bump-stop rate 1000000000000 N\/mm/,
    ],
  ];
  for (const [what, over, message] of absurd) {
    it(`refuses ${what}, naming the field, the range and its reason`, () => {
      const e = inputErrorOf(() => cornerInputParse(cornerWith(over)));
      expect(e.message).toMatch(message);
      expect(e.message).toMatch(/outside the plausible .+ \(.+\)/);
    });
  }

  it('refuses damping that would stop the wheel faster than any real corner, though each value is in range', () => {
    const e = inputErrorOf(() =>
      cornerInputParse(
        cornerWith({
          unsprungMass: '1.5 kg',
          damperMotionRatio: 2,
          damper: { bump: { lowSpeed: 150_000 }, rebound: { lowSpeed: 150_000 } },
        }),
      ),
    );
    expect(e.field).toBe('corner.damper');
    expect(e.problem).toMatch(
      /would stop the 1\.5 kg unsprung mass in 0\.0000025 s, faster than the 0\.0002 s/,
    );
  });

  it('refuses a bump and a road outside their ranges in a corner file', () => {
    const file = (over: Record<string, unknown>) => ({ corner: demo.corner, ...over });
    expect(
      inputErrorOf(() => cornerFileParse(file({ bump: { ...demo.bump, speed: '1e6 m/s' } }))).field,
    ).toBe('bump.speed');
    expect(inputErrorOf(() => cornerFileParse(file({ bump: { ...demo.bump, length: '1 nm' } }))).field).toBe(
      'bump.length',
    );
    expect(inputErrorOf(() => cornerFileParse(file({ bump: { ...demo.bump, height: '2 m' } }))).field).toBe(
      'bump.height',
    );
    expect(
      inputErrorOf(() => cornerFileParse(file({ road: { class: 'C', speed: '900 km/h' } }))).message,
    ).toMatch(
      /^road\.speed: speed 900 km\/h is outside the plausible 1\.8–432 km\/h \(from walking pace to a top-speed run\)/,
    );
  });

  it('refuses sheet quantities outside their ranges with the same words', () => {
    const raw = setupFileFixture();
    raw.corners.FR.tirePressureCold = 26;
    expect(inputErrorOf(() => setupFileParse(raw)).message).toMatch(
      /^corners\.FR\.tirePressureCold: cold tyre pressure 0\.026 kPa is outside the plausible 20–1000 kPa \(gauge pressure.*\); check the value and its unit, e\.g\. "1\.6 bar" or "24 psi"/,
    );
  });

  it('warns, without refusing, for a value inside the plausible range but outside the usual one', () => {
    const corner = cornerInputParse(cornerWith({ cornerMass: '3000 kg', springMotionRatio: 1.6 }));
    const warnings = cornerInputWarnings(corner);
    expect(warnings.map((w) => [w.code, w.field])).toEqual([
      ['unusual-cornerMass', 'cornerMass'],
      ['unusual-sprungMass', 'unsprungMass'],
      ['unusual-motionRatio', 'springMotionRatio'],
    ]);
    expect(warnings[0]?.message).toBe(
      "The corner mass 3000 kg is outside the usual 30–1500 kg, though possible (from a kart's corner to a heavy truck's): check the value and its unit.",
    );
    expect(cornerInputWarnings(corner, 'us')[0]?.message).toMatch(
      /corner mass 6614 lb is outside the usual 66\.14–3307 lb/,
    );
    // The demo corner is usual in every respect.
    expect(cornerInputWarnings(cornerInputParse(demo.corner))).toEqual([]);
    // The analysis carries them with the figures' own warnings.
    const analysis = cornerAnalyze(cornerFileParse({ corner: cornerWith({ cornerMass: '3000 kg' }) }));
    expect(analysis.warnings.map((w) => w.code)).toContain('unusual-cornerMass');
  });
});

describe('events too short or too fast for the simulation', () => {
  it('refuses a bump crossed faster than the simulation can follow, naming the event', () => {
    const e = inputErrorOf(() => eventBump({ height: 0.025, length: 1e-9, speed: 14 }));
    expect(e.field).toBe('bump.length');
    // 1 nm at 14 m/s passes in 7.14e-11 s [calc: 1e-9 / 14].
    expect(e.problem).toMatch(
      /^the 25\.0 mm bump, 0 mm long, at 50\.4 km\/h is crossed in 7\.143e-11 s, too short or too fast for the simulation to follow \(at least 0\.2 ms; a tyre bridges anything shorter\): make it at least 2\.8 mm long at this speed, or slower$/,
    );
  });

  it('refuses speeds outside the plausible range for every kind of event', () => {
    expect(inputErrorOf(() => eventBump({ height: 0.025, length: 0.6, speed: 1e6 })).field).toBe(
      'bump.speed',
    );
    expect(inputErrorOf(() => eventStep({ height: 0.025, rise: 0.05, speed: 0.01 })).field).toBe(
      'step.speed',
    );
    expect(
      inputErrorOf(() => eventCurb({ height: 0.04, rise: 0.15, hold: 0.3, drop: 0.02, speed: 500 })).field,
    ).toBe('curb.speed');
    expect(inputErrorOf(() => eventPothole({ depth: 0.04, length: 1e-6, speed: 20 })).field).toBe(
      'pothole.length',
    );
    expect(inputErrorOf(() => eventStep({ height: 0.025, rise: 1e-5, speed: 20 })).field).toBe('step.rise');
  });

  it('still runs a short, fast event the simulation can follow', () => {
    expect(() => eventBump({ height: 0.025, length: 0.05, speed: 120 })).not.toThrow();
  });
});

describe('the final guard', () => {
  it('turns a figure that is not finite into an InputError naming it', () => {
    const e = inputErrorOf(() => figuresFiniteCheck({ a: 1, b: { c: [2, Number.NaN] } }, 'corner'));
    expect(e.field).toBe('corner');
    expect(e.problem).toMatch(/^the figure b\.c\[1\] came out as NaN/);
    expect(
      inputErrorOf(() => figuresFiniteCheck({ t: new Float64Array([1, Infinity]) }, 'x')).problem,
    ).toMatch(/t\[1\] came out as Infinity/);
    expect(() =>
      figuresFiniteCheck({ a: 1, b: null, c: 'text', d: [new Float64Array([0])] }, 'x'),
    ).not.toThrow();
  });

  it('gives finite figures, or an InputError, for any corner whose every quantity is in range (property)', () => {
    const R = PLAUSIBLE_RANGES;
    /** A value spread evenly on a log scale over a range, so both ends are tried. */
    const logIn = (low: number, high: number) =>
      fc.double({ min: Math.log(low), max: Math.log(high), noNaN: true }).map((x) => Math.exp(x));
    const masses = logIn(R.cornerMass.low, R.cornerMass.high).chain((cornerMass) =>
      logIn(
        Math.max(R.unsprungMass.low, 0.01 * cornerMass),
        Math.min(R.unsprungMass.high, 0.6 * cornerMass),
      ).map((unsprungMass) => ({ cornerMass, unsprungMass })),
    );
    const corner = fc.record({
      masses,
      springRate: logIn(R.springRate.low, R.springRate.high),
      springMotionRatio: logIn(R.motionRatio.low, R.motionRatio.high),
      damperMotionRatio: logIn(R.motionRatio.low, R.motionRatio.high),
      tireRate: logIn(R.tireRate.low, R.tireRate.high),
      bump: logIn(R.damping.low, R.damping.high),
      rebound: logIn(R.damping.low, R.damping.high),
      bumpHigh: logIn(R.damping.low, R.damping.high),
      reboundHigh: logIn(R.damping.low, R.damping.high),
      knee: logIn(R.kneeSpeed.low, R.kneeSpeed.high),
      bumpSpeed: logIn(R.eventSpeed.low, R.eventSpeed.high),
      bumpLength: logIn(R.bumpLength.low, R.bumpLength.high),
      bumpHeight: logIn(R.bumpHeight.low, R.bumpHeight.high),
    });
    let analysed = 0;
    const refusedFields: string[] = [];
    fc.assert(
      fc.property(corner, (c) => {
        const raw = {
          corner: {
            cornerMass: c.masses.cornerMass,
            unsprungMass: c.masses.unsprungMass,
            springRate: c.springRate,
            springMotionRatio: c.springMotionRatio,
            damperMotionRatio: c.damperMotionRatio,
            tireRate: c.tireRate,
            damper: {
              bump: { lowSpeed: c.bump, kneeSpeed: c.knee, highSpeed: c.bumpHigh },
              rebound: { lowSpeed: c.rebound, kneeSpeed: c.knee, highSpeed: c.reboundHigh },
            },
            bumpStop: { gap: 0.03, rate: 250_000 },
          },
          road: { class: 'C', speed: c.bumpSpeed },
          bump: { height: c.bumpHeight, length: c.bumpLength, speed: c.bumpSpeed },
        };
        let file;
        try {
          refusedFields.push('');
          file = cornerFileParse(raw);
        } catch (e) {
          // Each value is in range; only their combination (the damping time) may be refused.
          expect(e).toBeInstanceOf(InputError);
          refusedFields.push((e as InputError).field);
          expect((e as InputError).field).toBe('corner.damper');
          return;
        }
        const a = cornerAnalyze(file);
        analysed++;
        const { file: _f, bump, warnings: _w, ...figures } = a;
        expect(() => figuresFiniteCheck({ ...figures, bump: bump?.metrics }, 'corner')).not.toThrow();
        expect(Number.isFinite(a.figures.dampingRatio.bump)).toBe(true);
        expect(Number.isFinite(a.bump?.metrics.peakBodyAccel)).toBe(true);
      }),
      { numRuns: 100, seed: 11 },
    );
    // Most draws are analysed, so the property speaks for in-range corners, not for refusals.
    expect(analysed, refusedFields.filter(Boolean).join(' ')).toBeGreaterThan(40);
  }, 120_000);
});

describe('the test corner', () => {
  it('is plausible and usual', () => {
    expect(cornerInputWarnings(testCorner())).toEqual([]);
  });
});
