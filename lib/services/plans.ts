import type { Db } from "@/db/client";
import { insertAuditEvent } from "@/db/queries/audit";
import { findFacilityByPermit } from "@/db/queries/facilities";
import {
  currentPeriod,
  dueReviewPeriods,
  findPlan,
  findThread,
  insertComment,
  insertPlan,
  insertPlanAllocation,
  insertReviewPeriod,
  insertThreads,
  listPlansUnderReview,
  listPublishedPlans as listPublishedRows,
  markThreadAddressed,
  newerPublishedPlan,
  nextPlanPlace,
  setPublicationAcknowledgement,
  reviewsClosingSoon,
  threadTitle,
  updateReviewPeriod, planAllocations, listBasinPlans, planThreads, transitionPlanStatus, lockPlanStatus } from "@/db/queries/plans";
import type { PlanStatus, PublicationAcknowledgement } from "@/db/schema";
import { requireActor, type Actor } from "@/lib/auth/guard";
import { basinScope, type BasinScope } from "@/lib/auth/scope";
import { PLAN_STAGE_TEXT, planStage, reviewDateIssues } from "@/lib/plans/review-rules";
import { AppError, conflict, notFound, unauthenticated } from "@/lib/errors";
import { formatWhen } from "@/lib/format/zoned-time";
import { awaitsResponse } from "@/lib/results/responsiveness";
import { PLAN_SNAPSHOT_VERSION, readPlanSnapshot } from "@/lib/plans/snapshot";
import { MIN_ACK_STATEMENT, type PlanPropose, type PlanPublish, type ReviewExtend, type ReviewOpen } from "@/lib/validation/plan";
import { noticePlanPublished, noticeReviewClosingSoon, noticeReviewOpened, noticeThreadReply } from "./plan-notices";
import { getRun, runScenarioRecord } from "./runs";
import { findBasinById, setBasinTimeZoneIfUnset, type BasinRecord } from "@/db/queries/basins";
import { networkReachLines } from "@/db/queries/plan-reports";

/** Another request changed the plan's state first. */
const raced = () => conflict("The plan's state changed while this request was being handled; reload the plan and try again");

/** Plan states anyone signed in may read (and, when published, anyone at all). */
const PUBLIC_READ: PlanStatus[] = ["review", "closed", "published"];

/**
 * A plan's reader outside a basin scope (the public pages and downloads, readers of plans
 * under review): the basin, and for a signed-in reader their scope in it, in one read.
 */
async function readerScope(db: Db, actor: Actor | null, basinId: string): Promise<{ basin: BasinRecord; scope: BasinScope | null }> {
  if (actor) {
    const scope = await basinScope(db, actor, basinId);
    return { basin: scope.basin, scope };
  }
  const basin = await findBasinById(db, basinId);
  if (!basin) throw notFound("Basin");
  return { basin, scope: null };
}

/**
 * Who may read a plan: drafts only planners and leads; plans in or after
 * review any signed-in person (also once withdrawn, when they had been
 * reviewed: the comments stay on the record); published plans everyone.
 */
function requirePlanRead(scope: BasinScope | null, status: PlanStatus, reviewed: boolean): void {
  if (status === "published") return;
  if (!scope) throw unauthenticated();
  if (PUBLIC_READ.includes(status) || (status === "withdrawn" && reviewed)) return;
  scope.require("scenario.read");
}

/** Propose a plan from a finished, feasible allocation run: a frozen snapshot of what was run. */
export async function proposePlan(scope: BasinScope, input: PlanPropose) {
  scope.require("plan.propose");
  const { db, actor, basin } = scope;
  const run = await getRun(scope, input.runId);
  if (run.kind !== "allocation" || run.status !== "done" || !run.result?.allocation) {
    throw new AppError("invalid", "A plan is proposed from a finished allocation run", [{ path: "runId", message: "Not a finished allocation run" }]);
  }
  const allocation = run.result.allocation;
  if (!allocation.feasible) {
    throw new AppError("invalid", "That allocation does not meet the criterion; a plan needs a feasible allocation", [
      { path: "runId", message: "Infeasible allocation" },
    ]);
  }
  // What the run used, never the scenario as it reads now: it may have been
  // edited (or renamed, or moved to another network) since the run.
  const scenario = await runScenarioRecord(db, basin.id, run);
  if (!scenario) {
    throw conflict(
      `The scenario has been edited since this run (the run used version ${run.scenarioVersion}) and the run does not hold its own copy of the inputs; run the allocation again and propose from the new run`,
      [{ path: "runId", message: "Run older than its scenario's current version" }],
    );
  }
  const reachLines = await networkReachLines(db, scenario.networkId);
  const snapshot = {
    snapshotVersion: PLAN_SNAPSHOT_VERSION,
    run: { ...run, scenarioName: scenario.name },
    scenario: { id: scenario.id, name: scenario.name, version: scenario.version, networkId: scenario.networkId, inputs: scenario.inputs },
  };
  // nothing is frozen that the readers could not read back (a round trip through JSON, as stored)
  readPlanSnapshot("(new)", JSON.parse(JSON.stringify(snapshot)));
  return db.transaction().execute(async (trx) => {
    const place = await nextPlanPlace(trx, basin.id, input.revises, scenario.id);
    if (place === "unknown_plan") throw new AppError("invalid", "The plan to revise is not a plan of this basin", [{ path: "revises", message: "Not a plan of this basin" }]);
    const { version, lineageId, revisedPlanId } = place;
    const plan = await insertPlan(trx, {
      basinId: basin.id,
      lineageId,
      version,
      title: input.title,
      runId: run.id,
      reachLines,
      snapshot,
      createdBy: actor.id,
    });
    const facilityIds: string[] = [];
    for (const a of allocation.allocations) {
      const facility = await findFacilityByPermit(trx, basin.id, a.id);
      if (!facility) throw new AppError("invalid", `Discharger ${a.id} is not a facility of this basin`, [{ path: "runId", message: a.id }]);
      facilityIds.push(facility.id);
      await insertPlanAllocation(trx, {
        planId: plan.id,
        facilityId: facility.id,
        facilityName: facility.name,
        permitId: a.id,
        cboduKgDay: a.cbodu_kg_day,
        bod5KgDay: a.bod5_kg_day,
        bod5MgL: a.bod5_mg_l,
        todayKgDay: a.today_cbodu_kg_day,
        reductionPct: a.reduction_pct,
        terms: a,
      });
    }
    await insertThreads(trx, plan.id, facilityIds);
    await insertAuditEvent(trx, { basinId: basin.id, actorId: actor.id, action: "plan.proposed", targetType: "plan", targetId: plan.id, details: { version, runId: run.id, revises: revisedPlanId } });
    return { id: plan.id, version, revises: revisedPlanId };
  });
}

/** A basin's plans, as many as the reader may see: drafts for its planners and leads, the rest for anyone signed in, published ones for all. */
export async function listPlans(db: Db, actor: Actor | null, basinId: string) {
  const { basin, scope } = await readerScope(db, actor, basinId);
  const seesDrafts = scope?.can("scenario.read") ?? false;
  const rows = await listBasinPlans(db, basin.id, seesDrafts ? "planner" : actor ? "signedIn" : "public");
  const now = new Date();
  return rows.map((p) => ({
    id: p.id,
    /** Versions count within a lineage (a plan and its revisions); lineageId is its version 1's id. */
    lineageId: p.lineage_id,
    version: p.version,
    title: p.title,
    status: p.status,
    /** The scenario the plan's run came from (a new plan from it revises this lineage by default). */
    scenarioId: p.scenario_id,
    stage: planStage(p.status, p.starts_at && p.ends_at ? { startsAt: p.starts_at, endsAt: p.ends_at, closedAt: p.closed_at } : null, now),
    createdAt: p.created_at.toISOString(),
    createdBy: p.created_by_name,
    publishedAt: p.published_at?.toISOString() ?? null,
  }));
}

/** A plan with its allocations, review period and threads (comments as plain text). */
export async function getPlan(db: Db, actor: Actor | null, basinId: string, planId: string) {
  const { basin, scope } = await readerScope(db, actor, basinId);
  return planView(db, basin, scope, planId);
}

/** The same plan read inside a basin scope the request already holds (workspace pages): no further basin read. */
export const getPlanIn = (scope: BasinScope, planId: string) => planView(scope.db, scope.basin, scope, planId);

async function planView(db: Db, basin: BasinRecord, scope: BasinScope | null, planId: string) {
  const plan = await findPlan(db, basin.id, planId, true);
  if (!plan) throw notFound("Plan");
  const period = await currentPeriod(db, plan.id);
  requirePlanRead(scope, plan.status, period !== undefined);
  const [allocations, threads] = await Promise.all([planAllocations(db, plan.id), planThreads(db, plan.id)]);
  return {
    id: plan.id,
    lineageId: plan.lineage_id,
    version: plan.version,
    title: plan.title,
    status: plan.status,
    stage: planStage(plan.status, period ? { startsAt: period.starts_at, endsAt: period.ends_at, closedAt: period.closed_at } : null, new Date()),
    createdAt: plan.created_at.toISOString(),
    createdBy: plan.created_by_name,
    publishedAt: plan.published_at?.toISOString() ?? null,
    /** Threads the lead published without a response, and why (null when every comment had its response). */
    publicationAcknowledgement: plan.publication_acknowledgement,
    /** The basin's shortest review, days: the lead's form checks the dates against it as the server does. */
    minReviewDays: basin.min_review_days,
    /** The basin's time zone (null until set or a first review opens): dates and times are shown in it. */
    basinTimeZone: basin.time_zone,
    /** What the run used and produced, checked against its schema (lib/plans/snapshot.ts) and as stored. */
    snapshot: readPlanSnapshot(plan.id, (plan as typeof plan & { snapshot: unknown }).snapshot),
    allocations: allocations.map((a) => ({
      facilityId: a.facility_id,
      facilityName: a.facility_name,
      permitId: a.permit_id,
      cboduKgDay: a.cbodu_kg_day,
      bod5KgDay: a.bod5_kg_day,
      bod5MgL: a.bod5_mg_l,
      todayCboduKgDay: a.today_cbodu_kg_day,
      reductionPct: a.reduction_pct,
    })),
    review: period
      ? {
          startsAt: period.starts_at.toISOString(),
          endsAt: period.ends_at.toISOString(),
          timeZone: period.time_zone,
          closedAt: period.closed_at?.toISOString() ?? null,
          extensions: period.extensions,
          open: isOpen(period, new Date()),
        }
      : null,
    threads: threads.map((t) => ({
      id: t.id,
      facilityId: t.facility_id,
      facilityName: t.facility_name,
      permitId: t.permit_id,
      status: t.status,
      response: t.response,
      respondedAt: t.responded_at?.toISOString() ?? null,
      responder: t.responder_name,
      comments: t.comments.map((c) => ({ id: c.id, author: c.author_name, role: c.author_role, body: c.body, at: c.created_at.toISOString() })),
    })),
  };
}

const isOpen = (p: { starts_at: Date; ends_at: Date; closed_at: Date | null }, now: Date) =>
  p.closed_at === null && p.starts_at <= now && now < p.ends_at;

async function planForLead(scope: BasinScope, planId: string, action: "review.manage" | "plan.publish") {
  scope.require(action);
  const { db, actor, basin } = scope;
  const plan = await findPlan(db, basin.id, planId);
  if (!plan) throw notFound("Plan");
  return { db, actor, basin, plan };
}

/** Open the review period of a draft plan (lead). */
export async function openReview(scope: BasinScope, planId: string, input: ReviewOpen) {
  const { db, actor, basin, plan } = await planForLead(scope, planId, "review.manage");
  if (plan.status !== "draft") throw conflict(`Only a draft plan can go to review; this one is ${plan.status}`);
  const issues = reviewDateIssues(
    { startsAt: new Date(input.startsAt), endsAt: new Date(input.endsAt), minReviewDays: basin.min_review_days, now: new Date() },
    input.timeZone,
  );
  if (issues.length > 0) throw new AppError("invalid", issues[0].message, issues);
  await db.transaction().execute(async (trx) => {
    // the state changes first, in one statement: a second "open" sent at the same time finds it changed
    if (!(await transitionPlanStatus(trx, plan.id, ["draft"], "review"))) throw raced();
    const period = await insertReviewPeriod(trx, { planId: plan.id, startsAt: input.startsAt, endsAt: input.endsAt, timeZone: input.timeZone, openedBy: actor.id });
    // a basin without a time zone of its own takes its first review's
    await setBasinTimeZoneIfUnset(trx, basin.id, input.timeZone);
    await noticeReviewOpened(trx, plan, { id: period.id, startsAt: period.starts_at, endsAt: period.ends_at, timeZone: input.timeZone });
    await insertAuditEvent(trx, { basinId: basin.id, actorId: actor.id, action: "review.opened", targetType: "plan", targetId: plan.id, details: { ...input } });
  });
}

/** Extend an open review; a reason is required and recorded. */
export async function extendReview(scope: BasinScope, planId: string, input: ReviewExtend) {
  const { db, actor, basin, plan } = await planForLead(scope, planId, "review.manage");
  const period = await currentPeriod(db, plan.id);
  if (plan.status !== "review" || !period) throw conflict("Only a plan in review can have its review extended");
  if (period.ends_at.getTime() <= Date.now()) throw reviewEnded(period);
  if (Date.parse(input.endsAt) <= period.ends_at.getTime()) throw notLater(period);
  await db.transaction().execute(async (trx) => {
    // under the plan's lock, against the period as it is now (a concurrent extension or the closing job may have moved it)
    if ((await lockPlanStatus(trx, plan.id, "update")) !== "review") throw raced();
    const locked = (await currentPeriod(trx, plan.id))!;
    if (locked.closed_at !== null || locked.ends_at.getTime() <= Date.now()) throw reviewEnded(locked);
    if (Date.parse(input.endsAt) <= locked.ends_at.getTime()) throw notLater(locked);
    const extensions = [...locked.extensions, { at: new Date().toISOString(), by: actor.name, from: locked.ends_at.toISOString(), to: input.endsAt, reason: input.reason }];
    await updateReviewPeriod(trx, locked.id, { ends_at: input.endsAt, closed_at: null, extensions });
    await insertAuditEvent(trx, { basinId: basin.id, actorId: actor.id, action: "review.extended", targetType: "plan", targetId: plan.id, details: { ...input } });
  });
}

/** A review whose end has passed is closed: it is not reopened by an extension. */
const reviewEnded = (period: { ends_at: Date; time_zone: string }) =>
  conflict(`The review closed at ${formatWhen(period.ends_at, period.time_zone)}; a closed review is not extended`);

/** An extension only moves the end later: the message names the current end in the period's zone. */
function notLater(period: { ends_at: Date; time_zone: string }) {
  const message = `An extension moves the end later: choose a time after the current end, ${formatWhen(period.ends_at, period.time_zone)}`;
  return new AppError("invalid", message, [{ path: "endsAt", message }]);
}

/** Close a review whose end has passed (plan locked by the caller): by the scheduled job, or by the publication that finds it ended. */
async function closeEndedReview(trx: Db, basinId: string, planId: string, period: { id: string }, now: Date, by: "schedule" | "publication") {
  await transitionPlanStatus(trx, planId, ["review"], "closed");
  await updateReviewPeriod(trx, period.id, { closed_at: now });
  await insertAuditEvent(trx, { basinId, actorId: null, action: "review.closed", targetType: "plan", targetId: planId, details: { by } });
}

/** Close review periods whose end has passed (the scheduled job); returns how many closed. */
export async function closeDueReviews(db: Db, now = new Date()): Promise<number> {
  return db.transaction().execute(async (trx) => {
    const due = await dueReviewPeriods(trx, now);
    let closed = 0;
    for (const d of due) {
      // a plan withdrawn (or a review extended) meanwhile is left as it is
      if ((await lockPlanStatus(trx, d.plan_id, "update")) !== "review") continue;
      const period = await currentPeriod(trx, d.plan_id);
      if (!period || period.id !== d.id || period.closed_at !== null || period.ends_at > now) continue;
      await closeEndedReview(trx, d.basin_id, d.plan_id, period, now, "schedule");
      closed++;
    }
    return closed;
  });
}

/** How long before a review's end its "closing soon" notice goes out (less for short reviews). */
export const CLOSING_SOON_MS = 48 * 3_600_000;

/** Queue the "review closing soon" notices that are due (the scheduled job); returns how many e-mails were queued. */
export async function sendClosingSoonNotices(db: Db, now = new Date()): Promise<number> {
  let queued = 0;
  for (const r of await reviewsClosingSoon(db, now, CLOSING_SOON_MS)) {
    queued += await db.transaction().execute((trx) =>
      noticeReviewClosingSoon(trx, { id: r.plan_id, basin_id: r.basin_id, title: r.title, version: r.version }, { id: r.id, endsAt: r.ends_at, timeZone: r.time_zone }),
    );
  }
  return queued;
}

/** Who a thread is about, as readers see it. */
const threadTopic = (facilityName: string | null) => facilityName ?? "The plan as a whole";

/**
 * Approve and publish a plan whose review has closed (lead). The plan is frozen from then
 * on. A thread whose comments have no response (awaitsResponse) must be acknowledged by
 * the lead, by id, with a statement of why the plan goes out without answering it; the
 * acknowledgement is kept with the plan, printed in its responsiveness summary and
 * written to the audit trail. A thread left unanswered that the lead did not see (a
 * comment written or a response withdrawn meanwhile) is refused by name.
 */
export async function publishPlan(scope: BasinScope, planId: string, input: PlanPublish = { acknowledgedThreadIds: [], statement: "" }) {
  const { db, actor, basin, plan } = await planForLead(scope, planId, "plan.publish");
  await db.transaction().execute(async (trx) => {
    // the row lock holds responses and the closing job off until this transaction ends
    const status = await lockPlanStatus(trx, plan.id, "update");
    const period = await currentPeriod(trx, plan.id);
    const now = new Date();
    const stage = status ? planStage(status, period ? { startsAt: period.starts_at, endsAt: period.ends_at, closedAt: period.closed_at } : null, now) : null;
    if (stage !== "closed") throw conflict(`A plan is published after its review closes; this one is ${stage ? PLAN_STAGE_TEXT[stage] : "gone"}`);
    // a review whose end has passed is closed, whether or not the closing job has run yet: close it here, as the job would
    if (status === "review") await closeEndedReview(trx, basin.id, plan.id, period!, now, "publication");
    const threads = await planThreads(trx, plan.id);
    const unanswered = threads.filter((t) =>
      awaitsResponse({ respondedAt: t.responded_at?.toISOString() ?? null, comments: t.comments.map((c) => ({ at: c.created_at.toISOString() })) }),
    );
    const acknowledged = new Set(input.acknowledgedThreadIds);
    const missing = unanswered.filter((t) => !acknowledged.has(t.id));
    if (missing.length > 0) {
      const names = missing.map((t) => `"${threadTopic(t.facility_name)}"`).join(", ");
      throw new AppError(
        "invalid",
        `${missing.length} thread${missing.length === 1 ? " has" : "s have"} comments without a response: ${names}. Respond, or acknowledge each before publishing`,
        [{ path: "acknowledgedThreadIds", message: `Not acknowledged: ${names}` }],
      );
    }
    if (unanswered.length > 0 && input.statement.length < MIN_ACK_STATEMENT) {
      throw new AppError("invalid", "Say why the plan is published with threads unanswered", [
        { path: "statement", message: `Say why the plan is published with threads unanswered (at least ${MIN_ACK_STATEMENT} characters)` },
      ]);
    }
    const publishedAt = new Date();
    let ack: PublicationAcknowledgement | null = null;
    if (unanswered.length > 0) {
      ack = {
        by: actor.name,
        byId: actor.id,
        at: publishedAt.toISOString(),
        statement: input.statement,
        threads: unanswered.map((t) => ({
          id: t.id,
          topic: threadTopic(t.facility_name),
          permitId: t.permit_id,
          comments: t.comments.length,
          lastCommentAt: t.comments.reduce((m, c) => (c.created_at > m ? c.created_at : m), t.comments[0].created_at).toISOString(),
        })),
      };
      // written while the plan is still closed: once published, its row is frozen
      await setPublicationAcknowledgement(trx, plan.id, ack);
    }
    if (!(await transitionPlanStatus(trx, plan.id, ["closed"], "published", { published_by: actor.id, published_at: publishedAt }))) throw raced();
    await noticePlanPublished(trx, plan, publishedAt, period?.time_zone ?? "UTC");
    await insertAuditEvent(trx, {
      basinId: basin.id,
      actorId: actor.id,
      action: "plan.published",
      targetType: "plan",
      targetId: plan.id,
      details: {
        version: plan.version,
        ...(ack ? { unansweredThreads: ack.threads.map((t) => ({ id: t.id, topic: t.topic, comments: t.comments })), statement: ack.statement } : {}),
      },
    });
  });
}

/** Withdraw a plan that is not published (lead). */
export async function withdrawPlan(scope: BasinScope, planId: string) {
  const { db, actor, basin, plan } = await planForLead(scope, planId, "review.manage");
  if (plan.status === "published" || plan.status === "withdrawn") throw conflict(`This plan is ${plan.status} and cannot be withdrawn`);
  await db.transaction().execute(async (trx) => {
    if (!(await transitionPlanStatus(trx, plan.id, ["draft", "review", "closed"], "withdrawn"))) throw raced();
    await insertAuditEvent(trx, { basinId: basin.id, actorId: actor.id, action: "plan.withdrawn", targetType: "plan", targetId: plan.id });
  });
}

/**
 * Comment on a thread: any signed-in person (members with their basin role,
 * others as members of the public), only while the plan's review period is open.
 */
export async function addComment(scope: BasinScope, threadId: string, body: string, now = new Date()) {
  const { db, actor: a, basin } = scope;
  const thread = await findThread(db, basin.id, threadId);
  if (!thread) throw notFound("Thread");
  const period = await currentPeriod(db, thread.plan_id);
  if (thread.plan_status !== "review" || !period || !isOpen(period, now)) {
    const when = period
      ? ` (the review ${now < period.starts_at ? "opens" : "closed"} ${(now < period.starts_at ? period.starts_at : (period.closed_at ?? period.ends_at)).toISOString()})`
      : "";
    throw conflict(`Comments are accepted only while the plan's review period is open${when}`);
  }
  const role = scope.role ?? "stakeholder (public)";
  return db.transaction().execute(async (trx) => {
    // the review must still be open when the comment is written (the closing job or a withdrawal may have won the race)
    const status = await lockPlanStatus(trx, thread.plan_id, "share");
    const still = await currentPeriod(trx, thread.plan_id);
    if (status !== "review" || !still || !isOpen(still, now)) throw conflict("The review closed just now; comments are no longer accepted");
    const c = await insertComment(trx, { threadId: thread.id, authorId: a.id, authorName: a.name, authorRole: role, body });
    const plan = (await findPlan(trx, basin.id, thread.plan_id))!;
    await noticeThreadReply(
      trx,
      plan,
      { id: thread.id, title: await threadTitle(trx, thread.facility_id) },
      { id: c.id, authorId: a.id, authorName: a.name, authorRole: role, body },
    );
    await insertAuditEvent(trx, { basinId: basin.id, actorId: a.id, action: "comment.added", targetType: "thread", targetId: thread.id });
    return { id: c.id, at: c.created_at.toISOString(), role };
  });
}

/** A planner's response marks the thread addressed; everyone who wrote in the thread hears of it. */
export async function respondToThread(scope: BasinScope, threadId: string, response: string) {
  scope.require("comment.answer");
  const { db, actor, basin, role } = scope;
  const thread = await findThread(db, basin.id, threadId);
  if (!thread) throw notFound("Thread");
  if (thread.plan_status === "published" || thread.plan_status === "withdrawn") throw conflict(`This plan is ${thread.plan_status}; its threads are closed`);
  await db.transaction().execute(async (trx) => {
    // publishing locks the plan for update: a response waits for it, then finds the plan frozen
    const status = await lockPlanStatus(trx, thread.plan_id, "share");
    if (status === "published" || status === "withdrawn") throw conflict(`This plan is ${status}; its threads are closed`);
    await markThreadAddressed(trx, thread.id, response, actor.id);
    const plan = (await findPlan(trx, basin.id, thread.plan_id))!;
    await noticeThreadReply(
      trx,
      plan,
      { id: thread.id, title: await threadTitle(trx, thread.facility_id) },
      { id: `${thread.id}:response:${Date.now()}`, authorId: actor.id, authorName: actor.name, authorRole: `${role ?? "admin"}, responding`, body: response },
    );
    await insertAuditEvent(trx, { basinId: basin.id, actorId: actor.id, action: "thread.addressed", targetType: "thread", targetId: thread.id });
  });
}

/** Published plans across basins, for the public front page. */
export async function listPublishedPlans(db: Db) {
  const rows = await listPublishedRows(db);
  const newest = new Map<string, number>();
  for (const p of rows) newest.set(p.lineage_id, Math.max(newest.get(p.lineage_id) ?? 0, p.version));
  return rows.map((p) => ({
    /** A later version of this plan (its lineage) has been published since. */
    superseded: p.version < newest.get(p.lineage_id)!,
    id: p.id,
    basinId: p.basin_id,
    basinName: p.basin_name,
    title: p.title,
    version: p.version,
    publishedAt: p.published_at?.toISOString() ?? null,
    /** The basin's zone, that the publication date is given in. */
    timeZone: p.time_zone ?? "UTC",
  }));
}

/** A published plan with its basin's name and units, for the public page; null when not published. */
export async function getPublishedPlan(db: Db, actor: Actor | null, basinId: string, planId: string) {
  const found = await getPlanForReader(db, actor, basinId, planId).catch((e) => {
    if (e instanceof AppError) return null;
    throw e;
  });
  if (found?.plan.status !== "published") return null;
  const newer = await newerPublishedPlan(db, found.plan.lineageId, found.plan.version);
  return { ...found, supersededBy: newer ? { id: newer.id, version: newer.version } : null };
}

/** Plans in review (and closed reviews awaiting publication) across basins: anyone signed in may read and, while open, comment. */
export async function listReviews(db: Db, actor: Actor | null, now = new Date()) {
  requireActor(actor);
  return (await listPlansUnderReview(db)).map((p) => ({
    id: p.id,
    basinId: p.basin_id,
    basinName: p.basin_name,
    title: p.title,
    version: p.version,
    status: p.status,
    stage: planStage(p.status, p.starts_at && p.ends_at ? { startsAt: p.starts_at, endsAt: p.ends_at, closedAt: p.closed_at } : null, now),
    startsAt: p.starts_at?.toISOString() ?? null,
    endsAt: p.ends_at?.toISOString() ?? null,
    timeZone: p.time_zone ?? "UTC",
    open: p.starts_at !== null && p.ends_at !== null && isOpen({ starts_at: p.starts_at, ends_at: p.ends_at, closed_at: p.closed_at }, now),
  }));
}

/** A plan with its basin's name and units, for a reader outside the basin (the plan's own rules decide who may read it). */
export async function getPlanForReader(db: Db, actor: Actor | null, basinId: string, planId: string) {
  const { basin, scope } = await readerScope(db, actor, basinId);
  const plan = await planView(db, basin, scope, planId);
  return { plan, basin: { id: basin.id, name: basin.name, slug: basin.slug, unitSystem: basin.unit_system, timeZone: basin.time_zone } };
}
