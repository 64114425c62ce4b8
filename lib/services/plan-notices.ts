import type { Db } from "@/db/client";
import { findBasinById } from "@/db/queries/basins";
import { basinFollowersWithEmail } from "@/db/queries/follows";
import { isThreadComment, lockThreadNotices, outboxRowExists, threadCommentsSince, upsertPendingOutboxRow } from "@/db/queries/thread-digest";
import { basinMembersWithEmail, dischargerAllocations, planCommenters, planSnapshot, threadParticipants } from "@/db/queries/plans";
import { appUrl } from "@/lib/email/app-url";
import { queueEmail } from "@/lib/email/outbox";
import { DIGEST_QUOTED, threadDigestEmail } from "@/lib/email/thread-digest-template";
import { planPublishedEmail, reviewClosingEmail, reviewOpenedEmail, threadReplyEmail, type GoverningFigure } from "@/lib/email/templates";
import type { AllocationResult } from "@/lib/model/allocation/types";
import { governingCondition, type ConditionResult } from "@/lib/results/governing";

/** Works for everyone signed in: members are sent on to the workspace page, others read the plan there. */
const planUrl = (basinId: string, planId: string) => `${appUrl()}/reviews/${basinId}/${planId}`;

interface PlanInfo {
  id: string;
  basin_id: string;
  title: string;
  version: number;
}

async function basinName(db: Db, basinId: string): Promise<string> {
  return (await findBasinById(db, basinId))?.name ?? "";
}

/** The zone a basin's notices give times in: the basin's own, else `fallback` (a review's zone). */
async function basinZone(db: Db, basinId: string, fallback = "UTC"): Promise<string> {
  return (await findBasinById(db, basinId))?.time_zone ?? fallback;
}

interface Person {
  id: string;
  name: string;
  email: string;
}

/** People from several lists, each once. */
function everyone(...lists: Person[][]): Person[] {
  const byId = new Map<string, Person>();
  for (const list of lists) for (const p of list) if (!byId.has(p.id)) byId.set(p.id, p);
  return [...byId.values()];
}

/** Every member and follower of the basin hears that the review opened (queued in the caller's transaction). */
export async function noticeReviewOpened(trx: Db, plan: PlanInfo, period: { id: string; startsAt: Date; endsAt: Date; timeZone: string }) {
  const name = await basinName(trx, plan.basin_id);
  const members = everyone(await basinMembersWithEmail(trx, plan.basin_id), await basinFollowersWithEmail(trx, plan.basin_id));
  for (const m of members) {
    await queueEmail(trx, {
      to: m.email,
      kind: "review_opened",
      basinId: plan.basin_id,
      dedupeKey: `review_opened:${period.id}:${m.id}`,
      ...reviewOpenedEmail({
        recipientName: m.name,
        basinName: name,
        planTitle: plan.title,
        planVersion: plan.version,
        url: planUrl(plan.basin_id, plan.id),
        startsAt: period.startsAt,
        endsAt: period.endsAt,
        timeZone: period.timeZone,
      }),
    });
  }
}

/**
 * The review closes soon: members, followers and everyone who has commented on
 * the plan hear of it once per end time (an extension earns a fresh notice).
 */
export async function noticeReviewClosingSoon(trx: Db, plan: PlanInfo, period: { id: string; endsAt: Date; timeZone: string }): Promise<number> {
  const name = await basinName(trx, plan.basin_id);
  const people = everyone(
    await basinMembersWithEmail(trx, plan.basin_id),
    await basinFollowersWithEmail(trx, plan.basin_id),
    await planCommenters(trx, plan.id),
  );
  let queued = 0;
  for (const p of people) {
    const added = await queueEmail(trx, {
      to: p.email,
      kind: "review_closing",
      basinId: plan.basin_id,
      dedupeKey: `review_closing:${period.id}:${period.endsAt.toISOString()}:${p.id}`,
      ...reviewClosingEmail({
        recipientName: p.name,
        basinName: name,
        planTitle: plan.title,
        planVersion: plan.version,
        url: planUrl(plan.basin_id, plan.id),
        endsAt: period.endsAt,
        timeZone: period.timeZone,
      }),
    });
    if (added) queued += 1;
  }
  return queued;
}

/** How long a thread's notices to one person are gathered into one summary (SAGLINE_THREAD_DIGEST_MINUTES, default 15). */
export function threadDigestMinutes(env: Record<string, string | undefined> = process.env): number {
  const raw = env.SAGLINE_THREAD_DIGEST_MINUTES;
  const n = raw === undefined || raw === "" ? 15 : Number(raw);
  if (!Number.isFinite(n) || n < 1 || n > 24 * 60) throw new Error(`SAGLINE_THREAD_DIGEST_MINUTES must be 1 to 1440; got "${raw}"`);
  return n;
}

/**
 * Everyone who already wrote in a thread (and the planner who answered it)
 * hears of a new comment, except its author — at most twice per recipient,
 * thread and window (SAGLINE_THREAD_DIGEST_MINUTES): the window's first comment
 * right away (outbox key `thread_reply:<thread>:<person>:<window>`), and, if
 * more follow, one summary of the window's comments sent when it ends (key
 * `thread_digest:…:<window>`, rewritten while still pending). A planner's
 * response is always sent on its own.
 */
export async function noticeThreadReply(
  trx: Db,
  plan: PlanInfo,
  thread: { id: string; title: string },
  comment: { id: string; authorId: string; authorName: string; authorRole: string; body: string },
  now = new Date(),
) {
  const name = await basinName(trx, plan.basin_id);
  const participants = await threadParticipants(trx, thread.id, comment.authorId);
  const zone = await basinZone(trx, plan.basin_id);
  const digested = await isThreadComment(trx, thread.id, comment.id);
  const minutes = threadDigestMinutes();
  const windowMs = minutes * 60_000;
  const window = Math.floor(now.getTime() / windowMs);
  const windowStart = new Date(window * windowMs);
  const windowEnd = new Date((window + 1) * windowMs);
  for (const p of participants) {
    const ref = {
      recipientName: p.name,
      basinName: name,
      planTitle: plan.title,
      planVersion: plan.version,
      url: planUrl(plan.basin_id, plan.id),
    };
    const single = (dedupeKey: string) =>
      queueEmail(trx, {
        to: p.email,
        kind: "thread_reply",
        basinId: plan.basin_id,
        dedupeKey,
        ...threadReplyEmail({
          ...ref,
          threadTitle: thread.title,
          authorName: comment.authorName,
          authorRole: comment.authorRole,
          body: comment.body,
        }),
      });
    if (!digested) {
      await single(`thread_reply:${comment.id}:${p.id}`);
      continue;
    }
    await lockThreadNotices(trx, thread.id, p.id);
    const firstKey = `thread_reply:${thread.id}:${p.id}:${window}`;
    if (!(await outboxRowExists(trx, firstKey))) {
      await single(firstKey);
      continue;
    }
    const { total, latest } = await threadCommentsSince(trx, thread.id, p.id, windowStart, DIGEST_QUOTED);
    const digest = threadDigestEmail({
      ...ref,
      timeZone: zone,
      threadTitle: thread.title,
      windowMinutes: minutes,
      total: Math.max(total, 1),
      latest: latest.map((c) => ({ authorName: c.author_name, authorRole: c.author_role, body: c.body, at: c.created_at })),
    });
    const written = await upsertPendingOutboxRow(trx, {
      basin_id: plan.basin_id,
      to_address: p.email,
      kind: "thread_reply",
      dedupe_key: `thread_digest:${thread.id}:${p.id}:${window}`,
      subject: digest.subject,
      text_body: digest.text,
      html_body: digest.html,
      next_attempt_at: windowEnd,
    });
    // the summary already went out (a comment at the very end of its window): this one goes alone
    if (!written) await single(`thread_reply:${comment.id}:${p.id}`);
  }
}

/** A published plan is open to anyone: its link needs no sign-in. */
const publishedUrl = (basinId: string, planId: string) => `${appUrl()}/published/${basinId}/${planId}`;

/**
 * Everyone with a stake hears that a plan was published: every member of the basin,
 * every follower, and everyone who commented on the plan — each once. A discharger
 * linked to facilities also gets their final allocations. The link is the public page of
 * the published plan, which opens without signing in. The governing condition's lowest
 * DO (with the allocated loads) is stated, named.
 */
export async function noticePlanPublished(trx: Db, plan: PlanInfo, publishedAt: Date, reviewZone: string) {
  const name = await basinName(trx, plan.basin_id);
  const timeZone = await basinZone(trx, plan.basin_id, reviewZone);
  const rows = await dischargerAllocations(trx, plan.id);
  const own = new Map<string, typeof rows>();
  for (const r of rows) own.set(r.user_id, [...(own.get(r.user_id) ?? []), r]);
  const people = everyone(
    rows.map((r) => ({ id: r.user_id, name: r.name, email: r.email })),
    await basinMembersWithEmail(trx, plan.basin_id),
    await basinFollowersWithEmail(trx, plan.basin_id),
    await planCommenters(trx, plan.id),
  );
  const governing = await planGoverningFigure(trx, plan.id);
  for (const person of people) {
    await queueEmail(trx, {
      to: person.email,
      kind: "plan_published",
      basinId: plan.basin_id,
      dedupeKey: `plan_published:${plan.id}:${person.id}`,
      ...planPublishedEmail({
        recipientName: person.name,
        basinName: name,
        planTitle: plan.title,
        planVersion: plan.version,
        url: publishedUrl(plan.basin_id, plan.id),
        publishedAt,
        timeZone,
        governing,
        allocations: (own.get(person.id) ?? []).map((r) => ({
          facilityName: r.facility_name,
          todayCbodUKgDay: r.today_cbodu_kg_day,
          allocatedCbodUKgDay: r.cbodu_kg_day,
          bod5KgDay: r.bod5_kg_day,
          bod5MgL: r.bod5_mg_l,
          reductionPct: r.reduction_pct,
        })),
      }),
    });
  }
}

/** The lowest DO of the plan's run under its governing condition (lib/results/governing), or null for a snapshot without results. */
async function planGoverningFigure(trx: Db, planId: string): Promise<GoverningFigure | null> {
  const snapshot = (await planSnapshot(trx, planId)) as { run?: { result?: { conditions?: ConditionResult[]; allocation?: AllocationResult } } } | undefined;
  const result = snapshot?.run?.result;
  if (!result?.conditions?.length) return null;
  const g = governingCondition({ conditions: result.conditions, allocation: result.allocation });
  return {
    condition: g.name,
    conditions: result.conditions.length,
    lowestDoMgL: g.run.minimum.do_mg_l,
    reach: g.run.minimum.reach,
    criterionMgL: g.run.criterion_do_mg_l,
  };
}
