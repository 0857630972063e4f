import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { benchRunById, benchRunInsert } from '../../db/queries/bench-run';
import type { BenchRunRow } from '../../db/rows';
import { setupFileFixture } from '../core/setup-fixture';
import { storeDigest } from '../db/store-fixture';
import { freshContext } from './api-fixture';

const TABLE = 'velocity,force\n-0.3,-1500\n-0.2,-1100\n-0.1,-600\n0.1,300\n0.2,500\n0.3,650\n';

describe('bench handlers', () => {
  it('imports text with the run fields given as quantities with units', async () => {
    const ctx = freshContext();
    const out = await apiCall(
      'benchImport',
      {
        damper: 'D-1',
        source: { text: TABLE, name: 'sweep.csv' },
        clicks: 'bump 3 rebound 6',
        date: '2025-02-15',
        stroke: '2 in',
        testFrequency: '1.5 Hz',
        temperature: '104 degF',
        type: 'monotube',
        serial: 'S-9',
      },
      ctx,
    );
    expect(out.damperCreated).toBe(true);
    expect(out.damper).toMatchObject({ label: 'D-1', kind: 'monotube', serial: 'S-9', runCount: 1 });
    const run = out.runs[0];
    // NIST SP 811 [pub]: 1 in = 0.0254 m exactly; 104 °F = 40 °C = 313.15 K.
    expect(run).toMatchObject({
      clicks: { bump: 3, rebound: 6 },
      date: '2025-02-15',
      testFrequency: 1.5,
      sourceName: 'sweep.csv',
      pointCount: 6,
    });
    expect(run?.stroke).toBeCloseTo(0.0508, 12);
    expect(run?.temperature).toBeCloseTo(313.15, 9);
    const shown = await apiCall('benchShow', { run: run?.id as number, points: true }, ctx);
    expect(shown.points?.[0]).toEqual([-0.3, -1500]);
    const list = await apiCall('benchList', { damper: 'd-1' }, ctx);
    expect(list.runs.map((r) => r.id)).toEqual([run?.id]);
  });

  it('takes the gas force given in any force unit off every reading', async () => {
    const ctx = freshContext();
    const out = await apiCall(
      'benchImport',
      { damper: 'D-1', source: { text: TABLE, name: 'sweep.csv' }, gasForce: '20 lbf' },
      ctx,
    );
    // NIST SP 811 [pub]: 1 lbf = 4.4482216152605 N, so 20 lbf = 88.96 N off −1500 N.
    const shown = await apiCall('benchShow', { run: out.runs[0]?.id as number, points: true }, ctx);
    expect(shown.points?.[0]?.[1]).toBeCloseTo(-1500 - 20 * 4.4482216152605, 9);
    expect(shown.run.notes).toMatch(/^Gas force of 89\.0 N subtracted from every reading at import/);
  });

  const bad: [string, Record<string, unknown>, RegExp][] = [
    ['a label with a control character', { damper: 'D\u00071' }, /^damper: contains a control character/],
    ['an empty label', { damper: ' ' }, /^damper: is empty/],
    ['clicks in words it does not know', { clicks: 'soft 3' }, /^clicks: "soft" is not a clicker adjuster/],
    ['an odd clicks text', { clicks: 'bump' }, /^clicks: got "bump"; expected adjuster–click pairs/],
    ['a stroke in kilograms', { stroke: '50 kg' }, /^stroke: got "50 kg" \(a mass\); expected a length/],
    ['a negative frequency', { testFrequency: '-2 Hz' }, /^testFrequency: must be greater than zero/],
    ['a gas force of nothing', { gasForce: '0 N' }, /^gasForce: must be greater than zero/],
    ['a gas force in metres', { gasForce: '12 m' }, /^gasForce: got "12 m" \(a length\); expected a force/],
    ['a date that is no day', { date: '2025-13-01' }, /^date: "2025-13-01" is not a day/],
    ['a compression sign in words', { compression: 'up' }, /^compression: /],
    [
      'a file that is not there',
      { source: { path: '/nonexistent/run.csv' } },
      /^\/nonexistent\/run\.csv: cannot read the file: no such file/,
    ],
  ];
  for (const [what, change, message] of bad) {
    it(`refuses ${what}, storing nothing`, async () => {
      const ctx = freshContext();
      const before = storeDigest(ctx.store);
      await expect(
        apiCall('benchImport', { damper: 'D-1', source: { text: TABLE, name: 'x.csv' }, ...change }, ctx),
      ).rejects.toThrow(message);
      expect(storeDigest(ctx.store)).toBe(before);
    });
  }

  it('names the units there are when a label is unknown, and a run that does not exist', async () => {
    const ctx = freshContext();
    await expect(apiCall('benchList', { damper: 'X' }, ctx)).rejects.toThrow(/the library is empty/);
    await apiCall('benchImport', { damper: 'D-1', source: { text: TABLE, name: 'x.csv' } }, ctx);
    await expect(apiCall('benchList', { damper: 'X' }, ctx)).rejects.toThrow(/units: "D-1"/);
    await expect(apiCall('benchShow', { run: 99 }, ctx)).rejects.toThrow(/^run: there is no bench run #99/);
  });

  it('still reads a run whose stored fit carries fields a later fit adds, and exports them', async () => {
    const ctx = freshContext();
    const out = await apiCall('benchImport', { damper: 'D-1', source: { text: TABLE, name: 'x.csv' } }, ctx);
    const row = benchRunById(ctx.store.db, out.runs[0]?.id as number) as BenchRunRow;
    const fit = JSON.parse(row.fit_json);
    fit.bump.confidence = 0.95;
    const { id: _id, ...rest } = row;
    benchRunInsert(ctx.store.db, { ...rest, source_sha256: 'e'.repeat(64), fit_json: JSON.stringify(fit) });
    const { runs } = await apiCall('benchList', { damper: 'D-1' }, ctx);
    expect(runs[1]?.fit.bump).toMatchObject({ confidence: 0.95 });
    await apiCall('vehicleAdd', { name: 'V' }, ctx);
    const file = setupFileFixture();
    file.vehicle = 'V';
    file.corners.FL.damperUnit = 'D-1';
    await apiCall('setupSave', { file, newDamperUnits: ['T-1', 'T-2'] }, ctx);
    const { bundle } = await apiCall('storeExport', { vehicle: 'V' }, ctx);
    expect(bundle.dampers.find((d) => d.label === 'D-1')?.runs[1]?.fit).toMatchObject({
      bump: { confidence: 0.95 },
    });
  });
});
