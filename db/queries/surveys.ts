import type { Insertable } from "kysely";
import type { Db } from "../client";
import type { SurveysTable } from "../schema";
import { isUuid } from "./users";

/** What a list shows (not the file's bytes nor the samples). */
const summaryColumns = [
  "s.id",
  "s.name",
  "s.network_id",
  "n.version as network_version",
  "s.units",
  "s.file_name",
  "s.size_bytes",
  "s.sha256",
  "s.first_time",
  "s.last_time",
  "s.station_count",
  "s.sample_count",
  "s.uploaded_at",
  "u.name as uploaded_by_name",
] as const;

function surveyQuery(db: Db, basinId: string) {
  return db
    .selectFrom("surveys as s")
    .innerJoin("networks as n", "n.id", "s.network_id")
    .leftJoin("users as u", "u.id", "s.uploaded_by")
    .select(summaryColumns)
    .where("s.basin_id", "=", basinId);
}

export async function insertSurvey(db: Db, row: Insertable<SurveysTable>): Promise<{ id: string }> {
  return db.insertInto("surveys").values(row).returning("id").executeTakeFirstOrThrow();
}

export async function listSurveys(db: Db, basinId: string) {
  return surveyQuery(db, basinId).orderBy("s.uploaded_at", "desc").execute();
}

export async function findSurvey(db: Db, basinId: string, id: string) {
  if (!isUuid(id)) return undefined;
  return surveyQuery(db, basinId).select("s.samples").where("s.id", "=", id).executeTakeFirst();
}
