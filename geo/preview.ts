import type { Feature, FeatureCollection } from "geojson";
import type { ImportNetwork } from "./validate";

/**
 * The validated draft as map features (same properties as a saved network's
 * map): reaches oriented head first, nodes by kind, dischargers at their
 * snapped position (or where they are, when not placed).
 */
export function networkPreview(network: ImportNetwork): FeatureCollection {
  const features: Feature[] = [
    ...network.reaches.map(
      (r): Feature => ({
        type: "Feature",
        id: `reach:${r.id}`,
        geometry: { type: "LineString", coordinates: r.coordinates },
        properties: { kind: "reach", id: r.id, name: r.attributes.name ?? null, lengthKm: r.lengthKm, downstreamId: r.downstreamReachId ?? null },
      }),
    ),
    ...network.nodes.map(
      (n): Feature => ({
        type: "Feature",
        id: `node:${n.id}`,
        geometry: { type: "Point", coordinates: n.position },
        properties: { kind: "node", id: n.id, nodeKind: n.kind },
      }),
    ),
    ...network.dischargers.map(
      (d): Feature => ({
        type: "Feature",
        id: `outfall:${d.id}`,
        geometry: { type: "Point", coordinates: d.snapped ?? d.position },
        properties: {
          kind: "outfall",
          id: d.id,
          name: d.attributes.name,
          reachId: d.reachId ?? "(not placed)",
          chainageKm: d.chainageKm ?? null,
          snapDistanceM: d.snapDistanceM ?? null,
        },
      }),
    ),
  ];
  return { type: "FeatureCollection", features };
}
