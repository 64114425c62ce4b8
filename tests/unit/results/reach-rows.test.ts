import { describe, expect, it } from "vitest";
import { runModel } from "@/lib/model";
import { reachRows } from "@/lib/results/reach-rows";
import { chainFile, example } from "./fixtures";

describe("per-reach rows", () => {
  it("gives travel time = length / velocity and the given k_a (hand check, 20 °C so no temperature correction)", () => {
    const rows = reachRows(runModel(chainFile()));
    const r2 = rows.find((r) => r.id === "R2")!;
    // 4 km at 0.25 m/s: 4000 / 0.25 = 16 000 s = 16000/86400 d
    expect(r2.travel_time_day).toBeCloseTo(16000 / 86400, 12);
    expect(r2.length_km).toBe(4);
    expect(r2.ka_methods).toEqual(["given"]);
    expect(r2.ka_min_per_day).toBeCloseTo(0.8, 12);
    expect(r2.ka_max_per_day).toBeCloseTo(0.8, 12);
    expect(r2.ka_floored).toBe(false);
  });

  it("matches each demo reach's critical point and velocity", () => {
    const model = example("tamsel-river");
    const run = runModel(model);
    const rows = reachRows(run);
    expect(rows.map((r) => r.id)).toEqual(run.reaches.map((r) => r.id));
    for (const row of rows) {
      const input = model.reaches.find((r) => r.id === row.id)!;
      const result = run.reaches.find((r) => r.id === row.id)!;
      expect(row.travel_time_day).toBeCloseTo((input.length_km * 1000) / input.velocity_m_s! / 86400, 9);
      expect(row.min_do_mg_l).toBe(result.critical.do_mg_l);
      expect(row.min_do_km).toBe(result.critical.km);
      expect(row.below_criterion).toBe(result.critical.do_mg_l < run.criterion_do_mg_l);
      expect(row.ka_min_per_day).toBeLessThanOrEqual(row.ka_max_per_day);
      expect(row.ka_methods.length).toBeGreaterThan(0);
    }
  });
});
