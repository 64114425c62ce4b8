import type { Geometry, Position } from "geojson";

/** All positions of a geometry, flattened. */
export function allPositions(g: Geometry): Position[] {
  switch (g.type) {
    case "Point":
      return [g.coordinates];
    case "MultiPoint":
    case "LineString":
      return g.coordinates;
    case "MultiLineString":
    case "Polygon":
      return g.coordinates.flat();
    case "MultiPolygon":
      return g.coordinates.flat(2);
    case "GeometryCollection":
      return g.geometries.flatMap(allPositions);
  }
}

/**
 * "invalid" when a coordinate is missing or not a finite number, "out_of_range" when a
 * longitude is outside ±180° or a latitude outside ±90°, undefined when all are usable.
 */
export function coordinateProblem(g: Geometry): "invalid" | "out_of_range" | undefined {
  let outOfRange = false;
  for (const p of allPositions(g)) {
    const [lon, lat] = p;
    if (typeof lon !== "number" || typeof lat !== "number" || !Number.isFinite(lon) || !Number.isFinite(lat)) return "invalid";
    if (Math.abs(lon) > 180 || Math.abs(lat) > 90) outOfRange = true;
  }
  return outOfRange ? "out_of_range" : undefined;
}

/** `{ geometry }` for a problem's map highlight, or `{}` when the geometry cannot be drawn. */
export function highlight(g: Geometry | null | undefined): { geometry?: Geometry } {
  return g && coordinateProblem(g) === undefined ? { geometry: g } : {};
}
