import { describe, expect, it } from "vitest";
import { formatIn, unitLabel } from "@/lib/format/quantities";
import {
  areaToKm2,
  CUBIC_METRES_PER_SECOND_PER_CFS,
  CUBIC_METRES_PER_SECOND_PER_MGD,
  depthToM,
  distanceToKm,
  flowToM3s,
  temperatureToC,
  velocityToMps,
} from "@/geo";

// Definitions: international foot 0.3048 m and mile 1609.344 m (1959 agreement);
// US gallon 231 in³ = 3.785411784 L. Products below worked by hand from those.
describe("unit conversions to SI", () => {
  it("converts flows", () => {
    expect(CUBIC_METRES_PER_SECOND_PER_CFS).toBeCloseTo(0.028316846592, 15);
    expect(flowToM3s(100, "cfs")).toBeCloseTo(2.8316846592, 12);
    // 10⁶ gal/d = 3785.411784 m³ / 86 400 s
    expect(CUBIC_METRES_PER_SECOND_PER_MGD).toBeCloseTo(3785.411784 / 86400, 15);
    expect(flowToM3s(1, "MGD")).toBeCloseTo(0.0438126364, 10);
    expect(flowToM3s(2.5, "m3/s")).toBe(2.5);
  });

  it("converts lengths, depths and velocities", () => {
    expect(distanceToKm(1, "mi")).toBe(1.609344);
    expect(distanceToKm(5280, "ft")).toBeCloseTo(1.609344, 12);
    expect(distanceToKm(250, "m")).toBe(0.25);
    expect(depthToM(10, "ft")).toBeCloseTo(3.048, 12);
    expect(velocityToMps(1, "ft/s")).toBe(0.3048);
  });

  it("converts temperatures", () => {
    expect(temperatureToC(212, "degF")).toBeCloseTo(100, 12);
    expect(temperatureToC(32, "degF")).toBe(0);
    expect(temperatureToC(-40, "degF")).toBeCloseTo(-40, 12);
    expect(temperatureToC(25, "degC")).toBe(25);
  });

  it("converts drainage areas", () => {
    // 1 mi² = 1.609344² km² = 2.589988110336 km² (exact); 1 ha = 100 m × 100 m = 0.01 km²
    expect(areaToKm2(1, "mi2")).toBeCloseTo(2.589988110336, 10);
    expect(areaToKm2(250, "ha")).toBe(2.5);
    expect(areaToKm2(12.5, "km2")).toBe(12.5);
    // shown in a US basin in mi²: 2.589988110336 km² is 1.00 mi²
    expect(formatIn("area", 2.589988110336, "US")).toBe("1.00");
    expect(unitLabel("area", "US")).toBe("mi²");
    expect(unitLabel("area", "SI")).toBe("km²");
  });
});
