// odex ships its TypeScript source next to the compiled JavaScript, and that
// source does not pass today's strict checks; this declares the part of its
// API the reference tests use so tsc reads this instead of odex's .ts file.
declare module "odex" {
  export type Derivative = (x: number, y: number[]) => number[];
  export interface SolverResult {
    y: number[];
    outcome: number;
    nStep: number;
    xEnd: number;
  }
  export class Solver {
    constructor(n: number);
    absoluteTolerance: number | number[];
    relativeTolerance: number | number[];
    maxSteps: number;
    initialStepSize: number;
    denseOutput: boolean;
    solve(f: Derivative, x: number, y0: number[], xEnd: number): SolverResult;
  }
}
