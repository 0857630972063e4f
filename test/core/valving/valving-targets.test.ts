import { describe, expect, it } from 'vitest';
import { valvingSettingsOf } from '../../../core/valving/valving';
import type { ValvingFigures } from '../../../core/valving/valving-evaluate';
import {
  VALVING_PRESET_NAMES,
  VALVING_PRESETS,
  valvingPresetOf,
  valvingScenarioEdit,
} from '../../../core/valving/valving-presets';
import {
  VALVING_TARGET_KEYS,
  valvingScoreOf,
  valvingTargetAssignmentParse,
  valvingTargetsEdit,
  type ValvingTargets,
} from '../../../core/valving/valving-targets';
import { inputErrorOf } from '../../input-error-fixture';

/** Figures with the given ζ and event values, the rest harmless. */
function figuresWith(change: { bump?: number; rebound?: number; airborne?: number } = {}): ValvingFigures {
  const event = {
    peakBodyAccel: 8,
    peakBodyAccelTime: 0.1,
    peakBodyDisplacement: 0.01,
    maxCompression: 0.02,
    maxExtension: 0.01,
    minTireLoad: 1000,
    maxTireLoad: 5000,
    airborneTime: change.airborne ?? 0,
    bumpStopContactTime: 0,
    bumpStopPeakForce: 0,
    reboundLimitContactTime: 0,
    settlingTime: 0.5,
    settled: true,
    peakDamperVelocityBump: 0.3,
    peakDamperVelocityRebound: 0.3,
    duration: 1.5,
  };
  const bump = change.bump ?? 0.4;
  const rebound = change.rebound ?? 0.8;
  return {
    dampingRatio: {
      bump,
      rebound,
      bumpHighSpeed: 0.35,
      reboundHighSpeed: 0.4,
      lowSpeedMean: (bump + rebound) / 2,
    },
    dampingClass: { bump: 'underdamped', rebound: 'underdamped' },
    kneeSpeed: { bump: 0.05, rebound: 0.05 },
    modes: {
      body: { frequencyHz: 2, dampingRatio: 0.5 },
      wheelHop: { frequencyHz: 14, dampingRatio: 0.3 },
      overdamped: 0,
    },
    rideFrequencyHz: 2,
    wheelHopFrequencyHz: 14,
    randomRoad: {
      bodyAccelRms: 1,
      bodyAccelWeightedRms: 0.8,
      tireLoadRms: 300,
      tireLoadRmsRatio: 0.1,
      travelRms: 0.005,
      roadRms: 0.004,
    },
    bump: event,
    curb: event,
  };
}

describe('valving presets', () => {
  it('has our four presets, each target with a tag and a source in words', () => {
    expect(VALVING_PRESET_NAMES).toEqual([
      'road-comfort',
      'track-day',
      'rally-stage',
      'high-downforce-circuit',
    ]);
    for (const name of VALVING_PRESET_NAMES) {
      const p = VALVING_PRESETS[name];
      expect(p.name).toBe(name);
      expect(p.scenarioSource.text.length).toBeGreaterThan(10);
      const keys = Object.keys(p.targets);
      expect(keys.length).toBeGreaterThan(5);
      for (const key of keys) {
        const t = p.targets[key as keyof ValvingTargets];
        expect(VALVING_TARGET_KEYS).toContain(key);
        expect(['pub', 'mem', 'trade', 'calc', 'ours']).toContain(t?.source.tag);
        expect(t?.source.text.length).toBeGreaterThan(10);
        expect(t?.scale).toBeGreaterThan(0);
        if (t?.low !== null && t?.high !== null) expect(t?.low).toBeLessThanOrEqual(t?.high as number);
      }
    }
  });

  it('builds the ζ bands from the trade bands of the reference notes', () => {
    const t = VALVING_PRESETS['track-day'].targets;
    // Trade [trade]: race cars ζ 0.6–0.7 at low shaft speed; high speed 0.3–0.5; rebound:bump 1.3–3.
    expect([t.lowSpeedMean?.low, t.lowSpeedMean?.high]).toEqual([0.6, 0.7]);
    expect([t.highSpeed?.low, t.highSpeed?.high]).toEqual([0.3, 0.5]);
    expect([t.reboundToBump?.low, t.reboundToBump?.high]).toEqual([1.3, 3]);
    // [calc] bump = 2m/(1+r) from 2·0.6/4 = 0.30 to 2·0.7/2.3 = 0.6087; rebound = 2mr/(1+r) from
    // 2·0.6·1.3/2.3 = 0.6783 to 2·0.7·3/4 = 1.05, rounded to two decimals.
    expect([t.bumpLowSpeed?.low, t.bumpLowSpeed?.high]).toEqual([0.3, 0.61]);
    expect([t.reboundLowSpeed?.low, t.reboundLowSpeed?.high]).toEqual([0.68, 1.05]);
    expect(t.bumpLowSpeed?.source.tag).toBe('calc');
    // Gillespie [mem]: passenger cars ζ 0.2–0.4; ISO 2631-1 Annex C [mem]: 0.63 m/s² "a little uncomfortable".
    const road = VALVING_PRESETS['road-comfort'].targets;
    expect([road.lowSpeedMean?.low, road.lowSpeedMean?.high]).toEqual([0.2, 0.4]);
    expect(road.lowSpeedMean?.source.tag).toBe('mem');
    expect(road.roadComfort?.high).toBe(0.63);
    // Ride-frequency bands [trade]: high downforce 3.5–5 Hz, rally 1.5–2.0 Hz; shown, not scored.
    expect(VALVING_PRESETS['high-downforce-circuit'].targets.rideFrequency).toMatchObject({
      low: 3.5,
      high: 5,
      weight: 0,
    });
    expect(VALVING_PRESETS['rally-stage'].targets.rideFrequency).toMatchObject({
      low: 1.5,
      high: 2,
      weight: 0,
    });
  });

  it('finds a preset by name, ignoring case, and names the ones there are', () => {
    expect(valvingPresetOf(' Track-Day ').name).toBe('track-day');
    expect(inputErrorOf(() => valvingPresetOf('drift')).message).toMatch(
      /^preset: "drift" is not a preset \(presets: road-comfort, track-day, rally-stage, high-downforce-circuit\)/,
    );
    expect(inputErrorOf(() => valvingPresetOf('')).field).toBe('preset');
  });
});

describe('valving target edits', () => {
  const base = VALVING_PRESETS['track-day'].targets;

  it('reads band texts with units, open ends and "off", tagging edits as the user’s', () => {
    const t = valvingTargetsEdit(base, {
      bumpLowSpeed: '0.5..0.7',
      airborneTime: '..10 ms',
      curbPeakAccel: '5 m/s^2..',
      rideFrequency: 'off',
    });
    expect(t.bumpLowSpeed).toMatchObject({ low: 0.5, high: 0.7, weight: 1, source: { tag: 'user' } });
    expect(t.bumpLowSpeed?.scale).toBeCloseTo(0.1, 12);
    expect(t.airborneTime?.low).toBeNull();
    expect(t.airborneTime?.high).toBeCloseTo(0.01, 12);
    expect(t.curbPeakAccel).toMatchObject({ low: 5, high: null });
    expect(t.rideFrequency).toBeUndefined();
    // Untouched targets keep the preset's band and source.
    expect(t.lowSpeedMean).toEqual(base.lowSpeedMean);
  });

  it('reads the object form and weights, and keeps a preset source when only the weight changes', () => {
    const t = valvingTargetsEdit(
      base,
      { airborneTime: { high: '5 ms', scale: '2 ms', weight: 3 }, roadComfort: { high: 0.5 } },
      { lowSpeedMean: '4', highSpeed: 0 },
    );
    expect(t.airborneTime?.high).toBeCloseTo(0.005, 12);
    expect(t.airborneTime?.scale).toBeCloseTo(0.002, 12);
    expect(t.airborneTime?.weight).toBe(3);
    expect(t.roadComfort).toMatchObject({
      low: null,
      high: 0.5,
      scale: 0.5,
      weight: 1,
      source: { tag: 'user' },
    });
    expect(t.lowSpeedMean).toMatchObject({ weight: 4, source: base.lowSpeedMean?.source });
    expect(t.highSpeed?.weight).toBe(0);
  });

  const bad: [string, unknown, unknown, RegExp][] = [
    ['an unknown target', { comfort: '0..1' }, undefined, /^targets\.comfort: is not a known field here/],
    [
      'a band with three dots',
      { bumpLowSpeed: '0.5...0.7' },
      undefined,
      /^targets\.bumpLowSpeed: could not read|^targets\.bumpLowSpeed: got/,
    ],
    [
      'a band with no dots',
      { bumpLowSpeed: '0.5' },
      undefined,
      /^targets\.bumpLowSpeed: got "0\.5"; expected a band LOW\.\.HIGH/,
    ],
    [
      'a band upside down',
      { bumpLowSpeed: '0.7..0.5' },
      undefined,
      /^targets\.bumpLowSpeed: the low end \(0\.7\) is above the high end/,
    ],
    [
      'an empty band',
      { bumpLowSpeed: '..' },
      undefined,
      /^targets\.bumpLowSpeed: a band needs a low end, a high end or both/,
    ],
    [
      'a time in kilograms',
      { airborneTime: '..5 kg' },
      undefined,
      /^targets\.airborneTime: got "5 kg" \(a mass\); expected a time/,
    ],
    [
      'NaN for a ratio',
      { bumpLowSpeed: 'NaN..1' },
      undefined,
      /^targets\.bumpLowSpeed: got "NaN"; expected a plain number/,
    ],
    ['a zero limit without a scale', { bumpStopContact: '..0 s' }, undefined, /needs a scale/],
    [
      'a negative weight',
      undefined,
      { bumpLowSpeed: -1 },
      /^weights\.bumpLowSpeed: got -1; expected a weight from 0 to 1000/,
    ],
    ['a weight in words', undefined, { bumpLowSpeed: 'heavy' }, /^weights\.bumpLowSpeed: got "heavy"/],
    [
      'the weight of a target that is off',
      { roadComfort: 'off' },
      { roadComfort: 2 },
      /^weights\.roadComfort: the target "roadComfort" is off/,
    ],
    [
      'a scale of zero',
      { airborneTime: { scale: 0 } },
      undefined,
      /^targets\.airborneTime\.scale: must be greater than zero/,
    ],
    ['targets as a list', ['bumpLowSpeed'], undefined, /^targets: expected an object/],
  ];
  for (const [what, edits, weights, message] of bad)
    it(`refuses ${what}, naming the field`, () => {
      expect(inputErrorOf(() => valvingTargetsEdit(base, edits, weights)).message).toMatch(message);
    });

  it('reads NAME=VALUE from a command line', () => {
    expect(valvingTargetAssignmentParse('bumpLowSpeed=0.5..0.7', '--target')).toEqual([
      'bumpLowSpeed',
      '0.5..0.7',
    ]);
    expect(inputErrorOf(() => valvingTargetAssignmentParse('=1', '--weight')).message).toMatch(
      /^--weight: got "=1"/,
    );
    expect(inputErrorOf(() => valvingTargetAssignmentParse('ride=1', '--weight')).message).toMatch(
      /"ride" is not a target/,
    );
  });

  it('edits the scenario field by field, with units, and names a bad one', () => {
    const s = valvingScenarioEdit(VALVING_PRESETS['track-day'].scenario, {
      road: { class: 'c', speed: '120 km/h' },
      curb: { height: '50 mm', hold: 0 },
    });
    expect(s.road.roadClass).toBe('C');
    // NIST SP 811 [pub]: 1 km/h = 1/3.6 m/s.
    expect(s.road.speed).toBeCloseTo(120 / 3.6, 12);
    expect(s.curb).toMatchObject({ height: 0.05, hold: 0, rise: 0.15 });
    expect(s.bump).toEqual(VALVING_PRESETS['track-day'].scenario.bump);
    const edit = (raw: unknown) => () => valvingScenarioEdit(VALVING_PRESETS['track-day'].scenario, raw);
    expect(inputErrorOf(edit({ road: { class: 'Z' } })).message).toMatch(
      /^scenario\.road\.class: got "Z"; expected an ISO 8608 class/,
    );
    expect(inputErrorOf(edit({ road: { speed: '0 km/h' } })).message).toMatch(
      /^scenario\.road\.speed: must be greater than zero/,
    );
    expect(inputErrorOf(edit({ bump: { height: '2 kg' } })).message).toMatch(
      /^scenario\.bump\.height: got "2 kg"/,
    );
    expect(inputErrorOf(edit({ curb: { hold: '-1 mm' } })).message).toMatch(
      /^scenario\.curb\.hold: must be zero or more/,
    );
    expect(inputErrorOf(edit({ curb: { drop: 'NaN' } })).field).toBe('scenario.curb.drop');
    expect(inputErrorOf(edit({ pothole: {} })).message).toMatch(/^scenario\.pothole: is not a known field/);
  });

  it('combines a preset and edits in one call', () => {
    const s = valvingSettingsOf('rally-stage', {
      scenario: { road: { speed: '50 km/h' } },
      targets: { airborneTime: 'off' },
    });
    expect(s.preset.name).toBe('rally-stage');
    expect(s.scenario.road.roadClass).toBe('D');
    expect(s.targets.airborneTime).toBeUndefined();
  });
});

describe('valving score', () => {
  const targets: ValvingTargets = {
    bumpLowSpeed: { low: 0.3, high: 0.5, scale: 0.1, weight: 1, source: { tag: 'user', text: 'test' } },
    airborneTime: { low: null, high: 0.01, scale: 0.01, weight: 2, source: { tag: 'user', text: 'test' } },
  };

  it('is zero inside every band, and Σ weight·(miss/scale)² outside', () => {
    const inside = valvingScoreOf(figuresWith({ bump: 0.45 }), targets);
    expect(inside.score).toBe(0);
    expect(inside.met).toBe(3);
    expect(inside.missed).toBe(0);
    // Centring over the two-ended band only: ((0.45 − 0.40)/0.10)² = 0.25 [calc].
    expect(inside.centring).toBeCloseTo(0.25, 12);
    const out = valvingScoreOf(figuresWith({ bump: 0.25, airborne: 0.025 }), targets);
    // bump misses by −0.05: 1·(0.05/0.1)² = 0.25; airborne misses by 0.015 on both events: 2·(1.5)² each = 9 [calc].
    expect(out.score).toBeCloseTo(0.25 + 4.5 + 4.5, 12);
    expect(out.checks.find((c) => c.figure === 'ζ bump, low speed')).toMatchObject({
      met: false,
      low: 0.3,
      high: 0.5,
    });
    expect(out.checks[0]?.miss).toBeCloseTo(-0.05, 12);
    expect(out.checks.filter((c) => c.target === 'airborneTime').map((c) => c.figure)).toEqual([
      'bump: time in the air',
      'curb: time in the air',
    ]);
    expect(out.missed).toBe(3);
  });

  it('checks every figure of a target, and a target at weight 0 counts for nothing', () => {
    const all = valvingScoreOf(figuresWith({ bump: 0.1 }), {
      ...targets,
      bumpLowSpeed: { ...targets.bumpLowSpeed!, weight: 0 },
    });
    expect(all.score).toBe(0);
    expect(all.missed).toBe(1);
    expect(valvingScoreOf(figuresWith(), {}).checks).toEqual([]);
  });

  it('counts a figure that could not be formed (NaN) as missing every band', () => {
    const s = valvingScoreOf(figuresWith({ bump: NaN }), targets);
    expect(s.checks[0]?.met).toBe(false);
    expect(s.score).toBe(Infinity);
  });
});
