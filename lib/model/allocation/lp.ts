import solver, { type Model as SolverModel, type SolveResult } from "javascript-lp-solver";

/**
 * A linear program in the one shape allocation needs:
 *   maximise c·x  subject to  Σ_j A_ij·x_j ≤ b_i (every row),  lo_j ≤ x_j ≤ hi_j.
 * Rows are sparse lists of [column, coefficient].
 */
export interface Lp {
  c: number[];
  rows: Array<{ terms: Array<[number, number]>; rhs: number }>;
  lo: number[];
  /** Infinity for no upper bound. */
  hi: number[];
}

export interface LpSolution {
  feasible: boolean;
  x: number[];
  objective: number;
}

/** Rounding precision handed to javascript-lp-solver (it rounds reported values to this). */
const PRECISION = 1e-10;

/**
 * Solves an Lp with javascript-lp-solver (simplex). The objective is recomputed from x so it
 * is not affected by the solver's rounding. Throws when the solver reports an unbounded LP.
 */
export function solveLp(lp: Lp): LpSolution {
  const n = lp.c.length;
  const constraints: SolverModel["constraints"] = {};
  const variables: SolverModel["variables"] = {};
  for (let j = 0; j < n; j++) variables[`x${j}`] = { obj: lp.c[j] };
  lp.rows.forEach((row, i) => {
    constraints[`r${i}`] = { max: row.rhs };
    for (const [j, a] of row.terms) variables[`x${j}`][`r${i}`] = a;
  });
  for (let j = 0; j < n; j++) {
    if (lp.lo[j] > 0) {
      constraints[`lo${j}`] = { min: lp.lo[j] };
      variables[`x${j}`][`lo${j}`] = 1;
    }
    if (Number.isFinite(lp.hi[j])) {
      constraints[`hi${j}`] = { max: lp.hi[j] };
      variables[`x${j}`][`hi${j}`] = 1;
    }
  }
  const result = solver.Solve({ optimize: "obj", opType: "max", constraints, variables }, PRECISION) as SolveResult;
  if (!result.feasible) return { feasible: false, x: [], objective: NaN };
  if (result.bounded === false) throw new RangeError("the allocation LP is unbounded (give every discharger an upper bound)");
  const x = Array.from({ length: n }, (_, j) => {
    const v = result[`x${j}`];
    return typeof v === "number" ? v : 0;
  });
  return { feasible: true, x, objective: x.reduce((s, v, j) => s + v * lp.c[j], 0) };
}

/**
 * Dual values of the rows of an Lp at its optimum, by solving the dual LP
 *   minimise b·y + hi·u − lo·v  subject to  Aᵀy + u − v = c,  y, u, v ≥ 0
 * with the same solver. y_i is the gain in objective per unit relaxation of row i.
 * Returns the duals and the dual objective (equal to the primal optimum by strong duality).
 */
export function lpDuals(lp: Lp): { y: number[]; objective: number } {
  const n = lp.c.length;
  const constraints: SolverModel["constraints"] = {};
  const variables: SolverModel["variables"] = {};
  for (let j = 0; j < n; j++) constraints[`c${j}`] = { equal: lp.c[j] };
  lp.rows.forEach((row, i) => {
    const v: Record<string, number> = { obj: row.rhs };
    for (const [j, a] of row.terms) v[`c${j}`] = (v[`c${j}`] ?? 0) + a;
    variables[`y${i}`] = v;
  });
  for (let j = 0; j < n; j++) {
    if (Number.isFinite(lp.hi[j])) variables[`u${j}`] = { obj: lp.hi[j], [`c${j}`]: 1 };
    variables[`v${j}`] = { obj: -lp.lo[j], [`c${j}`]: -1 };
  }
  const result = solver.Solve({ optimize: "obj", opType: "min", constraints, variables }, PRECISION) as SolveResult;
  if (!result.feasible) throw new RangeError("the dual of the allocation LP is infeasible (the primal is unbounded)");
  const y = lp.rows.map((_, i) => {
    const v = result[`y${i}`];
    return typeof v === "number" ? v : 0;
  });
  let objective = 0;
  lp.rows.forEach((row, i) => (objective += row.rhs * y[i]));
  for (let j = 0; j < n; j++) {
    const u = result[`u${j}`];
    const v = result[`v${j}`];
    if (typeof u === "number") objective += lp.hi[j] * u;
    if (typeof v === "number") objective -= lp.lo[j] * v;
  }
  return { y, objective };
}
