import fc from 'fast-check';
import { expm, matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import { bumpStopForce } from '../../../core/damper/bump-stop';
import { cornerQuarterCar, STANDARD_GRAVITY, type CornerInput } from '../../../core/corner/corner';
import { complexAbs } from '../../../core/numeric/complex';
import {
  eventBump,
  eventCurb,
  eventPothole,
  eventRoad,
  eventStep,
  type RoadEvent,
} from '../../../core/events/event';
import { frequencyResponseAt } from '../../../core/corner/frequency-response';
import type { SimulationHistory } from '../../../core/events/metrics';
import {
  roadLevel,
  roadProfileIso8608,
  roadProfileMeasured,
  type RoadProfile,
} from '../../../core/events/road';
import { sdofLogDecrement, sdofStepOvershoot } from '../../../core/corner/sdof';
import { eventSimulate, SIMULATE_REL_TOL } from '../../../core/events/simulate';
import { MILLBROOK_FRONT_LEFT } from '../demo-corner';

const COUPE = MILLBROOK_FRONT_LEFT;
const staticLoad = COUPE.cornerMass * STANDARD_GRAVITY;

/** A corner with one linear damper coefficient in both directions (the linear model's). */
function linearCorner(c: number, extra: Partial<CornerInput> = {}): CornerInput {
  const { bumpStop: _none, ...rest } = COUPE;
  return {
    ...rest,
    damper: { bump: { kind: 'linear', coefficient: c }, rebound: { kind: 'linear', coefficient: c } },
    ...extra,
  };
}

/** A sine road of amplitude a (m) and wavelength λ (m), for steady-state checks. */
function roadSine(a: number, wavelength: number): RoadProfile {
  const k = (2 * Math.PI) / wavelength;
  return {
    breaks: [],
    heightIn: (_p, s) => a * Math.sin(k * s),
    slopeIn: (_p, s) => a * k * Math.cos(k * s),
    curvatureIn: (_p, s) => -a * k * k * Math.sin(k * s),
  };
}

/** Complex Fourier coefficient of a sampled signal at frequency f over [t0, end], trapezoid rule. */
function fourierAt(time: Float64Array, x: Float64Array, f: number, t0: number): { re: number; im: number } {
  let re = 0;
  let im = 0;
  let span = 0;
  for (let k = 1; k < time.length; k++) {
    const a = time[k - 1] as number;
    const b = time[k] as number;
    if (a < t0) continue;
    const w = 2 * Math.PI * f;
    const ya = x[k - 1] as number;
    const yb = x[k] as number;
    re += 0.5 * (b - a) * (ya * Math.cos(w * a) + yb * Math.cos(w * b));
    im -= 0.5 * (b - a) * (ya * Math.sin(w * a) + yb * Math.sin(w * b));
    span += b - a;
  }
  return { re: (2 * re) / span, im: (2 * im) / span };
}

function historyOf(
  corner: CornerInput,
  event: RoadEvent,
  points: number,
  relTol?: number,
): SimulationHistory {
  const h = eventSimulate(
    corner,
    event,
    relTol === undefined ? { historyPoints: points } : { historyPoints: points, relTol },
  ).history;
  if (!h) throw new Error('no history');
  return h;
}

describe('eventSimulate against closed forms', () => {
  it('in steady sine matches the linear frequency response (body accel, tyre load, travel)', () => {
    for (const [f, ct] of [
      [1.7, 0],
      [12, 0],
      [6, 300],
    ] as const) {
      const corner = linearCorner(4400, { tireDamping: ct });
      const speed = 20;
      const amplitude = 0.002;
      // Start after a whole number of periods past 4 s, when the transient has died (e^−20 of
      // it left), and fit 40 whole periods sampled 64 times each.
      const t0 = Math.ceil(4 * f) / f;
      const duration = t0 + 40 / f;
      const event: RoadEvent = { ...eventRoad(roadSine(amplitude, speed / f), speed, 'sine'), duration };
      const h = historyOf(corner, event, Math.round(duration * f) * 64 + 1, 1e-9);
      const q = cornerQuarterCar(corner);
      const fr = frequencyResponseAt(q, f);
      // The road is a·sin ωt: its complex amplitude is −i·a.
      const gain = (c: { re: number; im: number }) => complexAbs(c) / amplitude;
      const accel = gain(fourierAt(h.time, h.bodyAccel, f, t0 - 1e-9));
      const tire = gain(fourierAt(h.time, h.tireLoad, f, t0 - 1e-9));
      const travel = gain(fourierAt(h.time, h.travel, f, t0 - 1e-9));
      // frequencyResponseAt [calc: closed-form 2×2 complex solve]
      expect(accel / complexAbs(fr.bodyAccel)).toBeCloseTo(1, 4);
      expect(tire / complexAbs(fr.tireLoad)).toBeCloseTo(1, 4);
      expect(travel / complexAbs(fr.travel)).toBeCloseTo(1, 4);
    }
  });

  it('from a start state on a level road matches e^{A·dt} (mathjs expm) and the ASTM E1926 golden car', () => {
    // The golden car (kt/ms 653, ks/ms 63.3, cs/ms 6.0, mu/ms 0.15) as a corner with ms = 1 kg.
    const golden: CornerInput = {
      cornerMass: 1.15,
      unsprungMass: 0.15,
      springRate: 63.3,
      springMotionRatio: 1,
      damperMotionRatio: 1,
      tireRate: 653,
      tireDamping: 0,
      damper: { bump: { kind: 'linear', coefficient: 6 }, rebound: { kind: 'linear', coefficient: 6 } },
    };
    const dt = 0.25 / (80 / 3.6);
    // Our states are (zs, zu, vs, vu); ASTM orders them (zs, żs, zu, żu).
    const A = [
      [0, 0, 1, 0],
      [0, 0, 0, 1],
      [-63.3, 63.3, -6, 6],
      [63.3 / 0.15, -(63.3 + 653) / 0.15, 6 / 0.15, -6 / 0.15],
    ];
    const expA = expm(matrix(A.map((r) => r.map((v) => v * dt)))).toArray() as number[][];
    const astmRow1 = [0.9966071, 0.01091514, -0.002083274, 0.0003190145]; // zs after dt from unit (zs, żs, zu, żu)
    const astmOrder = [0, 2, 1, 3];
    // Unit states scaled to 0.1 mm (and 1 mm/s) so that the tyre stays on the road (δ0 = 17 mm).
    const scale = 1e-4;
    for (let j = 0; j < 4; j++) {
      const start = [0, 0, 0, 0];
      start[j] = scale;
      const r = eventSimulate(
        golden,
        {
          ...eventRoad(roadLevel(), 22.2, 'level'),
          duration: dt,
          start: {
            bodyDisplacement: start[0],
            wheelDisplacement: start[1],
            bodyVelocity: start[2],
            wheelVelocity: start[3],
          },
        },
        { relTol: 1e-12 },
      );
      for (let i = 0; i < 4; i++) {
        // mathjs expm [calc]
        expect((r.finalState[i] as number) / scale).toBeCloseTo((expA[i] as number[])[j] as number, 8);
      }
      // ASTM E1926 transition table, row 1 [pub]
      expect((r.finalState[0] as number) / scale).toBeCloseTo(astmRow1[astmOrder.indexOf(j)] as number, 6);
    }
  });

  // A corner that is nearly a single-degree-of-freedom oscillator: a tyre 10⁵× the wheel rate
  // under 0.1 % of the sprung mass holds the wheel still (the damper in series with the tyre
  // loses a fraction 2·kw/kt of its damping, so the ratio must be that large for 4 decimals). The oscillator is the body on the wheel
  // rate and tyre in series, kr, so the damping is set for ζ on kr.
  const SDOF = { ms: 300, kw: 30_000, kt: 3e9, mu: 0.3 };
  const sdofKr = (SDOF.kw * SDOF.kt) / (SDOF.kw + SDOF.kt);
  function sdofCorner(zeta: number): CornerInput {
    const c = zeta * 2 * Math.sqrt(sdofKr * SDOF.ms);
    return {
      cornerMass: SDOF.ms + SDOF.mu,
      unsprungMass: SDOF.mu,
      springRate: SDOF.kw,
      springMotionRatio: 1,
      damperMotionRatio: 1,
      tireRate: SDOF.kt,
      tireDamping: 0,
      damper: { bump: { kind: 'linear', coefficient: c }, rebound: { kind: 'linear', coefficient: c } },
    };
  }
  // The body held h below static and let go, with the wheel already where that load puts it.
  const releaseFrom = (h: number, duration: number): RoadEvent => ({
    ...eventRoad(roadLevel(), 10, 'release'),
    duration,
    start: { bodyDisplacement: -h, wheelDisplacement: (-h * sdofKr) / SDOF.kt },
  });

  it('released from a held displacement, overshoots by exp(−ζπ/√(1−ζ²)) (the step overshoot)', () => {
    // The project's reference notes §1 [calc]: ζ 0.1 → 0.7292, 0.3 → 0.3723, 0.5 → 0.1630.
    for (const [zeta, mp] of [
      [0.1, 0.7292],
      [0.3, 0.3723],
      [0.5, 0.163],
    ] as const) {
      const h = 0.01;
      const m = eventSimulate(sdofCorner(zeta), releaseFrom(h, 1.5), { relTol: 1e-9 }).metrics;
      // Release from −h is a force step of the same size: overshoot = max(zs)/h, here against
      // the formula's exact value; the table's four decimals are rounded.
      expect(m.peakBodyDisplacement / h / sdofStepOvershoot(zeta)).toBeCloseTo(1, 4);
      expect(sdofStepOvershoot(zeta)).toBeCloseTo(mp, 4);
    }
  });

  it('decays by the logarithmic decrement 2πζ/√(1−ζ²) from peak to peak', () => {
    const zeta = 0.1;
    const hist = historyOf(sdofCorner(zeta), releaseFrom(0.01, 2), 40_001, 1e-10);
    const peaks: number[] = [];
    const z = hist.bodyDisplacement;
    for (let k = 1; k < z.length - 1; k++) {
      const v = z[k] as number;
      if (v > (z[k - 1] as number) && v >= (z[k + 1] as number) && v > 0) peaks.push(v);
    }
    expect(peaks.length).toBeGreaterThanOrEqual(3);
    const delta = Math.log((peaks[0] as number) / (peaks[1] as number));
    // Rao, Mechanical Vibrations, ch. 2 [pub]: δ = 2πζ/√(1−ζ²) = 0.6315 at ζ = 0.1
    expect(delta).toBeCloseTo(sdofLogDecrement(zeta), 3);
    expect(sdofLogDecrement(zeta)).toBeCloseTo(0.63148, 4);
  });

  it('critically damped returns without overshoot, and sooner than overdamped', () => {
    // Standard result [pub]: critical damping returns to rest fastest without overshoot.
    const settle = (zeta: number) => {
      const ev = { ...releaseFrom(0.01, 3), settle: { target: 0, band: 0.0002 } };
      return eventSimulate(sdofCorner(zeta), ev, { relTol: 1e-9 }).metrics;
    };
    const critical = settle(1);
    const over = settle(2);
    expect(critical.peakBodyDisplacement).toBeLessThan(1e-5 * 0.01);
    expect(over.peakBodyDisplacement).toBeLessThan(1e-6);
    expect(critical.settlingTime as number).toBeLessThan(over.settlingTime as number);
  });
});

/** Total mechanical energy from static equilibrium (DESIGN.md's forces; written here from them). */
function energyOf(c: CornerInput, zs: number, zu: number, vs: number, vu: number): number {
  const ms = c.cornerMass - c.unsprungMass;
  const kw = c.springRate * c.springMotionRatio ** 2;
  const d0 = (c.cornerMass * STANDARD_GRAVITY) / c.tireRate;
  const x = zu - zs;
  const xd = c.damperMotionRatio * x;
  let e =
    0.5 * ms * vs * vs +
    0.5 * c.unsprungMass * vu * vu +
    c.cornerMass * STANDARD_GRAVITY * zu +
    0.5 * kw * x * x;
  const tyre = Math.max(0, d0 - zu);
  e += 0.5 * c.tireRate * tyre * tyre;
  if (c.bumpStop && xd > c.bumpStop.gap) {
    // ∫ F dx over the stop's compression, by Simpson's rule on the force itself.
    const b = c.bumpStop;
    const n = 200;
    const span = xd - b.gap;
    let sum = 0;
    for (let i = 0; i <= n; i++) {
      const w = i === 0 || i === n ? 1 : i % 2 ? 4 : 2;
      sum += w * bumpStopForce(b, b.gap + (span * i) / n);
    }
    e += (sum * span) / (3 * n);
  }
  if (c.reboundLimit && -xd > c.reboundLimit.travel)
    e += 0.5 * c.reboundLimit.rate * (-xd - c.reboundLimit.travel) ** 2;
  return e;
}

function energies(c: CornerInput, h: SimulationHistory): number[] {
  return Array.from(h.time, (_t, k) =>
    energyOf(
      c,
      h.bodyDisplacement[k] as number,
      h.wheelDisplacement[k] as number,
      h.bodyVelocity[k] as number,
      h.wheelVelocity[k] as number,
    ),
  );
}

describe('eventSimulate energy', () => {
  const undamped = (extra: Partial<CornerInput>): CornerInput => ({ ...linearCorner(0), ...extra });
  const dropped: RoadEvent = { ...eventRoad(roadLevel(), 10, 'drop'), start: { bodyVelocity: -1.4 } };

  for (const [name, stop] of [
    ['a linear bump stop', { gap: 0.01, rate: 250_000 }],
    [
      'a progressive bump stop',
      {
        gap: 0.01,
        curve: [
          { compression: 0.005, force: 600 },
          { compression: 0.01, force: 2000 },
          { compression: 0.02, force: 9000 },
        ],
      },
    ],
  ] as const) {
    it(`with no road and no damping stays constant through ${name}, lift-off and landing`, () => {
      const corner = undamped({ bumpStop: stop, reboundLimit: { travel: 0.03, rate: 400_000 } });
      const r = eventSimulate(corner, dropped, { relTol: 1e-10, historyPoints: 3001 });
      // The event must really pass every switch for this to mean something.
      expect(r.metrics.bumpStopContactTime).toBeGreaterThan(0);
      expect(r.metrics.airborneTime).toBeGreaterThan(0);
      expect(r.metrics.reboundLimitContactTime).toBeGreaterThan(0);
      const e = energies(corner, r.history as SimulationHistory);
      const e0 = e[0] as number;
      const drift = Math.max(...e.map((v) => Math.abs(v - e0)));
      // [calc] ½·ms·v² = ½·257·1.4² = 251.9 J put in, above the energy at rest (the tyre's ½·kt·δ0²)
      expect(e0 - energyOf(corner, 0, 0, 0, 0)).toBeCloseTo(0.5 * 257 * 1.4 * 1.4, 6);
      // kept to the integrator's tolerance through every contact and landing
      expect(drift / e0).toBeLessThan(1e-6);
    });
  }

  it('never grows with damping and no road input (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 200, max: 8000, noNaN: true }),
        fc.double({ min: 200, max: 8000, noNaN: true }),
        fc.double({ min: -2, max: 2, noNaN: true }),
        fc.double({ min: 0, max: 500, noNaN: true }),
        (bump, rebound, v0, ct) => {
          const corner: CornerInput = {
            ...COUPE,
            tireDamping: ct,
            damper: {
              bump: { kind: 'bilinear', lowSpeed: bump, kneeSpeed: 0.08, highSpeed: bump / 3 },
              rebound: { kind: 'linear', coefficient: rebound },
            },
          };
          const h = eventSimulate(
            corner,
            { ...dropped, start: { bodyVelocity: v0 } },
            { relTol: 1e-8, historyPoints: 601 },
          ).history as SimulationHistory;
          const e = energies(corner, h);
          const scale = Math.max(1, e[0] as number);
          for (let k = 1; k < e.length; k++)
            expect(e[k] as number).toBeLessThanOrEqual((e[k - 1] as number) + 1e-6 * scale);
        },
      ),
      { numRuns: 25, seed: 2718 },
    );
  });
});

describe('eventSimulate on invented demo corners (hand-checkable limits)', () => {
  it('keeps the tyre on the road and off the bump stop over a 1 mm bump', () => {
    const m = eventSimulate(COUPE, eventBump({ height: 0.001, length: 0.6, speed: 14 })).metrics;
    expect(m.airborneTime).toBe(0);
    expect(m.bumpStopContactTime).toBe(0);
    // A 1 mm input cannot move the tyre load by more than kt·(a few mm).
    expect(m.minTireLoad).toBeGreaterThan(staticLoad - 240_000 * 0.003);
    expect(m.maxCompression).toBeLessThan(0.003);
  });

  it('throws the tyre off the road over a large, fast bump', () => {
    const m = eventSimulate(COUPE, eventBump({ height: 0.06, length: 0.5, speed: 25 })).metrics;
    expect(m.airborneTime).toBeGreaterThan(0);
    expect(m.minTireLoad).toBe(0);
    expect(m.bumpStopContactTime).toBeGreaterThan(0);
    // The stop touches when the damper closes its 30 mm gap: 33.3 mm at the wheel (MRd 0.9).
    expect(m.maxCompression).toBeGreaterThan(0.03 / 0.9);
    expect(m.bumpStopPeakForce).toBeGreaterThan(0);
  });

  it('lets the body follow a long, gentle bump (far below the ride frequency)', () => {
    // 20 mm over 20 m at 5 m/s: a 0.25 Hz input on a 2.3 Hz body — it rides the bump. The
    // crossing takes 4 s, so the window is longer than the usual 1.5 s.
    const ev = { ...eventBump({ height: 0.02, length: 20, speed: 5 }), duration: 5 };
    const m = eventSimulate(COUPE, ev, { relTol: 1e-7 }).metrics;
    expect(m.peakBodyDisplacement / 0.02).toBeGreaterThan(0.97);
    expect(m.peakBodyDisplacement / 0.02).toBeLessThan(1.1);
    expect(m.airborneTime).toBe(0);
  });

  it('ends a road step level at its height and settles there', () => {
    const m = eventSimulate(COUPE, eventStep({ height: 0.02, rise: 0.05, speed: 10 })).metrics;
    expect(m.settled).toBe(true);
    expect(m.settlingTime as number).toBeGreaterThan(0.1);
    expect(m.settlingTime as number).toBeLessThan(1.5);
    expect(m.peakBodyDisplacement).toBeGreaterThan(0.02);
  });

  it('drops the wheel into a pothole before the body', () => {
    const m = eventSimulate(COUPE, eventPothole({ depth: 0.03, length: 1.5, speed: 5 }), {
      historyPoints: 3001,
    });
    const h = m.history as SimulationHistory;
    // The wheel goes down into the hole first (extension), ahead of the body behind its spring.
    expect(m.metrics.maxExtension).toBeGreaterThan(0.005);
    expect(Math.min(...h.wheelDisplacement)).toBeLessThan(-0.02);
    const wheelLow = h.wheelDisplacement.indexOf(Math.min(...h.wheelDisplacement));
    const bodyLow = h.bodyDisplacement.indexOf(Math.min(...h.bodyDisplacement));
    expect(wheelLow).toBeLessThan(bodyLow);
  });

  it('holds the damper at its rebound limit', () => {
    const free = eventSimulate(COUPE, eventPothole({ depth: 0.05, length: 1.2, speed: 8 })).metrics;
    const limited = eventSimulate(
      { ...COUPE, reboundLimit: { travel: 0.01, rate: 1e6 } },
      eventPothole({ depth: 0.05, length: 1.2, speed: 8 }),
    ).metrics;
    expect(free.maxExtension * 0.9).toBeGreaterThan(0.02);
    expect(limited.reboundLimitContactTime).toBeGreaterThan(0);
    // The 1000 N/mm top-out lets the shaft past 10 mm by millimetres, not the free extension's tens.
    expect(limited.maxExtension * 0.9).toBeGreaterThan(0.01);
    expect(limited.maxExtension * 0.9).toBeLessThan(0.017);
  });

  it('gives the same answer for a damper table and a bump-stop curve of collinear points as for the linear forms', () => {
    // A monotone cubic through collinear points is the straight line itself.
    const tableCorner: CornerInput = {
      ...linearCorner(4000),
      damper: {
        bump: { kind: 'table', points: [0.1, 0.3, 1.2].map((v) => ({ velocity: v, force: 4000 * v })) },
        rebound: { kind: 'table', points: [0.05, 2].map((v) => ({ velocity: v, force: 4000 * v })) },
      },
      bumpStop: { gap: 0.02, curve: [0.01, 0.05].map((x) => ({ compression: x, force: 250_000 * x })) },
    };
    const lin = { ...linearCorner(4000), bumpStop: { gap: 0.02, rate: 250_000 } };
    const ev = eventCurb({ height: 0.05, rise: 0.2, hold: 0.3, drop: 0.02, speed: 12 });
    const a = eventSimulate(tableCorner, ev, { relTol: 1e-9 }).metrics;
    const b = eventSimulate(lin, ev, { relTol: 1e-9 }).metrics;
    expect(a.bumpStopContactTime).toBeGreaterThan(0);
    for (const k of [
      'peakBodyAccel',
      'maxCompression',
      'maxTireLoad',
      'airborneTime',
      'bumpStopPeakForce',
    ] as const) {
      expect(a[k]).toBeCloseTo(b[k], 6);
    }
  });

  it('with tyre damping still never pulls the wheel down: the tyre load never goes below zero', () => {
    const corner = { ...COUPE, tireDamping: 400 };
    const r = eventSimulate(corner, eventBump({ height: 0.05, length: 0.5, speed: 20 }), {
      historyPoints: 3001,
    });
    expect(r.metrics.airborneTime).toBeGreaterThan(0);
    expect(Math.min(...(r.history as SimulationHistory).tireLoad)).toBe(0);
  });
});

describe('eventSimulate accuracy and output', () => {
  const cases: [string, CornerInput, RoadEvent][] = [
    ['demo bump', COUPE, eventBump({ height: 0.025, length: 0.6, speed: 14 })],
    [
      'curb with bump stop and lift-off',
      COUPE,
      eventCurb({ height: 0.05, rise: 0.15, hold: 0.3, drop: 0.02, speed: 14 }),
    ],
    ['pothole', { ...COUPE, tireDamping: 200 }, eventPothole({ depth: 0.04, length: 0.6, speed: 14 })],
    ['step', COUPE, eventStep({ height: 0.025, rise: 0.05, speed: 14 })],
    [
      'ISO 8608 class D road',
      COUPE,
      eventRoad(roadProfileIso8608({ roadClass: 'D', seed: 3, length: 40 }), 25, 'class D'),
    ],
  ];
  for (const [name, corner, event] of cases) {
    it(`at the default tolerance keeps the ${name}'s peaks within 0.1 % of a 1e-10 run`, () => {
      const fast = eventSimulate(corner, event).metrics;
      const tight = eventSimulate(corner, event, { relTol: 1e-10 }).metrics;
      expect(SIMULATE_REL_TOL).toBeGreaterThan(1e-10);
      for (const k of [
        'peakBodyAccel',
        'maxCompression',
        'maxExtension',
        'maxTireLoad',
        'peakBodyDisplacement',
      ] as const) {
        expect(Math.abs(fast[k] - tight[k])).toBeLessThanOrEqual(1e-3 * Math.abs(tight[k]));
      }
      expect(Math.abs(fast.airborneTime - tight.airborneTime)).toBeLessThanOrEqual(
        1e-3 * tight.airborneTime + 1e-9,
      );
      expect(Math.abs(fast.minTireLoad - tight.minTireLoad)).toBeLessThanOrEqual(1e-3 * staticLoad);
    });
  }

  it('samples the history evenly, within the metrics, and agrees with them', () => {
    const ev = eventCurb({ height: 0.05, rise: 0.15, hold: 0.3, drop: 0.02, speed: 14 });
    const r = eventSimulate(COUPE, ev, { historyPoints: 15_001 });
    const h = r.history as SimulationHistory;
    const m = r.metrics;
    expect(h.time.length).toBe(15_001);
    expect(h.time[0]).toBe(0);
    expect(h.time[15_000]).toBeCloseTo(1.5, 12);
    const maxAbs = Math.max(...h.bodyAccel.map(Math.abs));
    expect(maxAbs).toBeLessThanOrEqual(m.peakBodyAccel * (1 + 1e-9));
    expect(maxAbs).toBeGreaterThan(m.peakBodyAccel * 0.99);
    expect(Math.max(...h.travel)).toBeLessThanOrEqual(m.maxCompression * (1 + 1e-9));
    expect(Math.max(...h.bumpStopForce)).toBeLessThanOrEqual(m.bumpStopPeakForce * (1 + 1e-9));
    // Airborne samples carry no tyre load; the share of them matches the airborne time.
    const airborne = h.tireLoad.filter((f) => f === 0).length * (1.5 / 15_000);
    expect(Math.abs(airborne - m.airborneTime)).toBeLessThan(5e-4);
    // History samples are the same states as a fresh run's (no drift between runs).
    expect(eventSimulate(COUPE, ev).metrics).toEqual(m);
  });

  it('sees a short feature in a long flat run of a measured road at any speed', () => {
    // A 30 mm, 0.8 m plateau 5 m down a flat 30 m road: nothing happens before it, so an
    // integrator free to grow its step could stride over it; the measured points stop it.
    const road = roadProfileMeasured([
      [0, 0],
      [5, 0],
      [5.2, 0.03],
      [5.6, 0.03],
      [5.8, 0],
      [30, 0],
    ]);
    for (const speed of [8, 14, 20, 25]) {
      const m = eventSimulate(COUPE, eventRoad(road, speed, 'plateau')).metrics;
      expect(m.maxCompression).toBeGreaterThan(0.01);
    }
  });

  it('names the bad input of an event', () => {
    expect(() => eventBump({ height: 0.02, length: 0, speed: 10 })).toThrow(/bump\.length/);
    expect(() => eventBump({ height: 0.02, length: 0.5, speed: NaN })).toThrow(/bump\.speed/);
    expect(() => eventStep({ height: 0.02, rise: -1, speed: 10 })).toThrow(/step\.rise/);
    expect(() => eventCurb({ height: 0.02, rise: 0.1, hold: -0.1, drop: 0.01, speed: 10 })).toThrow(
      /curb\.hold/,
    );
    expect(() => eventPothole({ depth: 0, length: 0.5, speed: 10 })).toThrow(/pothole\.depth/);
  });
});
