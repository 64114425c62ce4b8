import { sql } from "kysely";
import type { Db } from "../client";
import type { PlanStatus } from "../schema";
import { isUuid } from "./users";

export async function nextPlanVersion(db: Db, basinId: string): Promise<number> {
  await sql`select id from basins where id = ${basinId} for update`.execute(db);
  const row = await db.selectFrom("plans").select((eb) => eb.fn.max("version").as("v")).where("basin_id", "=", basinId).executeTakeFirst();
  return Number(row?.v ?? 0) + 1;
}

export const planQuery = (db: Db, basinId: string) =>
  db
    .selectFrom("plans as p")
    .leftJoin("users as u", "u.id", "p.created_by")
    .select(["p.id", "p.basin_id", "p.version", "p.title", "p.run_id", "p.status", "p.created_at", "p.published_at", "u.name as created_by_name"])
    .where("p.basin_id", "=", basinId);

export async function findPlan(db: Db, basinId: string, planId: string, withSnapshot = false) {
  if (!isUuid(planId)) return undefined;
  const q = planQuery(db, basinId).where("p.id", "=", planId);
  return withSnapshot ? q.select("p.snapshot").executeTakeFirst() : q.executeTakeFirst();
}

export async function setPlanStatus(db: Db, planId: string, status: PlanStatus, extra: { published_by?: string; published_at?: Date } = {}) {
  await db.updateTable("plans").set({ status, ...extra }).where("id", "=", planId).execute();
}

export async function planAllocations(db: Db, planId: string) {
  return db
    .selectFrom("plan_allocations as a")
    .innerJoin("facilities as f", "f.id", "a.facility_id")
    .selectAll("a")
    .select("f.name as facility_name")
    .where("a.plan_id", "=", planId)
    .orderBy("f.name")
    .execute();
}

export async function currentPeriod(db: Db, planId: string) {
  return db.selectFrom("review_periods").selectAll().where("plan_id", "=", planId).orderBy("created_at", "desc").limit(1).executeTakeFirst();
}

export async function planThreads(db: Db, planId: string) {
  const threads = await db
    .selectFrom("threads as t")
    .leftJoin("facilities as f", "f.id", "t.facility_id")
    .leftJoin("users as u", "u.id", "t.responded_by")
    .select(["t.id", "t.facility_id", "t.status", "t.response", "t.responded_at", "f.name as facility_name", "f.permit_id", "u.name as responder_name"])
    .where("t.plan_id", "=", planId)
    .orderBy("f.name", (ob) => ob.nullsFirst())
    .execute();
  const comments = threads.length
    ? await db
        .selectFrom("comments")
        .selectAll()
        .where(
          "thread_id",
          "in",
          threads.map((t) => t.id),
        )
        .orderBy("created_at")
        .execute()
    : [];
  return threads.map((t) => ({ ...t, comments: comments.filter((c) => c.thread_id === t.id) }));
}

export async function findThread(db: Db, basinId: string, threadId: string) {
  if (!isUuid(threadId)) return undefined;
  return db
    .selectFrom("threads as t")
    .innerJoin("plans as p", "p.id", "t.plan_id")
    .select(["t.id", "t.plan_id", "t.facility_id", "t.status", "p.status as plan_status", "p.basin_id"])
    .where("p.basin_id", "=", basinId)
    .where("t.id", "=", threadId)
    .executeTakeFirst();
}

/** Published plans of every basin, newest first (readable by anyone). */
export async function listPublishedPlans(db: Db, limit = 50) {
  return db
    .selectFrom("plans as p")
    .innerJoin("basins as b", "b.id", "p.basin_id")
    .select(["p.id", "p.basin_id", "p.title", "p.version", "p.published_at", "b.name as basin_name", "b.unit_system"])
    .where("p.status", "=", "published")
    .orderBy("p.published_at", "desc")
    .limit(limit)
    .execute();
}
