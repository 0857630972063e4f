import { readdirSync, readFileSync } from 'node:fs';
import fc from 'fast-check';
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
    // 70 N/mm = 399.71 lbf/in (1 lbf/in = 175.1268 N/m, NIST SP 811 [pub]), written as a shop does.
    expect(us.values['corners.FL.corner.springRate']).toBe('400');
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

  it('shows a US sheet converted from SI as a shop writes it: 650 lb, 514 lbf/in, 20.8 lbf·s/in, 24.7 psi', () => {
    const file = structuredClone(demoFiles()[0] as Record<string, unknown>);
    const fl = (file.corners as Record<string, Record<string, unknown>>).FL as Record<string, unknown>;
    const corner = fl.corner as Record<string, unknown>;
    Object.assign(corner, { cornerMass: '295 kg', springRate: '90 N/mm' });
    (corner.damper as { bump: Record<string, unknown> }).bump.lowSpeed = '3643 N*s/m';
    fl.tirePressureCold = '170 kPa';
    const us = setupFormConvert(setupFormFromFile(file, 'si'), 'us');
    // NIST SP 811 factors [pub]: 650.364 lb, 513.92 lbf/in, 20.802 lbf·s/in, 24.656 psi [calc].
    expect(us.values['corners.FL.corner.cornerMass']).toBe('650');
    expect(us.values['corners.FL.corner.springRate']).toBe('514');
    expect(us.values['corners.FL.corner.damper.bump.lowSpeed']).toBe('20.8');
    expect(us.values['corners.FL.tirePressureCold']).toBe('24.7');
    // A value entered in the unit shown reads as entered, every figure kept.
    const typed = setupFormSet(us, 'corners.FL.corner.springRate', '513.25');
    expect(setupFormFromFile(setupFormToFile(typed), 'us').values['corners.FL.corner.springRate']).toBe(
      '513.25',
    );
  });

  it('never changes a stored value by rounding what it shows, however often the units switch (property)', () => {
    const base = demoFiles()[0] as Record<string, unknown>;
    fc.assert(
      fc.property(
        fc.double({ min: 50, max: 900, noNaN: true }),
        fc.double({ min: 5_000, max: 500_000, noNaN: true }),
        fc.double({ min: 100, max: 20_000, noNaN: true }),
        fc.integer({ min: 1, max: 3 }),
        (mass, rate, damping, switches) => {
          const file = structuredClone(base);
          const corner = (
            (file.corners as Record<string, Record<string, unknown>>).RL as Record<string, unknown>
          ).corner as Record<string, unknown>;
          Object.assign(corner, { cornerMass: mass, springRate: rate });
          (corner.damper as { rebound: Record<string, unknown> }).rebound.lowSpeed = damping;
          let form = setupFormFromFile(file, 'si');
          for (let i = 0; i < switches; i++) form = setupFormConvert(setupFormConvert(form, 'us'), 'si');
          const us = setupFormConvert(form, 'us');
          for (const f of [form, us]) {
            const back = setupFileParse(setupFormToFile(f)).sheet.corners.RL.analysis;
            if (back.cornerMass !== mass || back.springRate !== rate) return false;
            const d = back.damper.rebound;
            if (d.kind !== 'linear' && d.kind !== 'bilinear') return false;
            if ((d.kind === 'linear' ? d.coefficient : d.lowSpeed) !== damping) return false;
          }
          return true;
        },
      ),
      { numRuns: 40 },
    );
  });
});
