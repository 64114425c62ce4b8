/** HiGHS (compiled to WebAssembly, npm `highs`) as the independent LP solver for checks. */
import highsLoader from "highs";
import type { Lp } from "@/lib/model";

let instance: Awaited<ReturnType<typeof highsLoader>> | undefined;

export async function highs() {
  instance ??= await highsLoader();
  return instance;
}

/** The Lp in CPLEX LP text: maximise c·x, rows ≤ rhs, bounds lo ≤ x ≤ hi. */
export function lpText(lp: Lp): string {
  const term = (a: number, j: number) => `${a < 0 ? "-" : "+"} ${Math.abs(a).toPrecision(17)} x${j}`;
  const lines = ["Maximize", ` obj: ${lp.c.map((c, j) => term(c, j)).join(" ")}`, "Subject To"];
  lp.rows.forEach((r, i) => {
    const terms = r.terms.length > 0 ? r.terms.map(([j, a]) => term(a, j)).join(" ") : "0 x0";
    lines.push(` r${i}: ${terms} <= ${r.rhs.toPrecision(17)}`);
  });
  lines.push("Bounds");
  lp.c.forEach((_, j) => lines.push(` ${lp.lo[j].toPrecision(17)} <= x${j} <= ${Number.isFinite(lp.hi[j]) ? lp.hi[j].toPrecision(17) : "+inf"}`));
  lines.push("End");
  return lines.join("\n");
}

export async function solveWithHighs(lp: Lp): Promise<{ status: string; objective: number; x: number[]; duals: number[] }> {
  const h = await highs();
  const sol = h.solve(lpText(lp));
  const cols = sol.Columns as Record<string, { Primal: number }>;
  const rows = sol.Rows as Array<{ Dual: number }>;
  return {
    status: sol.Status,
    objective: sol.ObjectiveValue,
    x: lp.c.map((_, j) => cols[`x${j}`]?.Primal ?? 0),
    duals: rows.map((r) => r.Dual),
  };
}
