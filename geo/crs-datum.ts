import proj4 from "proj4";
import { loadDatumGrids } from "./crs-grids";
import { GeoError } from "./errors";
import type { DatumShift, LngLat } from "./types";

/** proj4js's datum kinds (lib/constants/values.js). */
const PJD_3PARAM = 1;
const PJD_7PARAM = 2;
const PJD_GRIDSHIFT = 3;
const PJD_WGS84 = 4;
const PJD_NODATUM = 5;

type Proj = InstanceType<typeof proj4.Proj>;
interface ProjDatum {
  datum_type: number;
  datum_params?: number[];
  grids?: Array<{ name: string; isNull?: boolean; grid: unknown }>;
  a: number;
  b: number;
  es: number;
  ep2: number;
}
const datumOf = (p: Proj) => (p as unknown as { datum: ProjDatum }).datum;

/**
 * GRS 80 and WGS 84 differ by 0.1 mm in the semi-minor axis; both are taken as WGS 84's
 * ellipsoid. The sphere of radius 6 378 137 m is Web Mercator's, on WGS 84 coordinates.
 */
const wgs84Ellipsoid = (d: ProjDatum) => Math.abs(d.a - 6378137) < 0.01 && (Math.abs(d.b - 6356752.314) < 0.01 || d.b === d.a);
const clarke1866 = (d: ProjDatum) => Math.abs(d.a - 6378206.4) < 0.01 && Math.abs(d.b - 6356583.8) < 0.01;

/**
 * EPSG's three-parameter transformations NAD27 → WGS 84 used when no NADCON grid is loaded,
 * each with EPSG's stated accuracy. Parameters and accuracies from PROJ's copy of the EPSG
 * database: `projinfo -k operation EPSG:1173 -o PROJ` (and -o WKT2_2019 for OPERATIONACCURACY).
 * PROJ itself falls back to these when the grids are missing (`projinfo -s EPSG:4267 -t EPSG:4326`).
 */
const NAD27_HELMERT = [
  { region: "Alaska", operation: "EPSG:1176 NAD27 to WGS 84 (7)", towgs84: [-5, 135, 172], accuracyM: 12, contains: ([lon, lat]: LngLat) => lat >= 51 && lat <= 72 && (lon <= -129.9 || lon >= 172) },
  { region: "the conterminous United States", operation: "EPSG:1173 NAD27 to WGS 84 (4)", towgs84: [-8, 160, 176], accuracyM: 10, contains: ([lon, lat]: LngLat) => lat >= 24 && lat <= 49.5 && lon >= -125 && lon <= -66.5 },
  { region: "Canada", operation: "EPSG:1172 NAD27 to WGS 84 (3)", towgs84: [-10, 158, 187], accuracyM: 20, contains: ([lon, lat]: LngLat) => lat > 41.6 && lat <= 84 && lon >= -141 && lon <= -47 },
] as const;

/** The converter of `p` to WGS 84 with its datum replaced by a three-parameter shift. */
function withHelmert(def: string | object, towgs84: readonly number[]) {
  const p = new proj4.Proj(def as string);
  const d = datumOf(p);
  (p as unknown as { datum: ProjDatum }).datum = { ...d, datum_type: PJD_3PARAM, datum_params: [...towgs84], grids: undefined };
  return proj4(p, "WGS84");
}

export type PointConverter = (x: number, y: number) => LngLat;

const guard =
  (c: { forward: (p: number[]) => number[] }): PointConverter =>
  (x, y) => {
    // proj4 throws for some points outside a projection's domain; NaN lets the validator name them.
    try {
      const [lon, lat] = c.forward([x, y]);
      return [lon, lat];
    } catch {
      return [Number.NaN, Number.NaN];
    }
  };

/**
 * NAD27 without its grid: each point goes through the EPSG transformation of the region it
 * lies in (found from a first pass with the conterminous-US parameters, good to ~100 m, far
 * inside every region's margin). A point outside all three regions becomes NaN, for the
 * validator to report, rather than being shifted by parameters that were never published for it.
 */
function nad27(def: string | object, datum: string): { toWgs84: PointConverter; shift: DatumShift } {
  const converters = NAD27_HELMERT.map((h) => guard(withHelmert(def, h.towgs84)));
  const conus = 1;
  const used = new Set<number>();
  const describe = (which: number[]) => ({
    operation: which.map((i) => `${NAD27_HELMERT[i].operation} (${NAD27_HELMERT[i].region}, ${NAD27_HELMERT[i].accuracyM} m)`).join("; "),
    accuracyM: Math.max(...which.map((i) => NAD27_HELMERT[i].accuracyM)),
  });
  // Names every transformation until points are converted, then only those that were used
  // (the object is shared with the layer's CrsInfo, so the report shows what was applied).
  const shift: DatumShift = { datum, method: "helmert", ...describe([0, 1, 2]) };
  const toWgs84: PointConverter = (x, y) => {
    const first = converters[conus](x, y);
    const region = NAD27_HELMERT[conus].contains(first) ? conus : NAD27_HELMERT.findIndex((h) => h.contains(first));
    if (region < 0) return [Number.NaN, Number.NaN];
    if (!used.has(region)) {
      used.add(region);
      Object.assign(shift, describe([...used].sort()));
    }
    return region === conus ? first : converters[region](x, y);
  };
  return { toWgs84, shift };
}

/**
 * The converter to WGS 84 of a proj4 definition (proj4 string, WKT, or the object proj4 parses
 * them to) and how its datum is shifted. Refuses, with `datum_unsupported` naming the datum,
 * any datum that would otherwise be read as if it were WGS 84: proj4js leaves a datum without
 * parameters ("no datum") or with a missing shift grid unshifted, silently.
 * `registryAccuracyM` is the accuracy EPSG states for the registry's transformation.
 */
export function datumConverter(def: string, datumName: string, registryAccuracyM: number | null): { toWgs84: PointConverter; shift: DatumShift } {
  loadDatumGrids();
  const p = new proj4.Proj(def);
  const d = datumOf(p);
  const named = (s: Omit<DatumShift, "datum">): DatumShift => ({ datum: datumName, ...s, ...(s.accuracyM === undefined && registryAccuracyM !== null ? { accuracyM: registryAccuracyM } : {}) });
  const plain = () => guard(proj4(p, "WGS84"));
  switch (d.datum_type) {
    case PJD_WGS84:
      return { toWgs84: plain(), shift: named({ method: wgs84Ellipsoid(d) ? "none" : "helmert", operation: "null transformation (datum taken as equal to WGS 84)" }) };
    case PJD_3PARAM:
    case PJD_7PARAM:
      return { toWgs84: plain(), shift: named({ method: "helmert", operation: `towgs84=${(d.datum_params ?? []).slice(0, 3).join(",")}${d.datum_type === PJD_7PARAM ? " (7 parameters)" : ""}` }) };
    case PJD_GRIDSHIFT: {
      const grids = d.grids ?? [];
      if (grids.some((g) => g.isNull)) return { toWgs84: plain(), shift: named({ method: "none", operation: "none (WGS 84 coordinates on a sphere)" }) };
      if (grids.some((g) => g.grid)) {
        const gridded = plain();
        const shift = named({ method: "grid", operation: grids.map((g) => g.name).join(", ") });
        if (!clarke1866(d)) return { toWgs84: gridded, shift };
        // NAD27's registry definition names Canada's grid; a point off every loaded grid (the
        // United States, say) takes EPSG's published parameters instead of becoming NaN.
        const fallback = nad27(def, datumName);
        const toWgs84: PointConverter = (x, y) => {
          const p = gridded(x, y);
          return Number.isNaN(p[0]) ? fallback.toWgs84(x, y) : p;
        };
        return { toWgs84, shift };
      }
      if (clarke1866(d)) {
        return nad27(def, datumName);
      }
      throw refuse(datumName, `its shift grid (${grids.map((g) => g.name).join(", ")}) is not available`);
    }
    case PJD_NODATUM:
    default:
      if (wgs84Ellipsoid(d)) return { toWgs84: plain(), shift: named({ method: "none", operation: "none (a datum on the GRS 80 / WGS 84 ellipsoid, taken as WGS 84)" }) };
      // proj4js names NAD27 in a WKT as the datum "nad27" (with optional grids) or leaves it without one.
      if (clarke1866(d) && /1927|nad.?27/i.test(datumName)) {
        return nad27(def, datumName);
      }
      throw refuse(datumName, "no transformation to WGS 84 is published with it");
  }
}

function refuse(datumName: string, why: string): GeoError {
  return new GeoError(
    "datum_unsupported",
    `The coordinates are on ${datumName.startsWith("the datum of ") ? datumName : `the datum "${datumName}"`}, which Sagline cannot shift to WGS 84 (${why}); ` +
      `export the file in WGS 84, NAD83 or ETRS89, or give the EPSG code of a coordinate system whose transformation is published`,
    { datum: datumName },
  );
}

/** The datum name of a WKT (DATUM["…"]) or "" when it names none. */
export const wktDatumName = (wkt: string): string => /DATUM\s*\[\s*"([^"]*)"/i.exec(wkt)?.[1] ?? "";
