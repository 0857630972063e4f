import { describe, expect, it } from 'vitest';
import { analysisFigureGroups } from '../../app/renderer/analysis-figures';
import { setupAnalyze } from '../../app/renderer/analysis-result';
import {
  SCENARIO_FIELDS,
  scenarioEditsOf,
  scenarioFieldEdit,
  scenarioFieldValue,
  scenarioTexts,
} from '../../app/renderer/scenario-model';
import { RIDE_SCENARIO_DEFAULT, rideScenarioParse } from '../../core/valving/ride-scenario';
import { figureNumbersRead } from './figure-read-back';
import { WORKED_CORNER, fourOf } from './worked-corner';

describe('the scenario on the screens', () => {
  it('writes each field in the unit system shown, and reading the shown text back lands within its rounding', () => {
    const us = scenarioTexts(RIDE_SCENARIO_DEFAULT, 'us');
    // 25 mm = 0.9843 in; 80 km/h = 49.71 mph (1 in = 25.4 mm, 1 mi = 1609.344 m exactly, NIST SP 811) [pub]
    expect(us['bump.height']).toBe('0.9843');
    expect(us['road.speed']).toBe('49.71');
    expect(scenarioTexts(RIDE_SCENARIO_DEFAULT, 'si')['bump.height']).toBe('25');
    for (const f of SCENARIO_FIELDS) {
      const r = scenarioFieldEdit(RIDE_SCENARIO_DEFAULT, f.key, us[f.key] as string, 'us');
      if (!('scenario' in r)) throw new Error(`${f.key}: ${r.problem}`);
      const was = scenarioFieldValue(RIDE_SCENARIO_DEFAULT, f);
      const now = scenarioFieldValue(r.scenario, f);
      if (typeof was === 'string') expect(now).toBe(was);
      else expect(Math.abs((now as number) - was) / was).toBeLessThan(5e-4); // 4 significant figures
    }
  });

  it('reads a bare number in the unit shown, a number with a unit as typed, and names what is wrong', () => {
    const inch = scenarioFieldEdit(RIDE_SCENARIO_DEFAULT, 'bump.height', '1', 'us');
    // 1 in = 0.0254 m exactly (NIST SP 811) [pub]
    expect('scenario' in inch && inch.scenario.bump.height).toBeCloseTo(0.0254, 15);
    const mm = scenarioFieldEdit(RIDE_SCENARIO_DEFAULT, 'curb.height', '30 mm', 'us');
    expect('scenario' in mm && mm.scenario.curb.height).toBeCloseTo(0.03, 15);
    const cls = scenarioFieldEdit(RIDE_SCENARIO_DEFAULT, 'road.class', 'e', 'si');
    expect('scenario' in cls && cls.scenario.road.roadClass).toBe('E');
    expect(scenarioFieldEdit(RIDE_SCENARIO_DEFAULT, 'bump.height', 'abc', 'si')).toEqual({
      problem: expect.stringMatching(/could not read "abc"/),
    });
    expect(scenarioFieldEdit(RIDE_SCENARIO_DEFAULT, 'bump.speed', '-3', 'si')).toEqual({
      problem: expect.stringMatching(/greater than zero/),
    });
    expect(scenarioFieldEdit(RIDE_SCENARIO_DEFAULT, 'curb.hold', '', 'si')).toEqual({ problem: 'is needed' });
    // What the screen stores is the scenario itself, SI: read back, it is the same scenario.
    expect(rideScenarioParse(scenarioEditsOf(RIDE_SCENARIO_DEFAULT))).toEqual(RIDE_SCENARIO_DEFAULT);
  });

  it('shows the same figures in SI and in US: read back to SI, every number agrees within the rounding', () => {
    // The figures come from the vehicle's scenario, SI, whichever system shows them.
    const s = RIDE_SCENARIO_DEFAULT;
    const result = setupAnalyze(fourOf(WORKED_CORNER), { road: s.road, bump: s.bump });
    const si = analysisFigureGroups(result, 'si');
    const us = analysisFigureGroups(result, 'us');
    const titles = (g: typeof si) => g.map((x) => x.title);
    expect(titles(us)).toHaveLength(titles(si).length);
    const pairs: [string, string, string][] = si.flatMap((g, i) => [
      [g.key, g.title, us[i]?.title ?? ''] as [string, string, string],
      ...g.rows.map(
        (r, j) => [r.key, r.cells.FL, us[i]?.rows[j]?.cells.FL ?? ''] as [string, string, string],
      ),
    ]);
    expect(pairs.length).toBeGreaterThanOrEqual(25);
    for (const [key, a, b] of pairs) {
      const x = figureNumbersRead(a, 'si');
      const y = figureNumbersRead(b, 'us');
      expect(y.length, `${key}: ${a} | ${b}`).toBe(x.length);
      x.forEach((n, k) => {
        const m = y[k] as (typeof y)[number];
        expect(Math.abs(n.si - m.si), `${key}: "${a}" against "${b}"`).toBeLessThanOrEqual(
          n.halfStep + m.halfStep + 1e-12,
        );
      });
    }
  });
});
