import { describe, expect, it } from "vitest";
import { allocate, runModel, runsAfterAllocation, type RunResult } from "@/lib/model";
import { compareRuns } from "@/lib/results/compare";
import { governingCondition } from "@/lib/results/governing";
import { example } from "./fixtures";

describe("run comparison", () => {
  const a = example("tamsel-river-allocate");
  const b = example("tamsel-river-equal-percent");
  const aAlloc = allocate(a, { own_condition_name: "Design" });
  const bAlloc = allocate(b, { own_condition_name: "Design" });
  const runs = [
    { label: "most load", conditions: runsAfterAllocation(a, aAlloc, "Design"), allocation: aAlloc },
    { label: "equal %", conditions: runsAfterAllocation(b, bAlloc, "Design"), allocation: bAlloc },
    { label: "today", conditions: [{ name: "Design", run: runModel(example("tamsel-river")) }] },
  ];
  const c = compareRuns(runs);

  it("lines facilities up across runs, sums the totals and states the change from the first run", () => {
    expect(c.facilities.map((f) => f.id)).toEqual(runs[0].allocation!.allocations.map((x) => x.id));
    c.columns.forEach((col, i) => {
      const al = runs[i].allocation;
      if (!al) {
        expect(col.total_cbodu_kg_day).toBeNull();
        expect(col.objective).toBeNull();
        return;
      }
      const byHand = c.facilities.reduce((s, f) => s + (f.entries[i]?.cbodu_kg_day ?? 0), 0);
      expect(col.total_cbodu_kg_day).toBeCloseTo(byHand, 9);
      expect(col.objective).toBe(al.objective);
      expect(col.feasible).toBe(al.feasible);
    });
    for (const f of c.facilities) {
      expect(f.entries[2]).toBeNull();
      expect(f.change_kg_day[0]).toBeNull();
      expect(f.change_kg_day[1]).toBeCloseTo(f.entries[1]!.cbodu_kg_day - f.entries[0]!.cbodu_kg_day, 12);
      expect(f.change_kg_day[2]).toBeNull();
    }
    c.columns.forEach((col, i) => {
      const g = governingCondition(runs[i]);
      expect(col.governing).toEqual({ name: g.name, minimum: g.run.minimum });
      expect(col.conditions.map((r) => r.name)).toEqual(runs[i].conditions.map((x) => x.name));
    });
  });

  it("differs between objectives (the comparison is not comparing a run with itself)", () => {
    expect(c.columns[0].objective).not.toBe(c.columns[1].objective);
  });

  it("says meets or fails for a model run from its DO (4.78 mg/L under a 5.0 criterion fails)", () => {
    const today = runModel(example("tamsel-river"));
    const low = { ...today, criterion_do_mg_l: 5, minimum: { ...today.minimum, do_mg_l: 4.78 } } as RunResult;
    const ok = { ...today, criterion_do_mg_l: 5, minimum: { ...today.minimum, do_mg_l: 6.22 } } as RunResult;
    const cc = compareRuns([
      { label: "model", conditions: [{ name: "Design low flow", run: ok }, { name: "Hot, dry 7Q10", run: low }] },
      { label: "other", conditions: [{ name: "Design low flow", run: ok }] },
    ]);
    expect(cc.columns[0].meets).toBe(false);
    expect(cc.columns[0].governing.name).toBe("Hot, dry 7Q10");
    expect(cc.columns[1].meets).toBe(true);
    expect(cc.conditions.map((x) => x.name)).toEqual(["Design low flow", "Hot, dry 7Q10"]);
    expect(cc.conditions[1].cells[0]!.meets).toBe(false);
    expect(cc.conditions[1].cells[1]).toBeNull();
    expect(cc.conditions[0].cells.map((x) => x!.meets)).toEqual([true, true]);
  });

  it("measures changes from the first run that allocates when the first is a model run", () => {
    const cc = compareRuns([runs[2], runs[0], runs[1]]);
    expect(cc.baseline).toBe(1);
    for (const f of cc.facilities) {
      expect(f.change_kg_day[0]).toBeNull();
      expect(f.change_kg_day[1]).toBeNull();
      expect(f.change_kg_day[2]).toBeCloseTo(f.entries[2]!.cbodu_kg_day - f.entries[1]!.cbodu_kg_day, 12);
    }
    expect(compareRuns([runs[2], runs[2]]).baseline).toBeNull();
  });

  it("gives an infeasible allocation no loads (its entries are the floors it failed at)", () => {
    const f = example("tamsel-river-allocate");
    f.criterion_do_mg_l = 8.5;
    const bad = allocate(f, { own_condition_name: "Design" });
    expect(bad.feasible).toBe(false);
    const cc = compareRuns([runs[0], { label: "too strict", conditions: runsAfterAllocation(f, bad, "Design"), allocation: bad }]);
    expect(cc.columns[1].feasible).toBe(false);
    expect(cc.columns[1].total_cbodu_kg_day).toBeNull();
    expect(cc.columns[1].meets).toBe(false);
    for (const fac of cc.facilities) expect(fac.entries[1]).toBeNull();
  });

  it("needs two runs", () => {
    expect(() => compareRuns(runs.slice(0, 1))).toThrow(RangeError);
  });
});
