import { describe, expect, it } from 'vitest';
import { benchImport } from '../../db/bench-import';
import { bundleExport, bundleImport, type Bundle } from '../../db/bundle';
import { setupSave } from '../../db/setup-store';
import { setupFileParse } from '../../core/setup/setup-file';
import { setupFileFixture } from '../core/setup-fixture';
import { freshStore, setupSaved, storeDigest, vehicleAdded } from './store-fixture';

function traceText(): string {
  const lines = ['time,displacement,force'];
  for (let i = 0; i < 1000; i++) {
    const t = i / 1000;
    const v = 0.025 * 2 * Math.PI * 2 * Math.cos(2 * Math.PI * 2 * t);
    lines.push(`${t},${0.025 * Math.sin(2 * Math.PI * 2 * t)},${v > 0 ? 3000 * v : 5000 * v}`);
  }
  return lines.join('\n');
}

/** A vehicle with a branch in its history, unicode texts, and both kinds of bench run. */
function shopWithHistory() {
  const store = freshStore();
  const v = vehicleAdded(store, 'Coupe «Ærø» №7');
  setupSaved(store, v);
  setupSaved(store, v, (r) => (r.corners.FL.corner.springRate = 80_000.123456789));
  setupSave(store, v, setupFileParse({ ...setupFileFixture(), notes: 'Branch:\nwet' }).sheet, {
    parentNumber: 1,
  });
  benchImport(store, {
    damper: 'T-1',
    text: traceText(),
    sourceName: 'trace.csv',
    table: { clicks: { rebound: 4 } },
    stroke: 0.05,
  });
  benchImport(store, {
    damper: 'T-2',
    text: 'velocity,force\n0.1,300\n0.2,500\n0.3,650\n-0.1,-500\n-0.2,-800\n-0.3,-1000\n',
    sourceName: 'p.csv',
  });
  benchImport(store, {
    damper: 'Unfitted',
    text: 'velocity,force\n0.1,300\n0.2,500\n0.3,650\n',
    sourceName: 'u.csv',
  });
  return store;
}

describe('bundle export and import', () => {
  it('round-trips exactly: export → import into an empty database → export gives the same bundle', () => {
    const bundle = bundleExport(shopWithHistory(), 'coupe «ærø» №7');
    expect(bundle.revisions.map((r) => [r.number, r.parent])).toEqual([
      [1, null],
      [2, 1],
      [3, 1],
    ]);
    expect(bundle.dampers.map((d) => [d.label, d.runs.length])).toEqual([
      ['T-1', 1],
      ['T-2', 1],
    ]);
    expect(bundle.dampers[0]?.runs[0]?.traceCount).toBe(1000);
    const text = JSON.stringify(bundle);
    const empty = freshStore();
    const result = bundleImport(empty, JSON.parse(text) as Bundle);
    expect(result).toMatchObject({
      vehicle: 'Coupe «Ærø» №7',
      revisions: 3,
      dampersCreated: ['T-1', 'T-2'],
      runsImported: 2,
    });
    expect(JSON.stringify(bundleExport(empty, 'Coupe «Ærø» №7'))).toBe(text);
  });

  it('refuses a vehicle name already in the database and stores nothing, but imports under another name', () => {
    const store = shopWithHistory();
    const bundle = bundleExport(store, 'Coupe «Ærø» №7');
    const before = storeDigest(store);
    expect(() => bundleImport(store, bundle)).toThrow(
      /vehicle\.name: a vehicle named "Coupe «Ærø» №7" is already in this database; nothing was imported/,
    );
    expect(storeDigest(store)).toBe(before);
    const copy = bundleImport(store, bundle, { asName: 'Coupe copy' });
    // The dampers are the same units: used again, and their runs are not added twice.
    expect(copy).toMatchObject({
      dampersCreated: [],
      dampersMatched: ['T-1', 'T-2'],
      runsImported: 0,
      runsAlreadyPresent: 2,
    });
  });

  it('refuses a damaged bundle, naming the field, and stores nothing', () => {
    const store = shopWithHistory();
    const bundle = bundleExport(store, 'Coupe «Ærø» №7');
    const target = freshStore();
    const before = storeDigest(target);
    const cases: [string, (b: Bundle) => void, RegExp][] = [
      [
        'points',
        (b) => (b.dampers[0]!.runs[0]!.points = `${b.dampers[0]!.runs[0]!.points.slice(0, -8)}AAAAAAA=`),
        /dampers\[0\]\.runs\[0\]\.points: does not match its point count and checksum/,
      ],
      [
        'not base64',
        (b) => (b.dampers[1]!.runs[0]!.points = '***'),
        /dampers\[1\]\.runs\[0\]\.points: is not base64/,
      ],
      [
        'trace',
        (b) => (b.dampers[0]!.runs[0]!.traceCount = 999),
        /dampers\[0\]\.runs\[0\]\.trace: does not match its sample count/,
      ],
      [
        'a corner',
        (b) => ((b.revisions[1]!.corners.RL.analysis as Record<string, unknown>).springRate = -1),
        /revisions\[1\]\.corners\.RL\.analysis\.springRate: spring rate must be greater than zero/,
      ],
      [
        'a corner of another shape',
        (b) => (b.revisions[0]!.corners.FR.analysis = { hello: 1 }),
        /revisions\[0\]\.corners\.FR\.analysis/,
      ],
      [
        'a parent',
        (b) => (b.revisions[2]!.parent = 3),
        /revisions\[2\]\.parent: revision 3's parent 3 is not an earlier revision/,
      ],
      [
        'a twice-numbered revision',
        (b) => (b.revisions[2]!.number = 2),
        /revisions\[2\]\.number: revision 2 appears twice/,
      ],
      [
        'a missing damper',
        (b) => b.dampers.splice(1, 1),
        /damperUnit: "T-2" is not among the bundle's dampers/,
      ],
    ];
    for (const [, damage, message] of cases) {
      const b = structuredClone(bundle);
      damage(b);
      expect(() => bundleImport(target, b)).toThrow(message);
      expect(storeDigest(target)).toBe(before);
    }
  });

  it('refuses a bundle whose damper label is here with another serial', () => {
    const store = shopWithHistory();
    const bundle = bundleExport(store, 'Coupe «Ærø» №7');
    const target = freshStore();
    benchImport(target, {
      damper: 't-2',
      text: 'velocity,force\n0.1,1\n0.2,2\n0.3,3\n',
      sourceName: 'x.csv',
      unit: { serial: 'OTHER' },
    });
    const before = storeDigest(target);
    expect(() => bundleImport(target, bundle)).toThrow(
      /dampers\[1\]\.serial: damper "T-2" is already here with serial "OTHER"/,
    );
    expect(storeDigest(target)).toBe(before);
  });
});
