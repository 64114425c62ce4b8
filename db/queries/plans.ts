import { randomUUID } from "node:crypto";
import { sql } from "kysely";
import type { Db } from "../client";
import type { PlanStatus, PublicationAcknowledgement } from "../schema";
import { isUuid } from "./users";

/**
 * Where a new plan goes: the lineage of the plan it revises (its next version), or a
 * lineage of its own (version 1). With `revises` undefined, the plan revises the newest
 * plan proposed from the same scenario, if any. Locks the basin row so two proposals
 * cannot take the same version.
 */
export async function nextPlanPlace(
  db: Db,
  basinId: string,
  revises: string | null | undefined,
  scenarioId: string,
): Promise<{ lineageId: string | null; version: number; revisedPlanId: string | null } | "unknown_plan"> {
  await sql`select id from basins where id = ${basinId} for update`.execute(db);
  let base: { id: string; lineage_id: string } | undefined;
  if (revises === undefined) {
    base = await db
      .selectFrom("plans")
      .select(["id", "lineage_id"])
      .where("basin_id", "=", basinId)
      .where(sql<string>`snapshot->'scenario'->>'id'`, "=", scenarioId)
      .orderBy("created_at", "desc")
      .limit(1)
      .executeTakeFirst();
  } else if (revises !== null) {
    if (!isUuid(revises)) return "unknown_plan";
    base = await db.selectFrom("plans").select(["id", "lineage_id"]).where("basin_id", "=", basinId).where("id", "=", revises).executeTakeFirst();
    if (!base) return "unknown_plan";
  }
  if (!base) return { lineageId: null, version: 1, revisedPlanId: null };
  const row = await db.selectFrom("plans").select((eb) => eb.fn.max("version").as("v")).where("lineage_id", "=", base.lineage_id).executeTakeFirst();
  return { lineageId: base.lineage_id, version: Number(row?.v ?? 0) + 1, revisedPlanId: base.id };
}

export const planQuery = (db: Db, basinId: string) =>
  db
    .selectFrom("plans as p")
    .leftJoin("users as u", "u.id", "p.created_by")
    .select(["p.id", "p.basin_id", "p.lineage_id", "p.version", "p.title", "p.run_id", "p.status", "p.created_at", "p.published_at", "p.publication_acknowledgement", "u.name as created_by_name"])
    .where("p.basin_id", "=", basinId);

/**
 * A basin's plans, newest first, as one kind of reader may list them:
 * planners and leads every plan; anyone signed in the plans in or after review
 * (withdrawn ones too when they had been reviewed); the public published plans.
 */
export async function listBasinPlans(db: Db, basinId: string, reader: "planner" | "signedIn" | "public") {
  // a plan has at most one review period (it goes from draft to review once)
  let q = planQuery(db, basinId)
    .leftJoin("review_periods as rp", "rp.plan_id", "p.id")
    .select(["rp.starts_at", "rp.ends_at", "rp.closed_at", sql<string | null>`p.snapshot->'scenario'->>'id'`.as("scenario_id")]);
  if (reader === "public") q = q.where("p.status", "=", "published");
  if (reader === "signedIn") {
    q = q.where((eb) =>
      eb.or([
        eb("p.status", "in", ["review", "closed", "published"]),
        eb.and([eb("p.status", "=", "withdrawn"), eb.exists(eb.selectFrom("review_periods as r").select("r.id").whereRef("r.plan_id", "=", "p.id"))]),
      ]),
    );
  }
  // newest first: versions count within a lineage, so only the time orders plans across lineages
  return q.orderBy("p.created_at", "desc").orderBy("p.version", "desc").execute();
}

export async function findPlan(db: Db, basinId: string, planId: string, withSnapshot = false) {
  if (!isUuid(planId)) return undefined;
  const q = planQuery(db, basinId).where("p.id", "=", planId);
  return withSnapshot ? q.select("p.snapshot").executeTakeFirst() : q.executeTakeFirst();
}

/**
 * Move a plan from one of `from` to `to` in one statement: the row lock the
 * UPDATE takes makes a concurrent transition wait and then find the state
 * changed, so of two racing transitions only one happens. False when the plan
 * was not in any of `from` any more.
 */
export async function transitionPlanStatus(
  db: Db,
  planId: string,
  from: PlanStatus[],
  to: PlanStatus,
  extra: { published_by?: string; published_at?: Date } = {},
): Promise<boolean> {
  const row = await db.updateTable("plans").set({ status: to, ...extra }).where("id", "=", planId).where("status", "in", from).returning("id").executeTakeFirst();
  return row !== undefined;
}

/** The plan's status under a row lock held to the end of the transaction (share: others may read-lock too). */
export async function lockPlanStatus(db: Db, planId: string, mode: "share" | "update"): Promise<PlanStatus | undefined> {
  const q = db.selectFrom("plans").select("status").where("id", "=", planId);
  const row = await (mode === "share" ? q.forShare() : q.forUpdate()).executeTakeFirst();
  return row?.status;
}

export async function planAllocations(db: Db, planId: string) {
  return db
    .selectFrom("plan_allocations as a")
    .innerJoin("facilities as f", "f.id", "a.facility_id")
    .selectAll("a")
    .select((eb) => eb.fn.coalesce("a.facility_name", "f.name").as("facility_name"))
    .where("a.plan_id", "=", planId)
    .orderBy((eb) => eb.fn.coalesce("a.facility_name", "f.name"))
    .execute();
}

export async function currentPeriod(db: Db, planId: string) {
  return db.selectFrom("review_periods").selectAll().where("plan_id", "=", planId).orderBy("created_at", "desc").limit(1).executeTakeFirst();
}

export async function planThreads(db: Db, planId: string) {
  const threads = await db
    .selectFrom("threads as t")
    .leftJoin("facilities as f", "f.id", "t.facility_id")
    .leftJoin("plan_allocations as a", (j) => j.onRef("a.plan_id", "=", "t.plan_id").onRef("a.facility_id", "=", "t.facility_id"))
    .leftJoin("users as u", "u.id", "t.responded_by")
    .select((eb) => ["t.id", "t.facility_id", "t.status", "t.response", "t.responded_at", eb.fn.coalesce("a.facility_name", "f.name").as("facility_name"), "f.permit_id", "u.name as responder_name"])
    .where("t.plan_id", "=", planId)
    .orderBy((eb) => eb.fn.coalesce("a.facility_name", "f.name"), (ob) => ob.nullsFirst())
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
    .select(["p.id", "p.basin_id", "p.lineage_id", "p.title", "p.version", "p.published_at", "b.name as basin_name", "b.unit_system", "b.time_zone"])
    .where("p.status", "=", "published")
    .orderBy("p.published_at", "desc")
    .limit(limit)
    .execute();
}

export async function insertPlan(
  db: Db,
  v: { basinId: string; lineageId: string | null; version: number; title: string; runId: string; snapshot: unknown; reachLines: unknown[]; createdBy: string },
): Promise<{ id: string }> {
  // a plan that starts a lineage is its own lineage
  const id = randomUUID();
  return db
    .insertInto("plans")
    .values({
      id,
      basin_id: v.basinId,
      lineage_id: v.lineageId ?? id,
      version: v.version,
      title: v.title,
      run_id: v.runId,
      snapshot: JSON.stringify(v.snapshot),
      reach_lines: JSON.stringify(v.reachLines),
      created_by: v.createdBy,
    })
    .returning("id")
    .executeTakeFirstOrThrow();
}

export async function insertPlanAllocation(
  db: Db,
  v: { planId: string; facilityId: string; facilityName: string; permitId: string; cboduKgDay: number; bod5KgDay: number; bod5MgL: number; todayKgDay: number; reductionPct: number | null; terms: unknown },
): Promise<void> {
  await db
    .insertInto("plan_allocations")
    .values({
      plan_id: v.planId,
      facility_id: v.facilityId,
      facility_name: v.facilityName,
      permit_id: v.permitId,
      cbodu_kg_day: v.cboduKgDay,
      bod5_kg_day: v.bod5KgDay,
      bod5_mg_l: v.bod5MgL,
      today_cbodu_kg_day: v.todayKgDay,
      reduction_pct: v.reductionPct,
      terms: JSON.stringify(v.terms),
    })
    .execute();
}

/** One thread for the plan as a whole (facility null) and one per facility. */
export async function insertThreads(db: Db, planId: string, facilityIds: string[]): Promise<void> {
  await db
    .insertInto("threads")
    .values([{ plan_id: planId, facility_id: null }, ...facilityIds.map((id) => ({ plan_id: planId, facility_id: id }))])
    .execute();
}

export async function insertReviewPeriod(db: Db, v: { planId: string; startsAt: string; endsAt: string; timeZone: string; openedBy: string }) {
  return db
    .insertInto("review_periods")
    .values({ plan_id: v.planId, starts_at: v.startsAt, ends_at: v.endsAt, time_zone: v.timeZone, opened_by: v.openedBy })
    .returning(["id", "starts_at", "ends_at"])
    .executeTakeFirstOrThrow();
}

export async function updateReviewPeriod(db: Db, id: string, patch: { ends_at?: string; closed_at?: Date | null; extensions?: unknown[] }) {
  await db
    .updateTable("review_periods")
    .set({
      ...(patch.ends_at !== undefined ? { ends_at: patch.ends_at } : {}),
      ...(patch.closed_at !== undefined ? { closed_at: patch.closed_at } : {}),
      ...(patch.extensions !== undefined ? { extensions: JSON.stringify(patch.extensions) } : {}),
    })
    .where("id", "=", id)
    .execute();
}

/** Open review periods whose end has passed, locked for closing. */
export async function dueReviewPeriods(db: Db, now: Date) {
  return db
    .selectFrom("review_periods as r")
    .innerJoin("plans as p", "p.id", "r.plan_id")
    .select(["r.id", "r.plan_id", "p.basin_id"])
    .where("p.status", "=", "review")
    .where("r.closed_at", "is", null)
    .where("r.ends_at", "<=", now)
    .forUpdate()
    .execute();
}

export async function insertComment(db: Db, v: { threadId: string; authorId: string; authorName: string; authorRole: string; body: string }) {
  return db
    .insertInto("comments")
    .values({ thread_id: v.threadId, author_id: v.authorId, author_name: v.authorName, author_role: v.authorRole, body: v.body })
    .returning(["id", "created_at"])
    .executeTakeFirstOrThrow();
}

export async function markThreadAddressed(db: Db, threadId: string, response: string, userId: string): Promise<void> {
  await db.updateTable("threads").set({ status: "addressed", response, responded_by: userId, responded_at: new Date() }).where("id", "=", threadId).execute();
}

/** How a thread is named in messages: its facility, or the plan as a whole. */
export async function threadTitle(db: Db, facilityId: string | null): Promise<string> {
  if (!facilityId) return "The plan as a whole";
  const f = await db.selectFrom("facilities").select(["name", "permit_id"]).where("id", "=", facilityId).executeTakeFirst();
  return f ? `${f.name} (${f.permit_id})` : "The plan as a whole";
}

// Recipients of plan notices.

export const basinMembersWithEmail = (db: Db, basinId: string) =>
  db
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select(["u.id", "u.name", "u.email"])
    .where("m.basin_id", "=", basinId)
    .execute();

/** Everyone who wrote in a thread or answered it, except `exceptUserId`. */
export const threadParticipants = (db: Db, threadId: string, exceptUserId: string) =>
  db
    .selectFrom("users as u")
    .select(["u.id", "u.name", "u.email"])
    .where((eb) =>
      eb.or([
        eb("u.id", "in", eb.selectFrom("comments").select("author_id").where("thread_id", "=", threadId).where("author_id", "is not", null).$narrowType<{ author_id: string }>()),
        eb("u.id", "in", eb.selectFrom("threads").select("responded_by").where("id", "=", threadId).where("responded_by", "is not", null).$narrowType<{ responded_by: string }>()),
      ]),
    )
    .where("u.id", "!=", exceptUserId)
    .execute();

/** Each linked discharger user with the allocations of its facilities in a plan. */
export const dischargerAllocations = (db: Db, planId: string) =>
  db
    .selectFrom("plan_allocations as a")
    .innerJoin("facilities as f", "f.id", "a.facility_id")
    .innerJoin("facility_users as fu", "fu.facility_id", "a.facility_id")
    .innerJoin("users as u", "u.id", "fu.user_id")
    .select(["u.id as user_id", "u.name", "u.email", "f.name as facility_name", "a.cbodu_kg_day", "a.today_cbodu_kg_day", "a.bod5_kg_day", "a.bod5_mg_l", "a.reduction_pct"])
    .where("a.plan_id", "=", planId)
    .execute();

/**
 * Open review periods that end within `withinMs` of `now` — or within half of
 * the period's length when that is shorter, so a short review is not announced
 * as closing the moment it opens.
 */
export async function reviewsClosingSoon(db: Db, now: Date, withinMs: number) {
  return db
    .selectFrom("review_periods as r")
    .innerJoin("plans as p", "p.id", "r.plan_id")
    .select(["r.id", "r.plan_id", "r.ends_at", "r.time_zone", "p.basin_id", "p.title", "p.version"])
    .where("p.status", "=", "review")
    .where("r.closed_at", "is", null)
    .where("r.starts_at", "<=", now)
    .where("r.ends_at", ">", now)
    .where(sql<boolean>`r.ends_at <= ${now}::timestamptz + least(${withinMs} * interval '1 millisecond', (r.ends_at - r.starts_at) / 2)`)
    .execute();
}

/** Everyone who commented anywhere on a plan (members of the public included). */
export const planCommenters = (db: Db, planId: string) =>
  db
    .selectFrom("users as u")
    .select(["u.id", "u.name", "u.email"])
    .where("u.id", "in", (eb) =>
      eb
        .selectFrom("comments as c")
        .innerJoin("threads as t", "t.id", "c.thread_id")
        .select("c.author_id")
        .where("t.plan_id", "=", planId)
        .where("c.author_id", "is not", null)
        .$narrowType<{ author_id: string }>(),
    )
    .execute();

/** Plans in review or with a closed review awaiting publication, across basins, with their current period. */
export async function listPlansUnderReview(db: Db) {
  return db
    .selectFrom("plans as p")
    .innerJoin("basins as b", "b.id", "p.basin_id")
    .leftJoin("review_periods as r", (j) => j.onRef("r.plan_id", "=", "p.id"))
    .select(["p.id", "p.basin_id", "p.title", "p.version", "p.status", "b.name as basin_name", "r.starts_at", "r.ends_at", "r.time_zone", "r.closed_at"])
    .where("p.status", "in", ["review", "closed"])
    .orderBy("r.ends_at", "asc")
    .execute();
}

/** The newest version of a plan's lineage published after `version`, if any. */
export async function newerPublishedPlan(db: Db, lineageId: string, version: number) {
  return db
    .selectFrom("plans")
    .select(["id", "version", "published_at"])
    .where("lineage_id", "=", lineageId)
    .where("status", "=", "published")
    .where("version", ">", version)
    .orderBy("version", "desc")
    .limit(1)
    .executeTakeFirst();
}

/** Set what the lead acknowledged on publishing (in the publishing transaction). */
export async function setPublicationAcknowledgement(db: Db, planId: string, ack: PublicationAcknowledgement): Promise<void> {
  await db.updateTable("plans").set({ publication_acknowledgement: JSON.stringify(ack) }).where("id", "=", planId).execute();
}

/** A plan's frozen snapshot (what its run used and produced). */
export async function planSnapshot(db: Db, planId: string): Promise<unknown> {
  return (await db.selectFrom("plans").select("snapshot").where("id", "=", planId).executeTakeFirst())?.snapshot;
}

/**
 * What a published plan's page and files are drawn from besides its frozen rows: the plan's
 * state and publication time, its basin's name, slug, units and zone (a lead may change
 * them), and the newest later version of its lineage that is published (the page says it
 * is superseded). One row by primary key, read on every request for a published plan so
 * that any process's change is seen at once; undefined when the plan is not the basin's.
 */
export async function findPublicationStamp(db: Db, basinId: string, planId: string) {
  if (!isUuid(basinId) || !isUuid(planId)) return undefined;
  return db
    .selectFrom("plans as p")
    .innerJoin("basins as b", "b.id", "p.basin_id")
    .select((eb) => [
      "p.id",
      "p.status",
      "p.published_at",
      "b.name as basin_name",
      "b.slug as basin_slug",
      "b.unit_system",
      "b.time_zone",
      eb
        .selectFrom("plans as q")
        .select("q.id")
        .whereRef("q.lineage_id", "=", "p.lineage_id")
        .where("q.status", "=", "published")
        .whereRef("q.version", ">", "p.version")
        .orderBy("q.version", "desc")
        .limit(1)
        .as("newer_published_id"),
    ])
    .where("p.id", "=", planId)
    .where("p.basin_id", "=", basinId)
    .executeTakeFirst();
}
