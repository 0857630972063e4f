import { readdirSync, readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { setupFileParse } from '../../core/setup/setup-file';
import {
  setupFormBlank,
  setupFormConvert,
  setupFormCorner,
  setupFormFromFile,
  setupFormProblems,
  setupFormSet,
  setupFormToFile,
} from '../../app/renderer/setup-form';

/** Every revision file of the invented demo shop. */
const demoFiles = () => {
  const dir = new URL('../../assets/demo/setups/', import.meta.url);
  return readdirSync(dir, { recursive: true })
    .map(String)
    .filter((f) => f.endsWith('.json'))
    .sort()
    .map((f) => JSON.parse(readFileSync(new URL(f, dir), 'utf8')) as Record<string, unknown>);
};

describe('the setup editor model', () => {
  it('round-trips every demo revision: the form writes a file that reads to the same sheet', () => {
    for (const file of demoFiles()) {
      const form = setupFormFromFile(file, 'si');
      expect(setupFormProblems(form)).toEqual(new Map());
      const back = setupFileParse(setupFormToFile(form)).sheet;
      const want = setupFileParse(file).sheet;
      expect(back.corners.FL.analysis.springRate).toBeCloseTo(want.corners.FL.analysis.springRate, 6);
      expect(back.corners.RR.analysis.damper).toEqual(want.corners.RR.analysis.damper);
      expect(back.name).toBe(want.name);
    }
  });

  it('converts SI ⇄ US in place without changing a value', () => {
    const file = demoFiles()[0] as Record<string, unknown>;
    const si = setupFormFromFile(file, 'si');
    const us = setupFormConvert(si, 'us');
    expect(us.values['corners.FL.corner.springRate']).toBe(
      String(Number(((70_000 * 0.0254) / 4.4482216152605).toPrecision(6))),
    );
    const back = setupFormConvert(us, 'si');
    expect(back.values['corners.FL.corner.springRate']).toBe('70');
    expect(setupFileParse(setupFormToFile(us)).sheet.corners.FL.analysis.springRate).toBeCloseTo(70_000, 6);
  });

  it('keeps a field that does not read exactly as typed when the units change', () => {
    const form = setupFormSet(
      setupFormFromFile(demoFiles()[0] as Record<string, unknown>, 'si'),
      'corners.FL.corner.springRate',
      '70 kg',
    );
    expect(setupFormConvert(form, 'us').values['corners.FL.corner.springRate']).toBe('70 kg');
  });

  it('names each bad field with its problem, and cross-field problems after', () => {
    let form = setupFormBlank('us', 'New');
    expect(setupFormProblems(form).get('corners.FL.corner.springRate')).toBe('Spring rate is needed');
    form = setupFormSet(form, 'corners.FL.corner.springRate', '70 kg');
    expect(setupFormProblems(form).get('corners.FL.corner.springRate')).toMatch(/got "70 kg" \(a mass\)/);
    const ok = setupFormFromFile(demoFiles()[0] as Record<string, unknown>, 'si');
    const heavy = setupFormSet(ok, 'corners.RL.corner.unsprungMass', '400');
    expect(setupFormProblems(heavy).get('corners.RL.corner.unsprungMass')).toMatch(
      /must be less than the corner mass/,
    );
  });

  it('reads a corner typed in US units for the live figures', () => {
    let form = setupFormBlank('us', 'New');
    for (const [k, v] of Object.entries({
      cornerMass: '650',
      unsprungMass: '84',
      springRate: '400',
      springMotionRatio: '0.9',
      tireRate: '1370',
      'damper.bump.lowSpeed': '18',
      'damper.rebound.lowSpeed': '32',
    })) {
      form = setupFormSet(form, `corners.FL.corner.${k}`, v);
    }
    const r = setupFormCorner(form, 'FL');
    expect('corner' in r && r.corner.springRate).toBeCloseTo((400 * 4.4482216152605) / 0.0254, 6);
    expect('error' in setupFormCorner(form, 'FR')).toBe(true);
  });
});
