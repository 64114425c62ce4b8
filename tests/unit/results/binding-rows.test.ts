import { describe, expect, it } from "vitest";
import { allocate } from "@/lib/model";
import { LB_TO_KG } from "@/lib/model/units";
import type { AllocationResult } from "@/lib/model/allocation/types";
import { bindingRows } from "@/lib/results/binding-rows";
import { example } from "./fixtures";

const base = (objective: AllocationResult["objective"], objective_units: string): AllocationResult => ({
  feasible: true,
  objective,
  objective_value: 1,
  objective_units,
  allocations: [],
  binding: [{ condition: "base", reach: "R1", km: 2, do_mg_l: 5, dual: 2000, do_gain_mg_l_per_kg_day: 1 / 2000 }],
  tmdl: null,
  conditions: ["base"],
  iterations: 1,
  checkpoints: 1,
});

describe("binding checkpoints in plain units", () => {
  it("states a load dual in kg/d or lb/d per mg/L (hand conversion, 1 lb = 0.45359237 kg)", () => {
    const a = base("max-total", "kg/d CBODu allocated in total");
    const [si] = bindingRows(a, "SI");
    expect(si.dual_shown).toBe(2000);
    expect(si.dual_unit).toBe("kg/d of total load per mg/L");
    expect(si.gain_shown).toBe(0.5); // per 1000 kg/d
    expect(si.gain_unit).toBe("mg/L per 1000 kg/d given up");
    const [us] = bindingRows(a, "US");
    expect(us.dual_shown).toBeCloseTo(2000 / LB_TO_KG, 9);
    expect(us.gain_shown).toBeCloseTo(0.5 * LB_TO_KG, 12);
    expect(us.gain_unit).toBe("mg/L per 1000 lb/d given up");
    // the two readings stay inverse of each other in either system (the gain per 1000 units)
    expect((us.dual_shown * us.gain_shown!) / 1000).toBeCloseTo(1, 12);
  });

  it("leaves other objectives' duals in their own unit", () => {
    const [r] = bindingRows(base("equal-percent", "% reduction applied to every discharger"), "US");
    expect(r.dual_shown).toBe(2000);
    expect(r.dual_unit).toBe("% reduction applied to every discharger per mg/L");
    expect(r.gain_shown).toBeNull();
  });

  it("keeps every binding checkpoint of the demo allocation", () => {
    const a = allocate(example("tamsel-river-allocate"));
    const rows = bindingRows(a, "SI");
    expect(rows).toHaveLength(a.binding.length);
    rows.forEach((r, i) => expect(r.dual_shown).toBe(a.binding[i].dual));
  });
});
