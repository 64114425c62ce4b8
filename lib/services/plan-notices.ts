import type { Db } from "@/db/client";
import { queueEmail } from "@/lib/email/outbox";
import { planPublishedEmail, reviewOpenedEmail, threadReplyEmail } from "@/lib/email/templates";

/** The app's public address, for links in e-mails. */
const appUrl = () => (process.env.NEXTAUTH_URL ?? "http://127.0.0.1:3000").replace(/\/$/, "");
const planUrl = (basinId: string, planId: string) => `${appUrl()}/basins/${basinId}/plans/${planId}`;

interface PlanInfo {
  id: string;
  basin_id: string;
  title: string;
  version: number;
}

async function basinName(db: Db, basinId: string): Promise<string> {
  const b = await db.selectFrom("basins").select("name").where("id", "=", basinId).executeTakeFirstOrThrow();
  return b.name;
}

/** Every member of the basin hears that the review opened (queued in the caller's transaction). */
export async function noticeReviewOpened(trx: Db, plan: PlanInfo, period: { id: string; startsAt: Date; endsAt: Date; timeZone: string }) {
  const name = await basinName(trx, plan.basin_id);
  const members = await trx
    .selectFrom("memberships as m")
    .innerJoin("users as u", "u.id", "m.user_id")
    .select(["u.id", "u.name", "u.email"])
    .where("m.basin_id", "=", plan.basin_id)
    .execute();
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

/** Everyone who already wrote in a thread (and the planner who answered it) hears of a new comment, except its author. */
export async function noticeThreadReply(
  trx: Db,
  plan: PlanInfo,
  thread: { id: string; title: string },
  comment: { id: string; authorId: string; authorName: string; authorRole: string; body: string },
) {
  const name = await basinName(trx, plan.basin_id);
  const participants = await trx
    .selectFrom("users as u")
    .select(["u.id", "u.name", "u.email"])
    .where((eb) =>
      eb.or([
        eb("u.id", "in", eb.selectFrom("comments").select("author_id").where("thread_id", "=", thread.id).where("author_id", "is not", null).$narrowType<{ author_id: string }>()),
        eb("u.id", "in", eb.selectFrom("threads").select("responded_by").where("id", "=", thread.id).where("responded_by", "is not", null).$narrowType<{ responded_by: string }>()),
      ]),
    )
    .where("u.id", "!=", comment.authorId)
    .execute();
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

/** Each discharger linked to a facility gets its final allocation when the plan is published. */
export async function noticePlanPublished(trx: Db, plan: PlanInfo, publishedAt: Date, timeZone: string) {
  const name = await basinName(trx, plan.basin_id);
  const rows = await trx
    .selectFrom("plan_allocations as a")
    .innerJoin("facilities as f", "f.id", "a.facility_id")
    .innerJoin("facility_users as fu", "fu.facility_id", "a.facility_id")
    .innerJoin("users as u", "u.id", "fu.user_id")
    .select(["u.id as user_id", "u.name", "u.email", "f.name as facility_name", "a.cbodu_kg_day", "a.today_cbodu_kg_day", "a.bod5_kg_day", "a.bod5_mg_l", "a.reduction_pct"])
    .where("a.plan_id", "=", plan.id)
    .execute();
  const byUser = new Map<string, typeof rows>();
  for (const r of rows) byUser.set(r.user_id, [...(byUser.get(r.user_id) ?? []), r]);
  for (const [userId, own] of byUser) {
    await queueEmail(trx, {
      to: own[0].email,
      kind: "plan_published",
      basinId: plan.basin_id,
      dedupeKey: `plan_published:${plan.id}:${userId}`,
      ...planPublishedEmail({
        recipientName: own[0].name,
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
