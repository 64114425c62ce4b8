import { describe, expect, it } from "vitest";
import { objectiveName, objectiveValueText } from "@/lib/results/objective-text";

describe("objective names and values in words", () => {
  it("uses the plain names, not the codes", () => {
    expect(objectiveName("max-total")).toBe("Most total load");
    expect(objectiveName("equal-percent")).toBe("Equal percent removal");
    expect(objectiveName(null)).toBe("model run only");
  });

  it("states each objective's value in sensible rounding and the basin's units", () => {
    expect(objectiveValueText("max-total", 412.34, "kg/d CBODu allocated in total", "SI")).toBe("412.3 kg/d CBODu allocated in total");
    // 100 kg = 220.46 lb (1 lb = 0.45359237 kg exactly)
    expect(objectiveValueText("max-total", 100, "kg/d CBODu allocated in total", "US")).toBe("220.5 lb/d CBODu allocated in total");
    expect(objectiveValueText("equal-percent", 0.0002, "% reduction applied to every discharger", "SI")).toBe("no reduction needed");
    expect(objectiveValueText("equal-percent", -0.00001, "% reduction applied to every discharger", "SI")).toBe("no reduction needed");
    expect(objectiveValueText("equal-percent", 23.456, "% reduction applied to every discharger", "SI")).toBe("23.5 % reduction for every discharger");
    expect(objectiveValueText("equal-concentration", 41.27, "mg/L", "SI")).toBe("41.3 mg/L effluent CBODu for every discharger");
    expect(objectiveValueText("max-min-share", 0.8523, "fraction", "SI")).toBe("smallest allocation 85.2 % of its load today");
    expect(objectiveValueText(null, null, null, "SI")).toBe("—");
  });
});
