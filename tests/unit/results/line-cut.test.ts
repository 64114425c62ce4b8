import { describe, expect, it } from "vitest";
import { haversineKm, MeasuredLine } from "@/lib/results/line-cut";

// One degree of arc on a sphere of radius 6371.0088 km (mean Earth radius) is 6371.0088·π/180 km.
const DEG_KM = (6371.0088 * Math.PI) / 180;

describe("measuring and cutting a line", () => {
  it("measures a degree of latitude and of longitude on the equator", () => {
    expect(haversineKm([0, 0], [0, 1])).toBeCloseTo(DEG_KM, 9);
    expect(haversineKm([0, 0], [1, 0])).toBeCloseTo(DEG_KM, 9);
  });

  it("cuts at fractions of the length, keeping the vertices in between", () => {
    // two equal 1° legs along the prime meridian
    const m = new MeasuredLine([
      [0, 0],
      [0, 1],
      [0, 2],
    ]);
    expect(m.lengthKm).toBeCloseTo(2 * DEG_KM, 9);
    expect(m.at(0)).toEqual([0, 0]);
    expect(m.at(1)).toEqual([0, 2]);
    expect(m.at(0.25)[1]).toBeCloseTo(0.5, 9);
    expect(m.at(-1)).toEqual([0, 0]);
    expect(m.at(2)).toEqual([0, 2]);
    const s = m.slice(0.25, 0.75);
    expect(s).toHaveLength(3);
    expect(s[1]).toEqual([0, 1]);
    expect(s[0][1]).toBeCloseTo(0.5, 9);
    expect(s[2][1]).toBeCloseTo(1.5, 9);
    expect(m.slice(0, 0.4)).toHaveLength(2);
  });

  it("refuses a line of one position", () => {
    expect(() => new MeasuredLine([[0, 0]])).toThrow(RangeError);
  });
});
