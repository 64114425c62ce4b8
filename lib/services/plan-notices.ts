import type { Db } from "@/db/client";
import { findBasinById } from "@/db/queries/basins";
import { basinFollowersWithEmail } from "@/db/queries/follows";
import { basinMembersWithEmail, dischargerAllocations, planCommenters, threadParticipants } from "@/db/queries/plans";
import { appUrl } from "@/lib/email/app-url";
import { queueEmail } from "@/lib/email/outbox";
import { planPublishedEmail, reviewClosingEmail, reviewOpenedEmail, threadReplyEmail } from "@/lib/email/templates";

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

/** Everyone who already wrote in a thread (and the planner who answered it) hears of a new comment, except its author. */
export async function noticeThreadReply(
  trx: Db,
  plan: PlanInfo,
  thread: { id: string; title: string },
  comment: { id: string; authorId: string; authorName: string; authorRole: string; body: string },
) {
  const name = await basinName(trx, plan.basin_id);
  const participants = await threadParticipants(trx, thread.id, comment.authorId);
  for (const p of participants) {
    await queueEmail(trx, {
      to: p.email,
      kind: "thread_reply",
      basinId: plan.basin_id,
      dedupeKey: `thread_reply:${comment.id}:${p.id}`,
      ...threadReplyEmail({
        recipientName: p.name,
        basinName: name,
        planTitle: plan.title,
        planVersion: plan.version,
        url: planUrl(plan.basin_id, plan.id),
        threadTitle: thread.title,
        authorName: comment.authorName,
        authorRole: comment.authorRole,
        body: comment.body,
      }),
    });
  }
}

/**
 * Each discharger linked to a facility gets its final allocation when the plan
 * is published; the basin's other followers hear that it was published.
 */
export async function noticePlanPublished(trx: Db, plan: PlanInfo, publishedAt: Date, timeZone: string) {
  const name = await basinName(trx, plan.basin_id);
  const rows = await dischargerAllocations(trx, plan.id);
  const byUser = new Map<string, typeof rows>();
  for (const r of rows) byUser.set(r.user_id, [...(byUser.get(r.user_id) ?? []), r]);
  const recipients = [
    ...[...byUser].map(([userId, own]) => ({ userId, person: { id: userId, name: own[0].name, email: own[0].email }, own })),
    ...(await basinFollowersWithEmail(trx, plan.basin_id)).filter((f) => !byUser.has(f.id)).map((f) => ({ userId: f.id, person: f, own: [] as typeof rows })),
  ];
  for (const { userId, person, own } of recipients) {
    await queueEmail(trx, {
      to: person.email,
      kind: "plan_published",
      basinId: plan.basin_id,
      dedupeKey: `plan_published:${plan.id}:${userId}`,
      ...planPublishedEmail({
        recipientName: person.name,
        basinName: name,
        planTitle: plan.title,
        planVersion: plan.version,
        url: planUrl(plan.basin_id, plan.id),
        publishedAt,
        timeZone,
        allocations: own.map((r) => ({
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
