// shpjs ships no types; only the two parsers geo/ uses are declared.
declare module "shpjs" {
  import type { Geometry } from "geojson";

  type Bytes = ArrayBuffer | ArrayBufferView | DataView;

  /** Parses .shp bytes; with a proj4-readable `prj` it also reprojects to WGS84. */
  export function parseShp(shp: Bytes, prj?: string | false): Array<Geometry | null>;
  /** Parses .dbf bytes into one attribute object per record; `cpg` names the text encoding. */
  export function parseDbf(dbf: Bytes, cpg?: string | Bytes): Array<Record<string, unknown>>;
}
