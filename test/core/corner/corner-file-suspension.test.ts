import { describe, expect, it } from 'vitest';
import { bumpStopForce, REBOUND_LIMIT_DEFAULT_RATE } from '../../../core/damper/bump-stop';
import { cornerRideFigures } from '../../../core/corner/corner';
import { cornerInputParse, cornerInputToFile } from '../../../core/corner/corner-file';

/** The invented Millbrook club coupe, rear left, with bench tables (a demo corner). */
const RAW = {
  cornerMass: '280 kg',
  unsprungMass: '40 kg',
  springRate: '80 N/mm',
  springMotionRatio: 0.85,
  tireRate: '240 N/mm',
  tireDamping: '150 N*s/m',
  damper: {
    bump: {
      points: [
        ['0.025 m/s', '150 N'],
        ['0.05 m/s', '280 N'],
        ['0.3 m/s', '620 N'],
      ],
    },
    rebound: { lowSpeed: '5200 N*s/m', kneeSpeed: '0.07 m/s', highSpeed: '1800 N*s/m' },
    gasForce: '160 N',
  },
  bumpStop: {
    gap: '25 mm',
    curve: [
      ['5 mm', '500 N'],
      ['10 mm', '1500 N'],
      ['15 mm', '4000 N'],
    ],
  },
  reboundLimit: { travel: '40 mm' },
  travelLimit: '60 mm',
};

describe('corner inputs for the events', () => {
  it('reads a tabulated damper, gas force, progressive bump stop, rebound and travel limits', () => {
    const c = cornerInputParse(RAW);
    expect(c.damper.bump.kind).toBe('table');
    expect(c.damper.gasForce).toBe(160);
    expect(c.bumpStop && 'curve' in c.bumpStop ? c.bumpStop.curve.length : 0).toBe(3);
    expect(c.reboundLimit).toEqual({ travel: 0.04, rate: REBOUND_LIMIT_DEFAULT_RATE });
    expect(c.travelLimit).toBeCloseTo(0.06, 12);
    // The curve starts at the gap: zero before it, its own points past it.
    const b = c.bumpStop as NonNullable<typeof c.bumpStop>;
    expect(bumpStopForce(b, 0.02)).toBe(0);
    expect(bumpStopForce(b, 0.035)).toBeCloseTo(1500, 9);
    // The linear figures read the table's least-squares bilinear fit, which these three points
    // meet exactly [calc]: 150 N / 0.025 m/s = 6000 N·s/m below the knee, (620 − 280)/0.25 =
    // 1360 N·s/m past it, the lines meeting at 212/4640 = 0.04569 m/s; at the wheel × 0.85².
    expect(cornerRideFigures(c).wheelDamping.bump).toBeCloseTo(6000 * 0.85 ** 2, 5);
    expect(cornerRideFigures(c).wheelDamping.bumpHighSpeed).toBeCloseTo(1360 * 0.85 ** 2, 5);
  });

  it('writes every new field back so that the file reads to the same corner, in SI and US units', () => {
    const c = cornerInputParse(RAW);
    for (const system of ['si', 'us'] as const) {
      const again = cornerInputParse(cornerInputToFile(c, system));
      expect(again.reboundLimit?.travel).toBeCloseTo(0.04, 9);
      expect(again.reboundLimit?.rate).toBeCloseTo(REBOUND_LIMIT_DEFAULT_RATE, 3);
      expect(again.travelLimit).toBeCloseTo(0.06, 9);
      expect(again.damper.gasForce).toBeCloseTo(160, 9);
      const curve = again.bumpStop && 'curve' in again.bumpStop ? again.bumpStop.curve : [];
      expect(curve[2]?.force).toBeCloseTo(4000, 8);
      expect(curve[2]?.compression).toBeCloseTo(0.015, 10);
    }
    expect(cornerInputParse(cornerInputToFile(c))).toEqual(c);
  });

  it('keeps the linear bump stop as it was', () => {
    const c = cornerInputParse({ ...RAW, bumpStop: { gap: '30 mm', rate: '250 N/mm' } });
    expect(c.bumpStop).toEqual({ gap: 0.03, rate: 250_000 });
    expect(cornerInputParse(cornerInputToFile(c)).bumpStop).toEqual(c.bumpStop);
  });

  it('names the field that is wrong', () => {
    const bad = (patch: Record<string, unknown>, re: RegExp) =>
      expect(() => cornerInputParse({ ...RAW, ...patch })).toThrow(re);
    bad(
      { bumpStop: { gap: '25 mm', rate: '250 N/mm', curve: [['5 mm', '500 N']] } },
      /corner\.bumpStop\.curve: cannot be given with rate/,
    );
    bad({ bumpStop: { gap: '25 mm' } }, /corner\.bumpStop\.rate: is missing/);
    bad(
      {
        bumpStop: {
          gap: '25 mm',
          curve: [
            ['5 mm', '500 N'],
            ['4 mm', '900 N'],
          ],
        },
      },
      /corner\.bumpStop\.curve\[1\]: compression .* not above/,
    );
    bad(
      {
        bumpStop: {
          gap: '25 mm',
          curve: [
            ['5 mm', '500 N'],
            ['8 mm', '300 N'],
          ],
        },
      },
      /corner\.bumpStop\.curve\[1\]: force 300 N is below/,
    );
    bad(
      { reboundLimit: { travel: '0 mm' } },
      /corner\.reboundLimit\.travel: rebound travel must be greater than zero/,
    );
    bad(
      { reboundLimit: { travel: '30 mm', stiffness: '1 N/mm' } },
      /corner\.reboundLimit\.stiffness: is not a known field/,
    );
    bad(
      { reboundLimit: { travel: '30 mm', rate: '-5 N/mm' } },
      /corner\.reboundLimit\.rate: top-out rate must be greater than zero/,
    );
    bad({ travelLimit: '-10 mm' }, /corner\.travelLimit: travel limit must be greater than zero/);
    bad({ travelLimit: '10 kg' }, /corner\.travelLimit: got "10 kg" \(a mass\); expected a length/);
    bad({ damper: { ...RAW.damper, bump: { points: [] } } }, /corner\.damper\.bump\.points: has 0 points/);
  });
});
