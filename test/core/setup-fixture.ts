/** One corner of the fixture: the corner file's "corner" object and the sheet fields. */
export type FixtureCorner = { [key: string]: unknown; corner: Record<string, unknown> };

/** The fixture's shape, loose enough for tests to break it field by field. */
export type SetupFixture = {
  [key: string]: unknown;
  corners: { FL: FixtureCorner; FR: FixtureCorner; RL: FixtureCorner; RR: FixtureCorner };
};

/** An invented setup file for the tests (the demo shop's coupe, simplified). */
export function setupFileFixture(): SetupFixture {
  const corner = (front: boolean) => ({
    corner: {
      cornerMass: front ? '295 kg' : '265 kg',
      unsprungMass: front ? '38 kg' : '40 kg',
      springRate: front ? '70 N/mm' : '60 N/mm',
      springMotionRatio: front ? 0.9 : 0.85,
      tireRate: '240 N/mm',
      damper: {
        bump: { lowSpeed: '3600 N*s/m', kneeSpeed: '0.05 m/s', highSpeed: '1300 N*s/m' },
        rebound: { lowSpeed: '6000 N*s/m', kneeSpeed: '0.06 m/s', highSpeed: '2100 N*s/m' },
      },
    },
    damperUnit: front ? 'T-1' : 'T-2',
    clicks: { bump: 6, rebound: 6 },
    springLabel: front ? '70 N/mm 180 mm' : '60 N/mm 200 mm',
    rideHeight: front ? '95 mm' : '105 mm',
    tirePressureCold: '1.7 bar',
    camber: '-2.5 deg',
    toe: '1 mm',
  });
  return {
    format: 'rideledger-setup',
    version: 1,
    vehicle: 'Test coupe',
    name: 'Baseline',
    event: 'Test day',
    track: 'Millbrook Park',
    driver: 'A. Tester',
    date: '2025-04-12',
    fuelLoad: '25 kg',
    antiRollBar: { front: 'hole 2', rear: 'hole 3' },
    corners: { FL: corner(true), FR: corner(true), RL: corner(false), RR: corner(false) },
  };
}
