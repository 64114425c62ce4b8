/**
 * Independent reference integration with odex (Hairer & Wanner's ODEX, Gragg–Bulirsch–Stoer
 * extrapolation) of the same ODE system the closed forms solve:
 *   dL/dt = −k_r·L + L_rd,  dN/dt = −k_n·N,  dD/dt = k_d·L + k_n·N − k_a·D + S.
 */
import { createRequire } from "node:module";
import type { SegmentRates } from "@/lib/model";

// Loaded by file rather than by the bare name: tsconfig maps "odex" to a declaration file
// for type checking, and tsx (the benchmarks) would follow that mapping at run time.
const { Solver } = createRequire(import.meta.url)("odex/src/odex.js") as typeof import("odex");

/** The same rates the closed form takes (a type only: no code is shared). */
export type OdeRates = SegmentRates;

export function integrateSegment(r: OdeRates, y0: [number, number, number], t: number, tol = 1e-13): [number, number, number] {
  if (t === 0) return [...y0];
  const s = new Solver(3);
  s.absoluteTolerance = tol;
  s.relativeTolerance = tol;
  s.maxSteps = 100_000;
  const out = s.solve((_x, y) => [-r.kr * y[0] + r.lrd, -r.kn * y[1], r.kd * y[0] + r.kn * y[1] - r.ka * y[2] + r.sod], 0, [...y0], t);
  return [out.y[0], out.y[1], out.y[2]];
}
