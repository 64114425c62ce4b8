import { compilePlan, evaluatePlan, reachCriticals, reportRun, runModel } from "@/lib/model";
import { mib, ms, time } from "./measure";
import { syntheticNetwork } from "./synthetic";

/** Model run on a synthetic network: whole run, and its parts (compile, solve, profile output). */
export function runModelBench(reaches: number): void {
  const file = syntheticNetwork({ reaches, dischargers: Math.round(reaches / 20), seed: 1 });
    const whole = time(() => runModel(file), 5);
  const points = whole.last.reaches.reduce((t, r) => t + r.points.length, 0);
    const plan = compilePlan(file);
  const compile = time(() => compilePlan(file), 5);
  const solve = time(() => reachCriticals(plan, evaluatePlan(plan)), 9);
  const states = evaluatePlan(plan);
  const report = time(() => reportRun(plan, states), 5);
  console.log(`Model run, ${reaches} reaches, ${plan.segments.length} segments, ${file.dischargers.length} dischargers, ${points} profile points`);
  console.log(`  whole run (validate + compile + solve + profile JSON objects): median ${ms(whole.median)}, min ${ms(whole.min)}`);
  console.log(`  compile (topology, flows, temperatures, rates):               median ${ms(compile.median)}, min ${ms(compile.min)}`);
  console.log(`  solve (all segments + exact critical point of every reach):    median ${ms(solve.median)}, min ${ms(solve.min)}`);
  console.log(`  report (critical points + profile JSON objects): median ${ms(report.median)}, min ${ms(report.min)} = ${((report.min * 1e6) / points).toFixed(0)} ns per profile point (min)`);
  console.log(`  memory: result JSON ${mib(Buffer.byteLength(JSON.stringify(whole.last)))} as text; heap in use ${mib(process.memoryUsage().heapUsed)}; RSS ${mib(process.memoryUsage().rss)}`);
  if (reaches === 10_000) {
    const verdict = whole.min <= 20 ? "met" : solve.min <= 20 ? "met only by the solve on a compiled plan (minimum), not by the whole run" : "not met";
    console.log(`  target 10k-reach run ≤ 20 ms: ${verdict}`);
  }
  console.log("");
}
