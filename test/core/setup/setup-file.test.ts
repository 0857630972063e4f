import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { inputErrorOf } from '../../input-error-fixture';
import { setupFileParse, setupFileWrite } from '../../../core/setup/setup-file';
import { setupFileFixture } from '../setup-fixture';

describe('setupFileParse', () => {
  it('reads all four corners and the vehicle-level fields in SI', () => {
    const f = setupFileParse(setupFileFixture());
    expect(f.vehicle).toBe('Test coupe');
    expect(f.sheet.fuelLoad).toBe(25);
    expect(f.sheet.corners.FL.analysis.springRate).toBe(70_000);
    expect(f.sheet.corners.RL.analysis.damperMotionRatio).toBe(0.85); // defaults to the spring's
    expect(f.sheet.corners.FL.rideHeight).toBeCloseTo(0.095, 12);
    // 1 bar = 100 kPa exactly (NIST SP 811 [pub]).
    expect(f.sheet.corners.FL.tirePressureCold).toBeCloseTo(170_000, 6);
    expect(f.sheet.corners.FL.camber).toBeCloseTo((-2.5 * Math.PI) / 180, 12);
    expect(f.sheet.corners.FL.toe).toEqual({ kind: 'length', value: 0.001 });
    expect(f.sheet.corners.FL.clicks).toEqual({ bump: 6, rebound: 6 });
  });

  it('reads toe given as an angle', () => {
    const raw = setupFileFixture();
    raw.corners.FL.toe = '0.1 deg';
    expect(setupFileParse(raw).sheet.corners.FL.toe).toEqual({ kind: 'angle', value: (0.1 * Math.PI) / 180 });
  });

  it('writes a file that reads back to the same sheet', () => {
    const sheet = setupFileParse(setupFileFixture()).sheet;
    for (const system of ['si', 'us'] as const) {
      const again = setupFileParse(setupFileWrite({ sheet }, system)).sheet;
      expect(again.corners.FR.analysis.springRate).toBeCloseTo(sheet.corners.FR.analysis.springRate, 6);
      expect(again.corners.RR.tirePressureCold).toBeCloseTo(sheet.corners.RR.tirePressureCold as number, 4);
      expect(again.corners.FL.toe?.value).toBeCloseTo(0.001, 12);
      expect(again.antiRollBar).toEqual(sheet.antiRollBar);
    }
  });

  it('round-trips any spring rate and ride height within 1e-9 relative (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1e3, max: 1e6, noNaN: true }),
        fc.double({ min: 0.01, max: 0.5, noNaN: true }),
        (k, h) => {
          const raw = setupFileFixture();
          raw.corners.FL.corner.springRate = k;
          raw.corners.FL.rideHeight = h;
          const sheet = setupFileParse(raw).sheet;
          const again = setupFileParse(setupFileWrite({ sheet }, 'us')).sheet;
          expect(Math.abs(again.corners.FL.analysis.springRate - k) / k).toBeLessThan(1e-9);
          expect(Math.abs((again.corners.FL.rideHeight as number) - h) / h).toBeLessThan(1e-9);
        },
      ),
      { numRuns: 50 },
    );
  });

  const bad: [string, (raw: ReturnType<typeof setupFileFixture>) => void, string, RegExp][] = [
    ['a missing format tag', (r) => delete r.format, 'format', /is missing/],
    ['another format', (r) => (r.format = 'other'), 'format', /expected "rideledger-setup"/],
    ['a newer version', (r) => (r.version = 2), 'version', /update RideLedger/],
    [
      'a missing corner',
      (r) => delete (r.corners as Record<string, unknown>).RL,
      'corners.RL',
      /all four corners/,
    ],
    [
      'an unknown corner',
      (r) => ((r.corners as Record<string, unknown>).XX = {}),
      'corners.XX',
      /not a known field/,
    ],
    ['an unknown field', (r) => (r.colour = 'red'), 'colour', /not a known field/],
    ['no name', (r) => delete r.name, 'name', /is missing/],
    ['an empty name', (r) => (r.name = '   '), 'name', /is empty/],
    ['a name with @', (r) => (r.name = 'Coupe@3'), 'name', /"@"/],
    ['a day that does not exist', (r) => (r.date = '2025-02-30'), 'date', /not a day/],
    ['a date written day first', (r) => (r.date = '12/04/2025'), 'date', /YYYY-MM-DD/],
    [
      'a pressure without its unit',
      (r) => (r.corners.FL.tirePressureCold = 1.7),
      'corners.FL.tirePressureCold',
      /outside the plausible/,
    ],
    [
      'a ride height of 95 m',
      (r) => (r.corners.FL.rideHeight = '95'),
      'corners.FL.rideHeight',
      /outside the plausible/,
    ],
    [
      'camber in radians by mistake',
      (r) => (r.corners.FL.camber = -2.5),
      'corners.FL.camber',
      /outside the plausible/,
    ],
    [
      'camber in a wrong unit',
      (r) => (r.corners.FL.camber = '-2.5 mm'),
      'corners.FL.camber',
      /expected an angle/,
    ],
    ['toe without a unit', (r) => (r.corners.FL.toe = '1'), 'corners.FL.toe', /with its unit/],
    ['toe in kilograms', (r) => (r.corners.FL.toe = '1 kg'), 'corners.FL.toe', /angle .* or a length/],
    ['NaN clicks', (r) => (r.corners.FL.clicks = { bump: NaN }), 'corners.FL.clicks.bump', /whole number/],
    [
      'negative clicks',
      (r) => (r.corners.FL.clicks = { rebound: -1 }),
      'corners.FL.clicks.rebound',
      /whole number/,
    ],
    [
      'half clicks',
      (r) => (r.corners.FL.clicks = { rebound: 2.5 }),
      'corners.FL.clicks.rebound',
      /whole number/,
    ],
    [
      'an unknown adjuster',
      (r) => (r.corners.FL.clicks = { preload: 2 }),
      'corners.FL.clicks.preload',
      /not a clicker adjuster/,
    ],
    [
      'a corner input error',
      (r) => (r.corners.RR.corner.springRate = '-5 N/mm'),
      'corners.RR.corner.springRate',
      /greater than zero/,
    ],
    [
      'a spring rate in a wrong unit',
      (r) => (r.corners.RR.corner.springRate = '70 kg'),
      'corners.RR.corner.springRate',
      /expected a rate/,
    ],
    ['Infinity fuel', (r) => (r.fuelLoad = Infinity), 'fuelLoad', /Infinity/],
    ['a control character in notes', (r) => (r.notes = 'a\u0007b'), 'notes', /control character/],
    ['a huge note', (r) => (r.notes = 'x'.repeat(5000)), 'notes', /at most 4000/],
    ['a newline in the event', (r) => (r.event = 'a\nb'), 'event', /one line/],
    ['a number as the driver', (r) => (r.driver = 7), 'driver', /expected a text/],
  ];
  for (const [what, change, field, message] of bad) {
    it(`names the field for ${what}`, () => {
      const raw = setupFileFixture();
      change(raw);
      const e = inputErrorOf(() => setupFileParse(raw));
      expect(e.field).toBe(field);
      expect(e.problem).toMatch(message);
    });
  }

  it('rejects a file that is not an object', () => {
    expect(inputErrorOf(() => setupFileParse([])).problem).toMatch(/expected an object/);
    expect(inputErrorOf(() => setupFileParse(null)).problem).toMatch(/expected an object/);
  });

  it('keeps unicode names and normalises them to NFC', () => {
    const raw = setupFileFixture();
    raw.name = 'Nasse Strecke, weicher Stabi — Ærø'.normalize('NFD');
    raw.vehicle = 'Équipe Ω coupe №7';
    const f = setupFileParse(raw);
    expect(f.sheet.name).toBe('Nasse Strecke, weicher Stabi — Ærø'.normalize('NFC'));
    expect(f.vehicle).toBe('Équipe Ω coupe №7');
  });
});
