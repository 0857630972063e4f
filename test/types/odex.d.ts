// The part of odex 2.x (Hairer's ODEX: Gragg–Bulirsch–Stoer extrapolation) the tests use. The
// package ships TypeScript source that does not pass our strict settings and no declarations,
// so tsconfig's "paths" points the compiler here; at run time the package itself is loaded.
export type Derivative = (x: number, y: number[]) => number[];
export type Interpolator = (component: number, x: number) => number;
export type OutputFunction = (
  step: number,
  xOld: number,
  x: number,
  y: number[],
  dense?: Interpolator,
) => boolean | void;
export declare class Solver {
  constructor(n: number);
  absoluteTolerance: number | number[];
  relativeTolerance: number | number[];
  maxSteps: number;
  initialStepSize: number;
  maxStepSize: number;
  denseOutput: boolean;
  grid(dt: number, out: (x: number, y: number[]) => boolean | void): OutputFunction;
  solve(
    f: Derivative,
    x0: number,
    y0: number[],
    xEnd: number,
    solOut?: OutputFunction,
  ): { y: number[]; outcome: number; nStep: number; nAccept: number; nReject: number; nEval: number };
}
