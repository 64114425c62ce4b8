import { describe, expect, it } from "vitest";
import { runModel, type ModelFile } from "@/lib/model";
import { sagBelowOutlet } from "@/lib/results/sag-below-outlet";

/** One reach at 20 °C (no temperature correction), k_d 0.3/d, k_a 0.6/d given, 0.3 m/s, headwater 20 mg/L CBODu at 8 mg/L DO. */
const file = (lengthKm: number, downstream: ModelFile["reaches"] = []): ModelFile => ({
  reaches: [
    { id: "R1", downstream: downstream.length ? "R2" : null, length_km: lengthKm, velocity_m_s: 0.3, depth_m: 1.2, kd20_per_day: 0.3, ka20_per_day: 0.6, ka_method: "given", ks20_per_day: 0, sod20_g_m2_day: 0, temperature_c: 20 },
    ...downstream,
  ],
  headwaters: [{ reach: "R1", flow_m3_s: 1, cbodu_mg_l: 20, do_mg_l: 8, temperature_c: 20 }],
  dischargers: [],
  criterion_do_mg_l: 5,
  step_km: 0.5,
});

/**
 * Streeter & Phelps (1925) critical time, CBOD only (MODEL.md §4):
 * t_c = ln{(k_a/k_d)[1 − D0(k_a − k_d)/(k_d·L0)]}/(k_a − k_d); the sag bottoms out at U·t_c.
 */
function criticalKm(d0: number): number {
  const [kd, ka, l0, u] = [0.3, 0.6, 20, 0.3];
  const tc = Math.log((ka / kd) * (1 - (d0 * (ka - kd)) / (kd * l0))) / (ka - kd);
  return (u * 86_400 * tc) / 1000;
}

describe("sagBelowOutlet", () => {
  it("says so when the network ends before the sag's critical point (minimum at the outlet, still falling)", () => {
    const run = runModel(file(10));
    const d0 = run.reaches[0].points[0].deficit_mg_l;
    // the analytic critical point lies well below the 10 km reach's end
    expect(criticalKm(d0)).toBeGreaterThan(40);
    const sag = sagBelowOutlet(run, file(10).reaches);
    expect(sag).not.toBeNull();
    expect(sag!.reach).toBe("R1");
    expect(sag!.doMgL).toBeCloseTo(run.minimum.do_mg_l, 12);
    expect(sag!.fallMgLPerKm).toBeGreaterThan(0);
  });

  it("says nothing when the sag bottoms out inside the network", () => {
    const run = runModel(file(150));
    const d0 = run.reaches[0].points[0].deficit_mg_l;
    // the model's exact minimum sits at the analytic critical point (±1 m)
    expect(run.minimum.km).toBeCloseTo(criticalKm(d0), 3);
    expect(sagBelowOutlet(run, file(150).reaches)).toBeNull();
  });

  it("says nothing when the lowest DO is at the end of a reach that flows on to another", () => {
    const below = [{ id: "R2", downstream: null, length_km: 200, velocity_m_s: 0.3, depth_m: 1.2, kd20_per_day: 0.3, ka20_per_day: 0.6, ka_method: "given" as const, ks20_per_day: 0, sod20_g_m2_day: 0, temperature_c: 20 }];
    const f = file(10, below);
    const run = runModel(f);
    expect(run.minimum.reach).toBe("R2");
    expect(sagBelowOutlet(run, f.reaches)).toBeNull();
    // the same run read as if R1 were an outlet of its own: its minimum is not the run's, so still nothing
    expect(sagBelowOutlet(run, [{ id: "R1", downstream: null }])).toBeNull();
  });
});
