import { expm, matrix } from 'mathjs';
import { describe, expect, it } from 'vitest';
import {
  odeIntegrate,
  odeIntegrateRk4,
  odeSystemSmooth,
  type DenseStep,
  type OdeSystem,
} from '../../../core/numeric/integrator';
import { sdofFreeResponse, type Sdof } from '../../../core/corner/sdof';

/** The IRI reference quarter car per unit sprung mass, states (zs, żs, zu, żu) as ASTM E1926 orders them. */
const GOLDEN = { kt: 653, ks: 63.3, cs: 6.0, mu: 0.15 };
function goldenCar(): OdeSystem {
  const { kt, ks, cs, mu } = GOLDEN;
  return odeSystemSmooth(4, (_t, y, d) => {
    const [zs, vs, zu, vu] = y as unknown as [number, number, number, number];
    const f = ks * (zs - zu) + cs * (vs - vu);
    d[0] = vs;
    d[1] = -f;
    d[2] = vu;
    d[3] = (f - kt * zu) / mu;
  });
}
const GOLDEN_A = [
  [0, 1, 0, 0],
  [-GOLDEN.ks, -GOLDEN.cs, GOLDEN.ks, GOLDEN.cs],
  [0, 0, 0, 1],
  [
    GOLDEN.ks / GOLDEN.mu,
    GOLDEN.cs / GOLDEN.mu,
    -(GOLDEN.ks + GOLDEN.kt) / GOLDEN.mu,
    -GOLDEN.cs / GOLDEN.mu,
  ],
];

// ASTM E1926 state transition over dx = 0.25 m at 80 km/h [pub: ASTM E1926 table, as reproduced in
// several public codes; the project's reference notes §4]. Row i, column j: state i after dt from unit state j.
const ASTM_TRANSITION = [
  [0.9966071, 0.01091514, -0.002083274, 0.0003190145],
  [-0.5563044, 0.9438768, -0.8324718, 0.05064701],
  [0.02153176, 0.002126763, 0.7508714, 0.008221888],
  [3.335013, 0.3376467, -39.12762, 0.4347564],
];
const ASTM_DT = 0.25 / (80 / 3.6); // 0.01125 s

describe('odeIntegrate (Dormand–Prince 5(4))', () => {
  it('reproduces the ASTM E1926 golden-car state transition over 0.01125 s', () => {
    const expA = expm(matrix(GOLDEN_A.map((r) => r.map((v) => v * ASTM_DT)))).toArray() as number[][];
    for (let j = 0; j < 4; j++) {
      const e = [0, 0, 0, 0];
      e[j] = 1;
      const r = odeIntegrate(goldenCar(), 0, e, ASTM_DT, { relTol: 1e-12, absTol: 1e-13 });
      for (let i = 0; i < 4; i++) {
        const table = (ASTM_TRANSITION[i] as number[])[j] as number;
        const exact = (expA[i] as number[])[j] as number;
        // ASTM E1926 [pub]: the table's 7 significant digits.
        expect(Math.abs((r.y[i] as number) - table)).toBeLessThan(5e-7 * Math.max(1, Math.abs(table)));
        // mathjs expm [calc]: e^{A·dt}, an independent method (Padé scaling and squaring).
        expect(Math.abs((r.y[i] as number) - exact)).toBeLessThan(1e-10 * Math.max(1, Math.abs(exact)));
      }
    }
  });

  it('follows the closed-form free response of an oscillator in each of its four cases', () => {
    // Rao, Mechanical Vibrations, ch. 2 [pub]: the characteristic roots decide the form; sdofFreeResponse is it.
    const cases: Sdof[] = [
      { mass: 2, damping: 0, stiffness: 800 }, // undamped
      { mass: 2, damping: 8, stiffness: 800 }, // ζ = 0.1
      { mass: 2, damping: 80, stiffness: 800 }, // ζ = 1, repeated root
      { mass: 2, damping: 200, stiffness: 800 }, // ζ = 2.5
    ];
    for (const s of cases) {
      const exact = sdofFreeResponse(s, 0.01, -0.3);
      const sys = odeSystemSmooth(2, (_t, y, d) => {
        d[0] = y[1] as number;
        d[1] = -(s.damping * (y[1] as number) + s.stiffness * (y[0] as number)) / s.mass;
      });
      let worst = 0;
      const probe = new Float64Array(2);
      odeIntegrate(sys, 0, [0.01, -0.3], 2, { relTol: 1e-10, absTol: 1e-13 }, (step: DenseStep) => {
        for (let k = 1; k <= 4; k++) {
          const t = step.t0 + ((step.t1 - step.t0) * k) / 4;
          step.at(t, probe);
          worst = Math.max(worst, Math.abs((probe[0] as number) - exact(t)));
        }
      });
      expect(worst).toBeLessThan(1e-10);
    }
  });

  it('has a dense output with local error of fifth order (halving the step cuts it 32-fold)', () => {
    const sys = odeSystemSmooth(1, (_t, y, d) => {
      d[0] = y[0] as number;
    });
    const errors = [0.2, 0.1, 0.05].map((h) => {
      let e = 0;
      odeIntegrate(sys, 0, [1], h, { initialStep: h, relTol: 1, absTol: 1 }, (step) => {
        const out = new Float64Array(1);
        step.at(h / 3, out);
        e = Math.abs((out[0] as number) - Math.exp(h / 3));
      });
      return e;
    });
    // [calc] local error ∝ h⁵: ratios near 2⁵ = 32
    expect((errors[0] as number) / (errors[1] as number)).toBeGreaterThan(24);
    expect((errors[1] as number) / (errors[2] as number)).toBeGreaterThan(28);
  });

  it('tightening the tolerance tightens the error, by about the tolerance ratio', () => {
    const sys = odeSystemSmooth(2, (_t, y, d) => {
      d[0] = y[1] as number;
      d[1] = -(y[0] as number);
    });
    const err = (tol: number) =>
      Math.abs(
        (odeIntegrate(sys, 0, [1, 0], 20, { relTol: tol, absTol: tol }).y[0] as number) - Math.cos(20),
      );
    const e6 = err(1e-6);
    const e9 = err(1e-9);
    expect(e6).toBeLessThan(1e-4);
    expect(e9).toBeLessThan(e6 / 300);
  });

  it('agrees with fixed-step RK4 on the golden car over a second', () => {
    const y0 = [0.01, 0, -0.005, 0.2];
    const a = odeIntegrate(goldenCar(), 0, y0, 1, { relTol: 1e-11, absTol: 1e-14 });
    const b = odeIntegrateRk4(goldenCar(), 0, y0, 1, 20_000);
    for (let i = 0; i < 4; i++) expect(Math.abs((a.y[i] as number) - (b.y[i] as number))).toBeLessThan(1e-10);
  });

  it('locates a mode switch on the dense output: a dropped ball meets the floor at √(2h/g)', () => {
    const g = 9.81;
    let contactAt = NaN;
    let inAir = true;
    const ball: OdeSystem = {
      dimension: 2,
      switchCount: 1,
      derivative: (_t, y, d) => {
        d[0] = y[1] as number;
        d[1] = inAir ? -g : -g - 1e5 * (y[0] as number);
      },
      switches: (_t, y, out) => {
        out[0] = inAir ? (y[0] as number) : -(y[0] as number);
      },
      switchRates: (_t, y, _d, out) => {
        out[0] = inAir ? (y[1] as number) : -(y[1] as number);
      },
      switchCross: (_j, t) => {
        if (inAir) contactAt = t;
        inAir = !inAir;
      },
      nextStop: () => Infinity,
      stopReach: () => {},
    };
    const r = odeIntegrate(ball, 0, [1, 0], 0.5, { relTol: 1e-6 });
    // [calc] free fall from 1 m: t = √(2/9.81) = 0.451524 s, whatever the step sizes were.
    expect(contactAt).toBeCloseTo(Math.sqrt(2 / g), 9);
    expect(r.switches).toBeGreaterThanOrEqual(1);
  });

  it('lands exactly on time stops and tells the system', () => {
    const stops = [0.1, 0.35, 0.8];
    const reached: number[] = [];
    const ends: number[] = [];
    const sys: OdeSystem = {
      ...odeSystemSmooth(1, (_t, y, d) => {
        d[0] = -(y[0] as number);
      }),
      nextStop: (t) => stops.find((s) => s > t) ?? Infinity,
      stopReach: (t) => {
        reached.push(t);
      },
    };
    odeIntegrate(sys, 0, [1], 1, {}, (step) => ends.push(step.t1));
    expect(reached).toEqual(stops);
    for (const s of stops) expect(ends).toContain(s);
  });

  it('returns the start for an empty interval, and fails loudly on a derivative that is NaN', () => {
    const sys = odeSystemSmooth(1, (_t, _y, d) => {
      d[0] = NaN;
    });
    expect(odeIntegrate(sys, 1, [3], 1).y[0]).toBe(3);
    expect(() => odeIntegrate(sys, 0, [1], 1)).toThrow(/underflow|steps/);
  });
});
