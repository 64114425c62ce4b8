import { iter } from "but-unzip";
import { parseShp } from "shpjs";
import { crsFromEpsg, crsFromPrj, datumWarnings, type Reprojector } from "./crs";
import { dbfEncoding, decodeDbf } from "./dbf-encoding";
import { GeoError, wrapUnknown } from "./errors";
import { detectFields } from "./fields";
import { reprojectGeometry } from "./reproject";
import type { ReadWarning, SourceFeature, SourceLayer } from "./types";

export interface ShapefileOptions {
  /** EPSG code of the coordinates; overrides the .prj (and replaces a missing one). */
  epsg?: number;
  /** Base name of the layer to read when the zip holds several shapefiles. */
  layer?: string;
  /** Most bytes the shapefile parts may unpack to, all together. Default 256 MiB. */
  maxUncompressedBytes?: number;
}

const DEFAULT_MAX_UNCOMPRESSED = 256 * 1024 * 1024;

type Bytes = ArrayBuffer | Uint8Array;

const toUint8 = (b: Bytes): Uint8Array => (b instanceof Uint8Array ? b : new Uint8Array(b));
const view = (b: Uint8Array) => new DataView(b.buffer, b.byteOffset, b.byteLength);

/** Local file header "PK\3\4" or, for an empty archive, end of central directory "PK\5\6". */
function looksLikeZip(b: Uint8Array): boolean {
  return b.length >= 22 && b[0] === 0x50 && b[1] === 0x4b && (b[2] === 3 || b[2] === 5) && b[3] === b[2] + 1;
}

/**
 * Checks that the zip ends with an end-of-central-directory record whose directory lies inside
 * the file. but-unzip scans for that record itself but never stops when it is missing
 * (a truncated upload), so it must not see such bytes.
 */
function checkEndRecord(b: Uint8Array) {
  const d = view(b);
  const lowest = Math.max(0, b.length - 22 - 0xffff);
  for (let i = b.length - 22; i >= lowest; i--) {
    if (d.getUint32(i, true) !== 0x06054b50) continue;
    const size = d.getUint32(i + 12, true);
    const offset = d.getUint32(i + 16, true);
    if (offset + size <= i) return;
    break;
  }
  throw new GeoError("zip_corrupt", "The zip file is incomplete or damaged (its directory is missing); upload it again");
}

interface ShapefileParts {
  shp?: Uint8Array;
  dbf?: Uint8Array;
  prj?: Uint8Array;
  cpg?: Uint8Array;
  /** Whether the zip has the .shx index (not read: the .shp alone is enough, but it is named when parts are missing). */
  shx?: boolean;
}

/**
 * An inflate helper for but-unzip that stops once the entries read so far unpack to more than
 * `budget.left` bytes, so a small zip cannot expand into gigabytes.
 */
function limitedInflate(budget: { left: number; limit: number }) {
  return async (packed: Uint8Array): Promise<Uint8Array> => {
    const stream = new Blob([new Uint8Array(packed)]).stream().pipeThrough(new DecompressionStream("deflate-raw"));
    const reader = stream.getReader();
    const chunks: Uint8Array[] = [];
    for (;;) {
      const { done, value } = await reader.read();
      if (done) break;
      budget.left -= value.length;
      if (budget.left < 0) {
        await reader.cancel();
        throw new GeoError("zip_too_large", `The shapefile unpacks to more than ${Math.round(budget.limit / 1048576)} MiB; split it into smaller uploads`);
      }
      chunks.push(value);
    }
    const out = new Uint8Array(chunks.reduce((n, c) => n + c.length, 0));
    let at = 0;
    for (const c of chunks) {
      out.set(c, at);
      at += c.length;
    }
    return out;
  };
}

async function unzipParts(bytes: Uint8Array, maxBytes: number): Promise<{ layers: Map<string, ShapefileParts>; names: string[] }> {
  const layers = new Map<string, ShapefileParts>();
  const names: string[] = [];
  const inflate = limitedInflate({ left: maxBytes, limit: maxBytes });
  try {
    for (const entry of iter(bytes, inflate)) {
      const name = entry.filename;
      if (name.endsWith("/") || name.includes("__MACOSX")) continue;
      names.push(name);
      const m = /^(.*)\.(shp|shx|dbf|prj|cpg)$/i.exec(name);
      if (!m) continue;
      const ext = m[2].toLowerCase() as "shp" | "shx" | "dbf" | "prj" | "cpg";
      const parts = layers.get(m[1]) ?? {};
      if (ext === "shx") parts.shx = true;
      else parts[ext] = await entry.read();
      layers.set(m[1], parts);
    }
  } catch (e) {
    throw wrapUnknown(e, "zip_corrupt", "The zip file is damaged and cannot be opened");
  }
  return { layers, names };
}

function pickLayer(layers: Map<string, ShapefileParts>, names: string[], wanted?: string) {
  const withShp = [...layers].filter(([, p]) => p.shp);
  if (withShp.length === 0) {
    const dbfOnly = [...layers].find(([, p]) => p.dbf)?.[0];
    throw new GeoError(
      "shp_missing",
      dbfOnly
        ? `The zip has ${dbfOnly}.dbf but no ${dbfOnly}.shp; add the .shp file that holds the geometry`
        : `The zip holds no shapefile (.shp); found: ${names.join(", ") || "nothing"}`,
      { files: names },
    );
  }
  if (wanted !== undefined) {
    const hit = withShp.find(([base]) => base === wanted || base.split("/").pop() === wanted);
    if (!hit) {
      throw new GeoError("multiple_layers", `The zip has no shapefile named "${wanted}"`, {
        layers: withShp.map(([b]) => b),
      });
    }
    return hit;
  }
  if (withShp.length > 1) {
    throw new GeoError(
      "multiple_layers",
      `The zip holds ${withShp.length} shapefiles (${withShp.map(([b]) => b).join(", ")}); choose one`,
      { layers: withShp.map(([b]) => b) },
    );
  }
  return withShp[0];
}

/** Checks the .shp file code (9994) and the .dbf record count before the parsers trust them. */
function checkHeaders(base: string, shp: Uint8Array, dbf: Uint8Array) {
  if (shp.length < 100 || view(shp).getInt32(0, false) !== 9994) {
    throw new GeoError("shapefile_corrupt", `${base}.shp is not a valid shapefile (bad header)`);
  }
  const d = view(dbf);
  const records = dbf.length >= 33 ? d.getUint32(4, true) : 0;
  const headerLength = dbf.length >= 33 ? d.getUint16(8, true) : 0;
  const recordLength = dbf.length >= 33 ? d.getUint16(10, true) : 0;
  const ok =
    headerLength >= 33 &&
    (recordLength > 0 || records === 0) &&
    headerLength + records * recordLength <= dbf.length + 1;
  if (!ok) throw new GeoError("shapefile_corrupt", `${base}.dbf is damaged (its header does not match its size)`);
}

/**
 * Every part a shapefile lacks, named at once: the .dbf (its attributes) and the .prj (its
 * coordinate system, unless an EPSG code is given) are needed; a missing .shx is named too,
 * since other GIS programs need it, though Sagline reads without it.
 */
function missingParts(base: string, parts: ShapefileParts, epsg: number | undefined): asserts parts is ShapefileParts & { dbf: Uint8Array } {
  const needed = [
    ...(parts.dbf ? [] : [`${base}.dbf (the attribute table)`]),
    ...(parts.prj || epsg !== undefined ? [] : [`${base}.prj (the coordinate system; or give its EPSG code)`]),
  ];
  if (needed.length === 0) return;
  const shx = parts.shx ? "" : `; ${base}.shx is missing too (Sagline does not need it, other GIS programs do)`;
  const files = [...(parts.dbf ? [] : [`${base}.dbf`]), ...(parts.prj || epsg !== undefined ? [] : [`${base}.prj`]), ...(parts.shx ? [] : [`${base}.shx`])];
  throw new GeoError(
    parts.dbf ? "prj_missing" : "dbf_missing",
    `The zip has ${base}.shp but not ${needed.join(" or ")}${shx}; add ${needed.length > 1 ? "them" : "it"} to the zip`,
    { missing: files },
  );
}

function resolveCrs(base: string, prj: Uint8Array | undefined, epsg: number | undefined): Reprojector {
  if (epsg !== undefined) return crsFromEpsg(epsg, "override");
  if (!prj) {
    throw new GeoError(
      "prj_missing",
      `The zip has no ${base}.prj, so the coordinate system is unknown; give the EPSG code of the coordinates`,
    );
  }
  return crsFromPrj(new TextDecoder().decode(prj));
}

/**
 * Reads a zipped ESRI shapefile (.shp + .dbf, with .prj; .cpg optional) into WGS84 features.
 * Throws `GeoError`: not_a_zip, zip_corrupt, zip_too_large, shp_missing, dbf_missing, multiple_layers,
 * prj_missing, prj_unknown, epsg_unknown, datum_unsupported, shapefile_corrupt. Text is decoded as the
 * .cpg says, else as the .dbf's language-driver byte says, else as UTF-8; `readWarnings` says
 * when text was not valid in that encoding and how accurate the datum shift is.
 */
export async function readShapefileZip(bytes: Bytes, options: ShapefileOptions = {}): Promise<SourceLayer> {
  const u8 = toUint8(bytes);
  if (!looksLikeZip(u8)) {
    throw new GeoError("not_a_zip", "The file is not a zip archive; upload the shapefile's files zipped together");
  }
  checkEndRecord(u8);
  const { layers, names } = await unzipParts(u8, options.maxUncompressedBytes ?? DEFAULT_MAX_UNCOMPRESSED);
  const [base, parts] = pickLayer(layers, names, options.layer);
  const shp = parts.shp as Uint8Array;
  // a damaged file is told before a missing part
  if (parts.dbf) checkHeaders(base, shp, parts.dbf);
  missingParts(base, parts, options.epsg);
  const reprojector = resolveCrs(base, parts.prj, options.epsg);

  let geometries: ReturnType<typeof parseShp>;
  let records: Array<Record<string, unknown>>;
  const readWarnings: ReadWarning[] = [];
  try {
    geometries = parseShp(view(shp));
  } catch (e) {
    throw wrapUnknown(e, "shapefile_corrupt", `${base}.shp is damaged and cannot be read`);
  }
  try {
    // The .cpg, else the .dbf's language-driver byte, else UTF-8 (geo/dbf-encoding.ts).
    records = decodeDbf(view(parts.dbf), dbfEncoding(parts.dbf, parts.cpg, readWarnings, base), base, readWarnings);
  } catch (e) {
    throw wrapUnknown(e, "shapefile_corrupt", `${base}.dbf is damaged and cannot be read`);
  }
  if (records.length !== geometries.length) {
    throw new GeoError(
      "shapefile_corrupt",
      `${base}.shp has ${geometries.length} shapes but ${base}.dbf has ${records.length} records`,
    );
  }
  const features: SourceFeature[] = geometries.map((g, i) => ({
    index: i,
    label: `feature ${i + 1}`,
    geometry: g ? reprojectGeometry(g, reprojector) : null,
    properties: records[i] ?? {},
  }));
  // After the reprojection, which records the datum transformations it used.
  readWarnings.unshift(...datumWarnings(reprojector.crs));
  return {
    format: "shapefile",
    name: base.split("/").pop() ?? base,
    crs: reprojector.crs,
    features,
    fields: detectFields(features),
    ...(readWarnings.length > 0 ? { readWarnings } : {}),
  };
}
