import { describe, expect, it } from "vitest";
import { outcomeVerdict, runOutcome, type OutcomeSource } from "@/lib/results/run-outcome";

const cond = (name: string, doMgL: number, reach = "R1") => ({ name, minimum: { reach, km: 1.5, do_mg_l: doMgL }, criterion_do_mg_l: 5 });

describe("runOutcome", () => {
  it("takes the condition with the lowest DO, and says whether a model run meets the criterion", () => {
    const o = runOutcome({ kind: "model", conditions: [cond("7Q10", 6.1), cond("Hot", 4.2, "R3")], allocation: null })!;
    expect(o).toMatchObject({ condition: "Hot", conditionCount: 2, lowestDoMgL: 4.2, reach: "R3", meetsCriterion: false, feasible: null });
    expect(outcomeVerdict(o)).toBe("below the criterion");
    expect(outcomeVerdict(runOutcome({ kind: "model", conditions: [cond("7Q10", 5.2)], allocation: null })!)).toBe("meets the criterion");
  });

  it("breaks a tie at the criterion by the condition the allocation binds on", () => {
    const source: OutcomeSource = {
      kind: "allocation",
      conditions: [cond("7Q10", 5.0000001), cond("Hot", 5)],
      allocation: { feasible: true, conditions: ["7Q10", "Hot"], binding: ["7Q10", "7Q10", "Hot"] },
    };
    const o = runOutcome(source)!;
    expect(o.condition).toBe("7Q10");
    expect(o.feasible).toBe(true);
    expect(o.meetsCriterion).toBe(true);
    expect(outcomeVerdict(o)).toBe("feasible");
  });

  it("counts an old allocation's binding checkpoints on 'base' under the scenario's first condition", () => {
    const o = runOutcome({
      kind: "allocation",
      conditions: [cond("Design low flow", 5), cond("Hot", 5)],
      allocation: { feasible: true, conditions: ["base", "Hot"], binding: ["base", "base", "Hot"] },
    })!;
    expect(o.condition).toBe("Design low flow");
  });

  it("reports an infeasible allocation as such, and nothing for a result without conditions", () => {
    const o = runOutcome({ kind: "allocation", conditions: [cond("7Q10", 3.1)], allocation: { feasible: false, conditions: ["7Q10"], binding: [] } })!;
    expect(outcomeVerdict(o)).toBe("no feasible allocation");
    expect(runOutcome({ kind: "model", conditions: [], allocation: null })).toBeNull();
  });
});
