import { createRequire } from "node:module";

/** One coordinate reference system of the EPSG registry, as the epsg-index package holds it. */
export interface RegistryEntry {
  code: number;
  /** e.g. "CRS-PROJCRS", "CRS-GEOGCRS". */
  kind: string;
  name: string;
  wkt: string | null;
  proj4: string;
  /** Area of use in degrees: north, west, south, east (west > east when it crosses 180°). */
  bbox?: [number, number, number, number];
  /** Stated accuracy (metres) of the registry's transformation to WGS 84, when EPSG gives one. */
  accuracy: number | null;
}

const load = createRequire(import.meta.url);
const cache = new Map<number, RegistryEntry | null>();

/** Kinds that name a 2D horizontal CRS the readers can turn into longitude/latitude. */
const USABLE = /^CRS-(PROJCRS|GEOGCRS|GEOG2DCRS)$/;

/**
 * The registry entry of an EPSG code (epsg-index: every EPSG CRS with its WKT and proj4
 * definition, one small JSON file per code, read on first use and kept). Undefined for a code
 * the registry lacks, for vertical, geocentric or compound CRSs, and for entries without a
 * proj4 definition.
 */
export function registryEntry(code: number): RegistryEntry | undefined {
  if (!Number.isInteger(code) || code <= 0 || code > 99_999_999) return undefined;
  if (!cache.has(code)) {
    let entry: RegistryEntry | null = null;
    try {
      const raw = load(`epsg-index/s/${code}.json`) as Omit<RegistryEntry, "code"> & { code: string };
      if (USABLE.test(raw.kind) && typeof raw.proj4 === "string" && raw.proj4 !== "") entry = { ...raw, code };
    } catch {
      // No such file (the code is not in the registry) or an empty file in the package.
    }
    cache.set(code, entry);
  }
  return cache.get(code) ?? undefined;
}
