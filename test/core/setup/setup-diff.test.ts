import { describe, expect, it } from 'vitest';
import {
  setupChangeText,
  setupDiff,
  setupDiffSummary,
  type SetupFieldChange,
} from '../../../core/setup/setup-diff';
import { setupFileParse, setupFileWrite } from '../../../core/setup/setup-file';
import type { SetupSheet } from '../../../core/setup/setup-sheet';
import { setupFileFixture } from '../setup-fixture';

type Raw = ReturnType<typeof setupFileFixture>;
const sheetOf = (raw: Raw): SetupSheet => setupFileParse(raw).sheet;
const cornerOf = (raw: Raw, p: 'FL' | 'FR' | 'RL' | 'RR') => raw.corners[p].corner;

/** The worked example of the reference notes, §3, as the front-left corner (unsprung mass ours). */
function workedExampleFixture(frontSpring: number): Raw {
  const raw = setupFileFixture();
  Object.assign(cornerOf(raw, 'FL'), {
    cornerMass: 312 + 40,
    unsprungMass: 40,
    springRate: frontSpring,
    springMotionRatio: 0.7334,
    damperMotionRatio: 0.7334,
    tireRate: 318_030,
  });
  return raw;
}

describe('setupDiff', () => {
  it('shows a single spring-rate change as that one field and the changed figures of that corner only', () => {
    const before = workedExampleFixture(120_000);
    const after = workedExampleFixture(140_101);
    const d = setupDiff(sheetOf(before), sheetOf(after));
    expect(d.fields).toEqual([
      {
        field: 'corners.FL.corner.springRate',
        label: 'spring rate',
        position: 'FL',
        before: '120',
        after: '140.101',
        unit: 'N/mm',
      },
    ]);
    expect(new Set(d.figures.map((f) => f.position))).toEqual(new Set(['FL']));
    const ride = d.figures.find((f) => f.figure === 'rideFrequencyHz');
    // Engineering forum worked example, reference notes §3 [pub; recomputed]: front spring
    // 140 101 N/m, MR 0.7334, sprung 312 kg, kt 318 030 N/m → wheel rate 75 357 N/m, ride rate 60 922 N/m, 2.22 Hz.
    expect(ride?.after).toBeCloseTo(2.22, 2);
    // The same formulas by hand for the old spring [calc: kw = k·MR², kr = kw·kt/(kw+kt), f = √(kr/ms)/2π]:
    const kw = 120_000 * 0.7334 ** 2;
    const kr = (kw * 318_030) / (kw + 318_030);
    expect(ride?.before).toBeCloseTo(Math.sqrt(kr / 312) / (2 * Math.PI), 10);
    // ζ and wheel hop depend on the wheel rate too (ζ = c/2√(kw·ms), hop = √((kw+kt)/mu)/2π): they move, at FL only.
    expect(d.figures.map((f) => f.figure).sort()).toEqual(
      ['dampingRatioBump', 'dampingRatioRebound', 'rideFrequencyHz', 'wheelHopFrequencyHz'].sort(),
    );
    const hop = d.figures.find((f) => f.figure === 'wheelHopFrequencyHz');
    expect(hop?.after).toBeCloseTo(Math.sqrt((140_101 * 0.7334 ** 2 + 318_030) / 40) / (2 * Math.PI), 10);
  });

  it('reports nothing for two equal sheets', () => {
    const d = setupDiff(sheetOf(setupFileFixture()), sheetOf(setupFileFixture()));
    expect(d).toEqual({ fields: [], figures: [] });
    expect(setupDiffSummary(d)).toBe('no changes');
  });

  it('changes only sheet fields without touching the figures', () => {
    const a = setupFileFixture();
    const b = setupFileFixture();
    b.corners.RR.clicks = { bump: 6, rebound: 8 };
    b.corners.RR.tirePressureCold = '1.9 bar';
    b.antiRollBar = { front: 'hole 2', rear: 'disconnected' };
    const d = setupDiff(sheetOf(a), sheetOf(b));
    expect(d.figures).toEqual([]);
    expect(d.fields.map((f) => [f.field, f.before, f.after, f.unit])).toEqual([
      ['antiRollBar.rear', 'hole 3', 'disconnected', ''],
      ['corners.RR.clicks.rebound', '6', '8', 'clicks'],
      ['corners.RR.tirePressureCold', '170', '190', 'kPa'],
    ]);
  });

  it('walks the corner input generically: a damper going from bilinear to linear drops its knee and high-speed slope', () => {
    const a = setupFileFixture();
    const b = setupFileFixture();
    (cornerOf(b, 'FR').damper as Record<string, unknown>).bump = { lowSpeed: '3600 N*s/m' };
    const d = setupDiff(sheetOf(a), sheetOf(b));
    expect(d.fields.map((f) => [f.field, f.before, f.after])).toEqual([
      ['corners.FR.corner.damper.bump.kneeSpeed', '0.05', null],
      ['corners.FR.corner.damper.bump.highSpeed', '1300', null],
    ]);
    // The high-speed bump ratio changed; the figures the diff reports (low-speed ζ) did not.
    expect(d.figures).toEqual([]);
  });

  it('shows a bump stop added as new fields with no old value', () => {
    const a = setupFileFixture();
    const b = setupFileFixture();
    cornerOf(b, 'RL').bumpStop = { gap: '30 mm', rate: '250 N/mm' };
    const d = setupDiff(sheetOf(a), sheetOf(b));
    expect(d.fields.map((f) => [f.field, f.before, f.after, f.unit])).toEqual([
      ['corners.RL.corner.bumpStop.gap', null, '30', 'mm'],
      ['corners.RL.corner.bumpStop.rate', null, '250', 'N/mm'],
    ]);
  });

  it('keeps each unit with its value when toe changes from a length to an angle', () => {
    const a = setupFileFixture();
    const b = setupFileFixture();
    b.corners.FL.toe = '0.05 deg';
    const [change] = setupDiff(sheetOf(a), sheetOf(b)).fields;
    expect(change).toMatchObject({ field: 'corners.FL.toe', before: '1 mm', after: '0.05 deg', unit: '' });
  });

  it('shows values in US units when asked', () => {
    const a = setupFileFixture();
    const b = setupFileFixture();
    cornerOf(b, 'FL').springRate = '80 N/mm';
    const [change] = setupDiff(sheetOf(a), sheetOf(b), 'us').fields;
    // 1 lbf/in = 175.126835… N/m (NIST SP 811 [pub]: lbf 4.4482216152605 N, in 0.0254 m): 70 N/mm = 399.710 lbf/in.
    expect(change).toMatchObject({ unit: 'lbf/in', before: '399.71', after: '456.812' });
  });

  it('tells apart values that differ only far down, with enough digits', () => {
    const a = setupFileFixture();
    const b = setupFileFixture();
    cornerOf(b, 'FL').springRate = 70_000.5;
    const [change] = setupDiff(sheetOf(a), sheetOf(b)).fields;
    expect(change?.before).not.toBe(change?.after);
  });

  it('does not count the round-off of a sheet written in US units and read back as a change', () => {
    const sheet = sheetOf(setupFileFixture());
    const again = setupFileParse(setupFileWrite({ sheet }, 'us')).sheet;
    expect(again.corners.FL.analysis.tireRate).not.toBe(sheet.corners.FL.analysis.tireRate); // 12 digits kept
    expect(setupDiff(sheet, again)).toEqual({ fields: [], figures: [] });
  });
});

describe('setupDiffSummary', () => {
  it('groups the same change on several corners and puts the car before the paperwork', () => {
    const a = setupFileFixture();
    const b = setupFileFixture();
    for (const p of ['RL', 'RR'] as const) cornerOf(b, p).springRate = '65 N/mm';
    b.corners.FL.clicks = { bump: 6, rebound: 4 };
    b.event = 'Round 2';
    b.name = 'Stiffer rear';
    b.notes = 'A long note that the summary only names.';
    b.fuelLoad = '20 kg';
    expect(setupDiffSummary(setupDiff(sheetOf(a), sheetOf(b)))).toBe(
      'rebound clicks FL 6→4; spring rate rear 60→65 N/mm; fuel load 25→20 kg; notes',
    );
  });

  it('names all four corners as "all corners" and cuts a long line', () => {
    const a = setupFileFixture();
    const b = setupFileFixture();
    for (const p of ['FL', 'FR', 'RL', 'RR'] as const) b.corners[p].camber = '-3 deg';
    expect(setupDiffSummary(setupDiff(sheetOf(a), sheetOf(b)))).toBe('camber all corners -2.5→-3 deg');
    for (const p of ['FL', 'FR', 'RL', 'RR'] as const) {
      b.corners[p].springLabel = `label ${p}`;
      b.corners[p].rideHeight = `${80 + p.length} mm`;
      cornerOf(b, p).tireRate = `${250 + p.charCodeAt(1)} N/mm`;
    }
    const line = setupDiffSummary(setupDiff(sheetOf(a), sheetOf(b)), 80);
    expect(line.length).toBeLessThan(120);
    expect(line).toMatch(/… \d+ more$/);
  });

  it('writes stored numbers short, with as many figures as it takes to tell them apart', () => {
    const a = setupFileFixture();
    const b = setupFileFixture();
    // [calc] 1 lbf/in = 4.4482216152605 N ÷ 25.4 mm = 0.175127 N/mm: 400 lbf/in = 70.0507 N/mm, 500 lbf/in = 87.5634 N/mm.
    cornerOf(a, 'FL').springRate = '400 lbf/in';
    cornerOf(b, 'FL').springRate = '500 lbf/in';
    expect(setupDiffSummary(setupDiff(sheetOf(a), sheetOf(b)))).toBe('spring rate FL 70.1→87.6 N/mm');
    // 400 → 400.1 lbf/in: 70.0507 → 70.0682 N/mm, equal at 3 figures (70.1), apart at 4.
    cornerOf(b, 'FL').springRate = '400.1 lbf/in';
    expect(setupDiffSummary(setupDiff(sheetOf(a), sheetOf(b)))).toBe('spring rate FL 70.05→70.07 N/mm');
  });

  it('leaves dates, texts and an absent side alone when shortening', () => {
    const change = (field: string, before: string | null, after: string | null): SetupFieldChange => ({
      field,
      label: field,
      before,
      after,
      unit: '',
    });
    const rate = (b: string | null, a: string | null) =>
      setupChangeText(change('corners.FL.corner.springRate', b, a));
    expect(rate('399.71', '456.812')).toEqual(['400', '457']);
    expect(rate(null, '12.3456')).toEqual([null, '12.3']);
    expect(rate('-2.8', '-3.2')).toEqual(['-2.8', '-3.2']);
    expect(setupChangeText(change('date', '2025-03-22', '2025-04-12'))).toEqual(['2025-03-22', '2025-04-12']);
    // A text field that happens to read as a number is a text: kept exactly.
    expect(setupChangeText(change('corners.FL.springLabel', '0080', '0090.50'))).toEqual(['0080', '0090.50']);
    expect(setupChangeText(change('antiRollBar.front', 'hole 1 of 5', 'off'))).toEqual([
      'hole 1 of 5',
      'off',
    ]);
  });

  it('says "no setup changes" when only the name, event or date changed', () => {
    const b = setupFileFixture();
    b.name = 'Same car, new day';
    b.date = '2025-05-01';
    expect(setupDiffSummary(setupDiff(sheetOf(setupFileFixture()), sheetOf(b)))).toBe('no setup changes');
  });
});
