import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { cornerFileParse, cornerInputParse, cornerInputToFile } from '../../../core/corner/corner-file';
import { InputError } from '../../../core/units/input-error';

const demo = JSON.parse(
  readFileSync(new URL('../../../assets/demo/club-coupe-front-left.json', import.meta.url), 'utf8'),
) as {
  corner: Record<string, unknown>;
};

const withCorner = (over: Record<string, unknown>) => ({ corner: { ...demo.corner, ...over } });

function messageOf(raw: unknown): string {
  try {
    cornerFileParse(raw);
  } catch (e) {
    expect(e).toBeInstanceOf(InputError);
    return (e as Error).message;
  }
  throw new Error('expected an InputError');
}

describe('cornerFileParse', () => {
  it('reads the demo file, units and all, into SI', () => {
    const f = cornerFileParse(demo);
    expect(f.corner.cornerMass).toBe(295);
    expect(f.corner.springRate).toBe(70_000);
    expect(f.corner.damper.bump).toEqual({
      kind: 'bilinear',
      lowSpeed: 3200,
      kneeSpeed: 0.08,
      highSpeed: 1100,
    });
    expect(f.corner.bumpStop?.gap).toBeCloseTo(0.03, 15);
    expect(f.road).toEqual({ roadClass: 'C', speed: 25 });
    expect(f.bump?.height).toBeCloseTo(0.025, 15);
  });

  it('defaults the damper motion ratio to the spring one and tyre damping to zero', () => {
    const { damperMotionRatio: _d, ...rest } = demo.corner;
    const c = cornerInputParse({ ...rest, springMotionRatio: 0.75 });
    expect(c.damperMotionRatio).toBe(0.75);
    expect(c.tireDamping).toBe(0);
  });

  it('reads a linear damper from a low-speed coefficient alone, in US units', () => {
    const c = cornerInputParse({
      ...demo.corner,
      damper: { bump: { lowSpeed: '12 lbf*s/in' }, rebound: { lowSpeed: '20 lbf*s/in' } },
    });
    expect(c.damper.bump.kind).toBe('linear');
    expect(c.damper.bump.kind === 'linear' && c.damper.bump.coefficient).toBeCloseTo(
      (12 * 4.4482216152605) / 0.0254,
      6,
    );
  });

  it.each([
    [
      'a wrong unit',
      withCorner({ springRate: '70 kg' }),
      /^corner\.springRate: got "70 kg" \(a mass\); expected a rate/,
    ],
    ['a missing field', { corner: { ...demo.corner, tireRate: undefined } }, /^corner\.tireRate: is missing/],
    [
      'an unknown field (a typo)',
      withCorner({ tyreRate: '250 N/mm' }),
      /^corner\.tyreRate: is not a known field here/,
    ],
    [
      'unsprung above the corner mass',
      withCorner({ unsprungMass: '400 kg' }),
      /^corner\.unsprungMass: unsprung mass/,
    ],
    [
      'a zero motion ratio',
      withCorner({ springMotionRatio: 0 }),
      /^corner\.springMotionRatio: spring motion ratio must be greater than zero/,
    ],
    [
      'a motion ratio with a unit',
      withCorner({ springMotionRatio: '0.9 mm' }),
      /^corner\.springMotionRatio: got "0\.9 mm"/,
    ],
    ['NaN as text', withCorner({ cornerMass: 'NaN' }), /^corner\.cornerMass:/],
    [
      'a negative damper coefficient',
      withCorner({ damper: { bump: { lowSpeed: '-5 N*s/m' }, rebound: { lowSpeed: 1 } } }),
      /^corner\.damper\.bump\.lowSpeed: must be greater than zero/,
    ],
    [
      'a knee without a high-speed slope',
      withCorner({ damper: { bump: { lowSpeed: 1, kneeSpeed: '0.1 m/s' }, rebound: { lowSpeed: 1 } } }),
      /^corner\.damper\.bump\.highSpeed: is missing/,
    ],
    [
      'a missing rebound',
      withCorner({ damper: { bump: { lowSpeed: 1 } } }),
      /^corner\.damper\.rebound: is missing/,
    ],
    [
      'a bump stop without a rate',
      withCorner({ bumpStop: { gap: '30 mm' } }),
      /^corner\.bumpStop\.rate: is missing/,
    ],
    [
      'an unknown road class',
      { ...withCorner({}), road: { class: 'Z', speed: '80 km/h' } },
      /^road\.class: got "Z"; expected an ISO 8608 class/,
    ],
    [
      'a road speed in the wrong unit',
      { ...withCorner({}), road: { class: 'B', speed: '80 km' } },
      /^road\.speed: got "80 km" \(a length\)/,
    ],
    [
      'a zero bump height',
      { ...withCorner({}), bump: { height: 0, length: '0.5 m', speed: '10 m/s' } },
      /^bump\.height: must be greater than zero/,
    ],
    ['no corner at all', { name: 'x' }, /^corner: is missing/],
    ['a list instead of an object', [1, 2], /expected an object/],
    ['a name that is not text', { ...withCorner({}), name: 5 }, /^name: expected a string/],
  ])('rejects %s, naming the field', (_what, raw, message) => {
    expect(messageOf(raw)).toMatch(message);
  });
});

describe('cornerInputToFile', () => {
  it('writes a corner that reads back to the same SI values, in either unit system', () => {
    const c = cornerInputParse(demo.corner);
    for (const system of ['si', 'us'] as const) {
      const back = cornerInputParse(cornerInputToFile(c, system));
      expect(back.springRate).toBeCloseTo(c.springRate, 6);
      expect(back.cornerMass).toBeCloseTo(c.cornerMass, 9);
      expect(back.damper.rebound).toEqual(expect.objectContaining({ kind: 'bilinear' }));
      if (back.damper.rebound.kind === 'bilinear' && c.damper.rebound.kind === 'bilinear') {
        expect(back.damper.rebound.kneeSpeed).toBeCloseTo(c.damper.rebound.kneeSpeed, 12);
        expect(back.damper.rebound.highSpeed).toBeCloseTo(c.damper.rebound.highSpeed, 6);
      }
      const rate = (b: typeof c.bumpStop) => (b && 'rate' in b ? b.rate : NaN);
      expect(rate(back.bumpStop)).toBeCloseTo(rate(c.bumpStop), 4);
    }
  });
});
