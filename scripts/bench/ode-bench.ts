import { runModel } from "@/lib/model";
import { referenceProfiles } from "@/tests/reference/ode-network";
import { ms, time } from "./measure";
import { syntheticNetwork } from "./synthetic";

/**
 * The same network through odex (Gragg–Bulirsch–Stoer) between consecutive profile points,
 * at the loosest tolerance that still agrees with the closed form to ≤ 1e-6 mg/L everywhere.
 */
export function odeBench(reaches: number): void {
  const file = syntheticNetwork({ reaches, dischargers: Math.round(reaches / 20), seed: 2, heldTemperatures: true, givenKa: true });
  const ours = time(() => runModel(file), 5);
  const worst = (tol: number) => {
    const ref = referenceProfiles(file, tol);
    let w = 0;
    for (const r of ours.last.reaches) r.points.forEach((p, i) => (w = Math.max(w, Math.abs(p.do_mg_l - ref.get(r.id)![i].DO))));
    return w;
  };
  let tol = 1e-6;
  let err = worst(tol);
  while (err > 1e-6 && tol > 1e-13) {
    tol /= 10;
    err = worst(tol);
  }
  const ode = time(() => referenceProfiles(file, tol), reaches > 5000 ? 1 : 3);
  console.log(`ODE comparison, ${reaches} reaches (held temperatures, given k_a)`);
  console.log(`  closed form: median ${ms(ours.median)}; odex at tolerance ${tol.toExponential(0)} (worst DO difference ${err.toExponential(1)} mg/L): ${ms(ode.median)}`);
  const ratio = ode.median / ours.median;
  console.log(`  ratio ${ratio.toFixed(0)}× — target ≥ 100×: ${ratio >= 100 ? "met" : "not met"}\n`);
}
