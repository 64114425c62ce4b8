import type { Feature, FeatureCollection, LineString } from "geojson";

/**
 * The network's map features with the outlet as a node: unchanged when they already have
 * an outlet node; otherwise an outlet node (properties kind "node", nodeKind "outlet") is
 * added at the mouth of each reach whose `downstreamId` is null (the reach that drains
 * out of the network). Reaches without the property say nothing and get none.
 * Example: one reach R1 [[0,0],[1,1]] with downstreamId null → R1 and an outlet at [1,1].
 */
export function withOutletNode(fc: FeatureCollection): FeatureCollection {
  if (fc.features.some((f) => f.properties?.kind === "node" && f.properties.nodeKind === "outlet")) return fc;
  const outlets: Feature[] = fc.features
    .filter((f) => f.properties?.kind === "reach" && f.properties.downstreamId === null && f.geometry?.type === "LineString")
    .flatMap((f) => {
      const line = (f.geometry as LineString).coordinates;
      if (line.length === 0) return [];
      const id = String(f.properties!.id);
      return [{ type: "Feature", id: `node:outlet:${id}`, geometry: { type: "Point", coordinates: line[line.length - 1] }, properties: { kind: "node", id: `outlet of ${id}`, nodeKind: "outlet" } } satisfies Feature];
    });
  return outlets.length === 0 ? fc : { ...fc, features: [...fc.features, ...outlets] };
}
