import { readFileSync } from "node:fs";
import { join } from "node:path";
import geographiclib from "geographiclib-geodesic";
import { readGeoJson, type SourceLayer } from "@/geo";

const FIXTURES = join(process.cwd(), "tests/fixtures");

/**
 * Length of a polyline on the WGS84 ellipsoid, km, straight from GeographicLib's geodesic
 * inverse (the reference the import's lengths and chainage are held to, not Sagline's code).
 */
export function geodesicKm(coordinates: ReadonlyArray<readonly number[]>): number {
  let m = 0;
  for (let i = 1; i < coordinates.length; i++) {
    const [a, b] = [coordinates[i - 1], coordinates[i]];
    m += geographiclib.Geodesic.WGS84.Inverse(a[1], a[0], b[1], b[0]).s12 as number;
  }
  return m / 1000;
}

export const fixtureBytes = (path: string): Buffer => readFileSync(join(FIXTURES, path));
export const fixtureText = (path: string): string => readFileSync(join(FIXTURES, path), "utf8");

/** One of the hand-built networks in tests/fixtures/geo. */
export const network = (name: string): SourceLayer => readGeoJson(fixtureText(`geo/${name}.geojson`));

/** A layer of lines built in the test, properties `id` and optional `down`. */
export function lines(items: Array<{ id?: string; down?: string; coordinates: number[][] | number[][][]; type?: string }>): SourceLayer {
  const features = items.map((l) => ({
    type: "Feature",
    properties: { id: l.id ?? null, down: l.down ?? null },
    geometry: { type: l.type ?? "LineString", coordinates: l.coordinates },
  }));
  return readGeoJson(JSON.stringify({ type: "FeatureCollection", features }));
}

export const reachMapping = { reachId: "id", downstreamId: "down" };
