/**
 * File-level problems the geo readers refuse with. Every reader and the validator throw
 * only `GeoError`; a raw library exception never escapes (see `wrapUnknown`).
 */
export type GeoErrorCode =
  | "not_a_zip"
  | "zip_corrupt"
  | "shp_missing"
  | "dbf_missing"
  | "multiple_layers"
  | "shapefile_corrupt"
  | "prj_missing"
  | "prj_unknown"
  | "epsg_unknown"
  | "datum_unsupported"
  | "geojson_invalid"
  | "csv_invalid"
  | "csv_missing_column"
  | "zip_too_large"
  | "mapping_invalid"
  | "too_many_features"
  | "line_too_many_vertices"
  | "too_many_vertices"
  | "empty_layer"
  | "wrong_geometry_type";

/** A problem with an uploaded file, named so a planner can act on it. */
export class GeoError extends Error {
  readonly code: GeoErrorCode;
  /** Plain data for the UI, e.g. the file names found in a zip or the missing column. */
  readonly details?: Record<string, unknown>;

  constructor(code: GeoErrorCode, message: string, details?: Record<string, unknown>) {
    super(message);
    this.name = "GeoError";
    this.code = code;
    this.details = details;
  }
}

/** Re-throws a GeoError as is and turns anything else into one with `code`. */
export function wrapUnknown(e: unknown, code: GeoErrorCode, message: string): GeoError {
  if (e instanceof GeoError) return e;
  const reason = e instanceof Error && e.message ? ` (${e.message})` : "";
  return new GeoError(code, `${message}${reason}`);
}
