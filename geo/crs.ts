import proj4 from "proj4";
import { GeoError } from "./errors";
import type { CrsInfo, LngLat } from "./types";

/** Turns source coordinates (x, y in the layer's CRS) into WGS84 longitude/latitude. */
export interface Reprojector {
  crs: CrsInfo;
  toWgs84(x: number, y: number): LngLat;
}

interface EpsgEntry {
  name: string;
  proj4: string;
}

const FIXED_EPSG: Record<number, EpsgEntry> = {
  4326: { name: "WGS 84", proj4: "+proj=longlat +datum=WGS84 +no_defs" },
  4269: { name: "NAD83", proj4: "+proj=longlat +datum=NAD83 +no_defs" },
  4258: { name: "ETRS89", proj4: "+proj=longlat +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +no_defs" },
  3857: {
    name: "WGS 84 / Pseudo-Mercator",
    proj4:
      "+proj=merc +a=6378137 +b=6378137 +lat_ts=0 +lon_0=0 +x_0=0 +y_0=0 +k=1 +units=m +nadgrids=@null +no_defs",
  },
};

/**
 * The proj4 definition of an EPSG code Sagline knows: 4326, 4269, 4258, 3857, WGS 84 / UTM
 * (32601–32660 north, 32701–32760 south), NAD83 / UTM (26901–26923) and ETRS89 / UTM
 * (25828–25838). Returns undefined for any other code.
 */
export function epsgDefinition(code: number): EpsgEntry | undefined {
  if (!Number.isInteger(code)) return undefined;
  const fixed = FIXED_EPSG[code];
  if (fixed) return fixed;
  const zone = code % 100;
  const base = code - zone;
  if ((base === 32600 || base === 32700) && zone >= 1 && zone <= 60) {
    const south = base === 32700;
    return {
      name: `WGS 84 / UTM zone ${zone}${south ? "S" : "N"}`,
      proj4: `+proj=utm +zone=${zone}${south ? " +south" : ""} +datum=WGS84 +units=m +no_defs`,
    };
  }
  if (base === 26900 && zone >= 1 && zone <= 23) {
    return { name: `NAD83 / UTM zone ${zone}N`, proj4: `+proj=utm +zone=${zone} +datum=NAD83 +units=m +no_defs` };
  }
  if (base === 25800 && zone >= 28 && zone <= 38) {
    return {
      name: `ETRS89 / UTM zone ${zone}N`,
      proj4: `+proj=utm +zone=${zone} +ellps=GRS80 +towgs84=0,0,0,0,0,0,0 +units=m +no_defs`,
    };
  }
  return undefined;
}

const identity: Reprojector["toWgs84"] = (x, y) => [x, y];

function converter(definition: string): Reprojector["toWgs84"] {
  const c = proj4(definition, "WGS84");
  // proj4 throws for some points outside a projection's domain; NaN lets the validator name them.
  return (x, y) => {
    try {
      const [lon, lat] = c.forward([x, y]);
      return [lon, lat];
    } catch {
      return [Number.NaN, Number.NaN];
    }
  };
}

/** A reprojector for an EPSG code; throws `epsg_unknown` for a code not in `epsgDefinition`. */
export function crsFromEpsg(code: number, source: CrsInfo["source"] = "override"): Reprojector {
  const entry = epsgDefinition(code);
  if (!entry) {
    throw new GeoError(
      "epsg_unknown",
      `EPSG:${code} is not a coordinate system Sagline knows; use WGS 84 (4326), NAD83 (4269), ` +
        `Web Mercator (3857) or a UTM zone (326xx, 327xx, 269xx, 258xx), or export the file in one of them`,
      { epsg: code },
    );
  }
  return {
    crs: { source, epsg: code, name: entry.name },
    toWgs84: code === 4326 ? identity : converter(entry.proj4),
  };
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
  return code !== undefined && epsgDefinition(code) ? code : undefined;
}

const wktName = (wkt: string): string => /^\s*\w+\s*\[\s*"([^"]*)"/.exec(wkt)?.[1] ?? "unnamed CRS";

/**
 * A reprojector for the WKT text of a .prj file (ESRI or OGC WKT 1, or WKT 2), parsed by proj4.
 * An EPSG authority code Sagline knows takes precedence over the parameters.
 * Throws `prj_unknown`, asking for the EPSG code, when proj4 cannot use the text.
 */
export function crsFromPrj(prjText: string): Reprojector {
  const text = prjText.replace(/^\uFEFF/, "").trim();
  const epsg = wktEpsg(text) ?? esriUtmEpsg(text);
  if (epsg !== undefined && epsgDefinition(epsg)) return crsFromEpsg(epsg, "prj");
  const unknown = () =>
    new GeoError(
      "prj_unknown",
      `The .prj file does not describe a coordinate system Sagline can use ("${text.slice(0, 80)}"); ` +
        `give the EPSG code of the shapefile's coordinates`,
      { prj: text.slice(0, 2000) },
    );
  if (!/^(PROJCS|GEOGCS|PROJCRS|GEOGCRS|GEODCRS|BOUNDCRS|COMPD_CS)\s*\[/i.test(text)) throw unknown();
  let toWgs84: Reprojector["toWgs84"];
  try {
    toWgs84 = converter(text);
    const probe = toWgs84(0, 0);
    if (probe.length < 2) throw unknown();
  } catch {
    throw unknown();
  }
  return { crs: { source: "prj", epsg, name: wktName(text) }, toWgs84 };
}
