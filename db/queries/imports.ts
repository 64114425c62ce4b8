import { sql } from "kysely";
import type { Db } from "../client";
import type { ImportLayer, ImportFormat } from "../schema";
import { isUuid } from "./users";

export interface NewImport {
  basinId: string;
  layer: ImportLayer;
  format: ImportFormat;
  fileName: string;
  content: Buffer;
  sha256: string;
  crs: Record<string, unknown>;
  readOptions: Record<string, unknown>;
  featureCount: number;
  fields: unknown[];
  uploadedBy: string;
}

const META = [
  "id",
  "basin_id",
  "layer",
  "format",
  "file_name",
  "size_bytes",
  "sha256",
  "crs",
  "read_options",
  "feature_count",
  "fields",
  "status",
  "uploaded_by",
  "uploaded_at",
] as const;

/**
 * Uploads travel to and from PostgreSQL in pieces of this many bytes: pg turns a bytea into
 * hex text on the event loop (and back), which for a 30 MB file is a stall of the whole
 * server; a piece at a time lets other requests run in between.
 */
const CONTENT_CHUNK = 512 * 1024;

export async function insertImport(db: Db, i: NewImport) {
  const row = await db
    .insertInto("imports")
    .values({
      basin_id: i.basinId,
      layer: i.layer,
      format: i.format,
      file_name: i.fileName,
      size_bytes: i.content.byteLength,
      sha256: i.sha256,
      content: i.content.subarray(0, CONTENT_CHUNK),
      crs: JSON.stringify(i.crs),
      read_options: JSON.stringify(i.readOptions),
      feature_count: i.featureCount,
      fields: JSON.stringify(i.fields),
      uploaded_by: i.uploadedBy,
    })
    .returning(META)
    .executeTakeFirstOrThrow();
  for (let at = CONTENT_CHUNK; at < i.content.byteLength; at += CONTENT_CHUNK) {
    const piece = i.content.subarray(at, at + CONTENT_CHUNK);
    await db.updateTable("imports").set({ content: sql<Buffer>`content || ${piece}` }).where("id", "=", row.id).execute();
  }
  return row;
}

/** An upload's metadata without its bytes. */
export async function findImportMeta(db: Db, basinId: string, id: string) {
  if (!isUuid(id)) return undefined;
  return db.selectFrom("imports").select(META).where("basin_id", "=", basinId).where("id", "=", id).executeTakeFirst();
}

/** An upload's bytes, read a piece at a time (see CONTENT_CHUNK). */
export async function readImportContent(db: Db, id: string, sizeBytes: number): Promise<Buffer> {
  // shared memory: the bytes go on to an import worker without another copy on this thread
  const out = Buffer.from(new SharedArrayBuffer(sizeBytes));
  for (let at = 0; at < sizeBytes; at += CONTENT_CHUNK) {
    const { piece } = await db
      .selectFrom("imports")
      .select(sql<Buffer>`substring(content from ${at + 1} for ${CONTENT_CHUNK})`.as("piece"))
      .where("id", "=", id)
      .executeTakeFirstOrThrow();
    piece.copy(out, at);
  }
  return out;
}

export type ImportMeta = Awaited<ReturnType<typeof insertImport>>;

export async function findImport(db: Db, basinId: string, id: string) {
  if (!isUuid(id)) return undefined;
  return db
    .selectFrom("imports")
    .select([...META, "content"])
    .where("basin_id", "=", basinId)
    .where("id", "=", id)
    .executeTakeFirst();
}

export async function listImports(db: Db, basinId: string) {
  return db
    .selectFrom("imports as i")
    .leftJoin("users as u", "u.id", "i.uploaded_by")
    .select(META.map((c) => `i.${c}` as const))
    .select("u.name as uploader_name")
    .where("i.basin_id", "=", basinId)
    .orderBy("i.uploaded_at", "desc")
    .execute();
}

export async function markImportsCommitted(db: Db, ids: string[]): Promise<void> {
  await db.updateTable("imports").set({ status: "committed" }).where("id", "in", ids).execute();
}

export async function listFieldMappings(db: Db, basinId: string) {
  return db
    .selectFrom("field_mappings")
    .select(["id", "layer", "name", "mapping", "created_at"])
    .where("basin_id", "=", basinId)
    .orderBy("name")
    .execute();
}

export async function upsertFieldMapping(
  db: Db,
  v: { basinId: string; layer: ImportLayer; name: string; mapping: Record<string, unknown>; createdBy: string },
) {
  return db
    .insertInto("field_mappings")
    .values({
      basin_id: v.basinId,
      layer: v.layer,
      name: v.name,
      mapping: JSON.stringify(v.mapping),
      created_by: v.createdBy,
    })
    .onConflict((oc) =>
      oc.columns(["basin_id", "layer", "name"]).doUpdateSet({ mapping: JSON.stringify(v.mapping), created_by: v.createdBy }),
    )
    .returning(["id", "layer", "name", "mapping", "created_at"])
    .executeTakeFirstOrThrow();
}
