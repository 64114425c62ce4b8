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
 * in db/queries/networks.ts): strings cross the thread boundary as one copy each.
 */
export interface CommitRows {
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

export interface ValidateResult {
  errors: ProblemSummary[];
  warnings: ProblemSummary[];
  /** Permit ids of the placed dischargers, for matching existing facilities. */
  permits: string[];
  /** The whole report as UTF-8 JSON (validate only), moved (not copied) out of the worker. */
  reportJson?: Uint8Array;
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
