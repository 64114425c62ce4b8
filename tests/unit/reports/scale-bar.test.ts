import { describe, expect, it } from "vitest";
import { METRES_PER_MILE, scaleBar } from "@/lib/reports/scale-bar";

// Expected values by exact arithmetic from the rule: the largest 1/2/5 × 10^n length
// whose bar fits; a mile is 1609.344 m exactly (international yard and pound agreement, 1959).
describe("scaleBar", () => {
  it("picks the longest round metric length that fits", () => {
    expect(scaleBar(100, 60)).toEqual({ value: 5, unit: "km", points: 50, label: "5 km" }); // room 6000 m
    expect(scaleBar(100, 100)).toEqual({ value: 10, unit: "km", points: 100, label: "10 km" }); // exactly 10 000 m fits
    expect(scaleBar(100, 39.9)).toEqual({ value: 2, unit: "km", points: 20, label: "2 km" }); // room 3990 m
    expect(scaleBar(100, 20)).toEqual({ value: 2, unit: "km", points: 20, label: "2 km" }); // exactly 2000 m
    expect(scaleBar(100, 19.99)).toEqual({ value: 1, unit: "km", points: 10, label: "1 km" });
  });
  it("reads in metres below a kilometre", () => {
    expect(scaleBar(10, 60)).toEqual({ value: 500, unit: "m", points: 50, label: "500 m" });
    expect(scaleBar(2.5, 50)).toEqual({ value: 100, unit: "m", points: 40, label: "100 m" });
  });
  it("picks round miles, decimals below one", () => {
    const b = scaleBar(100, 60, "imperial"); // room 6000 m = 3.728 mi → 2 mi
    expect(b.value).toBe(2);
    expect(b.label).toBe("2 mi");
    expect(b.points).toBeCloseTo((2 * METRES_PER_MILE) / 100, 12); // 32.18688
    const small = scaleBar(10, 60, "imperial"); // 600 m = 0.3728 mi → 0.2 mi
    expect(small.label).toBe("0.2 mi");
    expect(small.points).toBeCloseTo((0.2 * METRES_PER_MILE) / 10, 12);
  });
  it("refuses a scale or room that is not positive", () => {
    expect(() => scaleBar(0, 10)).toThrow(RangeError);
    expect(() => scaleBar(10, -1)).toThrow(RangeError);
    expect(() => scaleBar(Number.NaN, 10)).toThrow(RangeError);
  });
});
