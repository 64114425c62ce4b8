import type { Geometry } from "geojson";

/** A WGS84 position, longitude then latitude, in degrees (RFC 7946 order). */
export type LngLat = [number, number];

export type SourceFormat = "shapefile" | "geojson" | "csv";

/** One feature as read from a file, already reprojected to WGS84. */
export interface SourceFeature {
  /** Zero-based position in the file. */
  index: number;
  /** How messages name the feature before fields are mapped, e.g. "feature 3" or "row 7". */
  label: string;
  geometry: Geometry | null;
  properties: Record<string, unknown>;
}

/** Where the coordinate reference system of a layer came from. */
export interface CrsInfo {
  source: "prj" | "override" | "geojson-default" | "geojson-crs" | "csv-latlon" | "csv-epsg";
  /** EPSG code, when known. */
  epsg?: number;
  /** Human-readable name of the source CRS. */
  name: string;
  /** How its datum is brought to WGS 84 (geo/crs-datum.ts); absent for WGS 84 itself. */
  datumShift?: DatumShift;
}

/** A datum shift to WGS 84 and the accuracy EPSG states for it, for the report to show. */
export interface DatumShift {
  datum: string;
  method: "none" | "helmert" | "grid";
  /** The EPSG transformation(s) or parameters used. */
  operation: string;
  accuracyM?: number;
}

/** Something a reader had to assume or could not read cleanly, for the report to show. */
export interface ReadWarning {
  code: "datum_shift_approximate" | "text_encoding_invalid";
  message: string;
}

/** A source field with a few sample values, for the field-mapping screen. */
export interface FieldInfo {
  name: string;
  /** "number" when every filled value parses as a number. */
  kind: "number" | "text" | "empty";
  /** Up to five distinct non-empty values, as text. */
  samples: string[];
  /** How many features have a non-empty value. */
  filled: number;
}

/** A layer read from an upload: WGS84 features plus their fields. */
export interface SourceLayer {
  format: SourceFormat;
  /** Layer name (shapefile base name) or "" when the format has none. */
  name: string;
  crs: CrsInfo;
  features: SourceFeature[];
  fields: FieldInfo[];
  /** Warnings from reading the file (datum shift accuracy, text encoding). */
  readWarnings?: ReadWarning[];
}
