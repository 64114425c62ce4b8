import { sql, type Insertable } from "kysely";
import type { Db } from "../client";
import type { GaugeRecordsTable } from "../schema";
import { isUuid } from "./users";

/** The columns a list or a page shows (not the file's bytes); dates as ISO text. */
const summaryColumns = [
  "g.id",
  "g.name",
  "g.station_code",
  "g.reach_key",
  "g.unit",
  "g.climatic_year_start",
  "g.file_name",
  "g.size_bytes",
  "g.sha256",
  "g.day_count",
  "g.missing_days",
  "g.uploaded_at",
] as const;

function gaugeQuery(db: Db, basinId: string) {
  return db
    .selectFrom("gauge_records as g")
    .leftJoin("users as u", "u.id", "g.uploaded_by")
    .select(summaryColumns)
    .select([sql<string>`g.first_day::text`.as("first_day"), sql<string>`g.last_day::text`.as("last_day"), "u.name as uploaded_by_name"])
    .where("g.basin_id", "=", basinId);
}

export async function insertGaugeRecord(db: Db, row: Insertable<GaugeRecordsTable>): Promise<{ id: string }> {
  return db.insertInto("gauge_records").values(row).returning("id").executeTakeFirstOrThrow();
}

export async function listGaugeRecords(db: Db, basinId: string) {
  return gaugeQuery(db, basinId).select(sql<unknown>`g.statistics -> 'statistics'`.as("design_flows")).orderBy("g.uploaded_at", "desc").execute();
}

export async function findGaugeRecord(db: Db, basinId: string, id: string) {
  if (!isUuid(id)) return undefined;
  return gaugeQuery(db, basinId).select("g.statistics").where("g.id", "=", id).executeTakeFirst();
}
