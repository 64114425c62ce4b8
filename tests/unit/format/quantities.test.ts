import { describe, expect, it } from "vitest";
import { formatIn, formatPercent, reductionText } from "@/lib/format/quantities";

describe("percentages and reductions as screens show them", () => {
  it("never prints -0.0", () => {
    expect(formatPercent(-0.02)).toBe("0.0");
    expect(formatPercent(-0.0)).toBe("0.0");
    expect(formatPercent(0.04)).toBe("0.0");
    expect(formatPercent(-0.06)).toBe("-0.1");
    expect(formatPercent(12.345)).toBe("12.3");
    expect(formatPercent(0.0004, 3)).toBe("0.000");
    expect(formatPercent(null)).toBe("—");
    expect(formatPercent(Number.NaN)).toBe("—");
  });

  it("says a reduction in words: a cut, no cut, or above today's load", () => {
    expect(reductionText(12.5)).toBe("12.5 % cut");
    expect(reductionText(-0.0000001)).toBe("no cut");
    expect(reductionText(0.0004)).toBe("no cut");
    expect(reductionText(-2)).toBe("2.0 % above today");
    expect(reductionText(null)).toBe("—");
  });

  it("keeps the unit conversions of formatIn (1 kg = 2.20462 lb; 1 m³/s = 35.3147 cfs)", () => {
    // 1 lb = 0.45359237 kg exactly (US customary definition); 1 ft = 0.3048 m exactly
    expect(formatIn("load", 100, "US")).toBe("220.5");
    expect(formatIn("flow", 1, "US")).toBe("35.31");
  });
});
