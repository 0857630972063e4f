import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { ValvingPool, valvingSweepParallel } from '../../app/api/valving-pool';
import { CAUTION_TEXT, VALVING_CAUTION_TEXT } from '../../core/safety/caution';
import { valvingJobOf } from '../../core/valving/valving';
import { valvingComboEvaluate } from '../../core/valving/valving-evaluate';
import { VALVING_PRESETS } from '../../core/valving/valving-presets';
import { ValvingSweepStopped, valvingSweepSerial } from '../../core/valving/valving-sweep';
import { MILLBROOK_FRONT_LEFT } from '../core/demo-corner';
import { bilinear, cellOf } from '../core/valving-fixture';
import { storeDigest } from '../db/store-fixture';
import { freshContext } from './api-fixture';

const COUPE = 'Millbrook coupe #27';

/** An invented 6 × 6 damper on two corners: 72 combinations, enough for every lane to take several chunks. */
function sweepJob() {
  const cells = [];
  for (let b = 0; b < 6; b++)
    for (let r = 0; r < 6; r++)
      cells.push(
        cellOf(
          { bump: b, rebound: r },
          bilinear(5000 - 500 * b, 0.05, 1500),
          bilinear(9000 - 900 * r, 0.06, 3000 - 200 * r),
        ),
      );
  return valvingJobOf(
    { cells },
    [
      { position: 'FL', corner: MILLBROOK_FRONT_LEFT },
      { position: 'RL', corner: { ...MILLBROOK_FRONT_LEFT, cornerMass: 280, springRate: 60_000 } },
    ],
    VALVING_PRESETS['track-day'].scenario,
  );
}

describe('valving sweep across worker threads', () => {
  const job = sweepJob();
  const oneByOne = [0, 1].map((k) =>
    job.cells.map((_, i) => valvingComboEvaluate(job, k * job.cells.length + i)),
  );

  it('equals the one-by-one evaluation exactly: workers only, workers with this thread, and a kept pool', async () => {
    expect(valvingSweepSerial(job)).toStrictEqual(oneByOne);
    const progress: number[] = [];
    const workersOnly = await valvingSweepParallel(job, {
      threads: 2,
      inThread: false,
      chunkSize: 5,
      onProgress: (done, total) => {
        expect(total).toBe(72);
        progress.push(done);
      },
    });
    expect(workersOnly).toStrictEqual(oneByOne);
    expect(progress.at(-1)).toBe(72);
    expect(progress).toEqual([...progress].sort((a, b) => a - b));
    const pool = new ValvingPool(1);
    try {
      expect(await pool.sweep(job, { chunkSize: 3 })).toStrictEqual(oneByOne);
      // Again on the running pool, with another job in between.
      const small = valvingJobOf({ cells: job.cells.slice(0, 4) }, job.corners, job.scenario);
      const [first, second] = await Promise.all([
        pool.sweep(small, { inThread: false }),
        pool.sweep(job, { inThread: false }),
      ]);
      expect(first).toStrictEqual([oneByOne[0]?.slice(0, 4), oneByOne[1]?.slice(0, 4)]);
      expect(second).toStrictEqual(oneByOne);
    } finally {
      await pool.close();
    }
  });

  it('stops between combinations when the signal aborts, with its reason', async () => {
    const controller = new AbortController();
    const stopped = valvingSweepParallel(job, {
      threads: 1,
      chunkSize: 1,
      signal: controller.signal,
      onProgress: (done) => {
        if (done >= 3) controller.abort(new ValvingSweepStopped(done, 72));
      },
    });
    await expect(stopped).rejects.toThrow(ValvingSweepStopped);
    const already = AbortSignal.abort(new Error('not wanted'));
    await expect(valvingSweepParallel(job, { threads: 0, signal: already })).rejects.toThrow('not wanted');
    await expect(valvingSweepParallel(job, { threads: 0, inThread: false })).rejects.toThrow(RangeError);
  });
});

describe('valving handlers on the demo shop', () => {
  it('maps the demo damper on a corner: 25 measured clicks, 169 with interpolation, each marked', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const map = await apiCall('valvingMap', { vehicle: COUPE, corner: 'FL' }, ctx);
    expect(map.damper).toBe('MB-DA-1');
    expect(map.axes.map((a) => [a.adjuster, a.clicks])).toEqual([
      ['bump', [0, 3, 6, 9, 12]],
      ['rebound', [0, 3, 6, 9, 12]],
    ]);
    expect(map.cells).toHaveLength(25);
    const filled = await apiCall('valvingMap', { vehicle: COUPE, corner: 'FL', interpolate: true }, ctx);
    expect(filled.cells).toHaveLength(169);
    expect(filled.cells.filter((c) => c.source === 'interpolated')).toHaveLength(144);
    // ζ falls as bump clicks soften (clicks from full stiff, as the demo damper counts them).
    const bumpZeta = [0, 3, 6, 9, 12].map(
      (b) =>
        map.cells.find((c) => c.clicks.bump === b && c.clicks.rebound === 6)?.figures.dampingRatio
          .bump as number,
    );
    for (let i = 1; i < bumpZeta.length; i++) expect(bumpZeta[i]).toBeLessThan(bumpZeta[i - 1] as number);
    expect(JSON.parse(JSON.stringify(map))).toEqual(map);
  });

  it('chooses clicks with the objective, targets, sources, cautions and balance, storing nothing', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const before = storeDigest(ctx.store);
    const input = {
      vehicle: COUPE,
      damper: 'MB-DA-1',
      corners: ['RL', 'FL'],
      preset: 'track-day',
      targets: { bumpLowSpeed: '0.35..0.5' },
      weights: { airborneTime: 2 },
      scenario: { road: { class: 'B' } },
      best: 2,
    };
    const out = await apiCall('valvingChoose', input, ctx);
    expect(storeDigest(ctx.store)).toBe(before);
    expect(out.caution).toBe(CAUTION_TEXT);
    expect(out.valvingCaution).toBe(VALVING_CAUTION_TEXT);
    expect(out.valvingCaution).toMatch(
      /do not exceed the damper maker's adjustment range; make one change at a time and record it/,
    );
    expect(out.objective).toMatch(/Σ weight × \(miss ÷ scale\)²/);
    expect(out.targets.bumpLowSpeed).toMatchObject({ low: 0.35, high: 0.5, source: { tag: 'user' } });
    expect(out.targets.airborneTime?.weight).toBe(2);
    expect(out.targets.lowSpeedMean?.source.tag).toBe('trade');
    expect(out.scenario.road.roadClass).toBe('B');
    expect(out.corners.map((c) => c.position)).toEqual(['FL', 'RL']);
    expect(out.combinations).toBe(50);
    for (const c of out.corners) {
      expect(c.evaluated).toBe(25);
      expect(c.best).toHaveLength(2);
      expect(c.best[0]?.rank).toBe(1);
      expect(c.best[0]?.source).toBe('measured');
      expect(c.current?.clicks).toEqual(
        c.position === 'FL' ? { bump: 6, rebound: 6 } : { bump: 6, rebound: 3 },
      );
      expect(c.best[0]!.score).toBeLessThanOrEqual(c.current!.score);
    }
    expect(out.balance?.front.positions).toEqual(['FL']);
    expect(out.dampers).toEqual([
      expect.objectContaining({
        label: 'MB-DA-1',
        positions: ['FL', 'RL'],
        cells: 25,
        measured: 25,
        interpolated: 0,
      }),
    ]);
    // The same answer in this thread alone: the worker threads change nothing.
    const here = await apiCall('valvingChoose', { ...input, threads: 0 }, ctx);
    expect(here).toEqual(out);
    expect(JSON.parse(JSON.stringify(out))).toEqual(out);
  });

  it('marks interpolated picks, and uses the damper each corner records when none is named', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const out = await apiCall(
      'valvingChoose',
      { vehicle: COUPE, corners: ['FL'], preset: 'road-comfort', interpolate: true, best: 10, threads: 0 },
      ctx,
    );
    expect(out.corners[0]?.damper).toBe('MB-DA-1');
    expect(out.corners[0]?.evaluated).toBe(169);
    const sources = new Set(out.corners[0]?.best.map((p) => p.source));
    expect(sources.has('interpolated')).toBe(true);
    for (const p of out.corners[0]?.best ?? [])
      if (p.source === 'interpolated') expect(p.runIds.length).toBeGreaterThan(1);
  });

  it('refuses what it cannot judge with one message naming the field, storing nothing', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const before = storeDigest(ctx.store);
    const choose = (change: Record<string, unknown>) =>
      apiCall(
        'valvingChoose',
        { vehicle: COUPE, corners: ['FL'], preset: 'track-day', threads: 0, ...change },
        ctx,
      );
    await expect(choose({ preset: 'drift' })).rejects.toThrow(/^preset: "drift" is not a preset/);
    await expect(choose({ damper: 'MB-XX' })).rejects.toThrow(
      /^damper: no damper unit labelled "MB-XX"; units: /,
    );
    await expect(choose({ corners: ['FR'] })).rejects.toThrow(/^damper: damper "MB-DA-2" has no bench runs/);
    await expect(choose({ corners: [] })).rejects.toThrow(/^corners: give at least one corner/);
    await expect(choose({ corners: ['XL'] })).rejects.toThrow(/^corners\[0\]: /);
    await expect(choose({ targets: { comfort: 'off' } })).rejects.toThrow(
      /^targets\.comfort: is not a known field/,
    );
    await expect(choose({ scenario: { road: { speed: '80 kg' } } })).rejects.toThrow(
      /^scenario\.road\.speed: got "80 kg"/,
    );
    await expect(choose({ revision: 99 })).rejects.toThrow(
      /^revision: "Millbrook coupe #27" has no revision 99/,
    );
    await expect(choose({ vehicle: 'Nope' })).rejects.toThrow(/^vehicle: no vehicle named "Nope"/);
    await expect(choose({ best: 0 })).rejects.toThrow(/^best: /);
    expect(storeDigest(ctx.store)).toBe(before);
  });

  it('compares two revisions for the track-day sheet', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const out = await apiCall(
      'setupCompare',
      {
        a: { vehicle: COUPE, revision: 1 },
        b: { vehicle: COUPE },
        preset: 'track-day',
        scenario: { road: { class: 'C', speed: '120 km/h' } },
      },
      ctx,
    );
    expect(out.a).toMatchObject({ revision: 1, name: 'Baseline' });
    expect(out.b.revision).toBe(6);
    expect(out.scenario.road).toEqual({ roadClass: 'C', speed: 120 / 3.6 });
    expect(out.corners.map((c) => c.position)).toEqual(['FL', 'FR', 'RL', 'RR']);
    for (const c of out.corners)
      for (const k of Object.keys(c.change) as (keyof typeof c.change)[]) {
        const a = c.a.headline[k];
        const b = c.b.headline[k];
        if (a !== null && b !== null) expect(c.change[k]).toBeCloseTo(b - a, 12);
      }
    expect(out.caution).toBe(CAUTION_TEXT);
    expect(out.valvingCaution).toBe(VALVING_CAUTION_TEXT);
    expect(out.balance.a?.ratio.rideFrequency).toBeGreaterThan(0);
    expect(out.corners.some((c) => c.b.warnings.length > 0)).toBe(true);
    // The same comparison asked for in US units: the same warnings, their quantities in US words.
    const us = await apiCall(
      'setupCompare',
      {
        a: { vehicle: COUPE, revision: 1 },
        b: { vehicle: COUPE },
        preset: 'track-day',
        scenario: { road: { class: 'C', speed: '120 km/h' } },
        units: 'us',
      },
      ctx,
    );
    expect(us.corners).toHaveLength(4);
    const words = (o: typeof out) => o.corners.flatMap((c) => [...c.a.warnings, ...c.b.warnings]);
    expect(words(us).map((w) => w.code)).toEqual(words(out).map((w) => w.code));
    expect(words(us).some((w) => / (in|lbf|mph)\b/.test(w.message))).toBe(true);
    for (const w of words(us)) expect(w.message).not.toMatch(/\d (mm|N|km\/h)\b/);
    expect(us.corners.map((c) => c.b.headline)).toEqual(out.corners.map((c) => c.b.headline));
    await expect(
      apiCall(
        'setupCompare',
        { a: { vehicle: COUPE, revision: 9 }, b: { vehicle: COUPE }, preset: 'track-day' },
        ctx,
      ),
    ).rejects.toThrow(/^a\.revision: /);
  });

  it('lists the presets with every target and its words', async () => {
    const out = await apiCall('valvingPresets', {}, freshContext());
    expect(out.presets.map((p) => p.name)).toEqual([
      'road-comfort',
      'track-day',
      'rally-stage',
      'high-downforce-circuit',
    ]);
    expect(out.targets.find((t) => t.key === 'airborneTime')).toMatchObject({ kind: 'time' });
  });
});
