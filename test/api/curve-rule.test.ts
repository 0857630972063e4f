import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { cornerFileParse } from '../../core/corner/corner-file';
import { eventSimulate } from '../../core/events/simulate';
import { valvingEventsOf } from '../../core/valving/valving-evaluate';
import { setupFileFixture } from '../core/setup-fixture';
import { freshContext } from './api-fixture';

/** Invented bench points of one damper at one clicker setting (m/s, N; magnitudes), digressive both ways. */
const BUMP: [number, number][] = [
  [0.025, 150],
  [0.05, 280],
  [0.1, 400],
  [0.2, 520],
  [0.3, 620],
  [0.6, 850],
];
const REBOUND: [number, number][] = [
  [0.025, 260],
  [0.05, 480],
  [0.1, 700],
  [0.2, 930],
  [0.3, 1100],
  [0.6, 1500],
];

/** The same points as a bench file, compression positive. */
const BENCH_TEXT = [
  'velocity,force',
  ...[...REBOUND].reverse().map(([v, f]) => `${-v},${-f}`),
  ...BUMP.map(([v, f]) => `${v},${f}`),
].join('\n');

/** Relative agreement: the same figure by the same computation, so to rounding. */
function expectSame(a: number | null | undefined, b: number | null | undefined) {
  expect(typeof a).toBe('number');
  expect(Math.abs((a as number) - (b as number))).toBeLessThanOrEqual(1e-12 * Math.abs(b as number));
}

describe('one rule for a measured curve', () => {
  it('gives one ζ in analyze, damping-map and choose, and choose runs its events on the table itself', async () => {
    const ctx = freshContext();
    const setup = setupFileFixture();
    await apiCall('vehicleAdd', { name: 'Test coupe' }, ctx);
    await apiCall('setupSave', { file: setup, newDamperUnits: ['T-1', 'T-2'] }, ctx);
    await apiCall(
      'benchImport',
      { damper: 'T-1', source: { text: BENCH_TEXT, name: 'sweep.csv' }, clicks: 'bump 6 rebound 6' },
      ctx,
    );
    // The front left corner of the sheet with the bench table as its damper, as a corner file.
    const cornerFile = {
      corner: {
        ...setup.corners.FL.corner,
        damper: { bump: { points: BUMP }, rebound: { points: REBOUND } },
      },
    };
    const analyzed = await apiCall('analyzeCorner', { file: cornerFile }, ctx);
    const map = await apiCall('valvingMap', { vehicle: 'Test coupe', corner: 'FL' }, ctx);
    const chosen = await apiCall(
      'valvingChoose',
      { vehicle: 'Test coupe', corners: ['FL'], preset: 'track-day', threads: 0 },
      ctx,
    );
    const cell = map.cells[0];
    const pick = chosen.corners[0]?.best[0];
    expect(map.cells).toHaveLength(1);
    expect(pick?.clicks).toEqual({ bump: 6, rebound: 6 });
    for (const key of ['bump', 'rebound', 'bumpHighSpeed', 'reboundHighSpeed'] as const) {
      expectSame(cell?.figures.dampingRatio[key], analyzed.dampingRatio[key]);
    }
    expectSame(pick?.headline.zetaBump, analyzed.dampingRatio.bump);
    expectSame(pick?.headline.zetaRebound, analyzed.dampingRatio.rebound);
    expectSame(pick?.headline.zetaBumpHighSpeed, analyzed.dampingRatio.bumpHighSpeed);
    expectSame(pick?.headline.zetaReboundHighSpeed, analyzed.dampingRatio.reboundHighSpeed);
    // The slopes the map shows are the least-squares bilinear fit of the points: below the
    // knee, the fit through zero of the points under it. [calc] numpy lstsq over a knee scan
    // with scipy's bounded minimize_scalar: bump knee between 0.05 and 0.1 m/s, so the
    // low-speed slope is (0.025·150 + 0.05·280)/(0.025² + 0.05²) = 5680 N·s/m.
    expect(cell?.damper.bump.lowSpeed).toBeCloseTo(5680, 4);

    // The events: the bump and the curb of the scenario choose judged on (the vehicle's), simulated
    // directly with the table curve.
    const corner = cornerFileParse(cornerFile).corner;
    const events = valvingEventsOf(chosen.scenario);
    const bump = eventSimulate(corner, events.bump).metrics;
    const curb = eventSimulate(corner, events.curb).metrics;
    expectSame(pick?.headline.bumpPeakAccel, bump.peakBodyAccel);
    expectSame(pick?.headline.curbPeakAccel, curb.peakBodyAccel);
    expect(pick?.headline.bumpAirborneTime).toBeCloseTo(bump.airborneTime, 12);
    expect(pick?.headline.curbAirborneTime).toBeCloseTo(curb.airborneTime, 12);
  });
});
