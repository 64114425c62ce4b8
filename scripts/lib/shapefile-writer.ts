/**
 * Writes ESRI shapefiles (.shp, .shx, .dbf) for Point and PolyLine layers, following the ESRI
 * Shapefile Technical Description (July 1998) and the dBASE III table layout it refers to.
 * Used by the demo generator and the tests; the app itself only reads shapefiles.
 */
export type ShapeKind = "point" | "polyline";

export interface DbfField {
  /** At most 10 ASCII characters. */
  name: string;
  /** C = text, N = number. */
  type: "C" | "N";
  length: number;
  /** Decimal places, for N fields. */
  decimals?: number;
}

export interface ShapeRecord {
  /** [x, y] for a point; one array of [x, y] per part for a polyline. */
  geometry: [number, number] | Array<Array<[number, number]>>;
  attributes: Record<string, string | number | null>;
}

export interface ShapefileBytes {
  shp: Uint8Array;
  shx: Uint8Array;
  dbf: Uint8Array;
}

const SHAPE_TYPE: Record<ShapeKind, number> = { point: 1, polyline: 3 };

function contentOf(kind: ShapeKind, g: ShapeRecord["geometry"]): Buffer {
  if (kind === "point") {
    const [x, y] = g as [number, number];
    const b = Buffer.alloc(20);
    b.writeInt32LE(1, 0);
    b.writeDoubleLE(x, 4);
    b.writeDoubleLE(y, 12);
    return b;
  }
  const parts = g as Array<Array<[number, number]>>;
  const points = parts.flat();
  const b = Buffer.alloc(44 + 4 * parts.length + 16 * points.length);
  b.writeInt32LE(3, 0);
  const xs = points.map((p) => p[0]);
  const ys = points.map((p) => p[1]);
  [Math.min(...xs), Math.min(...ys), Math.max(...xs), Math.max(...ys)].forEach((v, i) => b.writeDoubleLE(v, 4 + 8 * i));
  b.writeInt32LE(parts.length, 36);
  b.writeInt32LE(points.length, 40);
  let start = 0;
  parts.forEach((p, i) => {
    b.writeInt32LE(start, 44 + 4 * i);
    start += p.length;
  });
  const at = 44 + 4 * parts.length;
  points.forEach(([x, y], i) => {
    b.writeDoubleLE(x, at + 16 * i);
    b.writeDoubleLE(y, at + 16 * i + 8);
  });
  return b;
}

function header(kind: ShapeKind, fileBytes: number, box: number[]): Buffer {
  const h = Buffer.alloc(100);
  h.writeInt32BE(9994, 0);
  h.writeInt32BE(fileBytes / 2, 24); // length in 16-bit words
  h.writeInt32LE(1000, 28);
  h.writeInt32LE(SHAPE_TYPE[kind], 32);
  box.forEach((v, i) => h.writeDoubleLE(v, 36 + 8 * i));
  return h;
}

function dbfBytes(fields: readonly DbfField[], records: readonly ShapeRecord[]): Buffer {
  const recordLength = 1 + fields.reduce((s, f) => s + f.length, 0);
  const headerLength = 32 + 32 * fields.length + 1;
  const out = Buffer.alloc(headerLength + recordLength * records.length + 1, 0x20);
  out.fill(0, 0, headerLength);
  out.writeUInt8(0x03, 0);
  out.writeUInt8(2026 - 1900, 1); // last update: fixed date for repeatable output
  out.writeUInt8(1, 2);
  out.writeUInt8(1, 3);
  out.writeUInt32LE(records.length, 4);
  out.writeUInt16LE(headerLength, 8);
  out.writeUInt16LE(recordLength, 10);
  fields.forEach((f, i) => {
    const at = 32 + 32 * i;
    out.write(f.name.slice(0, 10), at, "ascii");
    out.write(f.type, at + 11, "ascii");
    out.writeUInt8(f.length, at + 16);
    out.writeUInt8(f.decimals ?? 0, at + 17);
  });
  out.writeUInt8(0x0d, headerLength - 1);
  records.forEach((r, k) => {
    let at = headerLength + recordLength * k + 1; // byte 0 is the deletion flag, left as a space
    for (const f of fields) {
      const v = r.attributes[f.name];
      let text = v === null || v === undefined ? "" : f.type === "N" ? Number(v).toFixed(f.decimals ?? 0) : String(v);
      text = text.slice(0, f.length);
      const padded = f.type === "N" ? text.padStart(f.length) : text.padEnd(f.length);
      out.write(padded, at, "latin1");
      at += f.length;
    }
  });
  out.writeUInt8(0x1a, out.length - 1);
  return out;
}

/** Builds the three files of a shapefile layer. */
export function writeShapefile(kind: ShapeKind, fields: readonly DbfField[], records: readonly ShapeRecord[]): ShapefileBytes {
  const contents = records.map((r) => contentOf(kind, r.geometry));
  const all = records.flatMap((r) => (kind === "point" ? [r.geometry as [number, number]] : (r.geometry as Array<Array<[number, number]>>).flat()));
  const box = all.length
    ? [Math.min(...all.map((p) => p[0])), Math.min(...all.map((p) => p[1])), Math.max(...all.map((p) => p[0])), Math.max(...all.map((p) => p[1])), 0, 0, 0, 0]
    : [0, 0, 0, 0, 0, 0, 0, 0];
  const shpLength = 100 + contents.reduce((s, c) => s + 8 + c.length, 0);
  const shp: Buffer[] = [header(kind, shpLength, box)];
  const shx: Buffer[] = [header(kind, 100 + 8 * records.length, box)];
  let offset = 100;
  contents.forEach((c, i) => {
    const rec = Buffer.alloc(8);
    rec.writeInt32BE(i + 1, 0);
    rec.writeInt32BE(c.length / 2, 4);
    shp.push(rec, c);
    const idx = Buffer.alloc(8);
    idx.writeInt32BE(offset / 2, 0);
    idx.writeInt32BE(c.length / 2, 4);
    shx.push(idx);
    offset += 8 + c.length;
  });
  return { shp: new Uint8Array(Buffer.concat(shp)), shx: new Uint8Array(Buffer.concat(shx)), dbf: new Uint8Array(dbfBytes(fields, records)) };
}

/** ESRI-style .prj text for WGS 84 / UTM zone `zone` north (what desktop GIS writes). */
export function utmNorthPrj(zone: number): string {
  const cm = -183 + 6 * zone;
  return (
    `PROJCS["WGS_1984_UTM_Zone_${zone}N",GEOGCS["GCS_WGS_1984",DATUM["D_WGS_1984",SPHEROID["WGS_1984",6378137.0,298.257223563]],` +
    `PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]],PROJECTION["Transverse_Mercator"],PARAMETER["False_Easting",500000.0],` +
    `PARAMETER["False_Northing",0.0],PARAMETER["Central_Meridian",${cm.toFixed(1)}],PARAMETER["Scale_Factor",0.9996],` +
    `PARAMETER["Latitude_Of_Origin",0.0],UNIT["Meter",1.0]]`
  );
}

/** ESRI-style .prj text for WGS 84 geographic coordinates. */
export const WGS84_PRJ =
  'GEOGCS["GCS_WGS_1984",DATUM["D_WGS_1984",SPHEROID["WGS_1984",6378137.0,298.257223563]],PRIMEM["Greenwich",0.0],UNIT["Degree",0.0174532925199433]]';
