import { describe, expect, it } from 'vitest';
import { VALVING_HEADLINE_SENSE, valvingHeadlineVerdict } from '../../../core/valving/valving-compare';
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

  it('calls a damping ratio better as it comes nearer its band, and the same anywhere inside it', () => {
    const band = targets.bumpLowSpeed as { low: number; high: number };
    expect(valvingHeadlineVerdict('zetaBump', band.low - 0.2, band.low - 0.05, targets)).toBe('better');
    expect(valvingHeadlineVerdict('zetaBump', band.high + 0.01, band.high + 0.3, targets)).toBe('worse');
    expect(valvingHeadlineVerdict('zetaBump', band.low, band.high, targets)).toBe('same');
  });

  it('gives no verdict where a figure has no sense, a value is missing or the target is off', () => {
    expect(valvingHeadlineVerdict('bodyFrequencyHz', 1.9, 2.1, targets)).toBeNull();
    expect(valvingHeadlineVerdict('zetaBump', null, 0.5, targets)).toBeNull();
    const { bumpLowSpeed: _off, ...rest } = targets;
    expect(valvingHeadlineVerdict('zetaBump', 0.1, 0.5, rest)).toBeNull();
  });
});
