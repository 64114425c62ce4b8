import geographiclib from "geographiclib-geodesic";
import { describe, expect, it } from "vitest";
import { snapPoints, type SnapReach } from "@/geo";
import { geodesicKm } from "./helpers";

// On the equator a geodesic is the equator itself, so 1° of it is exactly a·π/180 with
// a = 6 378 137 m, the WGS84 semi-major axis (EPSG:7030).
const EQUATOR_KM_PER_DEGREE = (6378137 * Math.PI) / 180 / 1000;
// A reach along the equator from 0° to 1° E, and a short one 0.5° north.
const EQUATOR: SnapReach = { name: "E", coordinates: [[0, 0], [1, 0]], lengthKm: EQUATOR_KM_PER_DEGREE, modelLengthKm: EQUATOR_KM_PER_DEGREE };
const NORTH: SnapReach = { name: "N", coordinates: [[0.4, 0.5], [0.6, 0.5]], lengthKm: geodesicKm([[0.4, 0.5], [0.6, 0.5]]), modelLengthKm: 10 };

/**
 * Reference: the least geodesic distance (m) from p to the line, by GeographicLib alone —
 * each segment taken as the geodesic between its vertices, sampled every 1/`steps` of its
 * length, then (with `refine`) again in 200 steps around the best sample. Independent of geo/geodesic.ts.
 */
function referenceDistanceM(line: ReadonlyArray<readonly number[]>, p: readonly number[], steps: number, refine: boolean): number {
  const g = geographiclib.Geodesic;
  let best = Infinity;
  for (let i = 0; i + 1 < line.length; i++) {
    const l = g.WGS84.InverseLine(line[i][1], line[i][0], line[i + 1][1], line[i + 1][0], g.STANDARD | g.DISTANCE_IN);
    const total = l.s13 as number;
    const at = (s: number) => {
      const q = l.Position(Math.max(0, Math.min(total, s)));
      return g.WGS84.Inverse(p[1], p[0], q.lat2 as number, q.lon2 as number).s12 as number;
    };
    let [bs, bd] = [0, Infinity];
    for (let k = 0; k <= steps; k++) {
      const d = at((k / steps) * total);
      if (d < bd) [bs, bd] = [(k / steps) * total, d];
    }
    if (refine) for (let k = -100; k <= 100; k++) bd = Math.min(bd, at(bs + (k / 100) * (total / steps)));
    best = Math.min(best, bd);
  }
  return best;
}

describe("snapPoints", () => {
  it("snaps a point 0.001° off the middle of a line: the geodesic distance, chainage half the length", () => {
    const { snapped, problems } = snapPoints([EQUATOR, NORTH], [{ name: "P", position: [0.5, 0.001] }]);
    expect(problems).toEqual([]);
    const [s] = snapped;
    expect(s).toMatchObject({ reach: 0, reachName: "E", assignment: "nearest" });
    // 0.001° of meridian from the equator, by GeographicLib's inverse.
    expect(s.distanceM).toBeCloseTo(geodesicKm([[0.5, 0.001], [0.5, 0]]) * 1000, 6);
    expect(s.chainageKm).toBeCloseTo(0.5 * EQUATOR_KM_PER_DEGREE, 6);
    expect(s.snapped?.[0]).toBeCloseTo(0.5, 9);
    expect(s.snapped?.[1]).toBeCloseTo(0, 9);
  });

  it("measures chainage from the head of the oriented line and scales it to the model length", () => {
    const scaled = { ...EQUATOR, modelLengthKm: 50 };
    const forward = snapPoints([scaled], [{ name: "P", position: [0.25, 0.0001] }]).snapped[0];
    expect(forward.chainageKm).toBeCloseTo(0.25 * EQUATOR_KM_PER_DEGREE, 6);
    expect(forward.modelChainageKm).toBeCloseTo(12.5, 6);
    const reversed = { ...scaled, coordinates: [...scaled.coordinates].reverse() };
    expect(snapPoints([reversed], [{ name: "P", position: [0.25, 0.0001] }]).snapped[0].chainageKm).toBeCloseTo(0.75 * EQUATOR_KM_PER_DEGREE, 6);
  });

  it("agrees with the least geodesic distance over many reaches (the box pre-filter skips none that matter)", () => {
    const reaches: SnapReach[] = Array.from({ length: 40 }, (_, i) => {
      const x = (i % 8) * 0.05;
      const y = Math.floor(i / 8) * 0.05;
      const coordinates: Array<[number, number]> = [[x, y], [x + 0.03, y + 0.01 * ((i % 3) - 1)], [x + 0.04, y + 0.02]];
      return { name: `R${i}`, coordinates, lengthKm: 1, modelLengthKm: 1 };
    });
    const points = Array.from({ length: 25 }, (_, k) => ({ name: `P${k}`, position: [((k * 37) % 100) / 250, ((k * 53) % 100) / 400] as [number, number] }));
    const { snapped } = snapPoints(reaches, points, { maxSnapDistanceM: 1e9 });
    points.forEach((p, k) => {
      // A coarse pass over every reach, then the three nearest measured finely.
      const coarse = reaches.map((r, i) => ({ i, d: referenceDistanceM(r.coordinates, p.position, 4, false) })).sort((a, b) => a.d - b.d);
      const distances = coarse.slice(0, 3).map(({ i }) => referenceDistanceM(reaches[i].coordinates, p.position, 100, true));
      // Sagline takes a short segment as straight in longitude/latitude, the reference as the
      // geodesic; on these 3 km segments the two paths differ by under a millimetre.
      expect(Math.abs(snapped[k].distanceM! - Math.min(...distances))).toBeLessThan(1e-5 * Math.min(...distances) + 1e-3);
    });
  });

  it("flags a point beyond the limit, and accepts an explicit reassignment", () => {
    const far = snapPoints([EQUATOR, NORTH], [{ name: "DP-9", position: [0.5, 0.01] }], { maxSnapDistanceM: 500 });
    expect(far.problems.map((p) => p.code)).toEqual(["discharger_too_far"]);
    // 0.01° of meridian from the equator: GeographicLib gives 1105.74 m.
    const farM = Math.round(geodesicKm([[0.5, 0.01], [0.5, 0]]) * 1000);
    expect(farM).toBe(1106);
    expect(far.problems[0].message).toMatch(new RegExp(`^DP-9 is ${farM} m from the nearest reach \\(E\\), beyond the 500 m limit`));
    const moved = snapPoints([EQUATOR, NORTH], [{ name: "DP-9", position: [0.5, 0.01] }], { reassign: { "DP-9": "N" } });
    expect(moved.snapped[0]).toMatchObject({ reachName: "N", assignment: "reassigned" });
    expect(moved.problems.map((p) => p.code)).toEqual(["discharger_reassigned"]);
    const unknown = snapPoints([EQUATOR], [{ name: "DP-9", position: [0.5, 0.01] }], { reassign: { "DP-9": "X" } });
    expect(unknown.snapped[0].assignment).toBe("unplaced");
    expect(unknown.problems.map((p) => p.code)).toEqual(["reassign_unknown_reach"]);
  });
});
