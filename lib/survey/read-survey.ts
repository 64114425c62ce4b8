import Papa from "papaparse";
import { GeoError } from "@/geo/errors";
import { valueNumber } from "@/geo/fields";
import { readUploadLayer } from "@/geo/read-upload";
import type { LngLat, SourceFormat } from "@/geo/types";
import { findSurveyColumns, SURVEY_COLUMNS, type SurveyColumn } from "./columns";

export { findSurveyColumns, SURVEY_COLUMNS, type SurveyColumn };
import { cfsToM3s, fToC, ftPerSToMPerS, ftToM } from "@/lib/model/units";

/**
 * A synoptic survey file read into rows (docs/surveys.md): one row per sample — a station,
 * when it was taken, where (WGS84 longitude/latitude, or a reach id and km from the reach's
 * head), and any of DO, water temperature, BOD5 or CBODu, NH3-N and flow. CSV (with lat/lon
 * or reach/km columns), GeoJSON points or a zipped point shapefile; the columns are found by
 * their names (SURVEY_COLUMNS) and the units are the planner's choice for the file. Every
 * value is converted to Sagline's units (mg/L, °C, m³/s). A row that cannot be used is a
 * problem naming the row and the column; the caller saves nothing while there are any.
 */

export type SurveyTemperatureUnit = "C" | "F";
export type SurveyFlowUnit = "m3/s" | "cfs";
/** What a column named plainly "bod" holds. */
export type SurveyBodKind = "bod5" | "cbodu";

export interface SurveyReadOptions {
  temperatureUnit: SurveyTemperatureUnit;
  flowUnit: SurveyFlowUnit;
  bodKind: SurveyBodKind;
  /** The CRS of a GeoJSON or shapefile without one, or of CSV x/y columns (not needed for lat/lon). */
  epsg?: number;
  /**
   * The planner's own mapping, Sagline's column → the file's (it wins over the names
   * recognised); `latitude` and `longitude` name a CSV's coordinate columns.
   */
  columns?: Partial<Record<SurveyColumn | "latitude" | "longitude", string>>;
}

export interface SurveySample {
  /** 1-based row (CSV) or feature number. */
  row: number;
  station: string;
  /** When the sample was taken, as written (ISO 8601 date or date-time); null when not given. */
  time: string | null;
  /** WGS84 longitude, latitude; null when the row is placed by reach and km. */
  position: LngLat | null;
  reach: string | null;
  km: number | null;
  do_mg_l: number | null;
  temperature_c: number | null;
  bod5_mg_l: number | null;
  cbodu_mg_l: number | null;
  nh3n_mg_l: number | null;
  flow_m3s: number | null;
  /** Mean velocity (m/s) and depth (m) measured with the flow, for hydraulic geometry; read in ft/s and ft when the flow is in cfs. */
  velocity_m_s: number | null;
  depth_m: number | null;
  /** Relative weight in a calibration (default 1). */
  weight: number | null;
}

export interface SurveyRowProblem {
  /** The row or feature (1-based); null for the file as a whole. */
  row: number | null;
  /** The column at fault (its name in the file when it has one). */
  field: string;
  message: string;
}

export interface SurveyRead {
  samples: SurveySample[];
  problems: SurveyRowProblem[];
  /** The columns found, Sagline's name → the file's. */
  columns: Partial<Record<SurveyColumn, string>>;
}

const ISO_DATE = /^\d{4}-\d{2}-\d{2}$/;
const ISO_DATE_TIME = /^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}(:\d{2}(\.\d+)?)?(Z|[+-]\d{2}:?\d{2})?$/;
const CLOCK = /^\d{1,2}:\d{2}(:\d{2})?$/;

/** Limits a value must keep to be a plausible field measurement (mg/L, °C, m³/s). */
const RANGES = {
  do: { min: 0, max: 25, unit: "mg/L" },
  temperature: { min: -2, max: 45, unit: "°C" },
  bod5: { min: 0, max: 1000, unit: "mg/L" },
  cbodu: { min: 0, max: 2000, unit: "mg/L" },
  nh3n: { min: 0, max: 500, unit: "mg/L" },
  flow: { min: 0, max: 1e6, unit: "m³/s" },
  velocity: { min: 0, max: 10, unit: "m/s" },
  depth: { min: 0, max: 100, unit: "m" },
} as const;

interface RawRow {
  row: number;
  position: LngLat | null;
  values: Record<string, unknown>;
}

function csvRows(text: string): { rows: RawRow[]; columns: string[] } {
  const result = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ""), { header: true, skipEmptyLines: "greedy", transformHeader: (h) => h.trim() });
  const fatal = result.errors.find((e) => e.type === "Quotes" || e.type === "Delimiter");
  if (fatal) throw new GeoError("csv_invalid", `The CSV cannot be read${fatal.row !== undefined ? ` at row ${fatal.row + 1}` : ""}: ${fatal.message}`);
  const columns = (result.meta.fields ?? []).filter((c) => c !== "");
  if (columns.length === 0) throw new GeoError("csv_invalid", "The CSV has no header row");
  return { rows: result.data.map((values, i) => ({ row: i + 1, position: null, values })), columns };
}

/** The rows of the file, with positions (WGS84) where the file gives them. */
async function rawRows(format: SourceFormat, bytes: Uint8Array, fileName: string, options: SurveyReadOptions): Promise<{ rows: RawRow[]; columns: string[] }> {
  if (format === "csv") {
    const text = new TextDecoder().decode(bytes);
    const plain = csvRows(text);
    const cols = findSurveyColumns(plain.columns, options.columns);
    const coordinates = options.columns?.latitude && options.columns?.longitude;
    // placed by reach and km (no coordinates needed), or by coordinates read as for outfalls
    if (!coordinates && cols.reach && cols.km && !plain.columns.some((c) => /^(lat|latitude|lon|lng|longitude|x|y)$/i.test(c))) return plain;
  }
  const csv = options.columns?.latitude && options.columns?.longitude ? { kind: "latlon" as const, latitude: options.columns.latitude, longitude: options.columns.longitude } : undefined;
  const layer = await readUploadLayer(format, bytes, { epsg: options.epsg, ...(csv ? { csv } : {}) }, "dischargers", fileName);
  const columns = [...new Set(layer.features.flatMap((f) => Object.keys(f.properties)))];
  return {
    columns,
    rows: layer.features.map((f) => {
      const g = f.geometry;
      const position = g?.type === "Point" && Number.isFinite(g.coordinates[0]) && Number.isFinite(g.coordinates[1]) ? ([g.coordinates[0], g.coordinates[1]] as LngLat) : null;
      return { row: f.index + 1, position, values: f.properties };
    }),
  };
}

const text = (v: unknown) => (v === undefined || v === null ? "" : String(v).trim());

/** Reads a survey file; throws GeoError when the file as a whole cannot be read. */
export async function readSurvey(format: SourceFormat, bytes: Uint8Array, fileName: string, options: SurveyReadOptions): Promise<SurveyRead> {
  const { rows, columns: fileColumns } = await rawRows(format, bytes, fileName, options);
  if (rows.length === 0) throw new GeoError("empty_layer", `${fileName} has no rows`);
  const columns = findSurveyColumns(fileColumns, options.columns);
  const problems: SurveyRowProblem[] = [];
  for (const [key, own] of Object.entries(options.columns ?? {})) {
    if (own && !fileColumns.includes(own) && key !== "latitude" && key !== "longitude") {
      problems.push({ row: null, field: key, message: `The mapping names a column "${own}" for ${key}, which the file does not have; its columns are ${fileColumns.join(", ")}` });
    }
  }
  if (!columns.station) {
    problems.push({ row: null, field: "station", message: `No station column (looked for ${SURVEY_COLUMNS.station.join(", ")}); the columns are ${fileColumns.join(", ")}` });
  }
  const measured = (["do", "temperature", "bod5", "cbodu", "bod", "nh3n", "flow", "velocity", "depth"] as const).filter((k) => columns[k]);
  if (measured.length === 0) {
    problems.push({ row: null, field: "do", message: `No measured values: a survey needs at least one of DO, temperature, BOD5 or CBODu, NH3-N or flow (the columns are ${fileColumns.join(", ")})` });
  }
  if (problems.length > 0) return { samples: [], problems, columns };

  const samples: SurveySample[] = [];
  for (const r of rows) {
    const bad = (field: SurveyColumn, message: string) => problems.push({ row: r.row, field: columns[field] ?? field, message });
    const get = (k: SurveyColumn) => (columns[k] ? r.values[columns[k]!] : undefined);
    const number = (k: SurveyColumn): number | null => {
      const n = valueNumber(get(k));
      if (n === undefined) return null;
      if (Number.isNaN(n)) {
        bad(k, `"${text(get(k))}" is not a number`);
        return null;
      }
      return n;
    };
    const inRange = (k: keyof typeof RANGES, v: number | null, label: string): number | null => {
      if (v === null) return null;
      const { min, max, unit } = RANGES[k];
      if (v < min || v > max) {
        bad(k, `${label} ${v} ${unit} lies outside ${min}–${max} ${unit}`);
        return null;
      }
      return v;
    };
    const station = text(get("station"));
    if (!station) bad("station", "The station is empty");

    let time: string | null = null;
    let t = text(get("time"));
    const d = text(get("date"));
    let c = text(get("clock"));
    // a "time" column beside a date column may hold the time of day alone
    if (d && !c && CLOCK.test(t)) [c, t] = [t, ""];
    if (t) {
      if (ISO_DATE_TIME.test(t) || ISO_DATE.test(t)) time = t.replace(" ", "T");
      else bad("time", `"${t}" is not an ISO 8601 date-time (e.g. 2026-08-14T09:30)`);
    } else if (d) {
      if (!ISO_DATE.test(d)) bad("date", `"${d}" is not an ISO 8601 date (e.g. 2026-08-14)`);
      else if (c && !CLOCK.test(c)) bad("clock", `"${c}" is not a time of day (e.g. 09:30)`);
      else time = c ? `${d}T${c.padStart(5, "0")}` : d;
    }

    const reach = text(get("reach")) || null;
    const km = number("km");
    if (km !== null && km < 0) bad("km", `km ${km} is negative`);
    if (!r.position && !(reach && km !== null)) {
      bad(columns.reach ? "reach" : "station", r.position === null && !columns.reach ? "The row has no usable coordinates" : "The row needs coordinates, or both a reach and a km");
    }

    const temperatureRaw = number("temperature");
    const temperature = temperatureRaw === null ? null : options.temperatureUnit === "F" ? fToC(temperatureRaw) : temperatureRaw;
    const flowRaw = number("flow");
    const flow = flowRaw === null ? null : options.flowUnit === "cfs" ? cfsToM3s(flowRaw) : flowRaw;
    const plainBod = number("bod");
    // velocity and depth are read in the flow's unit system: m/s and m with m³/s, ft/s and ft with cfs
    const us = options.flowUnit === "cfs";
    const velocityRaw = number("velocity");
    const depthRaw = number("depth");
    const weight = number("weight");
    if (weight !== null && !(weight > 0)) bad("weight", `weight ${weight} must be above 0`);
    const sample: SurveySample = {
      row: r.row,
      station,
      time,
      position: r.position,
      reach,
      km,
      do_mg_l: inRange("do", number("do"), "DO"),
      temperature_c: inRange("temperature", temperature, "Temperature"),
      bod5_mg_l: inRange("bod5", number("bod5") ?? (options.bodKind === "bod5" ? plainBod : null), "BOD5"),
      cbodu_mg_l: inRange("cbodu", number("cbodu") ?? (options.bodKind === "cbodu" ? plainBod : null), "CBODu"),
      nh3n_mg_l: inRange("nh3n", number("nh3n"), "NH3-N"),
      flow_m3s: inRange("flow", flow, "Flow"),
      velocity_m_s: inRange("velocity", velocityRaw === null ? null : us ? ftPerSToMPerS(velocityRaw) : velocityRaw, "Velocity"),
      depth_m: inRange("depth", depthRaw === null ? null : us ? ftToM(depthRaw) : depthRaw, "Depth"),
      weight: weight !== null && weight > 0 ? weight : null,
    };
    const values = [sample.do_mg_l, sample.temperature_c, sample.bod5_mg_l, sample.cbodu_mg_l, sample.nh3n_mg_l, sample.flow_m3s, sample.velocity_m_s, sample.depth_m];
    if (values.every((v) => v === null) && !problems.some((p) => p.row === r.row)) bad(measured[0], "The row has no measured value");
    samples.push(sample);
  }
  return { samples, problems, columns };
}
