import type { LowFlowReport } from "../hydrology/low-flow";
import type { NetworkReachLine, PlacedSample } from "../survey/place-stations";
import type { SurveyReadOptions, SurveyRowProblem } from "../survey/read-survey";
import type { FlowUnit, TemperatureRecordUnit } from "../hydrology/read-record";
import type { DesignTemperature } from "../hydrology/design-temperature";
import type { CrsInfo, DischargerMapping, FieldInfo, ReachMapping, ReadOptions, SourceFormat, UploadLayer, ValidateOptions } from "../../geo";

/** One kept upload as the import worker reads it. */
export interface UploadBytes {
  format: SourceFormat;
  bytes: Uint8Array;
  options: ReadOptions;
  fileName: string;
  /** The request field that named this upload, for messages ("reachImportId"). */
  path: string;
}

export type ImportJob =
  | { kind: "read"; upload: UploadBytes; layer: UploadLayer }
  /** A gauge's daily flow record: read and its low-flow statistics computed (lib/hydrology). */
  | { kind: "gauge"; bytes: Uint8Array; fileName: string; unit: FlowUnit; climaticYearStart: string }
  /** A daily water-temperature record: read, in °C. */
  | { kind: "temperature"; bytes: Uint8Array; fileName: string; unit: TemperatureRecordUnit }
  /** A synoptic survey: read (CSV, GeoJSON or shapefile points) and its samples placed on the network's reaches. */
  | { kind: "survey"; format: SourceFormat; bytes: Uint8Array; fileName: string; options: SurveyReadOptions; maxSnapDistanceM?: number; reaches: NetworkReachLine[] }
  | {
      kind: "validate";
      reaches: UploadBytes;
      dischargers?: UploadBytes;
      reachMapping: ReachMapping;
      dischargerMapping?: DischargerMapping;
      options: ValidateOptions;
      /** Also return the rows a commit writes. */
      forCommit: boolean;
    };

/** A gauge record read in the worker, or the reason it could not be (naming the line). */
export type GaugeReadResult =
  | { ok: true; report: LowFlowReport; sha256: string; dayCount: number; missingDays: number; firstDay: string; lastDay: string }
  | { ok: false; message: string };

/** A temperature record read in the worker, or the reason it could not be (naming the line). */
export type TemperatureReadResult =
  /** The days as JSON text (written as is), and the default rule's design temperature. */
  | { ok: true; daysJson: string; summer: DesignTemperature | null; sha256: string; dayCount: number; missingDays: number; firstDay: string; lastDay: string }
  | { ok: false; message: string };

/** A survey read and placed in the worker: its samples, or every row problem (nothing is saved then). */
export type SurveyReadResult =
  | { ok: true; samples: PlacedSample[]; sha256: string; columns: Record<string, string> }
  | { ok: false; problems: SurveyRowProblem[]; columns: Record<string, string> };

export interface ReadResult {
  crs: CrsInfo;
  featureCount: number;
  fields: FieldInfo[];
  sha256: string;
}

export interface ProblemSummary {
  code: string;
  message: string;
  features: string[];
}

/**
 * What a commit writes, prepared in the worker as JSON text in chunks (see the *Json inserts
 * in db/queries/networks.ts): strings cross the thread boundary as one copy each, and the
 * web server never builds or serialises the rows itself.
 */
export interface CommitRows {
  /** Problems that refuse the commit: the first MAX_LISTED_PROBLEMS of them, and how many there are. */
  errors: ProblemSummary[];
  errorCount: number;
  warningCount: number;
  /** The report stored with the network (`{ errors: [], warnings }`), as JSON text. */
  storedReport: string;
  totalLengthKm: number;
  reachCount: number;
  outfallCount: number;
  /** The first discharger not placed on a reach, if any (the commit is then refused). */
  unplaced?: string;
  nodes: string[];
  reaches: string[];
  facilities: string[];
  outfalls: string[];
}

/** How many of a refused commit's errors are listed one by one (the message gives the count). */
export const MAX_LISTED_PROBLEMS = 200;

export interface ValidateResult {
  /** Permit ids of the dischargers (a JSON array of strings), for matching existing facilities. */
  permitsJson: string;
  /** The whole report as UTF-8 JSON (validate only), moved (not copied) out of the worker. */
  reportJson?: Uint8Array;
  /** The rows to write (commit only). */
  commit?: CommitRows;
}

export type ImportStage = "reading reaches" | "reading dischargers" | "checking lines" | "building the network" | "placing dischargers" | "writing the report";

export interface ImportErrorData {
  name: string;
  message: string;
  code?: string;
  details?: Record<string, unknown>;
  /** The upload field at fault when reading failed. */
  path?: string;
}

export type ImportRequest = { id: number; job: ImportJob };
export type ImportResponse =
  | { id: number; type: "progress"; stage: ImportStage; fraction: number }
  | { id: number; type: "done"; result: unknown }
  | { id: number; type: "failed"; error: ImportErrorData };
