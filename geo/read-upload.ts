import { GeoError } from "./errors";
import { checkLimits } from "./limits";
import { detectCsvFields, guessCsvCoordinates, readPointCsv, type CsvCoordinates } from "./read-csv";
import { readGeoJson } from "./read-geojson";
import { readShapefileZip } from "./read-shapefile";
import type { SourceFormat, SourceLayer } from "./types";

export type UploadLayer = "reaches" | "dischargers";

export interface ReadOptions {
  epsg?: number;
  csv?: CsvCoordinates;
}

const LINE_TYPES = new Set(["LineString", "MultiLineString"]);
const POINT_TYPES = new Set(["Point"]);

/** Refuses a layer with nothing usable. */
function checkLayer(layer: UploadLayer, source: SourceLayer, fileName: string): void {
  if (source.features.length === 0) throw new GeoError("empty_layer", `${fileName} has no features (empty layer)`);
  const wanted = layer === "reaches" ? LINE_TYPES : POINT_TYPES;
  if (!source.features.some((f) => f.geometry && wanted.has(f.geometry.type))) {
    const found = [...new Set(source.features.map((f) => f.geometry?.type ?? "no geometry"))].join(", ");
    const want = layer === "reaches" ? "lines (LineString or MultiLineString)" : "points";
    throw new GeoError("wrong_geometry_type", `${fileName} holds ${found}; ${layer} must be ${want}`);
  }
}

/**
 * Reads an upload of a known format into a WGS84 layer and refuses it when it is empty,
 * holds the wrong geometry or is over `IMPORT_LIMITS`. Throws only `GeoError`.
 */
export async function readUploadLayer(format: SourceFormat, bytes: Uint8Array, options: ReadOptions, layer: UploadLayer, fileName: string): Promise<SourceLayer> {
  let source: SourceLayer;
  if (format === "shapefile") source = await readShapefileZip(bytes, { epsg: options.epsg });
  else {
    const text = new TextDecoder().decode(bytes);
    if (format === "geojson") source = readGeoJson(text, { epsg: options.epsg });
    else {
      const coordinates = options.csv ?? guessCsvCoordinates(detectCsvFields(text).map((f) => f.name));
      if (!coordinates) {
        throw new GeoError(
          "csv_missing_column",
          "The CSV has no latitude/longitude columns that Sagline recognises (it looks for lat or latitude, and lon, lng or longitude); " +
            'choose the columns under "Where each row is": latitude and longitude, or X and Y with their EPSG code',
          // the upload API's own names for the same choice
          { fields: ["csvLatitude", "csvLongitude", "csvX", "csvY", "epsg"] },
        );
      }
      source = readPointCsv(text, coordinates);
    }
  }
  checkLayer(layer, source, fileName);
  checkLimits(layer, source);
  return source;
}
