import { nearestPointOnLine, lineString } from "@turf/turf";
import { describe, expect, it } from "vitest";
import { snapPoints, type SnapReach } from "@/geo";
import { KM_PER_DEGREE } from "./helpers";

// A reach along the equator (a great circle) from 0° to 1° E, and a short one 0.5° north.
const EQUATOR: SnapReach = { name: "E", coordinates: [[0, 0], [1, 0]], lengthKm: KM_PER_DEGREE, modelLengthKm: KM_PER_DEGREE };
const NORTH: SnapReach = { name: "N", coordinates: [[0.4, 0.5], [0.6, 0.5]], lengthKm: 0.2 * KM_PER_DEGREE, modelLengthKm: 10 };

describe("snapPoints", () => {
  it("snaps a point 0.001° off the middle of a line: distance R·0.001°, chainage half the length", () => {
    const { snapped, problems } = snapPoints([EQUATOR, NORTH], [{ name: "P", position: [0.5, 0.001] }]);
    expect(problems).toEqual([]);
    const [s] = snapped;
    expect(s).toMatchObject({ reach: 0, reachName: "E", assignment: "nearest" });
    expect(s.distanceM).toBeCloseTo(0.001 * KM_PER_DEGREE * 1000, 6);
    expect(s.chainageKm).toBeCloseTo(0.5 * KM_PER_DEGREE, 6);
    expect(s.snapped?.[0]).toBeCloseTo(0.5, 9);
    expect(s.snapped?.[1]).toBeCloseTo(0, 9);
  });

  it("measures chainage from the head of the oriented line and scales it to the model length", () => {
    const scaled = { ...EQUATOR, modelLengthKm: 50 };
    const forward = snapPoints([scaled], [{ name: "P", position: [0.25, 0.0001] }]).snapped[0];
    expect(forward.chainageKm).toBeCloseTo(0.25 * KM_PER_DEGREE, 6);
    expect(forward.modelChainageKm).toBeCloseTo(12.5, 6);
    const reversed = { ...scaled, coordinates: [...scaled.coordinates].reverse() };
    expect(snapPoints([reversed], [{ name: "P", position: [0.25, 0.0001] }]).snapped[0].chainageKm).toBeCloseTo(0.75 * KM_PER_DEGREE, 6);
  });

  it("agrees with turf's nearestPointOnLine over many reaches (the box pre-filter skips none that matter)", () => {
    const reaches: SnapReach[] = Array.from({ length: 40 }, (_, i) => {
      const x = (i % 8) * 0.05;
      const y = Math.floor(i / 8) * 0.05;
      const coordinates: Array<[number, number]> = [[x, y], [x + 0.03, y + 0.01 * ((i % 3) - 1)], [x + 0.04, y + 0.02]];
      return { name: `R${i}`, coordinates, lengthKm: 1, modelLengthKm: 1 };
    });
    const points = Array.from({ length: 25 }, (_, k) => ({ name: `P${k}`, position: [((k * 37) % 100) / 250, ((k * 53) % 100) / 400] as [number, number] }));
    const { snapped } = snapPoints(reaches, points, { maxSnapDistanceM: 1e9 });
    points.forEach((p, k) => {
      const distances = reaches.map((r) => nearestPointOnLine(lineString(r.coordinates), p.position, { units: "meters" }).properties.pointDistance);
      expect(snapped[k].distanceM).toBeCloseTo(Math.min(...distances), 6);
    });
  });

  it("flags a point beyond the limit, and accepts an explicit reassignment", () => {
    const far = snapPoints([EQUATOR, NORTH], [{ name: "DP-9", position: [0.5, 0.01] }], { maxSnapDistanceM: 500 });
    expect(far.problems.map((p) => p.code)).toEqual(["discharger_too_far"]);
    expect(far.problems[0].message).toMatch(/^DP-9 is 1112 m from the nearest reach \(E\), beyond the 500 m limit/);
    const moved = snapPoints([EQUATOR, NORTH], [{ name: "DP-9", position: [0.5, 0.01] }], { reassign: { "DP-9": "N" } });
    expect(moved.snapped[0]).toMatchObject({ reachName: "N", assignment: "reassigned" });
    expect(moved.problems.map((p) => p.code)).toEqual(["discharger_reassigned"]);
    const unknown = snapPoints([EQUATOR], [{ name: "DP-9", position: [0.5, 0.01] }], { reassign: { "DP-9": "X" } });
    expect(unknown.snapped[0].assignment).toBe("unplaced");
    expect(unknown.problems.map((p) => p.code)).toEqual(["reassign_unknown_reach"]);
  });
});
