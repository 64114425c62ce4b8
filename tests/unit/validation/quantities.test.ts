import { describe, expect, it } from "vitest";
import { formatIn, quantity, toSi, unitLabel } from "@/lib/format/quantities";

// Exact definitions: 1 mi = 1.609344 km, 1 ft = 0.3048 m, °F = °C × 9/5 + 32 (NIST SP 811, appendix B).
describe("display in the basin's units", () => {
  it("converts SI to US customary with the exact constants", () => {
    expect(quantity("length", 1.609344, "US").value).toBeCloseTo(1, 12);
    expect(quantity("depth", 0.3048, "US").value).toBeCloseTo(1, 12);
    expect(quantity("flow", 0.3048 ** 3, "US").value).toBeCloseTo(1, 12);
    expect(quantity("temperature", 25, "US").value).toBeCloseTo(77, 12);
    expect(quantity("load", 0.45359237, "US").value).toBeCloseTo(1, 12);
  });
  it("leaves SI alone and labels the units", () => {
    expect(quantity("length", 3.2, "SI")).toEqual({ value: 3.2, unit: "km" });
    expect(unitLabel("flow", "US")).toBe("cfs");
  });
  it("reads typed values back to SI exactly", () => {
    for (const kind of ["length", "distance", "flow", "depth", "velocity", "temperature", "load"] as const) {
      for (const system of ["SI", "US"] as const) {
        expect(toSi(kind, quantity(kind, 12.345, system).value, system)).toBeCloseTo(12.345, 10);
      }
    }
    expect(toSi("temperature", 77, "US")).toBeCloseTo(25, 12);
  });
  it("formats missing values as a dash", () => {
    expect(formatIn("flow", undefined, "SI")).toBe("—");
    expect(formatIn("length", 1.609344, "US")).toBe("1.00");
  });
});
