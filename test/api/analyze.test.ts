import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { apiCall } from '../../app/api/call';
import { cornerFileParse } from '../../core/corner/corner-file';
import { eventBump } from '../../core/events/event';
import { InputError } from '../../core/units/input-error';
import { eventSimulate } from '../../core/events/simulate';
import { MILLBROOK_FRONT_LEFT } from '../core/demo-corner';
import { freshContext } from './api-fixture';

const demo = (name: string): Record<string, unknown> =>
  JSON.parse(readFileSync(new URL(`../../assets/demo/${name}`, import.meta.url), 'utf8')) as Record<
    string,
    unknown
  >;

describe('analyzeCorner: the bump section', () => {
  it('has exactly the keys DESIGN.md lists, from the nonlinear simulation of the file’s bump', async () => {
    const raw = demo('club-coupe-front-left.json');
    const report = await apiCall('analyzeCorner', { file: raw }, freshContext());
    const bump = report.bump as NonNullable<typeof report.bump>;
    expect(Object.keys(bump).sort()).toEqual(
      [
        'airborneTime',
        'bumpStopContactTime',
        'maxCompression',
        'maxExtension',
        'maxTireLoad',
        'minTireLoad',
        'peakBodyAccel',
        'peakBodyDisplacement',
      ].sort(),
    );
    const file = cornerFileParse(raw);
    // The event tests' corner is this demo file's.
    expect(file.corner).toEqual(MILLBROOK_FRONT_LEFT);
    const m = eventSimulate(file.corner, eventBump(file.bump as NonNullable<typeof file.bump>)).metrics;
    expect(bump.peakBodyAccel).toBe(m.peakBodyAccel);
    expect(bump.airborneTime).toBe(m.airborneTime);
    // The demo's 25 mm bump at 50 km/h throws the front tyre off the road: its warning comes along.
    expect(report.warnings.map((w) => w.code)).toContain('tire-lift-off');
  });

  it('fills it for the tabulated demo corner too, with its bump-stop and curve warnings', async () => {
    const report = await apiCall(
      'analyzeCorner',
      { file: demo('club-coupe-rear-left.json') },
      freshContext(),
    );
    expect(report.bump?.bumpStopContactTime).toBeGreaterThan(0);
    const codes = report.warnings.map((w) => w.code);
    expect(codes).toContain('bump-stop-engaged');
    expect(codes).toContain('damper-speed-beyond-data-bump');
  });

  it('leaves it out when the file has no bump, and names a bad bump field', async () => {
    const { bump: _bump, ...raw } = demo('club-coupe-front-left.json');
    expect((await apiCall('analyzeCorner', { file: raw }, freshContext())).bump).toBeUndefined();
    const bad = { ...raw, bump: { height: '25 mm', length: '0.6 m', speed: '-3 m/s' } };
    await expect(apiCall('analyzeCorner', { file: bad }, freshContext())).rejects.toThrow(InputError);
    await expect(apiCall('analyzeCorner', { file: bad }, freshContext())).rejects.toThrow(/bump\.speed/);
  });
});
