import { describe, expect, it } from "vitest";
import { runModel } from "@/lib/model";
import { governingCondition, governingIndex } from "@/lib/results/governing";
import { chainFile } from "./fixtures";

const at = (temperature_c: number) => {
  const f = chainFile();
  return runModel({ ...f, reaches: f.reaches.map((r) => ({ ...r, temperature_c })) });
};

describe("governing condition", () => {
  const mild = { name: "Design low flow", run: at(18) };
  const hot = { name: "Hot, dry 7Q10", run: at(28) };

  it("is the condition with the lowest DO, wherever it stands in the list", () => {
    // warmer water holds less oxygen (lower saturation), so the 28 °C run sags lower
    expect(hot.run.minimum.do_mg_l).toBeLessThan(mild.run.minimum.do_mg_l);
    expect(governingIndex([mild, hot])).toBe(1);
    expect(governingIndex([hot, mild])).toBe(0);
    expect(governingCondition({ conditions: [mild, hot] })).toMatchObject({ name: "Hot, dry 7Q10", index: 1 });
  });

  it("breaks a tie at the criterion by the allocation's binding checkpoints, then by order", () => {
    const a = { name: "A", run: { ...mild.run, minimum: { ...mild.run.minimum, do_mg_l: 5 } } };
    const b = { name: "B", run: { ...mild.run, minimum: { ...mild.run.minimum, do_mg_l: 5 + 5e-7 } } };
    const binding = (names: string[]) => ({ binding: names.map((condition) => ({ condition, reach: "R3", km: 1, do_mg_l: 5, shadow_price: 1 })) });
    expect(governingIndex([a, b])).toBe(0);
    expect(governingIndex([a, b], binding(["B"]) as never)).toBe(1);
    expect(governingIndex([a, b], binding(["A", "B", "B"]) as never)).toBe(1);
    expect(governingIndex([a, b], binding(["A"]) as never)).toBe(0);
  });

  it("refuses an empty result", () => {
    expect(() => governingIndex([])).toThrow(RangeError);
  });
});
