/**
 * Writes the invented Millbrook demo shop into assets/demo/: two vehicles' setup revisions,
 * two damper units' bench files, and the manifest `rideledger demo` loads. Everything here
 * is made up — the valving model, the cars, the people — and the noise has a fixed seed, so
 * running it again writes the same files.  Run: npx tsx test/demo/generate-demo-data.ts
 */
import { mkdirSync, writeFileSync } from 'node:fs';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import { seededRandom } from '../seeded-random';

const ROOT = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'assets', 'demo');

function gaussian(rand: () => number): () => number {
  return () => Math.sqrt(-2 * Math.log(1 - rand())) * Math.cos(2 * Math.PI * rand());
}

type Direction = { low: number; high: number; knee: number };

/** The invented valving: a smooth digressive curve, slope `low` near zero and `high` far past the knee. */
function directionForce(d: Direction, speed: number): number {
  return d.high * speed + (d.low - d.high) * d.knee * Math.tanh(speed / d.knee);
}

/** Double-adjustable demo unit: clicks from full stiff, 0–12 each way. */
function doubleAdjustable(bump: number, rebound: number): { bump: Direction; rebound: Direction } {
  return {
    bump: { low: 5200 * (1 - 0.05 * bump), high: 1500 * (1 - 0.025 * bump), knee: 0.05 },
    rebound: { low: 9000 * (1 - 0.055 * rebound), high: 2600 * (1 - 0.03 * rebound), knee: 0.06 },
  };
}

/** Rebound-adjustable demo unit: clicks from full stiff, 0–8; bump fixed. */
function singleAdjustable(rebound: number): { bump: Direction; rebound: Direction } {
  return {
    bump: { low: 3800, high: 1100, knee: 0.05 },
    rebound: { low: 7000 * (1 - 0.07 * rebound), high: 2000 * (1 - 0.04 * rebound), knee: 0.06 },
  };
}

function signedForce(model: { bump: Direction; rebound: Direction }, v: number): number {
  return v >= 0 ? directionForce(model.bump, v) : -directionForce(model.rebound, -v);
}

const SWEEP = [0.01, 0.025, 0.05, 0.075, 0.1, 0.15, 0.2, 0.25, 0.3, 0.4, 0.5];
const SIGNED_SWEEP = [...SWEEP.map((v) => -v).reverse(), ...SWEEP];

function write(path: string, text: string): void {
  const full = join(ROOT, path);
  mkdirSync(dirname(full), { recursive: true });
  writeFileSync(full, text);
}

const fmt = (x: number, d: number) => x.toFixed(d);

// ---- bench files -------------------------------------------------------------------------

const noise = gaussian(seededRandom(20250215));
const CLICKS = [0, 3, 6, 9, 12];
const LBF = 4.4482216152605;
const INCH = 0.0254;
type BenchEntry = Record<string, unknown>;
const bench: BenchEntry[] = [];

for (const b of CLICKS) {
  // One file per bump setting, one column pair per rebound setting. Two files come as other
  // bench software writes them: one in in/s and lbf, one with semicolons and decimal commas.
  const us = b === 12;
  const european = b === 9;
  const sep = european ? ';' : ',';
  const num = (x: number, d: number) => (european ? fmt(x, d).replace('.', ',') : fmt(x, d));
  const header = CLICKS.flatMap((r) => [
    `velocity${us ? ' [in/s]' : ''} (bump ${b} rebound ${r})`,
    `force${us ? ' [lbf]' : ''} (bump ${b} rebound ${r})`,
  ]);
  const rows = SIGNED_SWEEP.map((v) =>
    CLICKS.flatMap((r) => {
      const f = signedForce(doubleAdjustable(b, r), v) * (1 + 0.01 * noise()) + 4 * noise();
      const vv = v * (1 + 0.002 * noise());
      return us ? [num(vv / INCH, 3), num(f / LBF, 1)] : [num(vv, 4), num(f, 1)];
    }).join(sep),
  );
  const file = `bench/mb-da-1-bump-${b}.csv`;
  write(
    file,
    [`# Millbrook demo: MB-DA-1 sweep, bump ${b} clicks from stiff`, header.join(sep), ...rows, ''].join(
      '\n',
    ),
  );
  bench.push({
    file,
    damper: 'MB-DA-1',
    date: '2025-02-15',
    stroke: '50 mm',
    temperature: '30 degC',
    notes: `Peak-velocity sweep at bump ${b}, rebound 0–12 (invented demo data).`,
  });
}

{
  // A raw trace of the rebound-adjustable unit at rebound 4: 2 Hz sine, 50 mm stroke, 1 kHz.
  // The bench writes compression negative, time in ms and displacement in mm.
  const model = singleAdjustable(4);
  const f = 2;
  const stroke = 0.05;
  const lag = 0.004; // the force trails the shaft a little, as a compliant damper's does
  const lines = ['time [ms],displacement [mm],force [N]'];
  for (let i = 0; i < 2500; i++) {
    const t = i / 1000;
    const x = (stroke / 2) * Math.sin(2 * Math.PI * f * t);
    const v = (stroke / 2) * 2 * Math.PI * f * Math.cos(2 * Math.PI * f * (t - lag));
    const force = signedForce(model, v) * (1 + 0.01 * noise()) + 5 * noise();
    lines.push(`${fmt(t * 1000, 1)},${fmt(-(x + 0.00002 * noise()) * 1000, 4)},${fmt(-force, 1)}`);
  }
  const file = 'bench/mb-sa-1-trace-rebound-4.csv';
  write(file, `${lines.join('\n')}\n`);
  bench.push({
    file,
    damper: 'MB-SA-1',
    date: '2025-02-22',
    clicks: 'rebound 4',
    stroke: '50 mm',
    testFrequency: '2 Hz',
    temperature: '32 degC',
    compression: 'negative',
    notes: 'Raw sine trace, 2 Hz, 50 mm stroke (invented demo data).',
  });
}
{
  const header = [0, 8].flatMap((r) => [`velocity (rebound ${r})`, `force (rebound ${r})`]);
  const rows = SIGNED_SWEEP.map((v) =>
    [0, 8]
      .flatMap((r) => [
        fmt(v, 4),
        fmt(signedForce(singleAdjustable(r), v) * (1 + 0.01 * noise()) + 4 * noise(), 1),
      ])
      .join(','),
  );
  const file = 'bench/mb-sa-1-rebound-0-and-8.csv';
  write(file, [header.join(','), ...rows, ''].join('\n'));
  bench.push({
    file,
    damper: 'MB-SA-1',
    date: '2025-02-22',
    stroke: '50 mm',
    temperature: '31 degC',
    notes: 'Peak-velocity sweeps at rebound 0 and 8 (invented demo data).',
  });
}

// ---- setups ------------------------------------------------------------------------------

type Json = Record<string, unknown>;
const clone = <T>(x: T): T => JSON.parse(JSON.stringify(x)) as T;

function coupeCorner(front: boolean, damperUnit: string): Json {
  return {
    corner: {
      cornerMass: front ? '295 kg' : '265 kg',
      unsprungMass: front ? '38 kg' : '40 kg',
      springRate: front ? '70 N/mm' : '60 N/mm',
      springMotionRatio: front ? 0.9 : 0.85,
      damperMotionRatio: front ? 0.9 : 0.85,
      tireRate: '240 N/mm',
      damper: {
        bump: { lowSpeed: '3640 N*s/m', kneeSpeed: '0.05 m/s', highSpeed: '1280 N*s/m' },
        rebound: { lowSpeed: '6030 N*s/m', kneeSpeed: '0.06 m/s', highSpeed: '2130 N*s/m' },
      },
      bumpStop: front ? { gap: '30 mm', rate: '250 N/mm' } : { gap: '35 mm', rate: '200 N/mm' },
    },
    damperUnit,
    clicks: { bump: 6, rebound: 6 },
    springLabel: front ? 'MB-70-180 (70 N/mm, 180 mm)' : 'MB-60-200 (60 N/mm, 200 mm)',
    rideHeight: front ? '95 mm' : '105 mm',
    tirePressureCold: front ? '1.7 bar' : '1.6 bar',
    camber: front ? '-2.8 deg' : '-2 deg',
    toe: front ? '-0.5 mm' : '1 mm',
  };
}

function seaterCorner(front: boolean, damperUnit: string): Json {
  return {
    corner: {
      cornerMass: front ? '118 kg' : '150 kg',
      unsprungMass: front ? '17 kg' : '20 kg',
      springRate: front ? '55 N/mm' : '70 N/mm',
      springMotionRatio: front ? 0.62 : 0.66,
      tireRate: front ? '175 N/mm' : '190 N/mm',
      damper: {
        bump: { lowSpeed: '3800 N*s/m', kneeSpeed: '0.05 m/s', highSpeed: '1100 N*s/m' },
        rebound: { lowSpeed: '5040 N*s/m', kneeSpeed: '0.06 m/s', highSpeed: '1680 N*s/m' },
      },
      bumpStop: { gap: '20 mm', rate: '150 N/mm' },
    },
    damperUnit,
    clicks: { rebound: 4 },
    springLabel: front ? 'MB-55-150' : 'MB-70-150',
    rideHeight: front ? '45 mm' : '55 mm',
    tirePressureCold: front ? '1.1 bar' : '1.05 bar',
    camber: front ? '-1.5 deg' : '-1 deg',
    toe: front ? '0 mm' : '1.5 mm',
  };
}

type Sheet = Json & { corners: Record<string, Json & { corner: Json; clicks: Json }> };

function setupFile(vehicle: string, fields: Json, corners: Record<string, Json>): Sheet {
  return { format: 'rideledger-setup', version: 1, vehicle, ...fields, corners } as unknown as Sheet;
}

const COUPE = 'Millbrook coupe #27';
const SEATER = 'Millbrook single-seater #9';

const coupe: { slug: string; file: Sheet }[] = [];
{
  const base = setupFile(
    COUPE,
    {
      name: 'Baseline',
      event: 'Shakedown',
      track: 'Millbrook Park',
      driver: 'J. Ashby',
      date: '2025-03-22',
      fuelLoad: '30 kg',
      antiRollBar: { front: 'hole 2 of 5', rear: 'hole 3 of 5' },
      notes: 'Corner weights set with driver and 30 kg fuel.',
    },
    {
      FL: coupeCorner(true, 'MB-DA-1'),
      FR: coupeCorner(true, 'MB-DA-2'),
      RL: coupeCorner(false, 'MB-DA-3'),
      RR: coupeCorner(false, 'MB-DA-4'),
    },
  );
  coupe.push({ slug: '01-baseline', file: base });
  const r2 = clone(base);
  Object.assign(r2, {
    name: 'Front springs 80',
    event: 'Sprint round 1',
    date: '2025-04-12',
    notes: 'Understeer on entry to the hairpin: more front platform.',
  });
  for (const p of ['FL', 'FR']) {
    const c = r2.corners[p] as Sheet['corners'][string];
    c.corner.springRate = '80 N/mm';
    c.springLabel = 'MB-80-180 (80 N/mm, 180 mm)';
  }
  coupe.push({ slug: '02-front-springs-80', file: r2 });
  const r3 = clone(r2);
  Object.assign(r3, {
    name: 'Rear rebound 3 clicks stiffer',
    notes: 'Rear floats over the crest after the pit exit.',
  });
  for (const p of ['RL', 'RR']) {
    const c = r3.corners[p] as Sheet['corners'][string];
    c.clicks.rebound = 3;
    (c.corner.damper as Json).rebound = {
      lowSpeed: '7520 N*s/m',
      kneeSpeed: '0.06 m/s',
      highSpeed: '2370 N*s/m',
    };
  }
  coupe.push({ slug: '03-rear-rebound-stiffer', file: r3 });
  const r4 = clone(r3);
  Object.assign(r4, {
    name: 'Front ride height -5 mm',
    event: 'Sprint round 2',
    date: '2025-05-10',
    fuelLoad: '20 kg',
    notes: '',
  });
  for (const p of ['FL', 'FR']) (r4.corners[p] as Json).rideHeight = '90 mm';
  coupe.push({ slug: '04-front-ride-height-down', file: r4 });
  const r5 = clone(r4);
  Object.assign(r5, {
    name: 'Wet: rear bar off',
    event: 'Sprint round 3 (wet)',
    date: '2025-06-07',
    antiRollBar: { front: 'hole 1 of 5', rear: 'disconnected' },
    notes: 'Standing water at the hairpin.',
  });
  for (const p of ['FL', 'FR', 'RL', 'RR']) {
    const c = r5.corners[p] as Json;
    c.tirePressureCold = p.startsWith('F') ? '1.9 bar' : '1.8 bar';
  }
  coupe.push({ slug: '05-wet-rear-bar-off', file: r5 });
  // Back to the dry setup of round 2, with a little more front camber: a branch from revision 4.
  const r6 = clone(r4);
  Object.assign(r6, {
    name: 'Dry, more front camber',
    event: 'Sprint round 4',
    date: '2025-07-05',
    basedOnRevision: 4,
  });
  for (const p of ['FL', 'FR']) (r6.corners[p] as Json).camber = '-3.2 deg';
  coupe.push({ slug: '06-dry-more-front-camber', file: r6 });
}

const seater: { slug: string; file: Sheet }[] = [];
{
  const base = setupFile(
    SEATER,
    {
      name: 'Baseline',
      event: 'Test day',
      track: 'Millbrook Hill',
      driver: 'R. Okafor',
      date: '2025-04-05',
      fuelLoad: '8 kg',
      antiRollBar: { front: 'blade 2 of 3', rear: 'none fitted' },
    },
    {
      FL: seaterCorner(true, 'MB-SA-1'),
      FR: seaterCorner(true, 'MB-SA-2'),
      RL: seaterCorner(false, 'MB-SA-3'),
      RR: seaterCorner(false, 'MB-SA-4'),
    },
  );
  seater.push({ slug: '01-baseline', file: base });
  const r2 = clone(base);
  Object.assign(r2, {
    name: 'Softer rear springs',
    event: 'Hillclimb round 1',
    date: '2025-05-03',
    notes: 'Rear skips over the bumps at the top hairpin.',
  });
  for (const p of ['RL', 'RR']) {
    const c = r2.corners[p] as Sheet['corners'][string];
    c.corner.springRate = '62 N/mm';
    c.springLabel = 'MB-62-150';
  }
  seater.push({ slug: '02-softer-rear-springs', file: r2 });
  const r3 = clone(r2);
  Object.assign(r3, { name: 'Rebound 2 clicks stiffer', notes: 'Body float after the rear spring change.' });
  for (const p of ['FL', 'FR', 'RL', 'RR']) {
    const c = r3.corners[p] as Sheet['corners'][string];
    c.clicks.rebound = 2;
    (c.corner.damper as Json).rebound = {
      lowSpeed: '6020 N*s/m',
      kneeSpeed: '0.06 m/s',
      highSpeed: '1840 N*s/m',
    };
  }
  seater.push({ slug: '03-rebound-stiffer', file: r3 });
  const r4 = clone(r3);
  Object.assign(r4, {
    name: 'Front up 3 mm',
    event: 'Hillclimb round 2',
    date: '2025-06-14',
    notes: 'Splitter touching at the start line.',
  });
  for (const p of ['FL', 'FR']) (r4.corners[p] as Json).rideHeight = '48 mm';
  seater.push({ slug: '04-front-up', file: r4 });
}

const revisionFiles = (folder: string, list: { slug: string; file: Sheet }[]) =>
  list.map(({ slug, file }) => {
    const path = `setups/${folder}/${slug}.json`;
    write(path, `${JSON.stringify(file, null, 2)}\n`);
    return path;
  });

const manifest = {
  format: 'rideledger-demo',
  version: 1,
  shop: 'Millbrook',
  note: 'An invented shop for trying RideLedger: the vehicles, people, damper units and bench data are made up.',
  dampers: [
    {
      label: 'MB-DA-1',
      type: 'monotube, double-adjustable (demo)',
      serial: 'MB-0041',
      notes: 'Clicks from full stiff, 0–12 bump and rebound.',
    },
    { label: 'MB-DA-2', type: 'monotube, double-adjustable (demo)', serial: 'MB-0042' },
    { label: 'MB-DA-3', type: 'monotube, double-adjustable (demo)', serial: 'MB-0043' },
    { label: 'MB-DA-4', type: 'monotube, double-adjustable (demo)', serial: 'MB-0044' },
    {
      label: 'MB-SA-1',
      type: 'twin-tube, rebound-adjustable (demo)',
      serial: 'MB-1107',
      notes: 'Rebound clicks from full stiff, 0–8.',
    },
    { label: 'MB-SA-2', type: 'twin-tube, rebound-adjustable (demo)', serial: 'MB-1108' },
    { label: 'MB-SA-3', type: 'twin-tube, rebound-adjustable (demo)', serial: 'MB-1109' },
    { label: 'MB-SA-4', type: 'twin-tube, rebound-adjustable (demo)', serial: 'MB-1110' },
  ],
  vehicles: [
    {
      name: COUPE,
      kind: 'club sprint coupe',
      notes: 'Front-engined, rear-drive sprint coupe (invented).',
      revisions: revisionFiles('coupe-27', coupe),
    },
    {
      name: SEATER,
      kind: 'hillclimb single-seater',
      notes: 'Pushrod single-seater (invented).',
      revisions: revisionFiles('single-seater-9', seater),
    },
  ],
  bench,
};
write('shop.json', `${JSON.stringify(manifest, null, 2)}\n`);
console.log(
  `wrote ${bench.length} bench files, ${coupe.length + seater.length} setups and shop.json under assets/demo/`,
);
