import type { SourceFormat } from "./types";

/** What kind of file this is, from its first bytes and its name; undefined when it is none Sagline reads. */
export function sniffFormat(fileName: string, bytes: Uint8Array): SourceFormat | undefined {
  const name = fileName.toLowerCase();
  if (bytes[0] === 0x50 && bytes[1] === 0x4b) return "shapefile";
  if (name.endsWith(".zip")) return "shapefile";
  if (name.endsWith(".csv") || name.endsWith(".txt")) return "csv";
  if (name.endsWith(".geojson") || name.endsWith(".json")) return "geojson";
  const head = new TextDecoder().decode(bytes.subarray(0, 64)).trimStart();
  return head.startsWith("{") ? "geojson" : undefined;
}

/** The message for a file of no known kind. */
export const unknownFormatMessage = (fileName: string) =>
  `${fileName} is not a zipped shapefile, a GeoJSON file or a CSV; upload a .zip with .shp, .shx, .dbf and .prj, a .geojson, or a .csv`;
