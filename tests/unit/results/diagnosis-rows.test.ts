import { describe, expect, it } from "vitest";
import { allocate } from "@/lib/model";
import { diagnosisRows } from "@/lib/results/diagnosis-rows";
import { example } from "./fixtures";

const entry = (reach: string, do_mg_l: number, from_dischargers_mg_l: number) => ({
  condition: "base",
  reach,
  km: 1,
  do_mg_l,
  required_do_mg_l: 5,
  deficit_mg_l: 4,
  from_background_mg_l: 4 - 1 - from_dischargers_mg_l,
  from_sod_mg_l: 1,
  from_dischargers_mg_l,
});

describe("infeasibility diagnosis rows", () => {
  it("works the doc example by hand and puts the worst shortfall first", () => {
    const [worst, next] = diagnosisRows([entry("A", 4.8, 0.5), entry("B", 4, 0.5)]);
    expect(worst.reach).toBe("B");
    expect(worst.shortfall_mg_l).toBeCloseTo(1, 12);
    expect(worst.do_without_dischargers_mg_l).toBeCloseTo(4.5, 12);
    expect(worst.fails_without_dischargers).toBe(true);
    expect(worst.dischargers_pct).toBeCloseTo(12.5, 12);
    expect(worst.sod_pct).toBeCloseTo(25, 12);
    expect(worst.background_pct).toBeCloseTo(62.5, 12);
    // A: 4.8 + 0.5 = 5.3 ≥ 5, so the dischargers are what tip it below
    expect(next.fails_without_dischargers).toBe(false);
  });

  it("splits the demo's failing checkpoints into shares that add to 100 % (criterion raised to 7 mg/L)", () => {
    const model = example("tamsel-river-allocate");
    model.criterion_do_mg_l = 7;
    const a = allocate(model);
    expect(a.feasible).toBe(false);
    const rows = diagnosisRows(a.diagnosis!);
    expect(rows).toHaveLength(a.diagnosis!.length);
    for (const r of rows) {
      expect(r.background_pct + r.sod_pct + r.dischargers_pct).toBeCloseTo(100, 6);
      expect(r.shortfall_mg_l).toBeGreaterThan(0);
    }
    for (let i = 1; i < rows.length; i++) expect(rows[i].shortfall_mg_l).toBeLessThanOrEqual(rows[i - 1].shortfall_mg_l);
  });
});
