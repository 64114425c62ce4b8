import { sql, type Insertable } from "kysely";
import type { Db } from "../client";
import type { TemperatureRecordsTable } from "../schema";
import { isUuid } from "./users";

function recordQuery(db: Db, basinId: string) {
  return db
    .selectFrom("temperature_records as t")
    .leftJoin("users as u", "u.id", "t.uploaded_by")
    .select(["t.id", "t.name", "t.station_code", "t.reach_key", "t.unit", "t.file_name", "t.size_bytes", "t.sha256", "t.day_count", "t.missing_days", "t.summer", "t.uploaded_at", "u.name as uploaded_by_name"])
    .select([sql<string>`t.first_day::text`.as("first_day"), sql<string>`t.last_day::text`.as("last_day")])
    .where("t.basin_id", "=", basinId);
}

export async function insertTemperatureRecord(db: Db, row: Insertable<TemperatureRecordsTable>): Promise<{ id: string }> {
  return db.insertInto("temperature_records").values(row).returning("id").executeTakeFirstOrThrow();
}

/** The records without their daily means (each carries its summer value, worked out at upload). */
export async function listTemperatureRecords(db: Db, basinId: string) {
  return recordQuery(db, basinId).orderBy("t.uploaded_at", "desc").execute();
}

/** One record with its daily means (for working out a design temperature). */
export async function findTemperatureRecord(db: Db, basinId: string, id: string) {
  if (!isUuid(id)) return undefined;
  return recordQuery(db, basinId).select("t.days").where("t.id", "=", id).executeTakeFirst();
}

/** One record without its daily means. */
export async function findTemperatureRecordSummary(db: Db, basinId: string, id: string) {
  if (!isUuid(id)) return undefined;
  return recordQuery(db, basinId).where("t.id", "=", id).executeTakeFirst();
}
