import type { FeatureCollection } from "geojson";
import { describe, expect, it } from "vitest";
import { mapFigure } from "@/lib/reports/figures";

const piece = (coordinates: number[][], band = "ample") => ({
  type: "Feature" as const,
  geometry: { type: "LineString" as const, coordinates },
  properties: { kind: "reach-piece", band },
});
const discharger = (id: string, coordinates: number[]) => ({
  type: "Feature" as const,
  geometry: { type: "Point" as const, coordinates },
  properties: { kind: "discharger", id, reach: "R1", km: 0 },
});

describe("mapFigure: outfalls, scale bars and north", () => {
  // one degree by one degree at the equator into a 100 × 100 box: 88 points per degree, (0,0) at (6,94)
  const fc = (extra: ReturnType<typeof discharger>[]): FeatureCollection => ({ type: "FeatureCollection", features: [piece([[0, 0], [1, 1]]), ...extra] });

  it("puts each discharger where the projection puts its point, permit id beside it", () => {
    const f = mapFigure(fc([discharger("DP-1", [0.5, 0.5])]), 5, { width: 100, height: 100 })!;
    expect(f.outfalls).toEqual([{ id: "DP-1", x: 50, y: 50, label: { x: 54, y: 52, anchor: "start" } }]);
  });

  it("moves a label that would sit on another one, and leaves it out when no spot is free", () => {
    const f = mapFigure(fc([discharger("DP-1", [0.5, 0.5]), discharger("DP-2", [0.5, 0.51]), discharger("DP-3", [0.5, 0.52])]), 5, { width: 100, height: 100 })!;
    // sorted by x then y (the three share x): DP-3 is highest on the page (smallest y)
    const byId = Object.fromEntries(f.outfalls.map((o) => [o.id, o.label?.anchor ?? null]));
    expect(byId["DP-3"]).toBe("start");
    expect(byId["DP-2"]).toBe("end"); // right of DP-2 touches DP-3's label (0.88 pt apart, labels 7 pt tall)
    expect(byId["DP-1"]).toBe("middle"); // right and left taken; below is free
    const labelled = f.outfalls.filter((o) => o.label);
    expect(labelled).toHaveLength(3);
  });

  it("sizes the scale bars from the geodesic: a degree of latitude at the equator is 110.574 km", () => {
    // 110.574 km per degree near the equator: WGS84 meridian arc (GeographicLib; the
    // standard table of degree lengths on the WGS84 ellipsoid gives 110 574 m at 0°).
    const f = mapFigure(fc([]), 5, { width: 100, height: 100 })!;
    const metresPerPoint = 110_574 / 88;
    // room 30 points ≈ 37.7 km → 20 km; in miles 23.4 → 20 mi
    expect(f.scale.metric.label).toBe("20 km");
    expect(f.scale.metric.points).toBeCloseTo(20_000 / metresPerPoint, 1);
    expect(f.scale.imperial.label).toBe("20 mi");
    expect(f.scale.imperial.points).toBeCloseTo((20 * 1609.344) / metresPerPoint, 1);
    expect(f.north).toEqual({ x: 88, y: 6 });
  });
});
