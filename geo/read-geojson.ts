import type { Feature, Geometry } from "geojson";
import { crsFromEpsg, datumWarnings, type Reprojector } from "./crs";
import { GeoError } from "./errors";
import { detectFields } from "./fields";
import { reprojectGeometry } from "./reproject";
import type { SourceFeature, SourceLayer } from "./types";

export interface GeoJsonOptions {
  /** EPSG code of the coordinates, for files that are not WGS84 as RFC 7946 requires. */
  epsg?: number;
}

/** Nesting depth of `coordinates` for each geometry type. */
const DEPTH: Record<string, number> = {
  Point: 0,
  MultiPoint: 1,
  LineString: 1,
  MultiLineString: 2,
  Polygon: 2,
  MultiPolygon: 3,
};

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === "object" && v !== null && !Array.isArray(v);

function coordinatesOk(c: unknown, depth: number): boolean {
  if (!Array.isArray(c)) return false;
  if (depth === 0) return c.length >= 2 && c.every((n) => typeof n === "number" || n === null);
  return c.every((x) => coordinatesOk(x, depth - 1));
}

/** Why `g` is not a GeoJSON geometry, or undefined when it is one. */
function geometryProblem(g: unknown): string | undefined {
  if (!isObject(g) || typeof g.type !== "string") return "geometry has no type";
  if (g.type === "GeometryCollection") {
    if (!Array.isArray(g.geometries)) return "GeometryCollection has no geometries";
    return g.geometries.map(geometryProblem).find(Boolean);
  }
  const depth = DEPTH[g.type];
  if (depth === undefined) return `unknown geometry type "${g.type}"`;
  return coordinatesOk(g.coordinates, depth) ? undefined : `${g.type} coordinates are malformed`;
}

/**
 * Legacy (2008) `crs` member: WGS84 names are accepted; an EPSG code in any of its written forms
 * ("EPSG:2248", "urn:ogc:def:crs:EPSG::26733", "urn:ogc:def:crs:EPSG:6.6:4267") or an ESRI code
 * ("ESRI:102003", which the registry package also holds) is reprojected.
 */
function legacyCrs(root: Record<string, unknown>): Reprojector | undefined {
  const crs = root.crs;
  if (!isObject(crs) || !isObject(crs.properties)) return undefined;
  const name = String(crs.properties.name ?? "").trim();
  if (/CRS84$|EPSG:[\d.]*:?4326$/i.test(name)) return undefined;
  const m = /(?:^|:)(EPSG|ESRI):(?:[\d.]*:)?:?(\d+)$/i.exec(name);
  if (!m) {
    throw new GeoError("epsg_unknown", `The GeoJSON names its coordinate system as "${name}"; give its EPSG code`);
  }
  return crsFromEpsg(Number(m[2]), "geojson-crs");
}

function toFeatures(root: Record<string, unknown>): Array<Pick<Feature, "geometry" | "properties" | "id">> {
  if (root.type === "FeatureCollection") {
    if (!Array.isArray(root.features)) throw new GeoError("geojson_invalid", "The FeatureCollection has no features array");
    return root.features.map((f: unknown, i) => {
      if (!isObject(f) || f.type !== "Feature") {
        throw new GeoError("geojson_invalid", `Feature ${i + 1} is not a GeoJSON Feature`);
      }
      return f as unknown as Feature;
    });
  }
  if (root.type === "Feature") return [root as unknown as Feature];
  if (typeof root.type === "string" && (root.type in DEPTH || root.type === "GeometryCollection")) {
    return [{ geometry: root as unknown as Geometry, properties: {} }];
  }
  throw new GeoError("geojson_invalid", `The file is not GeoJSON (type is "${String(root.type)}")`);
}

/**
 * Reads GeoJSON text (RFC 7946: WGS84 longitude/latitude). A FeatureCollection, a single
 * Feature or a bare geometry are accepted. Throws `GeoError` geojson_invalid (naming the
 * feature at fault) or epsg_unknown.
 */
export function readGeoJson(text: string, options: GeoJsonOptions = {}): SourceLayer {
  let root: unknown;
  try {
    root = JSON.parse(text.replace(/^\uFEFF/, ""));
  } catch (e) {
    throw new GeoError("geojson_invalid", `The file is not valid JSON (${(e as Error).message})`);
  }
  if (!isObject(root)) throw new GeoError("geojson_invalid", "The file is not a GeoJSON object");
  const reprojector = options.epsg !== undefined ? crsFromEpsg(options.epsg, "override") : legacyCrs(root);
  const features: SourceFeature[] = toFeatures(root).map((f, i) => {
    const label = f.id !== undefined ? `feature ${i + 1} (id ${String(f.id)})` : `feature ${i + 1}`;
    if (f.geometry !== null && f.geometry !== undefined) {
      const problem = geometryProblem(f.geometry);
      if (problem) throw new GeoError("geojson_invalid", `${label}: ${problem}`);
    }
    const geometry = f.geometry ? (reprojector ? reprojectGeometry(f.geometry, reprojector) : f.geometry) : null;
    const properties = isObject(f.properties) ? f.properties : {};
    return { index: i, label, geometry, properties };
  });
  return {
    format: "geojson",
    name: typeof root.name === "string" ? root.name : "",
    crs: reprojector?.crs ?? { source: "geojson-default", epsg: 4326, name: "WGS 84" },
    features,
    fields: detectFields(features),
    ...(reprojector && datumWarnings(reprojector.crs).length > 0 ? { readWarnings: datumWarnings(reprojector.crs) } : {}),
  };
}
