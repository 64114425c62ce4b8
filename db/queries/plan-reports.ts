import type { Db } from "../client";
import type { PlanReachLine } from "../schema";
import { isUuid } from "./users";

/**
 * The reach lines of the network version a plan was computed on: plan → its run →
 * the run's scenario → that scenario's network version. A scenario never changes
 * network version, and a committed version's geometry is never edited (inline
 * edits touch names, lengths and attributes of the newest version only), so these
 * are the lines the plan's results were drawn on.
 */
export async function planReachLines(db: Db, planId: string): Promise<PlanReachLine[]> {
  if (!isUuid(planId)) return [];
  // kept with the plan when it was proposed: inline edits of the newest network version cannot reach it
  const kept = await db.selectFrom("plans").select("reach_lines").where("id", "=", planId).executeTakeFirst();
  if (kept?.reach_lines) return kept.reach_lines;
  return db
    .selectFrom("plans as p")
    .innerJoin("runs as r", "r.id", "p.run_id")
    .innerJoin("scenarios as s", "s.id", "r.scenario_id")
    .innerJoin("networks as n", "n.id", "s.network_id")
    .innerJoin("reaches as x", "x.network_id", "n.id")
    .select(["n.id as network_id", "n.version as network_version", "x.reach_key", "x.name", "x.length_km", "x.downstream_key", "x.coordinates"])
    .where("p.id", "=", planId)
    .orderBy("x.reach_key")
    .execute();
}

/** The reach lines of one network version, as a plan keeps them. */
export async function networkReachLines(db: Db, networkId: string): Promise<PlanReachLine[]> {
  return db
    .selectFrom("networks as n")
    .innerJoin("reaches as x", "x.network_id", "n.id")
    .select(["n.id as network_id", "n.version as network_version", "x.reach_key", "x.name", "x.length_km", "x.downstream_key", "x.coordinates"])
    .where("n.id", "=", networkId)
    .orderBy("x.reach_key")
    .execute();
}

/** A published plan's stored PDF, if it has been rendered. */
export async function findPlanReportFile(db: Db, planId: string): Promise<Buffer | undefined> {
  const row = await db.selectFrom("plan_report_files").select("pdf").where("plan_id", "=", planId).executeTakeFirst();
  return row?.pdf;
}

/**
 * Keep a published plan's PDF and return the one kept: the first one stored wins, so a
 * rendering that lost the race (another request or process stored first) gives way to it
 * and every caller serves the same bytes.
 */
export async function storePlanReportFile(db: Db, planId: string, pdf: Uint8Array): Promise<Buffer> {
  const inserted = await db
    .insertInto("plan_report_files")
    .values({ plan_id: planId, pdf: Buffer.from(pdf) })
    .onConflict((oc) => oc.column("plan_id").doNothing())
    .returning("pdf")
    .executeTakeFirst();
  return inserted?.pdf ?? (await findPlanReportFile(db, planId))!;
}
