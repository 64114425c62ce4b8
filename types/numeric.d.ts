/** The part of numeric.js (Sébastien Loisel's numerical library) the tests use; the package ships no types. */
declare module "numeric" {
  const numeric: {
    /** Unconstrained minimisation by BFGS (a gradient by finite differences when none is given). */
    uncmin(
      f: (x: number[]) => number,
      x0: number[],
      tol?: number,
      gradient?: (x: number[]) => number[],
      maxit?: number,
    ): { solution: number[]; f: number; iterations: number; message: string };
  };
  export default numeric;
}
