import { writeShapefile, type DbfField, type ShapeKind, type ShapeRecord } from "./shapefile-writer";
import { writeZip, type ZipEntry } from "./zip-writer";

export interface ZipShapefileOptions {
  /** .prj text; omitted → no .prj in the zip. */
  prj?: string;
  /** Leave parts out, to build broken uploads in tests. */
  omit?: Array<"shp" | "shx" | "dbf">;
}

/** A zipped shapefile layer `base` (.shp, .shx, .dbf, and .prj when given). */
export function zipShapefile(
  base: string,
  kind: ShapeKind,
  fields: readonly DbfField[],
  records: readonly ShapeRecord[],
  options: ZipShapefileOptions = {},
): Uint8Array {
  const files = writeShapefile(kind, fields, records);
  const omit = new Set(options.omit ?? []);
  const entries: ZipEntry[] = (["shp", "shx", "dbf"] as const).filter((e) => !omit.has(e)).map((e) => ({ name: `${base}.${e}`, data: files[e] }));
  if (options.prj !== undefined) entries.push({ name: `${base}.prj`, data: new TextEncoder().encode(options.prj) });
  return writeZip(entries);
}
