import { createHash } from 'node:crypto';
import { describe, expect, it } from 'vitest';
import { benchFit } from '../../core/damper/bench-fit';
import { canonicalJson } from '../../core/setup/canonical-json';
import { setupFileParse } from '../../core/setup/setup-file';
import { benchImport } from '../../db/bench-import';
import { benchPointsDecode } from '../../db/bench-points';
import { bundleExport, bundleImport, type Bundle } from '../../db/bundle';
import { setupSave } from '../../db/setup-store';
import type { Store } from '../../db/store';
import { setupFileFixture } from '../core/setup-fixture';
import { freshStore, setupSaved, storeDigest, vehicleAdded } from './store-fixture';

/** A vehicle of three revisions (one a branch) with two damper units and a bench run each. */
function shopBundle(): Bundle {
  const store = freshStore();
  const v = vehicleAdded(store, 'Coupe');
  setupSaved(store, v);
  setupSaved(store, v, (r) => (r.corners.FL.corner.springRate = '80 N/mm'));
  setupSave(store, v, setupFileParse({ ...setupFileFixture(), notes: 'Branch' }).sheet, { parentNumber: 1 });
  for (const [damper, text] of [
    [
      'T-1',
      'velocity,force\n0.05,180\n0.1,300\n0.2,420\n0.3,520\n-0.05,-260\n-0.1,-500\n-0.2,-700\n-0.3,-860\n',
    ],
    ['T-2', 'velocity,force\n0.1,300\n0.2,500\n0.3,650\n-0.1,-500\n-0.2,-800\n-0.3,-1000\n'],
  ] as const)
    benchImport(store, { damper, text, sourceName: `${damper}.csv`, date: '2025-04-10' });
  return bundleExport(store, 'Coupe');
}

function counts(store: Store): Record<string, number> {
  const n = (t: string) => store.db.prepare(`SELECT count(*) FROM ${t}`).pluck().get() as number;
  return {
    vehicle: n('vehicle'),
    setup_revision: n('setup_revision'),
    setup_corner: n('setup_corner'),
    damper_unit: n('damper_unit'),
    bench_run: n('bench_run'),
    store_event: n('store_event'),
  };
}

type Damage = [what: string, damage: (b: Bundle & Record<string, unknown>) => void, message: RegExp];

const ESC = '\u001b';

/** Each crafted bundle the importer must refuse, with the field its message must name. */
const REFUSED: Damage[] = [
  [
    'a terminal escape in a revision name',
    (b) => (b.revisions[1]!.name = `Baseline${ESC}[2J`),
    /^revisions\[1\]\.name: contains a control character$/,
  ],
  [
    'a terminal escape in a bench run source name',
    (b) => (b.dampers[0]!.runs[0]!.sourceName = `${ESC}]0;owned${ESC}\\x.csv`),
    /^dampers\[0\]\.runs\[0\]\.sourceName: contains a control character$/,
  ],
  [
    'a control character in a damper serial',
    (b) => (b.dampers[1]!.serial = 'SN\u00071'),
    /^dampers\[1\]\.serial: contains a control character$/,
  ],
  [
    'a newline in a one-line field',
    (b) => (b.revisions[0]!.driver = 'A.\nTester'),
    /^revisions\[0\]\.driver: must be one line/,
  ],
  [
    'over-long notes',
    (b) => (b.revisions[2]!.notes = 'x'.repeat(4001)),
    /^revisions\[2\]\.notes: is 4001 characters long; at most 4000 are kept$/,
  ],
  [
    'an over-long vehicle name',
    (b) => (b.vehicle.name = 'C'.repeat(121)),
    /^vehicle\.name: is 121 characters long; at most 120 are kept$/,
  ],
  [
    'an over-long spring label',
    (b) => (b.revisions[0]!.corners.RR.springLabel = 's'.repeat(201)),
    /^revisions\[0\]\.corners\.RR\.springLabel: is 201 characters long; at most 200 are kept$/,
  ],
  [
    'a click out of the adjuster range in a revision',
    (b) => (b.revisions[1]!.corners.FL.clicks.bump = 500),
    /^revisions\[1\]\.corners\.FL\.clicks\.bump: got 500; expected a whole number of clicks from 0 to 200$/,
  ],
  [
    'a click out of the adjuster range in a bench run',
    (b) => (b.dampers[0]!.runs[0]!.clicks = { rebound: 201 }),
    /^dampers\[0\]\.runs\[0\]\.clicks\.rebound: got 201; expected a whole number of clicks/,
  ],
  [
    'a date that is not a day',
    (b) => (b.revisions[0]!.date = '2025-02-30'),
    /^revisions\[0\]\.date: "2025-02-30" is not a day of the calendar$/,
  ],
  [
    'a bench run date that is not a day',
    (b) => (b.dampers[1]!.runs[0]!.date = '2025-13-01'),
    /^dampers\[1\]\.runs\[0\]\.date: "2025-13-01" is not a day of the calendar$/,
  ],
  [
    'a time saved that is not a time',
    (b) => (b.revisions[2]!.savedAt = 'yesterday'),
    /^revisions\[2\]\.savedAt: got "yesterday"; expected a time/,
  ],
  [
    'a creation time at hour 25',
    (b) => (b.dampers[0]!.createdAt = '2025-01-01T25:00:00.000Z'),
    /^dampers\[0\]\.createdAt: "2025-01-01T25:00:00.000Z" is not a time of day$/,
  ],
  [
    'revision number 2^53 − 1',
    (b) => (b.revisions[2]!.number = Number.MAX_SAFE_INTEGER),
    /^revisions\[2\]\.number: got 9007199254740991; the bundle's 3 revisions are numbered 1 to 3/,
  ],
  [
    'a gap in the revision numbers',
    (b) => (b.revisions[2]!.number = 4),
    /^revisions\[2\]\.number: got 4; the bundle's 3 revisions are numbered 1 to 3/,
  ],
  [
    'a fractional parent',
    (b) => (b.revisions[2]!.parent = 1.5),
    /^revisions\[2\]\.parent: revision 3's parent 1\.5 is not an earlier revision/,
  ],
  [
    'a bench run listed twice',
    (b) => b.dampers[1]!.runs.push(structuredClone(b.dampers[1]!.runs[0]!)),
    /^dampers\[1\]\.runs\[1\]: is the same bench run as dampers\[1\]\.runs\[0\]/,
  ],
  [
    'a damper listed twice',
    (b) => b.dampers.push({ ...structuredClone(b.dampers[0]!), label: 't-1', runs: [] }),
    /^dampers\[2\]\.label: "t-1" is also dampers\[0\]'s label$/,
  ],
  ['an unknown key at the top', (b) => (b.extra = 1), /^extra: is not a known field here/],
  [
    'an unknown key in a revision',
    (b) => ((b.revisions[0] as Record<string, unknown>).locked = true),
    /^revisions\[0\]\.locked: is not a known field here/,
  ],
  [
    'an unknown key in a corner input',
    (b) => (b.revisions[1]!.corners.RL.analysis.script = 'x'),
    /^revisions\[1\]\.corners\.RL\.analysis\.script: is not a known field here$/,
  ],
  [
    'an unknown key deep in a corner input',
    (b) =>
      ((
        (b.revisions[0]!.corners.FR.analysis.damper as Record<string, unknown>).bump as Record<
          string,
          unknown
        >
      ).note = 'x'),
    /^revisions\[0\]\.corners\.FR\.analysis\.damper\.bump\.note: is not a known field here$/,
  ],
  [
    'a corner quantity as text, not SI',
    (b) => (b.revisions[0]!.corners.FL.analysis.springRate = '70 N/mm'),
    /^revisions\[0\]\.corners\.FL\.analysis/,
  ],
  [
    'an unknown key in a bench run',
    (b) => ((b.dampers[0]!.runs[0] as Record<string, unknown>).verified = true),
    /^dampers\[0\]\.runs\[0\]\.verified: is not a known field here/,
  ],
  [
    'an unknown key in a stored fit',
    (b) => ((b.dampers[0]!.runs[0]!.fit as Record<string, unknown>).zeta = 0.7),
    /^dampers\[0\]\.runs\[0\]\.fit\.zeta: is not a known field here/,
  ],
  [
    'an unknown key in a corner of a sheet',
    (b) => ((b.revisions[0]!.corners.FL as Record<string, unknown>).preload = '2 mm'),
    /^revisions\[0\]\.corners\.FL\.preload: is not a known field here/,
  ],
  [
    'an implausible ride height (the setup file range)',
    (b) => (b.revisions[0]!.corners.FL.rideHeight = 95),
    /^revisions\[0\]\.corners\.FL\.rideHeight: .*outside the plausible/,
  ],
  [
    'a stroke of zero',
    (b) => (b.dampers[0]!.runs[0]!.stroke = 0),
    /^dampers\[0\]\.runs\[0\]\.stroke: must be greater than zero/,
  ],
  [
    'a point that is not a number (with its checksum made to agree)',
    (b) => {
      const run = b.dampers[1]!.runs[0]!;
      const buf = Buffer.from(run.points, 'base64');
      buf.writeDoubleLE(Number.NaN, 8);
      run.points = buf.toString('base64');
      run.pointsSha256 = createHashHex(buf);
    },
    /^dampers\[1\]\.runs\[0\]\.points: holds a value that is not a finite number/,
  ],
];

function createHashHex(b: Buffer): string {
  return createHash('sha256').update(b).digest('hex');
}

describe('a bundle is checked as a setup sheet and a bench import are', () => {
  it('imports the untouched bundle (the cases below differ from it by one field)', () => {
    const target = freshStore();
    expect(bundleImport(target, shopBundle())).toMatchObject({ revisions: 3, runsImported: 2 });
  });

  it.each(REFUSED)('refuses %s, naming the field, and stores nothing', (_what, damage, message) => {
    const bundle = structuredClone(shopBundle()) as Bundle & Record<string, unknown>;
    damage(bundle);
    const target = freshStore();
    // A database with a vehicle of its own already, whose rows must stay as they were.
    setupSaved(target, vehicleAdded(target, 'Other car'));
    const before = { digest: storeDigest(target), counts: counts(target) };
    let error: Error | undefined;
    try {
      bundleImport(target, bundle);
    } catch (e) {
      error = e as Error;
    }
    expect(error?.name).toBe('InputError');
    expect(error?.message).toMatch(message);
    expect(counts(target)).toEqual(before.counts);
    expect(storeDigest(target)).toBe(before.digest);
  });

  it('stores a fit recomputed from the points, never the fit the file carries', () => {
    const honest = shopBundle();
    const forged = structuredClone(honest);
    const run = forged.dampers[0]!.runs[0]!;
    // The issue's case: the fit scaled ×1.8, the real points kept.
    const fit = run.fit as {
      bump: { curve: Record<string, number> };
      rebound: { curve: Record<string, number> };
    };
    for (const side of [fit.bump, fit.rebound]) {
      side.curve.lowSpeed = (side.curve.lowSpeed as number) * 1.8;
      side.curve.highSpeed = (side.curve.highSpeed as number) * 1.8;
    }
    const target = freshStore();
    bundleImport(target, forged);
    const stored = target.db.prepare('SELECT fit_json, points FROM bench_run ORDER BY id').get() as {
      fit_json: string;
      points: Buffer;
    };
    // [calc] the fit of the stored points, computed here by core's benchFit, is the one kept.
    expect(stored.fit_json).toBe(canonicalJson(benchFit(benchPointsDecode(stored.points))));
    expect(stored.fit_json).toBe(canonicalJson(honest.dampers[0]!.runs[0]!.fit));
    const kept = JSON.parse(stored.fit_json) as typeof fit;
    expect(kept.bump.curve.lowSpeed).not.toBeCloseTo(fit.bump.curve.lowSpeed as number, 0);
  });

  it('stores summaries recomputed from the sheets, never the ones the file carries', () => {
    const honest = shopBundle();
    const forged = structuredClone(honest);
    forged.revisions[0]!.summary = 'approved by the engineer';
    forged.revisions[1]!.summary = `no change${ESC}[2J`;
    forged.revisions[2]!.summary = 'first setup';
    const target = freshStore();
    bundleImport(target, forged);
    const summaries = target.db
      .prepare('SELECT summary FROM setup_revision ORDER BY number')
      .pluck()
      .all() as string[];
    expect(summaries).toEqual(honest.revisions.map((r) => r.summary));
    expect(summaries[0]).toBe('first setup');
    expect(summaries[1]).toMatch(/spring rate/);
  });

  it('keeps a summary written in US units when that is how the sheet was entered', () => {
    const store = freshStore();
    const v = vehicleAdded(store, 'Coupe');
    setupSaved(store, v);
    const raw = setupFileFixture();
    raw.corners.FL.corner.springRate = '450 lbf/in';
    setupSave(store, v, setupFileParse(raw).sheet, { units: 'us' });
    const bundle = bundleExport(store, 'Coupe');
    expect(bundle.revisions[1]!.summary).toMatch(/lbf\/in/);
    const target = freshStore();
    bundleImport(target, bundle);
    expect(bundleExport(target, 'Coupe')).toEqual(bundle);
  });

  it('round-trips a corner with a bench table, gas force, a bump-stop curve and travel limits exactly', () => {
    const store = freshStore();
    const v = vehicleAdded(store, 'Coupe');
    setupSaved(store, v, (r) => {
      r.corners.RL.corner = {
        ...r.corners.RL.corner,
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
      r.corners.RR.toe = '-0.13 deg';
    });
    const bundle = bundleExport(store, 'Coupe');
    const target = freshStore();
    bundleImport(target, structuredClone(bundle));
    expect(bundleExport(target, 'Coupe')).toEqual(bundle);
  });
});
