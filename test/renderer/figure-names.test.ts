import { describe, expect, it } from 'vitest';
import { analysisFigureGroups } from '../../app/renderer/analysis-figures';
import { setupAnalyze } from '../../app/renderer/analysis-result';
import { FIGURES, figureText } from '../../core/units/figure-labels';
import { RIDE_SCENARIO_DEFAULT } from '../../core/valving/ride-scenario';
import { VALVING_HEADLINES } from '../../core/valving/valving-rank';
import { VALVING_TARGET_SPECS } from '../../core/valving/valving-targets';
import { WORKED_CORNER, fourOf } from './worked-corner';

describe('one name and one unit per figure', () => {
  const s = RIDE_SCENARIO_DEFAULT;
  const result = setupAnalyze(fourOf(WORKED_CORNER), { road: s.road, bump: s.bump });
  const rows = new Map(
    analysisFigureGroups(result, 'us')
      .flatMap((g) => g.rows)
      .map((r) => [r.key, r]),
  );

  it('names the time a tyre spends off the road alike on Ride figures, in the headlines and in the targets, in ms', () => {
    const airborne = rows.get('bumpAirborne');
    expect(airborne?.label).toBe('Time in the air');
    expect(airborne?.cells.FL).toMatch(/^\d+\.\d ms$/);
    expect(VALVING_HEADLINES.bumpAirborneTime.label).toBe('bump: time in the air');
    expect(VALVING_HEADLINES.curbAirborneTime.label).toBe('curb: time in the air');
    expect(VALVING_TARGET_SPECS.airborneTime.figures.map((f) => f.figure)).toEqual([
      'bump: time in the air',
      'curb: time in the air',
    ]);
    expect(rows.get('bumpStopTime')?.label).toBe('Time on the bump stop');
    expect(rows.get('bumpStopTime')?.cells.FL).toMatch(/ ms$/);
  });

  it('takes every road and bump row of Ride figures from the one table', () => {
    const names = new Set(Object.values(FIGURES).map((f) => f.label.toLowerCase()));
    for (const key of [
      'roadBodyAccel',
      'roadBodyAccelWeighted',
      'roadTireLoad',
      'roadTravel',
      'bumpPeakAccel',
    ])
      expect(names.has(rows.get(key)?.label.toLowerCase() ?? '')).toBe(true);
    expect(VALVING_HEADLINES.bumpPeakAccel.label).toBe(`bump: ${FIGURES.peakBodyAccel.label}`);
    expect(VALVING_HEADLINES.roadTireLoad.label).toBe(`road: ${FIGURES.roadTireLoad.label}`);
  });

  it('writes short event times in ms and shares in % in either unit system', () => {
    expect(figureText('airborneTime', 0.0262, 'us')).toBe('26.2 ms');
    expect(figureText('airborneTime', 0.0262, 'si')).toBe('26.2 ms');
    expect(figureText('roadTireLoad', 0.3546, 'si')).toBe('35.5 %');
    // 1 lbf = 4.4482216152605 N exactly (NIST SP 811, appendix B) [pub]: 4448.2 N = 1000 lbf.
    expect(figureText('maxTireLoad', 4448.2216152605, 'us')).toBe('1000 lbf');
  });
});
