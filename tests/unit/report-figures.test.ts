import type { FeatureCollection } from "geojson";
import { describe, expect, it } from "vitest";
import { farthestHeadwater } from "@/lib/reports/plan-report-data";
import { mapFigure, niceStep, profileFigure } from "@/lib/reports/figures";
import { DO_BAND_COLOURS } from "@/lib/results/do-scale";
import type { ProfileSeries, SeriesPoint } from "@/lib/results/profile-series";
import { chainFile } from "./results/fixtures";

const point = (distance: number, doMgL: number, sat = 9): SeriesPoint => ({
  reach: distance < 5 ? "A" : "B",
  km: distance,
  distance,
  to_outlet: 10 - distance,
  t_day: distance / 20,
  do_mg_l: doMgL,
  do_shown_mg_l: Math.max(0, doMgL),
  anoxic: doMgL < 0,
  do_sat_mg_l: sat,
  criterion_mg_l: 5,
});

const series = (points: SeriesPoint[]): ProfileSeries => ({
  unit: "km",
  path: ["A", "B"],
  criterion_mg_l: 5,
  reaches: [
    { id: "A", from: 0, to: 5 },
    { id: "B", from: 5, to: 10 },
  ],
  points,
  dischargers: [{ id: "F1", reach: "A", km: 2.5, distance: 2.5 }],
  criticals: [],
  length: 10,
});

describe("niceStep", () => {
  it("rounds to 1, 2 or 5 times a power of ten", () => {
    expect(niceStep(10, 5)).toBe(2);
    expect(niceStep(47, 5)).toBe(10);
    expect(niceStep(0.7, 5)).toBeCloseTo(0.2, 12);
    expect(niceStep(8, 4)).toBe(2);
    expect(niceStep(0)).toBe(1);
  });
});

describe("profileFigure", () => {
  // box 200 × 140 with left 34, bottom 26: plot x 34..192 (w 158), y 14..114 (h 100)
  const box = { width: 200, height: 140, left: 34, bottom: 26 };

  it("scales distance to the plot width and DO from 0 to the next whole mg/L above saturation + 0.5", () => {
    const f = profileFigure(series([point(0, 8), point(5, 6), point(10, 7)]), box);
    expect(f.plot).toEqual({ x: 34, y: 14, w: 158, h: 100 });
    // top = ceil(9 + 0.5) = 10 mg/L, so 5 mg/L sits halfway: 14 + 100 − 50
    expect(f.criterionY).toBeCloseTo(64, 9);
    expect(f.doLine).toBe("34.0,34.0 113.0,54.0 192.0,44.0");
    expect(f.yTicks.map((t) => t.label)).toEqual(["0", "2", "4", "6", "8", "10"]);
    expect(f.xTicks.map((t) => t.label)).toEqual(["0", "2", "4", "6", "8", "10"]);
    expect(f.reachBreaks).toEqual([{ x: 113, id: "A" }]);
    expect(f.dischargers).toEqual([{ x: 73.5, id: "F1" }]);
    expect(f.lowest).toEqual({ x: 113, y: 54, doMgL: 6 });
    expect(f.xLabel).toBe("Distance from the head of A (km)");
  });

  it("draws anoxic water on the zero line but reports the computed low", () => {
    const f = profileFigure(series([point(0, 8), point(5, -1.5), point(10, 3)]), box);
    expect(f.doLine.split(" ")[1]).toBe("113.0,114.0");
    expect(f.lowest.doMgL).toBe(-1.5);
  });

  it("refuses an empty profile", () => {
    expect(() => profileFigure(series([]), box)).toThrow(/no points/);
  });
});

describe("mapFigure", () => {
  const piece = (coordinates: number[][], band: string) => ({
    type: "Feature" as const,
    geometry: { type: "LineString" as const, coordinates },
    properties: { kind: "reach-piece", band },
  });

  it("fits the pieces into the box, north up, coloured by band", () => {
    const fc: FeatureCollection = {
      type: "FeatureCollection",
      features: [piece([[0, 0], [0.5, 0.5]], "ample"), piece([[0.5, 0.5], [1, 1]], "below"), { type: "Feature", geometry: { type: "Point", coordinates: [5, 5] }, properties: { kind: "critical" } }],
    };
    const f = mapFigure(fc, 5, { width: 100, height: 100 })!;
    // 1° × 1° at the equator into 100 − 2 × 6 points: scale 88; (0,0) bottom-left, (1,1) top-right
    expect(f.lines).toEqual([
      { points: "6.0,94.0 50.0,50.0", colour: DO_BAND_COLOURS.ample, band: "ample" },
      { points: "50.0,50.0 94.0,6.0", colour: DO_BAND_COLOURS.below, band: "below" },
    ]);
    expect(f.legend).toHaveLength(5);
  });

  it("shrinks longitude by the cosine of the latitude", () => {
    const fc: FeatureCollection = { type: "FeatureCollection", features: [piece([[0, 60], [2, 60.5]], "meets")] };
    const f = mapFigure(fc, 5, { width: 100, height: 100 })!;
    const [[x0, y0], [x1, y1]] = f.lines[0].points.split(" ").map((p) => p.split(",").map(Number));
    // 2° of longitude at ~60.25° N is ~0.993° "wide" against 0.5° tall: about twice as wide as tall
    expect((x1 - x0) / (y0 - y1)).toBeCloseTo((2 * Math.cos((60.25 * Math.PI) / 180)) / 0.5, 1);
  });

  it("is null when there is nothing to draw", () => {
    expect(mapFigure({ type: "FeatureCollection", features: [] }, 5, { width: 100, height: 100 })).toBeNull();
  });
});

describe("farthestHeadwater", () => {
  it("picks the headwater whose water travels farthest to the outlet", () => {
    // R1 → R2 → R3 is 3 + 4 + 5 = 12 km; S1 → R3 is 2 + 5 = 7 km
    expect(farthestHeadwater(chainFile())).toBe("R1");
    const f = chainFile();
    f.reaches.find((r) => r.id === "S1")!.length_km = 8;
    expect(farthestHeadwater(f)).toBe("S1");
  });
});
