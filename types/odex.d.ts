// odex ships its TypeScript source as its entry, which does not compile under our strict
// settings; tsconfig "paths" points the type checker here instead (runtime is unchanged).
declare module "odex" {
  export type Derivative = (x: number, y: number[]) => number[];
  export enum Outcome {
    Converged = 0,
    MaxStepsExceeded = 1,
    EarlyReturn = 2,
  }
  export class Solver {
    constructor(n: number);
    absoluteTolerance: number | number[];
    relativeTolerance: number | number[];
    maxSteps: number;
    denseOutput: boolean;
    solve(
      f: Derivative,
      x: number,
      y0: number[],
      xEnd: number,
      solOut?: (n: number, xOld: number, x: number, y: number[], dense?: (c: number, x: number) => number) => boolean | void,
    ): { y: number[]; outcome: Outcome; nStep: number; xEnd: number; nAccept: number; nReject: number; nEval: number };
  }
}
