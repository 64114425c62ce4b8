import { describe, expect, it } from "vitest";
import { allocate, runModel } from "@/lib/model";
import { compareRuns } from "@/lib/results/compare";
import { example } from "./fixtures";

describe("run comparison", () => {
  const a = example("tamsel-river-allocate");
  const b = example("tamsel-river-equal-percent");
  const runs = [
    { label: "most load", run: runModel(a), allocation: allocate(a) },
    { label: "equal %", run: runModel(b), allocation: allocate(b) },
    { label: "today", run: runModel(example("tamsel-river")) },
  ];
  const c = compareRuns(runs);

  it("lines facilities up across runs and sums the totals", () => {
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
    for (const f of c.facilities) expect(f.entries[2]).toBeNull();
    c.columns.forEach((col, i) => expect(col.minimum).toEqual(runs[i].run.minimum));
  });

  it("differs between objectives (the comparison is not comparing a run with itself)", () => {
    expect(c.columns[0].objective).not.toBe(c.columns[1].objective);
  });

  it("needs two runs", () => {
    expect(() => compareRuns(runs.slice(0, 1))).toThrow(RangeError);
  });
});
