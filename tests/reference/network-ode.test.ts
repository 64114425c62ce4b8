import { describe, expect, it } from "vitest";
import { runModel } from "@/lib/model";
import { syntheticNetwork } from "@/scripts/bench/synthetic";
import { referenceProfiles } from "./ode-network";

describe("chained network against an independent odex integration (agreement ≤ 1e-6 mg/L)", () => {
  for (const seed of [1, 2, 3, 4, 5]) {
    it(`random branching network, seed ${seed}`, () => {
      const file = syntheticNetwork({ reaches: 14, dischargers: 8, inflows: 3, seed, heldTemperatures: true, givenKa: true, step_km: 0.7 });
      const run = runModel(file);
      const ref = referenceProfiles(file);
      let compared = 0;
      for (const reach of run.reaches) {
        const expected = ref.get(reach.id)!;
        const got = reach.points;
        // Same points in the same order: the reference walks its own list of chainages.
        expect(got.map((p) => Number(p.km.toFixed(9)))).toEqual(expected.map((p) => Number(p.km.toFixed(9))));
        got.forEach((p, i) => {
          expect(Math.abs(p.do_mg_l - expected[i].DO)).toBeLessThan(1e-6);
          expect(Math.abs(p.cbodu_mg_l - expected[i].L)).toBeLessThan(1e-6);
          expect(Math.abs(p.nbodu_mg_l - expected[i].N)).toBeLessThan(1e-6);
          compared++;
        });
        // The exact critical point is no higher than any point of the reference profile.
        expect(reach.critical.do_mg_l).toBeLessThanOrEqual(Math.min(...expected.map((p) => p.DO)) + 1e-6);
      }
      expect(compared).toBeGreaterThan(40);
    });
  }
});
