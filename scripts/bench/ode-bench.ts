import { compilePlan, evaluatePlan, reachPoints, runModel } from "@/lib/model";
import { referenceProfiles } from "@/tests/reference/ode-network";
import { ms, time } from "./measure";
import { syntheticNetwork } from "./synthetic";

/**
 * The same network through odex (Gragg–Bulirsch–Stoer) between consecutive profile points.
 * Both sides compute the same values: L, N and DO at every profile point. Two accuracies:
 * the loosest odex tolerance agreeing with the closed form to ≤ 1e-6 mg/L everywhere, and
 * odex at 1e-13 (agreement ~1e-14 mg/L, the closed form's own accuracy).
 */
export function odeBench(reaches: number): void {
  const file = syntheticNetwork({ reaches, dischargers: Math.round(reaches / 20), seed: 2, heldTemperatures: true, givenKa: true });
  const closed = time(() => {
    const plan = compilePlan(file);
    const states = evaluatePlan(plan);
    return plan.reaches.map((_, ri) => reachPoints(plan, states, ri));
  }, 7);
  const run = runModel(file);
  const worst = (tol: number) => {
    const ref = referenceProfiles(file, tol);
    let w = 0;
    for (const r of run.reaches) r.points.forEach((p, i) => (w = Math.max(w, Math.abs(p.do_mg_l - ref.get(r.id)![i].DO))));
    return w;
  };
  let tol = 1e-3;
  let err = worst(tol);
  while (err > 1e-6 && tol > 1e-13) {
    tol /= 10;
    err = worst(tol);
  }
  const n = reaches > 5000 ? 2 : 5;
  const loose = time(() => referenceProfiles(file, tol), n);
  const tight = time(() => referenceProfiles(file, 1e-13), n);
  const tightErr = worst(1e-13);
  console.log(`ODE comparison, ${reaches} reaches (held temperatures, given k_a), same profile points on both sides`);
  console.log(`  closed form (compile + solve + point values): median ${ms(closed.median)}, min ${ms(closed.min)}`);
  const ratio = (a: { min: number }) => (a.min / closed.min).toFixed(0);
  console.log(`  odex at ${tol.toExponential(0)} (worst DO difference ${err.toExponential(1)} mg/L): median ${ms(loose.median)}, min ${ms(loose.min)} → ratio of minima ${ratio(loose)}×`);
  console.log(`  odex at 1e-13 (worst DO difference ${tightErr.toExponential(1)} mg/L): median ${ms(tight.median)}, min ${ms(tight.min)} → ratio of minima ${ratio(tight)}×`);
  const met = (a: { min: number }) => (a.min / closed.min >= 100 ? "met" : "not met");
  console.log(`  target ≥ 100× at ≤ 1e-6 mg/L: ${met(loose)}; at the closed form's own accuracy: ${met(tight)}\n`);
}
