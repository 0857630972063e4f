import { describe, expect, it } from 'vitest';
import { setupFieldLabel, setupFormDamperRefs, setupProblemText } from '../../app/renderer/setup-field-words';
import { setupFormBlank, setupFormCorner, setupFormSet } from '../../app/renderer/setup-form';

describe('the setup sheet speaks in field names, not keys', () => {
  it('names a field by its label, with its corner when asked', () => {
    expect(setupFieldLabel('corners.FL.corner.cornerMass')).toBe('Corner mass');
    expect(setupFieldLabel('corners.RR.corner.springRate', true)).toBe('RR spring rate');
    expect(setupFieldLabel('fuelLoad')).toBe('Fuel load');
    // Fields the sheet has no input for still read as words.
    expect(setupFieldLabel('corners.FL.corner.reboundLimit.travel')).toBe('travel');
    expect(setupFieldLabel('corners.FL.corner.bumpStop.curve')).toBe('curve');
  });

  it('puts the label in front of a problem that continues it, and leaves whole sentences alone', () => {
    expect(setupProblemText('corners.FL.corner.cornerMass', 'is missing')).toBe('Corner mass is missing');
    expect(setupProblemText('corners.FL.corner.unsprungMass', 'must be less than the corner mass')).toBe(
      'Unsprung mass must be less than the corner mass',
    );
    expect(setupProblemText('corners.FL.corner.springRate', 'Spring rate is needed')).toBe(
      'Spring rate is needed',
    );
    // What the live panel of an empty corner shows: no key, no colon.
    const empty = setupFormCorner(setupFormBlank('si'), 'FL');
    expect('error' in empty).toBe(true);
    if ('error' in empty) {
      const text = setupProblemText(empty.error.field, empty.error.problem);
      expect(text).toBe('Corner mass is missing');
      expect(text).not.toMatch(/cornerMass|:/);
    }
  });

  it('asks about the dampers of the corners that read, with their unit and clicks', () => {
    let form = setupFormBlank('si', 'New');
    for (const [k, v] of Object.entries({
      'corner.cornerMass': '295',
      'corner.unsprungMass': '38',
      'corner.springRate': '80',
      'corner.springMotionRatio': '0.9',
      'corner.tireRate': '240',
      'corner.damper.bump.lowSpeed': '3640',
      'corner.damper.rebound.lowSpeed': '6030',
      damperUnit: 'MB-DA-1',
      'clicks.bump': '3',
      'clicks.rebound': '9',
    }))
      form = setupFormSet(form, `corners.FL.${k}`, v);
    const refs = setupFormDamperRefs(form);
    expect(refs.map((r) => r.position)).toEqual(['FL']);
    expect(refs[0]).toMatchObject({ damperUnit: 'MB-DA-1', clicks: { bump: 3, rebound: 9 } });
    // A click count that does not read leaves the corner out until it does.
    expect(setupFormDamperRefs(setupFormSet(form, 'corners.FL.clicks.bump', 'three'))).toEqual([]);
  });
});
