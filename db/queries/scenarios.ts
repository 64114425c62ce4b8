import { sql } from "kysely";
import type { Db } from "../client";
import type { RunKind } from "../schema";
import { isUuid } from "./users";

/** Scenarios with their network version and the name of whoever saved them last. */
const scenarioQuery = (db: Db, basinId: string) =>
  db
    .selectFrom("scenarios as s")
    .innerJoin("networks as n", "n.id", "s.network_id")
    .leftJoin("users as u", "u.id", "s.updated_by")
    .selectAll("s")
    .select(["n.version as network_version", "u.name as updated_by_name"])
    .where("s.basin_id", "=", basinId);

export async function listScenarios(db: Db, basinId: string) {
  return scenarioQuery(db, basinId).orderBy("s.updated_at", "desc").execute();
}

export async function findScenario(db: Db, basinId: string, id: string) {
  if (!isUuid(id)) return undefined;
  return scenarioQuery(db, basinId).where("s.id", "=", id).executeTakeFirst();
}

export async function findScenarioByName(db: Db, basinId: string, name: string) {
  return db.selectFrom("scenarios").select("id").where("basin_id", "=", basinId).where("name", "=", name).executeTakeFirst();
}

export async function insertScenario(
  db: Db,
  v: { basinId: string; networkId: string; name: string; description: string; inputs: unknown; userId: string },
) {
  return db
    .insertInto("scenarios")
    .values({
      basin_id: v.basinId,
      network_id: v.networkId,
      name: v.name,
      description: v.description,
      inputs: JSON.stringify(v.inputs),
      created_by: v.userId,
      updated_by: v.userId,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
}

/** Update only when the stored version is the one the editor started from; returns false when stale. */
export async function updateScenarioIfVersion(
  db: Db,
  id: string,
  expectedVersion: number,
  patch: { name?: string; description?: string; inputs?: unknown },
  userId: string,
): Promise<boolean> {
  const res = await db
    .updateTable("scenarios")
    .set((eb) => ({
      ...(patch.name !== undefined ? { name: patch.name } : {}),
      ...(patch.description !== undefined ? { description: patch.description } : {}),
      ...(patch.inputs !== undefined ? { inputs: JSON.stringify(patch.inputs) } : {}),
      version: eb("version", "+", 1),
      updated_by: userId,
      updated_at: new Date(),
    }))
    .where("id", "=", id)
    .where("version", "=", expectedVersion)
    .executeTakeFirst();
  return res.numUpdatedRows > 0n;
}

export async function deleteScenario(db: Db, id: string): Promise<void> {
  await db.deleteFrom("scenarios").where("id", "=", id).execute();
}

export async function countRuns(db: Db, scenarioId: string): Promise<number> {
  const row = await db
    .selectFrom("runs")
    .select((e) => e.fn.countAll<string>().as("n"))
    .where("scenario_id", "=", scenarioId)
    .executeTakeFirstOrThrow();
  return Number(row.n);
}

const RUN_META = [
  "r.id",
  "r.basin_id",
  "r.scenario_id",
  "r.scenario_version",
  "r.kind",
  "r.status",
  "r.progress",
  "r.error",
  "r.inputs_hash",
  "r.model_version",
  "r.methods",
  "r.created_at",
  "r.started_at",
  "r.finished_at",
] as const;

export async function insertRun(
  db: Db,
  v: { basinId: string; scenarioId: string; scenarioVersion: number; kind: RunKind; inputsHash: string; modelFile: unknown; modelVersion: string; userId: string },
) {
  return db
    .insertInto("runs")
    .values({
      basin_id: v.basinId,
      scenario_id: v.scenarioId,
      scenario_version: v.scenarioVersion,
      kind: v.kind,
      inputs_hash: v.inputsHash,
      model_file: JSON.stringify(v.modelFile),
      model_version: v.modelVersion,
      created_by: v.userId,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
}

/** A finished run with the same inputs, to serve instead of computing again. */
export async function findDoneRunByHash(db: Db, basinId: string, kind: RunKind, hash: string) {
  return db
    .selectFrom("runs")
    .select("id")
    .where("basin_id", "=", basinId)
    .where("kind", "=", kind)
    .where("inputs_hash", "=", hash)
    .where("status", "=", "done")
    .orderBy("finished_at", "desc")
    .limit(1)
    .executeTakeFirst();
}

/** Runs with their scenario's name (no result). */
const runQuery = (db: Db, basinId: string) =>
  db
    .selectFrom("runs as r")
    .innerJoin("scenarios as s", "s.id", "r.scenario_id")
    .select(RUN_META)
    .select("s.name as scenario_name")
    .where("r.basin_id", "=", basinId);

export async function listRuns(db: Db, basinId: string, scenarioId?: string) {
  let q = runQuery(db, basinId);
  if (scenarioId) q = q.where("r.scenario_id", "=", scenarioId);
  return q.orderBy("r.created_at", "desc").limit(200).execute();
}

export async function findRun(db: Db, basinId: string, id: string, withResult: boolean) {
  if (!isUuid(id)) return undefined;
  const q = runQuery(db, basinId).where("r.id", "=", id);
  return withResult ? q.select(["r.result", "r.model_file"]).executeTakeFirst() : q.executeTakeFirst();
}

export async function runForWork(db: Db, id: string) {
  return db.selectFrom("runs").select(["id", "kind", "status", "model_file"]).where("id", "=", id).executeTakeFirst();
}

export async function findRunJsonText(db: Db, basinId: string, id: string) {
  if (!isUuid(id)) return undefined;
  return runQuery(db, basinId)
    .select((eb) => [
      eb.cast<string | null>("r.result", "text").as("result_text"),
      eb.cast<string>(eb.ref("r.model_file", "->").key("files"), "text").as("files_text"),
    ])
    .where("r.id", "=", id)
    .executeTakeFirst();
}

/** A basin's finished calibration runs with what a choice list names them by (no result bodies). */
export async function listDoneCalibrations(db: Db, basinId: string) {
  return db
    .selectFrom("runs as r")
    .innerJoin("scenarios as s", "s.id", "r.scenario_id")
    .select(["r.id", "r.finished_at", "s.name as scenario_name"])
    .select([
      sql<string>`r.result -> 'calibration' -> 'survey' ->> 'name'`.as("survey_json_name"),
      sql<string | null>`r.result -> 'calibration' ->> 'name'`.as("set_name"),
      sql<string>`r.result -> 'calibration' ->> 'condition'`.as("condition_json"),
      sql<string>`r.result -> 'calibration' ->> 'rmse_mg_l'`.as("rmse"),
    ])
    .where("r.basin_id", "=", basinId)
    .where("r.kind", "=", "calibration")
    .where("r.status", "=", "done")
    .orderBy("r.finished_at", "desc")
    .limit(100)
    .execute();
}
