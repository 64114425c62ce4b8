import type { FeatureCollection } from "geojson";
import { describe, expect, it } from "vitest";
import { withOutletNode } from "@/lib/map/outlet-point";

const reach = (id: string, coordinates: number[][], downstreamId: string | null | undefined) => ({
  type: "Feature" as const,
  id: `reach:${id}`,
  geometry: { type: "LineString" as const, coordinates },
  properties: downstreamId === undefined ? { kind: "reach", id } : { kind: "reach", id, downstreamId },
});

describe("withOutletNode", () => {
  it("adds the outlet at the mouth (last point) of the reach that drains out", () => {
    const fc: FeatureCollection = { type: "FeatureCollection", features: [reach("A", [[0, 0], [1, 1]], "B"), reach("B", [[1, 1], [2, 1.5], [3, 1]], null)] };
    const out = withOutletNode(fc);
    expect(out.features).toHaveLength(3);
    expect(out.features[2]).toEqual({
      type: "Feature",
      id: "node:outlet:B",
      geometry: { type: "Point", coordinates: [3, 1] },
      properties: { kind: "node", id: "outlet of B", nodeKind: "outlet" },
    });
  });
  it("leaves a network that has its outlet node, or says nothing about downstream reaches, as it is", () => {
    const withNode: FeatureCollection = {
      type: "FeatureCollection",
      features: [reach("B", [[1, 1], [3, 1]], null), { type: "Feature", geometry: { type: "Point", coordinates: [3, 1] }, properties: { kind: "node", nodeKind: "outlet" } }],
    };
    expect(withOutletNode(withNode)).toBe(withNode);
    const silent: FeatureCollection = { type: "FeatureCollection", features: [reach("B", [[1, 1], [3, 1]], undefined)] };
    expect(withOutletNode(silent)).toBe(silent);
  });
});
