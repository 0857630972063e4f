import { describe, expect, it } from 'vitest';
import type { QuarterCarLinear } from '../../../core/corner/corner';
import { frequencyResponseAt } from '../../../core/corner/frequency-response';
import { integrateAdaptive } from '../../../core/numeric/quadrature';
import {
  ISO8608_BAND,
  ISO8608_CLASSES,
  iso8608ClassGd0,
  iso8608DisplacementPsd,
  randomRoadResponse,
} from '../../../core/corner/random-road';

/** The worked random-road case of REFERENCES §5 [calc, two independent methods]. */
const WORKED: QuarterCarLinear = {
  sprungMass: 250,
  unsprungMass: 35,
  wheelRate: 16_000,
  wheelDamping: 1000,
  tireRate: 160_000,
  tireDamping: 0,
};

const rel = (a: number, b: number) => Math.abs(a / b - 1);

describe('ISO 8608 road classes', () => {
  it('has the class geometric means A 16 … H 262144 ×10⁻⁶ m³ at n0 = 0.1 cycles/m', () => {
    // ISO 8608 [mem; widely reproduced; REFERENCES §5]
    const want = [16, 64, 256, 1024, 4096, 16384, 65536, 262144];
    ISO8608_CLASSES.forEach((c, i) => expect(iso8608ClassGd0(c)).toBeCloseTo((want[i] as number) * 1e-6, 15));
    expect(ISO8608_BAND).toEqual({ low: 0.011, high: 2.83 });
  });

  it('uses the spatial-frequency form, not the angular one 16× smaller', () => {
    // REFERENCES §5: Gd(Ω0 = 1 rad/m) is 1, 4, 16 … ×10⁻⁶; the n-form at n0 = 0.1 is 16× that.
    expect(iso8608ClassGd0('A')).toBe(16e-6);
    expect(iso8608DisplacementPsd(0.1, 'A')).toBeCloseTo(16e-6, 15);
  });

  it('falls as n⁻² (waviness 2)', () => {
    expect(iso8608DisplacementPsd(0.2, 'C') / iso8608DisplacementPsd(0.1, 'C')).toBeCloseTo(0.25, 14);
  });

  it('gives class C an RMS height of 15.23 mm over the band', () => {
    // σ² = Gd(n0)·n0²·(1/n1 − 1/n2) → 15.23 mm [calc; REFERENCES §5]
    const r = randomRoadResponse(WORKED, { roadClass: 'C', speed: 20 });
    expect(r.roadRms * 1000).toBeCloseTo(15.23, 2);
  });

  it('has a white road-velocity spectrum of 2.0213·10⁻³ (m/s)²/Hz for class C at 20 m/s', () => {
    // G = (2π·n0)²·Gd(n0)·V [calc; REFERENCES §5]; temporal PSD G(f) = Gd(f/V)/V (DESIGN.md).
    const v = 20;
    for (const f of [0.5, 2, 10]) {
      const displacement = iso8608DisplacementPsd(f / v, 'C') / v;
      expect((2 * Math.PI * f) ** 2 * displacement).toBeCloseTo(2.0213e-3, 7);
    }
  });
});

describe('randomRoadResponse', () => {
  it('reproduces the worked case to 0.1 %', () => {
    // REFERENCES §5 [calc, Lyapunov closed form and spectral integration]: class C, 20 m/s, band 0.011–2.83 cycles/m →
    // body accel RMS 1.3720 m/s², Wk-weighted 1.1399 m/s², travel RMS 11.998 mm, tyre deflection RMS 4.325 mm (load ratio 0.2476).
    const r = randomRoadResponse(WORKED, { roadClass: 'C', speed: 20 });
    expect(rel(r.bodyAccelRms, 1.372)).toBeLessThan(1e-3);
    expect(rel(r.bodyAccelWeightedRms, 1.1399)).toBeLessThan(1e-3);
    expect(rel(r.travelRms, 11.998e-3)).toBeLessThan(1e-3);
    expect(rel(r.tireLoadRms / WORKED.tireRate, 4.325e-3)).toBeLessThan(1e-3);
    expect(rel(r.tireLoadRmsRatio, 0.2476)).toBeLessThan(1e-3);
  });

  it('agrees with the white-noise closed forms over an unbounded band to 1e-6', () => {
    // REFERENCES §5 closed forms, two-sided intensity q = 2π²·n0²·Gd(n0)·V:
    // σ²(accel) = q(c²kt + ks²(ms+mu))/(2c·ms²); σ²(travel) = q(ms+mu)/(2c).
    const v = 20;
    const q = 2 * Math.PI ** 2 * 0.1 ** 2 * iso8608ClassGd0('C') * v;
    const { sprungMass: ms, unsprungMass: mu, wheelRate: ks, wheelDamping: c, tireRate: kt } = WORKED;
    const accel = Math.sqrt((q * (c * c * kt + ks * ks * (ms + mu))) / (2 * c * ms * ms));
    const travel = Math.sqrt((q * (ms + mu)) / (2 * c));
    const r = randomRoadResponse(
      WORKED,
      { roadClass: 'C', speed: v },
      { band: { low: 1e-7, high: 1e4 }, relTol: 1e-10 },
    );
    expect(rel(r.bodyAccelRms, accel)).toBeLessThan(1e-6);
    expect(rel(r.travelRms, travel)).toBeLessThan(1e-6);
  });

  it('agrees with a brute-force sum over 200 000 log-spaced frequencies to 1e-5', () => {
    const v = 25;
    const n = 200_000;
    const lo = Math.log(ISO8608_BAND.low * v);
    const hi = Math.log(ISO8608_BAND.high * v);
    let accel2 = 0;
    for (let i = 0; i < n; i++) {
      const u = lo + ((i + 0.5) * (hi - lo)) / n; // midpoint rule in ln f
      const f = Math.exp(u);
      const g = iso8608DisplacementPsd(f / v, 'D') / v;
      accel2 +=
        Math.hypot(
          frequencyResponseAt(WORKED, f).bodyAccel.re,
          frequencyResponseAt(WORKED, f).bodyAccel.im,
        ) **
          2 *
        g *
        f *
        ((hi - lo) / n);
    }
    const r = randomRoadResponse(WORKED, { roadClass: 'D', speed: v });
    expect(rel(r.bodyAccelRms, Math.sqrt(accel2))).toBeLessThan(1e-5);
  });

  it('doubles every RMS figure from one class to the next rougher one', () => {
    const c = randomRoadResponse(WORKED, { roadClass: 'C', speed: 30 });
    const d = randomRoadResponse(WORKED, { roadClass: 'D', speed: 30 });
    for (const key of [
      'bodyAccelRms',
      'bodyAccelWeightedRms',
      'tireLoadRms',
      'travelRms',
      'roadRms',
    ] as const) {
      expect(d[key] / c[key]).toBeCloseTo(2, 9);
    }
  });

  it('converges: a tighter tolerance changes nothing at the 0.1 % level', () => {
    const a = randomRoadResponse(WORKED, { roadClass: 'B', speed: 35 });
    const b = randomRoadResponse(WORKED, { roadClass: 'B', speed: 35 }, { relTol: 1e-12 });
    expect(rel(a.bodyAccelRms, b.bodyAccelRms)).toBeLessThan(1e-6);
    expect(rel(a.tireLoadRms, b.tireLoadRms)).toBeLessThan(1e-6);
  });

  it('handles a very lightly damped corner (sharp resonance) to 0.1 %', () => {
    // The bus quarter car of REFERENCES §4 has a body mode with ζ ≈ 0.02; check against a fine brute-force sum.
    const bus: QuarterCarLinear = {
      sprungMass: 2500,
      unsprungMass: 320,
      wheelRate: 80_000,
      wheelDamping: 350,
      tireRate: 500_000,
      tireDamping: 15_020,
    };
    const v = 15;
    const r = randomRoadResponse(bus, { roadClass: 'B', speed: v });
    const lo = Math.log(ISO8608_BAND.low * v);
    const hi = Math.log(ISO8608_BAND.high * v);
    const n = 400_000;
    let travel2 = 0;
    for (let i = 0; i < n; i++) {
      const f = Math.exp(lo + ((i + 0.5) * (hi - lo)) / n);
      const t = frequencyResponseAt(bus, f).travel;
      travel2 += (t.re * t.re + t.im * t.im) * (iso8608DisplacementPsd(f / v, 'B') / v) * f * ((hi - lo) / n);
    }
    expect(rel(r.travelRms, Math.sqrt(travel2))).toBeLessThan(1e-3);
  });
});

describe('integrateAdaptive', () => {
  it('integrates smooth and peaked functions to the asked tolerance', () => {
    expect(integrateAdaptive(Math.sin, 0, Math.PI).value).toBeCloseTo(2, 12);
    // ∫ 1/(1 + (x/ε)²) dx over [−1, 1] = 2ε·atan(1/ε): a sharp peak at 0.
    const eps = 1e-4;
    const r = integrateAdaptive((x) => 1 / (1 + (x / eps) ** 2), -1, 1, { relTol: 1e-10 });
    expect(rel(r.value, 2 * eps * Math.atan(1 / eps))).toBeLessThan(1e-9);
  });
});
