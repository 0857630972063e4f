import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import type { ApiContext } from '../../app/api/context';
import { cornerRideFigures } from '../../core/corner/corner';
import { cornerInputParse } from '../../core/corner/corner-file';
import { damperCurveParse } from '../../core/damper/damper-curve';
import { setupFileParse } from '../../core/setup/setup-file';
import { freshContext } from './api-fixture';

const COUPE = 'Millbrook coupe #27';
/** ζ through one path or another must be the same number: the same curve on the same corner [calc]. */
const SAME = 12;

/** The coupe's newest revision saved again with the front-left clicks (and corner edits) changed. */
async function savedWithClicks(
  ctx: ApiContext,
  clicks: Record<string, number>,
  corner: (c: Record<string, unknown>) => void = () => {},
): Promise<number> {
  const shown = await apiCall('setupShow', { vehicle: COUPE, units: 'si' }, ctx);
  const file = structuredClone(shown.file) as {
    name: string;
    corners: Record<string, { clicks: unknown; corner: Record<string, unknown> }>;
  };
  const fl = file.corners.FL as { clicks: unknown; corner: Record<string, unknown> };
  fl.clicks = clicks;
  corner(fl.corner);
  file.name = `FL at ${JSON.stringify(clicks)}`;
  const saved = await apiCall('setupSave', { file, vehicle: COUPE, units: 'si' }, ctx);
  return saved.revision.number;
}

/** The per-click damping map's ζ of the front-left damper at `clicks`. */
async function mapZeta(ctx: ApiContext, revision: number, clicks: { bump: number; rebound: number }) {
  const map = await apiCall('valvingMap', { vehicle: COUPE, revision, corner: 'FL', interpolate: true }, ctx);
  const cell = map.cells.find((c) => c.clicks.bump === clicks.bump && c.clicks.rebound === clicks.rebound);
  if (!cell) throw new Error(`no map cell at ${JSON.stringify(clicks)}`);
  return cell;
}

describe('which damper curve a corner runs: one answer on every screen and command', () => {
  it('runs the bench curve at the corner clicks, names its run, and flags an entered curve that disagrees', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const shown = await apiCall('setupShow', { vehicle: COUPE, units: 'si' }, ctx);
    const fl = shown.dampers.find((d) => d.position === 'FL');
    expect(fl?.source.kind).toBe('bench');
    expect(fl?.source.damper).toBe('MB-DA-1');
    expect(fl?.source.runIds).toHaveLength(1);
    expect(fl?.source.text).toBe(`bench run #${fl?.source.runIds[0]} of MB-DA-1, bump 6 rebound 6`);
    const cell = await mapZeta(ctx, shown.revision.number, { bump: 6, rebound: 6 });
    expect(cell.source).toBe('measured');
    expect(shown.figures.FL.dampingRatio.bump).toBeCloseTo(cell.figures.dampingRatio.bump, SAME);
    expect(shown.figures.FL.dampingRatio.rebound).toBeCloseTo(cell.figures.dampingRatio.rebound, SAME);
    // The demo's entered FL curve gives ζ rebound 0.60 against the bench's 0.53 at 6/6: flagged.
    const entered = cornerRideFigures(setupFileParse(shown.file).sheet.corners.FL.analysis).dampingRatio;
    expect(Math.abs(entered.rebound - cell.figures.dampingRatio.rebound)).toBeGreaterThan(
      0.1 * cell.figures.dampingRatio.rebound,
    );
    const flagged = shown.warnings.filter((w) => w.code === 'damper-entered-differs');
    expect(flagged.map((w) => w.position)).toEqual(['FL']);
    expect(flagged[0]?.message).toMatch(/entered damper curve gives ζ bump \d\.\d\d, rebound 0\.60/);
    expect(fl?.warning?.code).toBe('damper-entered-differs');
  });

  it('keeps the entered curve where the damper has no bench runs, and says so', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const shown = await apiCall('setupShow', { vehicle: COUPE, units: 'si' }, ctx);
    const fr = shown.dampers.find((d) => d.position === 'FR');
    expect(fr?.source).toMatchObject({ kind: 'entered', damper: 'MB-DA-2', runIds: [] });
    expect(fr?.source.text).toBe('entered on the sheet; MB-DA-2 has no bench runs');
    expect(fr?.warning).toBeNull();
    const entered = cornerRideFigures(setupFileParse(shown.file).sheet.corners.FR.analysis);
    expect(shown.figures.FR.dampingRatio.rebound).toBeCloseTo(entered.dampingRatio.rebound, SAME);
  });

  it('moves ζ with the clicks: the sheet, the diff, the comparison and the map agree', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const before = await apiCall('setupShow', { vehicle: COUPE, units: 'si' }, ctx);
    const n = await savedWithClicks(ctx, { bump: 3, rebound: 9 });
    const after = await apiCall('setupShow', { vehicle: COUPE, revision: n, units: 'si' }, ctx);
    const cell = await mapZeta(ctx, n, { bump: 3, rebound: 9 });
    expect(after.figures.FL.dampingRatio.rebound).toBeCloseTo(cell.figures.dampingRatio.rebound, SAME);
    expect(after.figures.FL.dampingRatio.bump).toBeCloseTo(cell.figures.dampingRatio.bump, SAME);
    // Softer rebound (more clicks from stiff), stiffer bump: the figures moved.
    expect(after.figures.FL.dampingRatio.rebound).toBeLessThan(before.figures.FL.dampingRatio.rebound);
    expect(after.figures.FL.dampingRatio.bump).toBeGreaterThan(before.figures.FL.dampingRatio.bump);

    const diff = await apiCall(
      'setupDiff',
      {
        a: { vehicle: COUPE, revision: before.revision.number },
        b: { vehicle: COUPE, revision: n },
        units: 'si',
      },
      ctx,
    );
    expect(diff.fields.map((f) => f.field)).toContain('corners.FL.clicks.rebound');
    const rebound = diff.figures.find((f) => f.position === 'FL' && f.figure === 'dampingRatioRebound');
    expect(rebound?.after).toBeCloseTo(cell.figures.dampingRatio.rebound, SAME);

    const compared = await apiCall(
      'setupCompare',
      {
        a: { vehicle: COUPE, revision: before.revision.number },
        b: { vehicle: COUPE, revision: n },
        preset: 'track-day',
        units: 'si',
      },
      ctx,
    );
    const corner = compared.corners.find((c) => c.position === 'FL');
    expect(corner?.a.headline.zetaRebound).toBeCloseTo(before.figures.FL.dampingRatio.rebound, SAME);
    expect(corner?.b.headline.zetaRebound).toBeCloseTo(cell.figures.dampingRatio.rebound, SAME);
    expect(corner?.b.headline.zetaBump).toBeCloseTo(cell.figures.dampingRatio.bump, SAME);
  });

  it('interpolates between measured clicks and marks it; clicks beyond the bench fall back to the entered curve', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const between = await savedWithClicks(ctx, { bump: 4, rebound: 8 });
    const shown = await apiCall('setupShow', { vehicle: COUPE, revision: between, units: 'si' }, ctx);
    const fl = shown.dampers.find((d) => d.position === 'FL');
    expect(fl?.source.kind).toBe('interpolated');
    expect(fl?.source.runIds.length).toBe(4);
    expect(fl?.source.text).toMatch(
      /^interpolated between bench runs #\d+, #\d+, #\d+ and #\d+ of MB-DA-1, bump 4 rebound 8$/,
    );
    const cell = await mapZeta(ctx, between, { bump: 4, rebound: 8 });
    expect(cell.source).toBe('interpolated');
    expect(shown.figures.FL.dampingRatio.rebound).toBeCloseTo(cell.figures.dampingRatio.rebound, SAME);

    const beyond = await savedWithClicks(ctx, { bump: 14, rebound: 8 });
    const out = await apiCall('setupShow', { vehicle: COUPE, revision: beyond, units: 'si' }, ctx);
    const far = out.dampers.find((d) => d.position === 'FL');
    expect(far?.source.kind).toBe('entered');
    expect(far?.source.text).toBe(
      'entered on the sheet; the bench runs of MB-DA-1 (bump 0–12, rebound 0–12) do not cover bump 14 rebound 8',
    );
    const entered = cornerRideFigures(setupFileParse(out.file).sheet.corners.FL.analysis);
    expect(out.figures.FL.dampingRatio.bump).toBeCloseTo(entered.dampingRatio.bump, SAME);
  });

  it('raises no disagreement when the entered curve is the bench curve, and gives an edited sheet the same answer', async () => {
    const ctx = freshContext();
    await apiCall('loadDemo', {}, ctx);
    const shown = await apiCall('setupShow', { vehicle: COUPE, units: 'si' }, ctx);
    const bench = shown.dampers.find((d) => d.position === 'FL')?.curve as Record<string, unknown>;
    const n = await savedWithClicks(ctx, { bump: 6, rebound: 6 }, (c) => {
      c.damper = bench;
    });
    const same = await apiCall('setupShow', { vehicle: COUPE, revision: n, units: 'si' }, ctx);
    expect(same.dampers.find((d) => d.position === 'FL')?.warning).toBeNull();
    expect(same.warnings.some((w) => w.code === 'damper-entered-differs')).toBe(false);

    // The sheet being edited asks the same question of the same place.
    const file = shown.file as { corners: Record<string, { corner: unknown }> };
    const edited = await apiCall(
      'setupDampers',
      {
        corners: [
          {
            position: 'FL',
            corner: file.corners.FL?.corner,
            damperUnit: 'mb-da-1',
            clicks: { bump: 3, rebound: 9 },
          },
          { position: 'RL', corner: file.corners.RL?.corner, damperUnit: '', clicks: {} },
        ],
      },
      ctx,
    );
    const cell = await mapZeta(ctx, n, { bump: 3, rebound: 9 });
    const [fl, rl] = edited.dampers;
    expect(fl?.source.kind).toBe('bench');
    expect(fl?.source.damper).toBe('MB-DA-1');
    expect(rl?.source.text).toBe('entered on the sheet; no damper unit named');
    const corner = cornerInputParse(file.corners.FL?.corner);
    const zeta = cornerRideFigures({ ...corner, damper: damperCurveParse(fl?.curve, 'curve') }).dampingRatio;
    expect(zeta.bump).toBeCloseTo(cell.figures.dampingRatio.bump, SAME);
    expect(zeta.rebound).toBeCloseTo(cell.figures.dampingRatio.rebound, SAME);
    await expect(
      apiCall(
        'setupDampers',
        { corners: [{ position: 'FL', corner: { cornerMass: 'heavy' }, damperUnit: '' }] },
        ctx,
      ),
    ).rejects.toThrow(/corners\.FL\.corner\.cornerMass/);
  });
});
