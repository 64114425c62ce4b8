import type { Db } from "@/db/client";
import { insertAuditEvent } from "@/db/queries/audit";
import {
  findImport,
  findImportMeta,
  insertImport,
  listFieldMappings,
  listImports,
  readImportContent,
  upsertFieldMapping,
  type ImportMeta,
} from "@/db/queries/imports";
import type { ImportFormat, ImportLayer } from "@/db/schema";
import { sniffFormat, unknownFormatMessage } from "@/geo/detect-format";
import type { FieldInfo, ReadOptions } from "@/geo";
import type { BasinScope } from "@/lib/auth/scope";
import { ImportJobError, importPool } from "@/lib/compute/import-pool";
import type { UploadBytes } from "@/lib/compute/import-protocol";
import { AppError, notFound } from "@/lib/errors";
import type { FieldMappingSave, UploadFields } from "@/lib/validation/network";

/** Upload size limit in bytes: SAGLINE_UPLOAD_LIMIT_MB (default 50 MB). */
export function uploadLimitBytes(): number {
  const mb = Number(process.env.SAGLINE_UPLOAD_LIMIT_MB ?? 50);
  return (Number.isFinite(mb) && mb > 0 ? mb : 50) * 1024 * 1024;
}

export interface ImportDto {
  id: string;
  layer: ImportLayer;
  format: ImportFormat;
  fileName: string;
  sizeBytes: number;
  sha256: string;
  crs: Record<string, unknown>;
  featureCount: number;
  fields: FieldInfo[];
  status: string;
  uploadedAt: string;
  uploadedBy?: string | null;
}

const importDto = (m: ImportMeta & { uploader_name?: string | null }): ImportDto => ({
  id: m.id,
  layer: m.layer,
  format: m.format,
  fileName: m.file_name,
  sizeBytes: m.size_bytes,
  sha256: m.sha256,
  crs: m.crs,
  featureCount: m.feature_count,
  fields: m.fields as FieldInfo[],
  status: m.status,
  uploadedAt: m.uploaded_at.toISOString(),
  uploadedBy: m.uploader_name,
});

const fileProblem = (message: string, code: string, extra?: Record<string, unknown>) =>
  new AppError("invalid", message, [{ path: "file", message, code, ...extra }]);

/** What kind of file this is, from its first bytes and its name (geo/detect-format.ts), or a 422. */
export function detectFormat(fileName: string, bytes: Uint8Array): ImportFormat {
  const format = sniffFormat(fileName, bytes);
  if (!format) throw fileProblem(unknownFormatMessage(fileName), "unknown_format");
  return format;
}

/**
 * An import worker's failure as the caller's error: a file problem (a GeoError while reading,
 * over a limit included) is a 422 naming the upload field and the feature at fault; anything
 * else is unexpected and stays a 500.
 */
export function importFailure(e: unknown, path = "file"): unknown {
  if (!(e instanceof ImportJobError) || !e.data.code) return e;
  if (e.data.code === "import_timeout") return new AppError("invalid", e.data.message, [{ path, message: e.data.message, code: e.data.code }]);
  return new AppError("invalid", e.data.message, [{ path: e.data.path ?? path, message: e.data.message, code: e.data.code, ...e.data.details }]);
}

/**
 * Keep an upload (bytes, SHA-256, who, when) after it has been read
 * successfully; returns its fields with sample values for the mapping step.
 */
export async function uploadImport(scope: BasinScope, file: { name: string; bytes: Buffer }, fields: UploadFields): Promise<ImportDto> {
  scope.require("network.import");
  const { db, actor, basin } = scope;
  if (file.bytes.byteLength > uploadLimitBytes()) {
    throw new AppError("too_large", `${file.name} is larger than the ${uploadLimitBytes() / 1048576} MB upload limit`, [
      { path: "file", message: "File too large" },
    ]);
  }
  if (file.bytes.byteLength === 0) throw fileProblem(`${file.name} is empty`, "empty_file");
  const format = detectFormat(file.name, file.bytes);
  if (format === "csv" && fields.layer === "reaches") {
    throw fileProblem("Reaches must be lines: upload a zipped shapefile or a GeoJSON file, not a CSV", "wrong_format");
  }
  const options: ReadOptions = { epsg: fields.epsg };
  if (fields.csvLatitude && fields.csvLongitude) {
    options.csv = { kind: "latlon", latitude: fields.csvLatitude, longitude: fields.csvLongitude };
  } else if (fields.csvX && fields.csvY && fields.epsg) {
    options.csv = { kind: "xy", x: fields.csvX, y: fields.csvY, epsg: fields.epsg };
  }
  // Parsing, the limits and the checksum run in a worker thread (a 30 MB GeoJSON takes seconds).
  const read = await importPool()
    .read({ kind: "read", layer: fields.layer, upload: { format, bytes: file.bytes, options, fileName: file.name, path: "file" } })
    .catch((e: unknown) => {
      throw importFailure(e);
    });
  const { sha256 } = read;
  return db.transaction().execute(async (trx) => {
    const row = await insertImport(trx, {
      basinId: basin.id,
      layer: fields.layer,
      format,
      fileName: file.name,
      content: file.bytes,
      sha256,
      crs: { ...read.crs },
      readOptions: { ...options },
      featureCount: read.featureCount,
      fields: read.fields,
      uploadedBy: actor.id,
    });
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "import.uploaded",
      targetType: "import",
      targetId: row.id,
      details: { fileName: file.name, layer: fields.layer, format, sha256, features: read.featureCount },
    });
    return importDto(row);
  });
}

/** A kept upload's bytes for the import worker, checking it belongs to the basin and layer. */
export async function loadUploadBytes(db: Db, basinId: string, importId: string, layer: ImportLayer, path: string): Promise<UploadBytes> {
  const row = await findImportMeta(db, basinId, importId);
  if (!row) throw new AppError("invalid", `${path}: no such upload in this basin`, [{ path, message: "Unknown upload" }]);
  if (row.layer !== layer) {
    throw new AppError("invalid", `${path}: that upload holds ${row.layer}, not ${layer}`, [{ path, message: `Not a ${layer} upload` }]);
  }
  const bytes = await readImportContent(db, row.id, row.size_bytes);
  return { format: row.format, bytes, options: row.read_options as ReadOptions, fileName: row.file_name, path };
}

export async function listBasinImports(scope: BasinScope): Promise<ImportDto[]> {
  scope.require("scenario.read");
  const { db, basin } = scope;
  return (await listImports(db, basin.id)).map(importDto);
}

/** The original bytes of an upload, for download (traceability). */
export async function importFile(scope: BasinScope, importId: string) {
  scope.require("scenario.read");
  const { db, basin } = scope;
  const row = await findImport(db, basin.id, importId);
  if (!row) throw notFound("Upload");
  return { fileName: row.file_name, format: row.format, content: row.content, sha256: row.sha256 };
}

export interface FieldMappingDto {
  id: string;
  layer: ImportLayer;
  name: string;
  mapping: Record<string, unknown>;
  createdAt: string;
}

export async function listMappings(scope: BasinScope): Promise<FieldMappingDto[]> {
  scope.require("network.import");
  const { db, basin } = scope;
  return (await listFieldMappings(db, basin.id)).map((m) => ({
    id: m.id,
    layer: m.layer,
    name: m.name,
    mapping: m.mapping,
    createdAt: m.created_at.toISOString(),
  }));
}

/** Save (or replace, by name) a field mapping for the next import into this basin. */
export async function saveMapping(scope: BasinScope, input: FieldMappingSave): Promise<FieldMappingDto> {
  scope.require("network.import");
  const { db, actor, basin } = scope;
  const m = await upsertFieldMapping(db, {
    basinId: basin.id,
    layer: input.layer,
    name: input.name,
    mapping: input.mapping as Record<string, unknown>,
    createdBy: actor.id,
  });
  return { id: m.id, layer: m.layer, name: m.name, mapping: m.mapping, createdAt: m.created_at.toISOString() };
}
