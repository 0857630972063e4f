import { describe, expect, it } from 'vitest';
import { testCorner } from '../test-corner';
import { cornerRideFigures, type CornerInput } from '../../../core/corner/corner';
import { cornerAnalyze } from '../../../core/figures/corner-analysis';
import { WARNING_BANDS, cornerWarnings } from '../../../core/corner/warnings';
import { MILLBROOK_FRONT_LEFT } from '../demo-corner';

const corner = testCorner;
const codes = (c: CornerInput) => cornerAnalyze({ name: '', corner: c }).warnings.map((w) => w.code);
const linear = (bump: number, rebound: number): CornerInput['damper'] => ({
  bump: { kind: 'linear', coefficient: bump },
  rebound: { kind: 'linear', coefficient: rebound },
});

describe('cornerWarnings', () => {
  it('uses the trade bands of the issue [trade]', () => {
    // Common practice, no single source (REFERENCES §6): wide bands on purpose.
    expect(WARNING_BANDS.rideFrequencyHz).toEqual({ low: 0.5, high: 5 });
    expect(WARNING_BANDS.wheelHopFrequencyHz).toEqual({ low: 8, high: 20 });
    expect(WARNING_BANDS.lowSpeedDampingRatio).toEqual({ low: 0.15, high: 1.2 });
    expect(WARNING_BANDS.unsprungRatio).toEqual({ low: 0.05, high: 0.3 });
  });

  it('says nothing about a sound corner', () => {
    expect(codes(corner())).toEqual([]);
  });

  it('warns of a ride frequency below 0.5 Hz or above 5 Hz', () => {
    expect(codes(corner({ springRate: 2500 }))).toContain('ride-frequency-low');
    expect(codes(corner({ springRate: 600_000, tireRate: 3e6 }))).toContain('ride-frequency-high');
  });

  it('warns of a wheel hop outside 8–20 Hz', () => {
    expect(codes(corner({ unsprungMass: 140, tireRate: 150_000 }))).toContain('wheel-hop-low');
    expect(codes(corner({ unsprungMass: 15, tireRate: 400_000 }))).toContain('wheel-hop-high');
  });

  it('warns of low-speed ζ below 0.15 or above 1.2, per direction', () => {
    const figures = cornerRideFigures(corner());
    const cc = figures.criticalDamping / 0.64;
    expect(codes(corner({ damper: linear(0.1 * cc, 0.5 * cc) }))).toContain('damping-low-bump');
    expect(codes(corner({ damper: linear(0.5 * cc, 1.5 * cc) }))).toContain('damping-high-rebound');
  });

  it('warns when rebound is softer than bump, and says why it matters', () => {
    const w = cornerAnalyze({ name: '', corner: corner({ damper: linear(5000, 3000) }) }).warnings;
    const found = w.find((x) => x.code === 'rebound-softer-than-bump');
    expect(found?.message).toMatch(/softer than bump/);
    expect(found?.message).toMatch(/rebound controls the body/);
    expect(found?.field).toBe('damper.rebound.lowSpeed');
  });

  it('writes the damping in the unit system asked for', () => {
    const c = corner({ damper: linear(5000, 3000) });
    const f = cornerRideFigures(c);
    const message = (units: 'si' | 'us') =>
      cornerWarnings(f, undefined, undefined, units).find((x) => x.code === 'rebound-softer-than-bump')
        ?.message ?? '';
    // 1 lbf·s/in = 4.4482216152605 N ÷ 0.0254 m/s = 175.1268 N·s/m (exact definitions of the lbf and the inch).
    const perLbfSIn = 4.4482216152605 / 0.0254;
    expect(message('si')).toContain(`(${f.wheelDamping.rebound.toFixed(0)} N·s/m at the wheel)`);
    // Converted figures are written as a shop writes them: three significant figures.
    const shop = (v: number) => String(Number(v.toPrecision(3)));
    expect(message('us')).toContain(`(${shop(f.wheelDamping.rebound / perLbfSIn)} lbf·s/in at the wheel)`);
    expect(message('us')).toContain(`bump (${shop(f.wheelDamping.bump / perLbfSIn)} lbf·s/in)`);
    expect(message('us')).not.toMatch(/N·s\/m/);
  });

  it('warns of an unsprung ÷ sprung ratio outside 0.05–0.3', () => {
    expect(codes(corner({ unsprungMass: 10, tireRate: 120_000 }))).toContain('unsprung-ratio');
    expect(codes(corner({ unsprungMass: 90 }))).toContain('unsprung-ratio');
  });

  it('warns when the damping is so stiff that body and wheel move as one on the tyre', () => {
    // The remaining oscillation sits near √(kt/(ms+mu)) = 4.6 Hz, the two masses on the tyre [calc].
    const cc = cornerRideFigures(corner()).criticalDamping / 0.64;
    const a = cornerAnalyze({ name: '', corner: corner({ damper: linear(2.5 * cc, 3 * cc) }) });
    expect(a.modes.body?.frequencyHz).toBeCloseTo(Math.sqrt(250_000 / 300) / (2 * Math.PI), 0);
    expect(a.warnings.map((w) => w.code)).toContain('suspension-locked');
  });

  it('warns when the body mode does not oscillate at all', () => {
    // Stiff damping and a heavily damped tyre: every eigenvalue is real [calc].
    const cc = cornerRideFigures(corner()).criticalDamping / 0.64;
    const c = corner({ damper: linear(2.5 * cc, 3 * cc), tireDamping: 30_000 });
    expect(codes(c)).toContain('body-mode-overdamped');
  });

  it('states what it saw in every message', () => {
    const f = cornerRideFigures(corner({ springRate: 2500 }));
    const w = cornerWarnings(f);
    expect(w[0]?.message).toContain(f.rideFrequencyHz.toFixed(2));
  });
});

describe('random-road warnings', () => {
  const onRoad = (roadClass: 'C' | 'D', units: 'si' | 'us' = 'si') =>
    cornerAnalyze({ name: '', corner: MILLBROOK_FRONT_LEFT, road: { roadClass, speed: 25 } }, { units });

  it('warns when the dynamic tyre load RMS passes half the static load [trade]', () => {
    // Common practice: above about half the static load the tyre is barely in contact.
    expect(WARNING_BANDS.tireLoadRmsRatio.high).toBe(0.5);
    const c = onRoad('C');
    const d = onRoad('D');
    // README's worked example: 35.5 % on class C at 90 km/h. ISO 8608 [pub]: each class doubles
    // the road's RMS height, so the linear model's tyre load RMS doubles too: 71.1 % on class D.
    expect(c.randomRoad?.tireLoadRmsRatio).toBeCloseTo(0.355, 3);
    expect(d.randomRoad?.tireLoadRmsRatio).toBeCloseTo(2 * (c.randomRoad?.tireLoadRmsRatio as number), 9);
    expect(c.warnings.map((w) => w.code)).not.toContain('tyre-load-rms-high');
    const w = d.warnings.find((x) => x.code === 'tyre-load-rms-high');
    expect(w?.field).toBe('road');
    expect(w?.message).toMatch(
      /^On the class D road at 90\.0 km\/h the dynamic tyre load RMS is 71 % of the static load, above 50 %: the tyre is barely in contact/,
    );
    expect(onRoad('D', 'us').warnings.find((x) => x.code === 'tyre-load-rms-high')?.message).toMatch(
      /class D road at 55\.9 mph/,
    );
  });
});
