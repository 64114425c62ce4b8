import { GeoError } from "./errors";
import { datumConverter, wktDatumName } from "./crs-datum";
import { registryEntry } from "./crs-registry";
import type { CrsInfo, DatumShift, LngLat, ReadWarning } from "./types";

/** Turns source coordinates (x, y in the layer's CRS) into WGS84 longitude/latitude. */
export interface Reprojector {
  crs: CrsInfo;
  toWgs84(x: number, y: number): LngLat;
}

interface EpsgEntry {
  name: string;
  proj4: string;
}

/**
 * The name and proj4 definition of an EPSG code from the EPSG registry (geo/crs-registry.ts),
 * or undefined for a code it lacks or one that is not a 2D horizontal CRS.
 */
export function epsgDefinition(code: number): EpsgEntry | undefined {
  const entry = registryEntry(code);
  return entry && { name: entry.name, proj4: entry.proj4 };
}

const identity: Reprojector["toWgs84"] = (x, y) => [x, y];

const isWgs84Datum = (shift: DatumShift) => shift.method === "none" && /^(D_)?(WGS.?1984|WGS.?84|World Geodetic System 1984)$/i.test(shift.datum);

/** CrsInfo with the datum shift, left out when the datum is WGS 84 itself. */
const crsInfo = (base: CrsInfo, shift: DatumShift): CrsInfo => (isWgs84Datum(shift) ? base : { ...base, datumShift: shift });

/**
 * A reprojector for an EPSG code of the registry; throws `epsg_unknown` naming a code it lacks,
 * and `datum_unsupported` naming a datum Sagline cannot shift to WGS 84.
 */
export function crsFromEpsg(code: number, source: CrsInfo["source"] = "override"): Reprojector {
  const entry = registryEntry(code);
  if (!entry) {
    throw new GeoError(
      "epsg_unknown",
      `EPSG:${code} is not a coordinate system of the EPSG registry (or not a horizontal one); check the code, ` +
        `or export the file in WGS 84 (EPSG:4326)`,
      { epsg: code },
    );
  }
  if (code === 4326) return { crs: { source, epsg: code, name: entry.name }, toWgs84: identity };
  const { toWgs84, shift } = datumConverter(entry.proj4, wktDatumName(entry.wkt ?? "") || `the datum of ${entry.name}`, entry.accuracy);
  return { crs: crsInfo({ source, epsg: code, name: entry.name }, shift), toWgs84 };
}

/** The EPSG code of the outermost AUTHORITY of a WKT (the last one at nesting depth 1). */
export function wktEpsg(wkt: string): number | undefined {
  let depth = 0;
  let found: number | undefined;
  const re = /AUTHORITY\s*\[\s*"EPSG"\s*,\s*"?(\d+)"?\s*\]|ID\s*\[\s*"EPSG"\s*,\s*(\d+)\s*\]|[[\]()]/gi;
  for (const m of wkt.matchAll(re)) {
    const tok = m[0];
    if (tok === "[" || tok === "(") depth++;
    else if (tok === "]" || tok === ")") depth--;
    else if (depth === 1) found = Number(m[1] ?? m[2]);
  }
  return found;
}

/** EPSG code of an ESRI UTM name such as "WGS_1984_UTM_Zone_16N" or "NAD_1983_UTM_Zone_15N". */
function esriUtmEpsg(wkt: string): number | undefined {
  const m = /^\s*PROJCS\s*\[\s*"(WGS_1984|NAD_1983)_UTM_Zone_(\d{1,2})([NS])"/i.exec(wkt);
  if (!m) return undefined;
  const zone = Number(m[2]);
  const code = m[1].toUpperCase() === "WGS_1984" ? (m[3].toUpperCase() === "N" ? 32600 : 32700) + zone : m[3].toUpperCase() === "N" ? 26900 + zone : undefined;
  return code !== undefined && registryEntry(code) ? code : undefined;
}

const wktName = (wkt: string): string => /^\s*\w+\s*\[\s*"([^"]*)"/.exec(wkt)?.[1] ?? "unnamed CRS";

/**
 * A reprojector for the WKT text of a .prj file (ESRI or OGC WKT 1, or WKT 2), parsed by proj4.
 * An EPSG authority code of the registry takes precedence over the parameters.
 * Throws `prj_unknown`, asking for the EPSG code, when proj4 cannot use the text, and
 * `datum_unsupported` naming a datum Sagline cannot shift to WGS 84.
 */
export function crsFromPrj(prjText: string): Reprojector {
  const text = prjText.replace(/^\uFEFF/, "").trim();
  const epsg = wktEpsg(text) ?? esriUtmEpsg(text);
  if (epsg !== undefined && registryEntry(epsg)) return crsFromEpsg(epsg, "prj");
  const unknown = () =>
    new GeoError(
      "prj_unknown",
      `The .prj file does not describe a coordinate system Sagline can use ("${text.slice(0, 80)}"); ` +
        `give the EPSG code of the shapefile's coordinates`,
      { prj: text.slice(0, 2000) },
    );
  if (!/^(PROJCS|GEOGCS|PROJCRS|GEOGCRS|GEODCRS|BOUNDCRS|COMPD_CS)\s*\[/i.test(text)) throw unknown();
  let converted: ReturnType<typeof datumConverter>;
  try {
    converted = datumConverter(text, wktDatumName(text) || wktName(text), null);
    const probe = converted.toWgs84(0, 0);
    if (probe.length < 2) throw unknown();
  } catch (e) {
    if (e instanceof GeoError && e.code === "datum_unsupported") throw e;
    throw unknown();
  }
  return { crs: crsInfo({ source: "prj", epsg, name: wktName(text) }, converted.shift), toWgs84: converted.toWgs84 };
}

/**
 * A warning for the report when the datum shift is a published transformation with a stated
 * accuracy coarser than 2 m (NAD27 without its grid, ED50, …), naming the operation used.
 */
export function datumWarnings(crs: CrsInfo): ReadWarning[] {
  const s = crs.datumShift;
  if (!s || s.method !== "helmert" || (s.accuracyM !== undefined && s.accuracyM <= 2)) return [];
  const accuracy = s.accuracyM !== undefined ? `, stated accuracy ${s.accuracyM} m` : ", accuracy not stated";
  return [
    {
      code: "datum_shift_approximate",
      message: `The coordinates are on ${s.datum} (${crs.name}); they were shifted to WGS 84 by ${s.operation}${accuracy}. Positions may be off by that much`,
    },
  ];
}
