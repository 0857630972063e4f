import fc from 'fast-check';
import { complex, lusolve, type Complex as MathComplex, type MathNumericType } from 'mathjs';
import { describe, expect, it } from 'vitest';
import type { QuarterCarLinear } from '../../../core/corner/corner';
import {
  frequencyResponseAt,
  frequencyResponseGrid,
  frequencyResponseMagnitudeAt,
} from '../../../core/corner/frequency-response';
import { quarterCarStateMatrix } from '../../../core/corner/modal';
import { sdofBaseTransmissibility } from '../../../core/corner/sdof';

const abs = (z: { re: number; im: number }) => Math.hypot(z.re, z.im);

/** A quarter car with a rigid tyre and a negligible wheel: the SDOF base-excitation model. */
function sdofOnRigidTyre(m: number, k: number, c: number): QuarterCarLinear {
  return {
    sprungMass: m,
    unsprungMass: 1e-4 * m,
    wheelRate: k,
    wheelDamping: c,
    tireRate: 1e13,
    tireDamping: 0,
  };
}

/** Body displacement amplitude of the SDOF vehicle at speed V (m/s) over a sine road of wavelength λ, amplitude Y. */
function roadAmplitude(q: QuarterCarLinear, speed: number, wavelength: number, amplitude: number): number {
  return abs(frequencyResponseAt(q, speed / wavelength).body) * amplitude;
}

describe('frequencyResponseAt against the base-excitation worked examples', () => {
  it('vehicle 1200 kg, 400 kN/m, ζ 0.5 on a 6 m wave of 0.05 m', () => {
    // Worked exam problem, ques10.com, recomputed [pub; REFERENCES §2]: X = 0.0550 m at 20 km/h, 0.0425 m at 100 km/h.
    const m = 1200;
    const k = 400_000;
    const c = 0.5 * 2 * Math.sqrt(k * m);
    const q = sdofOnRigidTyre(m, k, c);
    expect(roadAmplitude(q, 20 / 3.6, 6, 0.05)).toBeCloseTo(0.055, 4);
    expect(roadAmplitude(q, 100 / 3.6, 6, 0.05)).toBeCloseTo(0.0425, 4);
    const r = (2 * Math.PI * (20 / 3.6 / 6)) / Math.sqrt(k / m);
    expect(sdofBaseTransmissibility(r, 0.5) * 0.05).toBeCloseTo(0.055, 4);
  });

  it('vehicle 1007 kg, 40 kN/m, 2 kN·s/m at 20 km/h on a 6 m wave of 0.01 m', () => {
    // Inman, Engineering Vibration, base-excitation example [mem; calc REFERENCES §2]: ζ 0.1576, r 0.9231, X = 0.0319 m.
    const q = sdofOnRigidTyre(1007, 4e4, 2e3);
    expect(roadAmplitude(q, 20 / 3.6, 6, 0.01)).toBeCloseTo(0.0319, 4);
  });

  it('fn 2 Hz, ζ 0.15, 60 km/h on a 35 m wave of 0.1 m', () => {
    // Rao, Mechanical Vibrations, base-excitation example [mem; calc REFERENCES §2]: r 0.2381, X/Y 1.0598.
    const m = 1000;
    const k = m * (2 * Math.PI * 2) ** 2;
    const q = sdofOnRigidTyre(m, k, 0.15 * 2 * Math.sqrt(k * m));
    expect(roadAmplitude(q, 60 / 3.6, 35, 0.1) / 0.1).toBeCloseTo(1.0598, 4);
  });

  it('trailer loaded vs empty at 100 km/h on a 5 m wave', () => {
    // Rao [mem; calc REFERENCES §2]: 1000/250 kg, 350 kN/m, ζ 0.5 loaded, same c; loaded ÷ empty amplitude 0.6024.
    const k = 350_000;
    const c = 0.5 * 2 * Math.sqrt(k * 1000);
    const loaded = roadAmplitude(sdofOnRigidTyre(1000, k, c), 100 / 3.6, 5, 1);
    const empty = roadAmplitude(sdofOnRigidTyre(250, k, c), 100 / 3.6, 5, 1);
    expect(loaded / empty).toBeCloseTo(0.6024, 4);
  });

  it('passes through T = 1 at r = √2 for every ζ, and peaks where the closed form says', () => {
    // REFERENCES §1 [calc]: T(√2) = 1; peaks ζ 0.1 → r 0.9903, T 5.123; 0.2 → 0.9647, 2.734; 0.3 → 0.9302, 1.995; 0.5 → 0.8556, 1.468.
    for (const z of [0.05, 0.3, 1, 2]) expect(sdofBaseTransmissibility(Math.SQRT2, z)).toBeCloseTo(1, 12);
    const peaks: [number, number, number][] = [
      [0.1, 0.9903, 5.123],
      [0.2, 0.9647, 2.734],
      [0.3, 0.9302, 1.995],
      [0.5, 0.8556, 1.468],
    ];
    for (const [zeta, rPeak, tPeak] of peaks) {
      const m = 1;
      const k = 1;
      const q = sdofOnRigidTyre(m, k, 2 * zeta);
      let best = 0;
      let bestR = 0;
      for (let r = 0.5; r <= 1.2; r += 1e-5) {
        const t = abs(frequencyResponseAt(q, r / (2 * Math.PI)).body);
        if (t > best) {
          best = t;
          bestR = r;
        }
      }
      expect(bestR).toBeCloseTo(rPeak, 3);
      expect(best).toBeCloseTo(tPeak, 3);
    }
  });
});

/** A 250 kg / 35 kg corner on a 160 kN/m tyre with any suspension: the invariant points do not move. */
const invariantCorner = (ks: number, cs: number): QuarterCarLinear => ({
  sprungMass: 250,
  unsprungMass: 35,
  wheelRate: ks,
  wheelDamping: cs,
  tireRate: 160_000,
  tireDamping: 0,
});

describe('invariant points of the quarter car', () => {
  // Hedrick & Butsuen 1990, "Invariant properties of automotive suspensions", Proc. IMechE Part D 204 [pub].
  it('body acceleration per road displacement is kt/ms at ω = √(kt/mu), whatever the suspension (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5e3, max: 2e5, noNaN: true }),
        fc.double({ min: 0, max: 2e4, noNaN: true }),
        (ks, cs) => {
          const q = invariantCorner(ks, cs);
          const f = Math.sqrt(160_000 / 35) / (2 * Math.PI);
          return Math.abs(abs(frequencyResponseAt(q, f).bodyAccel) / (160_000 / 250) - 1) < 1e-9;
        },
      ),
    );
  });

  it('rattle space per road displacement is (ms+mu)/ms at ω = √(kt/(ms+mu)) (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 5e3, max: 2e5, noNaN: true }),
        fc.double({ min: 0, max: 2e4, noNaN: true }),
        (ks, cs) => {
          const q = invariantCorner(ks, cs);
          const f = Math.sqrt(160_000 / 285) / (2 * Math.PI);
          return Math.abs(abs(frequencyResponseAt(q, f).travel) / (285 / 250) - 1) < 1e-9;
        },
      ),
    );
  });
});

describe('frequencyResponseAt against an independent complex solve', () => {
  /** (iωI − A)·X = B·zr by mathjs's complex LU solve on the 4×4 state-space form. */
  function stateSpaceResponse(q: QuarterCarLinear, f: number) {
    const w = 2 * Math.PI * f;
    const a = quarterCarStateMatrix(q);
    const m = a.map((row, i) => row.map((aij, j) => complex(-aij, i === j ? w : 0)));
    const b = [0, 0, 0, complex(q.tireRate / q.unsprungMass, (w * q.tireDamping) / q.unsprungMass)];
    const x = lusolve(
      m as unknown as MathNumericType[][],
      b as unknown as MathNumericType[],
    ) as unknown as MathComplex[][];
    const at = (i: number) => {
      const v = (x[i] as MathComplex[])[0] as unknown as MathComplex | number;
      return typeof v === 'number' ? { re: v, im: 0 } : { re: v.re, im: v.im };
    };
    return { body: at(0), wheel: at(1) };
  }

  it('matches on random corners and frequencies to 1e-9 (property)', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 100, max: 800, noNaN: true }),
        fc.double({ min: 10, max: 80, noNaN: true }),
        fc.double({ min: 1e4, max: 2e5, noNaN: true }),
        fc.double({ min: 100, max: 2e4, noNaN: true }),
        fc.double({ min: 1e5, max: 5e5, noNaN: true }),
        fc.double({ min: 0, max: 500, noNaN: true }),
        fc.double({ min: 0.1, max: 50, noNaN: true }),
        (ms, mu, k, c, kt, ct, f) => {
          const q: QuarterCarLinear = {
            sprungMass: ms,
            unsprungMass: mu,
            wheelRate: k,
            wheelDamping: c,
            tireRate: kt,
            tireDamping: ct,
          };
          const ours = frequencyResponseAt(q, f);
          const theirs = stateSpaceResponse(q, f);
          const w = 2 * Math.PI * f;
          const err = (x: { re: number; im: number }, y: { re: number; im: number }) =>
            Math.hypot(x.re - y.re, x.im - y.im) / Math.max(abs(y), 1e-12);
          expect(err(ours.body, theirs.body)).toBeLessThan(1e-9);
          expect(err(ours.wheel, theirs.wheel)).toBeLessThan(1e-9);
          expect(abs(ours.bodyAccel)).toBeCloseTo(w * w * abs(theirs.body), 6);
          const tireForce = {
            re: kt * (1 - theirs.wheel.re) + ct * w * theirs.wheel.im,
            im: -kt * theirs.wheel.im + ct * w * (1 - theirs.wheel.re),
          };
          expect(err(ours.tireLoad, tireForce)).toBeLessThan(1e-8);
          const travel = { re: theirs.wheel.re - theirs.body.re, im: theirs.wheel.im - theirs.body.im };
          expect(Math.hypot(ours.travel.re - travel.re, ours.travel.im - travel.im)).toBeLessThan(
            1e-9 * Math.max(1, abs(travel)),
          );
        },
      ),
      { numRuns: 200 },
    );
  });

  it('follows the road at low frequency: body and wheel gains → 1, travel and tyre load → 0', () => {
    const q: QuarterCarLinear = {
      sprungMass: 260,
      unsprungMass: 40,
      wheelRate: 38_400,
      wheelDamping: 2560,
      tireRate: 250_000,
      tireDamping: 0,
    };
    const r = frequencyResponseMagnitudeAt(q, 1e-4);
    expect(abs(frequencyResponseAt(q, 1e-4).body)).toBeCloseTo(1, 6);
    expect(r.travel).toBeLessThan(1e-6);
    expect(r.tireLoad).toBeLessThan(1e-2);
  });
});

describe('frequencyResponseGrid', () => {
  it('spans the range log-evenly', () => {
    const g = frequencyResponseGrid(0.1, 100, 10);
    expect(g[0]).toBeCloseTo(0.1, 12);
    expect(g[g.length - 1]).toBeCloseTo(100, 9);
    expect(g).toHaveLength(31);
    expect((g[1] as number) / (g[0] as number)).toBeCloseTo(Math.pow(10, 0.1), 12);
  });
});
