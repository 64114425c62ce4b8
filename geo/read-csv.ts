import Papa from "papaparse";
import { crsFromEpsg, datumWarnings, type Reprojector } from "./crs";
import { GeoError } from "./errors";
import { detectFields, valueNumber } from "./fields";
import type { FieldInfo, SourceFeature, SourceLayer } from "./types";

/** Which CSV columns hold the position: WGS84 latitude/longitude, or x/y in an EPSG system. */
export type CsvCoordinates =
  | { kind: "latlon"; latitude: string; longitude: string }
  | { kind: "xy"; x: string; y: string; epsg: number };

type Row = Record<string, string>;

function parseRows(text: string): { rows: Row[]; columns: string[] } {
  const result = Papa.parse<Row>(text.replace(/^\uFEFF/, ""), {
    header: true,
    skipEmptyLines: "greedy",
    transformHeader: (h) => h.trim(),
  });
  const fatal = result.errors.find((e) => e.type === "Quotes" || e.type === "Delimiter");
  if (fatal) {
    const where = fatal.row !== undefined ? ` at row ${fatal.row + 1}` : "";
    throw new GeoError("csv_invalid", `The CSV cannot be read${where}: ${fatal.message}`);
  }
  const columns = (result.meta.fields ?? []).filter((c) => c !== "");
  if (columns.length === 0) throw new GeoError("csv_invalid", "The CSV has no header row");
  return { rows: result.data, columns };
}

const rowFeatures = (rows: Row[], point: (r: Row) => [number, number]): SourceFeature[] =>
  rows.map((r, i) => ({
    index: i,
    label: `row ${i + 1}`,
    geometry: { type: "Point", coordinates: point(r) },
    properties: { ...r },
  }));

/** The columns of a CSV with sample values, before the coordinate columns are chosen. */
export function detectCsvFields(text: string): FieldInfo[] {
  const { rows } = parseRows(text);
  return detectFields(rowFeatures(rows, () => [0, 0]));
}

/** Suggests coordinate columns from common header names (lat/latitude, lon/lng/longitude). */
export function guessCsvCoordinates(columns: readonly string[]): CsvCoordinates | undefined {
  const find = (re: RegExp) => columns.find((c) => re.test(c.trim()));
  const latitude = find(/^(lat|latitude|y_?wgs84|lat_?dd)$/i);
  const longitude = find(/^(lon|long|lng|longitude|x_?wgs84|lon_?dd)$/i);
  return latitude && longitude ? { kind: "latlon", latitude, longitude } : undefined;
}

/**
 * Reads discharger points from CSV text with a header row. Coordinates that are missing or
 * not numbers become NaN, for the validator to report by row. Throws `GeoError` csv_invalid,
 * csv_missing_column (naming the column) or epsg_unknown.
 */
export function readPointCsv(text: string, coordinates: CsvCoordinates): SourceLayer {
  const { rows, columns } = parseRows(text);
  const [a, b] = coordinates.kind === "latlon" ? [coordinates.longitude, coordinates.latitude] : [coordinates.x, coordinates.y];
  for (const column of [a, b]) {
    if (!columns.includes(column)) {
      throw new GeoError("csv_missing_column", `The CSV has no column "${column}"; its columns are ${columns.join(", ")}`, {
        column,
        columns,
      });
    }
  }
  const reprojector: Reprojector | undefined = coordinates.kind === "xy" ? crsFromEpsg(coordinates.epsg, "csv-epsg") : undefined;
  const num = (v: string | undefined) => valueNumber(v) ?? Number.NaN;
  const features = rowFeatures(rows, (r) => {
    const x = num(r[a]);
    const y = num(r[b]);
    return reprojector && Number.isFinite(x) && Number.isFinite(y) ? reprojector.toWgs84(x, y) : [x, y];
  });
  return {
    format: "csv",
    name: "",
    crs: reprojector?.crs ?? { source: "csv-latlon", epsg: 4326, name: "WGS 84" },
    features,
    fields: detectFields(features),
    ...(reprojector && datumWarnings(reprojector.crs).length > 0 ? { readWarnings: datumWarnings(reprojector.crs) } : {}),
  };
}
