import { GeoError } from "./errors";
import type { Geometry } from "geojson";
import type { SourceLayer } from "./types";

/**
 * The largest import Sagline accepts (README, "Limits"). Each bounds the work one upload
 * can cause: validation runs off the request thread, but a line of a million vertices
 * would still hold a worker for minutes and send the browser a map it cannot draw.
 */
export const IMPORT_LIMITS = {
  /** Vertices in one reach line (all parts of a MultiLineString together). */
  verticesPerLine: 100_000,
  /** Vertices in all reach lines of one upload. */
  totalVertices: 500_000,
  /** Features in a reach layer. */
  reachFeatures: 20_000,
  /** Features (or CSV rows) in a discharger layer. */
  dischargerFeatures: 50_000,
} as const;

const fmt = (n: number) => n.toLocaleString("en-US");

function vertexCount(g: Geometry | null): number {
  if (!g) return 0;
  switch (g.type) {
    case "Point":
      return 1;
    case "MultiPoint":
    case "LineString":
      return g.coordinates.length;
    case "MultiLineString":
    case "Polygon":
      return g.coordinates.reduce((s, p) => s + p.length, 0);
    case "MultiPolygon":
      return g.coordinates.reduce((s, poly) => s + poly.reduce((t, p) => t + p.length, 0), 0);
    case "GeometryCollection":
      return g.geometries.reduce((s, x) => s + vertexCount(x), 0);
  }
}

/**
 * Refuses a layer over the limits, naming the limit and the feature (or row) at fault.
 * Throws `GeoError` too_many_features, line_too_many_vertices or too_many_vertices.
 */
export function checkLimits(layer: "reaches" | "dischargers", source: SourceLayer): void {
  const what = layer === "reaches" ? "reach" : "discharger";
  const max = layer === "reaches" ? IMPORT_LIMITS.reachFeatures : IMPORT_LIMITS.dischargerFeatures;
  const unit = source.format === "csv" ? "rows" : "features";
  if (source.features.length > max) {
    const first = source.features[max];
    throw new GeoError(
      "too_many_features",
      `The ${what} file has ${fmt(source.features.length)} ${unit}; the limit is ${fmt(max)} (${first.label} is the first over it)`,
      { limit: `${layer === "reaches" ? "reachFeatures" : "dischargerFeatures"}`, max, count: source.features.length, feature: first.label },
    );
  }
  if (layer !== "reaches") return;
  let total = 0;
  for (const f of source.features) {
    const n = vertexCount(f.geometry);
    if (n > IMPORT_LIMITS.verticesPerLine) {
      throw new GeoError(
        "line_too_many_vertices",
        `${f.label} has ${fmt(n)} vertices; the limit is ${fmt(IMPORT_LIMITS.verticesPerLine)} per line (simplify or split it)`,
        { limit: "verticesPerLine", max: IMPORT_LIMITS.verticesPerLine, count: n, feature: f.label },
      );
    }
    total += n;
    if (total > IMPORT_LIMITS.totalVertices) {
      throw new GeoError(
        "too_many_vertices",
        `The reach lines have more than ${fmt(IMPORT_LIMITS.totalVertices)} vertices in all (the limit), reached at ${f.label}; simplify the lines`,
        { limit: "totalVertices", max: IMPORT_LIMITS.totalVertices, feature: f.label },
      );
    }
  }
}
