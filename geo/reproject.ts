import type { Geometry, Position } from "geojson";
import type { Reprojector } from "./crs";

const position = (p: Position, r: Reprojector): Position => r.toWgs84(Number(p[0]), Number(p[1]));
const positions = (ps: Position[], r: Reprojector): Position[] => ps.map((p) => position(p, r));

/**
 * A copy of `g` in WGS84, 2D (any Z or M value is dropped). Coordinates that are not numbers
 * come out as NaN, for the validator to report.
 */
export function reprojectGeometry(g: Geometry, r: Reprojector): Geometry {
  switch (g.type) {
    case "Point":
      return { type: "Point", coordinates: position(g.coordinates, r) };
    case "MultiPoint":
      return { type: "MultiPoint", coordinates: positions(g.coordinates, r) };
    case "LineString":
      return { type: "LineString", coordinates: positions(g.coordinates, r) };
    case "MultiLineString":
      return { type: "MultiLineString", coordinates: g.coordinates.map((l) => positions(l, r)) };
    case "Polygon":
      return { type: "Polygon", coordinates: g.coordinates.map((l) => positions(l, r)) };
    case "MultiPolygon":
      return { type: "MultiPolygon", coordinates: g.coordinates.map((p) => p.map((l) => positions(l, r))) };
    case "GeometryCollection":
      return { type: "GeometryCollection", geometries: g.geometries.map((x) => reprojectGeometry(x, r)) };
  }
}
