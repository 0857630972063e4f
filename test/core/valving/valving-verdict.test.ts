import { describe, expect, it } from 'vitest';
import {
  VALVING_HEADLINE_SENSE,
  valvingHeadlineVerdict,
  valvingScoreVerdict,
} from '../../../core/valving/valving-compare';
import { VALVING_HEADLINE_KEYS } from '../../../core/valving/valving-rank';
import { VALVING_PRESETS } from '../../../core/valving/valving-presets';

const targets = VALVING_PRESETS['track-day'].targets;

describe('valvingHeadlineVerdict', () => {
  it('has a sense for every headline figure', () => {
    expect(Object.keys(VALVING_HEADLINE_SENSE).sort()).toEqual([...VALVING_HEADLINE_KEYS].sort());
  });

  it('calls lower better for accelerations, tyre-load variation and time in the air', () => {
    expect(valvingHeadlineVerdict('bumpPeakAccel', 12, 10, targets)).toBe('better');
    expect(valvingHeadlineVerdict('roadTireLoad', 0.2, 0.25, targets)).toBe('worse');
    expect(valvingHeadlineVerdict('bumpAirborneTime', 0, 0, targets)).toBe('same');
    expect(valvingHeadlineVerdict('curbPeakAccel', 10, 10 * (1 + 1e-9), targets)).toBe('same');
  });

  it('calls a change under half a percent the same, and one just over it a change', () => {
    // 0.0912 → 0.0916 in is +0.4 %: no change worth a verdict.
    expect(valvingHeadlineVerdict('roadTravel', 0.0912, 0.0916, targets)).toBe('same');
    expect(valvingHeadlineVerdict('roadTravel', 0.0912, 0.0912 * 1.006, targets)).toBe('worse');
    expect(valvingHeadlineVerdict('roadTravel', 0.0912 * 1.006, 0.0912, targets)).toBe('better');
  });

  it('calls a damping ratio better as it comes nearer the middle of its band, inside it too', () => {
    const band = targets.bumpLowSpeed as { low: number; high: number };
    const mid = (band.low + band.high) / 2;
    expect(valvingHeadlineVerdict('zetaBump', band.low - 0.2, band.low - 0.05, targets)).toBe('better');
    expect(valvingHeadlineVerdict('zetaBump', band.high + 0.01, band.high + 0.3, targets)).toBe('worse');
    // Both inside the band: the one nearer its middle is better, the one further out worse.
    expect(valvingHeadlineVerdict('zetaBump', band.low, mid, targets)).toBe('better');
    expect(valvingHeadlineVerdict('zetaBump', mid, band.high, targets)).toBe('worse');
    // Mirror images about the middle are as good as each other.
    expect(valvingHeadlineVerdict('zetaBump', band.low, band.high, targets)).toBe('same');
  });

  it('judges a +4.7 % ride frequency inside its band, which the old rule called the same', () => {
    const band = targets.rideFrequency as { low: number; high: number };
    expect([band.low, band.high]).toEqual([1, 2.5]); // the track-day preset's band (valving-presets.ts)
    // 2.00 → 2.094 Hz (+4.7 %): both inside 1–2.5 Hz, further from its 1.75 Hz middle.
    expect(valvingHeadlineVerdict('rideFrequencyHz', 2, 2 * 1.047, targets)).toBe('worse');
    expect(valvingHeadlineVerdict('rideFrequencyHz', 2 * 1.047, 2, targets)).toBe('better');
    // Under half a percent stays the same, inside the band or not.
    expect(valvingHeadlineVerdict('rideFrequencyHz', 2, 2 * 1.004, targets)).toBe('same');
  });

  it('judges a band open at one end by the distance to the band, the same anywhere inside', () => {
    const open = { ...targets, rideFrequency: { ...targets.rideFrequency!, low: 1.0, high: null } };
    expect(valvingHeadlineVerdict('rideFrequencyHz', 0.8, 0.9, open)).toBe('better');
    expect(valvingHeadlineVerdict('rideFrequencyHz', 1.1, 1.4, open)).toBe('same');
  });

  it('calls a lower score better, and one within half a percent the same', () => {
    expect(valvingScoreVerdict(0.4, 0.1)).toBe('better');
    expect(valvingScoreVerdict(0, 0.01)).toBe('worse');
    expect(valvingScoreVerdict(0, 0)).toBe('same');
    expect(valvingScoreVerdict(1, 1.004)).toBe('same');
  });

  it('gives no verdict where a figure has no sense, a value is missing or the target is off', () => {
    expect(valvingHeadlineVerdict('bodyFrequencyHz', 1.9, 2.1, targets)).toBeNull();
    expect(valvingHeadlineVerdict('zetaBump', null, 0.5, targets)).toBeNull();
    const { bumpLowSpeed: _off, ...rest } = targets;
    expect(valvingHeadlineVerdict('zetaBump', 0.1, 0.5, rest)).toBeNull();
  });
});
