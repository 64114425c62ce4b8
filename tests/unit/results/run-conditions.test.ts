import { describe, expect, it } from "vitest";
import { allocate, runModel, runsAfterAllocation, type RunResult } from "@/lib/model";
import { conditionRows, conditionsLine, governingHeadline, runConditions } from "@/lib/results/run-conditions";
import { example } from "./fixtures";

/** A copy of a run with its lowest DO and criterion set (the summary rows read only these and below_criterion). */
function withMinimum(run: RunResult, doMgL: number, criterion: number): RunResult {
  return { ...run, criterion_do_mg_l: criterion, minimum: { ...run.minimum, do_mg_l: doMgL }, below_criterion: doMgL < criterion ? [{ reach: run.minimum.reach, km: run.minimum.km, do_mg_l: doMgL }] : [] } as RunResult;
}

describe("a run's conditions as screens read them", () => {
  const today = runModel(example("tamsel-river"));

  it("names an old allocation's own condition (stored as \"base\") by the scenario's first condition", () => {
    const file = example("tamsel-river-allocate");
    const allocation = allocate(file); // as runs stored before own_condition_name: "base"
    expect(allocation.binding.every((b) => b.condition === "base")).toBe(true);
    const read = runConditions({ conditions: [{ name: "Design low flow", run: runModel(file) }], allocation });
    expect(read.allocation!.conditions).toEqual(["Design low flow"]);
    expect(read.allocation!.binding.length).toBe(allocation.binding.length);
    expect(read.allocation!.binding.every((b) => b.condition === "Design low flow")).toBe(true);
    expect(read.governing).toBe(0);
  });

  it("leaves a new allocation's names as stored", () => {
    const file = example("tamsel-river-allocate");
    file.allocation!.conditions = [{ name: "Hot", temperature_c: 28 }];
    file.allocation!.reserve_fraction = 0;
    const allocation = allocate(file, { own_condition_name: "Design" });
    const conditions = runsAfterAllocation(file, allocation, "Design");
    const read = runConditions({ conditions, allocation });
    expect(read.allocation).toEqual(allocation);
    // Hot is at the criterion and binds; Design is above it
    expect(read.governing).toBe(1);
    expect(governingHeadline({ conditions, allocation })).toBe(`Lowest DO ${conditions[1].run.minimum.do_mg_l.toFixed(2)} mg/L under “Hot” (governing)`);
  });

  it("has a row per condition with meets/fails by the criterion's tolerance, the lowest governing", () => {
    const rows = conditionRows({
      conditions: [
        { name: "Design low flow", run: withMinimum(today, 6.22, 5) },
        { name: "Hot, dry 7Q10", run: withMinimum(today, 4.78, 5) },
        { name: "At the criterion", run: withMinimum(today, 5 - 5e-5, 5) },
      ],
    });
    expect(rows.map((r) => [r.name, r.meets, r.governing])).toEqual([
      ["Design low flow", true, false],
      ["Hot, dry 7Q10", false, true],
      // within CRITERION_TOLERANCE_MG_L (1e-4) of the criterion counts as meeting it
      ["At the criterion", true, false],
    ]);
    expect(rows[1].points_below).toBe(1);
    expect(rows[2].points_below).toBe(0);
  });

  it("headlines one condition without \"(governing)\" and anoxic water as anoxic", () => {
    expect(governingHeadline({ conditions: [{ name: "Design low flow", run: withMinimum(today, 6.2249, 5) }] })).toBe("Lowest DO 6.22 mg/L under “Design low flow”");
    expect(governingHeadline({ conditions: [{ name: "A", run: withMinimum(today, 6, 5) }, { name: "B", run: withMinimum(today, -0.3, 5) }] })).toBe("Lowest DO anoxic under “B” (governing)");
  });
});

describe("what exports say about conditions", () => {
  const today = runModel(example("tamsel-river"));
  it("lists every condition and names the governing one", () => {
    const lo = { ...today, minimum: { ...today.minimum, do_mg_l: today.minimum.do_mg_l - 1 } };
    expect(conditionsLine({ conditions: [{ name: "A", run: today }, { name: "B", run: lo }] })).toBe("Design conditions: “A”, “B” (governing: “B”)");
    expect(conditionsLine({ conditions: [{ name: "A", run: today }] })).toBe("Design condition: “A”");
  });
});
