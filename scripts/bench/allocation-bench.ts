import { allocate, type Lp } from "@/lib/model";
import { fullLpRows } from "@/tests/reference/full-lp";
import { solveWithHighs } from "@/tests/reference/highs";
import { median, ms } from "./measure";
import { syntheticNetwork, withBindingCriterion } from "./synthetic";

/**
 * Allocation (most total load) with constraint generation, against HiGHS solving the full LP:
 * one row per profile point downstream of any discharger, plus the exact critical points our
 * run added. Same variables, bounds and scaling; the optima must agree.
 */
export async function allocationBench(reaches: number, dischargers: number): Promise<void> {
  const file = withBindingCriterion(syntheticNetwork({ reaches, dischargers, seed: 3 }));
  file.allocation = { objective: "max-total" };
  let last: Lp | undefined;
  let scale: number[] = [];
  const times: number[] = [];
  let result = allocate(file, { inspect_lp: (lp, _x, sc) => ((last = lp), (scale = sc)) });
  for (let i = 0; i < 3; i++) {
    const t = performance.now();
    result = allocate(file, { inspect_lp: (lp, _x, sc) => ((last = lp), (scale = sc)) });
    times.push(performance.now() - t);
  }
  const ours = median(times);
  const oursMin = Math.min(...times);
  if (!result.feasible || !last) {
    console.log(`Allocation, ${reaches} reaches, ${dischargers} dischargers: infeasible case, skipped\n`);
    return;
  }
  const small = last;
  const buildStart = performance.now();
  const rows = fullLpRows(file, small.rows, scale);
  const nonzeros = rows.reduce((t, r) => t + r.terms.length, 0);
  const buildMs = performance.now() - buildStart;
  const t0 = performance.now();
  const full = await solveWithHighs({ ...small, rows });
  const highsMs = performance.now() - t0;
  const t1 = performance.now();
  await solveWithHighs(small);
  const highsSmallMs = performance.now() - t1;
  const agree = Math.abs(full.objective - result.objective_value!) / Math.abs(full.objective);
  console.log(`Allocation (most total load), ${reaches} reaches, ${dischargers} dischargers`);
  console.log(
    `  ours (javascript-lp-solver + constraint generation): median ${ms(ours)}, min ${ms(oursMin)} — ${result.iterations} LP round(s), ${result.checkpoints} checkpoint rows, ${result.binding.length} binding`,
  );
  console.log(`  HiGHS on the full LP (${rows.length} rows, ${nonzeros} nonzeros, LP text parse included): ${ms(highsMs)} [${full.status}]; building its rows took ${ms(buildMs)} more`);
  console.log(`  HiGHS on our final small LP: ${ms(highsSmallMs)}`);
  console.log(`  optimum: ours ${result.objective_value!.toFixed(4)} kg/d, HiGHS full LP ${full.objective.toFixed(4)} kg/d, relative difference ${agree.toExponential(1)}`);
  console.log(
    `  ratio HiGHS-full / ours (minimum) ${(highsMs / oursMin).toFixed(1)}× — targets: ≤ 2 s ${ours <= 2000 ? "met" : "not met"}; no slower than HiGHS on the full LP (solve only) ${oursMin <= highsMs ? "met" : "not met"}\n`,
  );
}
