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

/** What a commit writes, prepared in the worker (coordinates and attributes already JSON). */
export interface CommitRows {
  totalLengthKm: number;
  nodes: Array<{ key: string; kind: string; lon: number; lat: number }>;
  reaches: Array<{
    key: string;
    name: string | null;
    downstreamKey: string | null;
    upstreamNode: string;
    downstreamNode: string;
    part: number;
    flipped: boolean;
    geometryLengthKm: number;
    lengthKm: number;
    coordinates: string;
    attributes: string;
    sourceIndex: number;
  }>;
  dischargers: Array<{
    id: string;
    permitId: string;
    name: string;
    reachId?: string;
    chainageKm?: number;
    modelChainageKm?: number;
    snapDistanceM?: number;
    assignment: string;
    position: [number, number];
    snapped?: [number, number];
    attributes: string;
    sourceIndex: number;
  }>;
}

export interface ValidateResult {
  errors: ProblemSummary[];
  warnings: ProblemSummary[];
  /** Permit ids of the placed dischargers, for matching existing facilities. */
  permits: string[];
  /** The whole report as JSON text (validate only): text crosses the thread boundary as one copy. */
  reportJson?: string;
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
