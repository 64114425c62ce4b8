import { sql } from "kysely";
import { beforeAll, describe, expect, it } from "vitest";
import { changeMemberRole } from "@/lib/services/members";
import { addComment, closeDueReviews, extendReview, openReview, publishPlan, withdrawPlan } from "@/lib/services/plans";
import { fileDb } from "../support/file-db";
import { planAt } from "../support/plan-fixture";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

// Every state change checks and changes state in one statement or under a row
// lock: two requests sent together must leave the state one of them would have
// left alone. A pool of several connections lets the transactions really overlap.
const db = fileDb(8);
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
});

const settle = <T>(ps: Promise<T>[]) => Promise.allSettled(ps);
const codes = (rs: PromiseSettledResult<unknown>[]) =>
  rs.map((r) => (r.status === "fulfilled" ? "ok" : ((r.reason as { code?: string }).code ?? String(r.reason)))).sort();

async function auditCount(planId: string, action: string) {
  const r = await db.selectFrom("audit_events").select((eb) => eb.fn.countAll<string>().as("n")).where("target_id", "=", planId).where("action", "=", action).executeTakeFirstOrThrow();
  return Number(r.n);
}

describe("concurrent state transitions of a plan", () => {
  it("withdraw and publish sent together: exactly one happens (three tries)", async () => {
    for (let i = 0; i < 3; i++) {
      const { planId } = await planAt(db, w, "closed");
      const rs = await settle([scoped(withdrawPlan)(db, w.users.lead, w.basinId, planId), scoped(publishPlan)(db, w.users.lead, w.basinId, planId)]);
      expect(codes(rs)).toEqual(["conflict", "ok"]);
      const plan = await db.selectFrom("plans").select("status").where("id", "=", planId).executeTakeFirstOrThrow();
      const withdrawn = await auditCount(planId, "plan.withdrawn");
      const published = await auditCount(planId, "plan.published");
      expect(withdrawn + published).toBe(1);
      expect(plan.status).toBe(published ? "published" : "withdrawn");
    }
  });

  it("two 'open review' requests make one review period and one set of e-mails", async () => {
    const { planId } = await planAt(db, w, "draft");
    const now = Date.now();
    const body = { startsAt: new Date(now - 60_000).toISOString(), endsAt: new Date(now + 31 * 86_400_000).toISOString(), timeZone: "UTC" };
    const rs = await settle([scoped(openReview)(db, w.users.lead, w.basinId, planId, body), scoped(openReview)(db, w.users.lead, w.basinId, planId, body)]);
    expect(codes(rs)).toEqual(["conflict", "ok"]);
    const periods = await db.selectFrom("review_periods").select("id").where("plan_id", "=", planId).execute();
    expect(periods).toHaveLength(1);
    expect(await auditCount(planId, "review.opened")).toBe(1);
    const mails = await sql<{ n: string }>`SELECT count(*) AS n FROM email_outbox WHERE dedupe_key LIKE ${"%" + periods[0].id + "%"}`.execute(db);
    const byRecipient = await sql<{ n: string }>`SELECT count(DISTINCT to_address) AS n FROM email_outbox WHERE dedupe_key LIKE ${"%" + periods[0].id + "%"}`.execute(db);
    expect(Number(mails.rows[0].n)).toBeGreaterThan(0);
    expect(Number(mails.rows[0].n)).toBe(Number(byRecipient.rows[0].n));
  });

  it("two extensions sent together both land in the record, or the second is refused — never one silently lost", async () => {
    const { planId } = await planAt(db, w, "review");
    const period = await db.selectFrom("review_periods").selectAll().where("plan_id", "=", planId).executeTakeFirstOrThrow();
    const later = (days: number) => new Date(period.ends_at.getTime() + days * 86_400_000).toISOString();
    const rs = await settle([
      scoped(extendReview)(db, w.users.lead, w.basinId, planId, { endsAt: later(3), reason: "first" }),
      scoped(extendReview)(db, w.users.lead, w.basinId, planId, { endsAt: later(5), reason: "second" }),
    ]);
    const after = await db.selectFrom("review_periods").selectAll().where("id", "=", period.id).executeTakeFirstOrThrow();
    const ok = rs.filter((r) => r.status === "fulfilled").length;
    expect(after.extensions).toHaveLength(ok);
    expect(await auditCount(planId, "review.extended")).toBe(ok);
  });

  it("a comment racing the closing job is either written while open or refused, never written after the close", async () => {
    const { planId, planThreadId } = await planAt(db, w, "review");
    const period = await db.selectFrom("review_periods").selectAll().where("plan_id", "=", planId).executeTakeFirstOrThrow();
    const inside = new Date(period.ends_at.getTime() - 1000);
    const after = new Date(period.ends_at.getTime() + 1000);
    const [comment] = await settle<unknown>([scoped(addComment)(db, w.users.stakeholder, w.basinId, planThreadId, "Racing the close", inside), closeDueReviews(db, after)]);
    const closed = await db.selectFrom("review_periods").select("closed_at").where("id", "=", period.id).executeTakeFirstOrThrow();
    expect(closed.closed_at).not.toBeNull();
    const comments = await db.selectFrom("comments").select("id").where("thread_id", "=", planThreadId).execute();
    expect(comments).toHaveLength(comment.status === "fulfilled" ? 1 : 0);
    if (comment.status === "rejected") expect((comment.reason as { code: string }).code).toBe("conflict");
    expect(await auditCount(planId, "review.closed")).toBe(1);
    // and once closed, a comment is refused
    await expect(scoped(addComment)(db, w.users.stakeholder, w.basinId, planThreadId, "Too late", after)).rejects.toMatchObject({ code: "conflict" });
  });
});

describe("concurrent membership changes", () => {
  it("two leads demoting each other at once leave the basin with a lead", async () => {
    // a second lead
    await scoped(changeMemberRole)(db, w.users.lead, w.basinId, w.users.planner.id, { role: "lead" });
    const rs = await settle([
      scoped(changeMemberRole)(db, w.users.lead, w.basinId, w.users.planner.id, { role: "planner" }),
      scoped(changeMemberRole)(db, w.users.planner, w.basinId, w.users.lead.id, { role: "planner" }),
    ]);
    expect(codes(rs)).toContain("ok");
    const leads = await db.selectFrom("memberships").select("user_id").where("basin_id", "=", w.basinId).where("role", "=", "lead").execute();
    expect(leads).toHaveLength(1);
  });
});

describe("a site admin giving themselves a basin role", () => {
  it("is recorded as such in the basin's audit trail, which its leads read", async () => {
    const { addMember } = await import("@/lib/services/members");
    const { listBasinAudit } = await import("@/lib/services/audit");
    await scoped(addMember)(db, w.users.admin, w.basinId, { email: w.users.admin.email, role: "planner" });
    // whichever of the two leads above kept the role reads the trail
    const lead = await db.selectFrom("memberships").select("user_id").where("basin_id", "=", w.basinId).where("role", "=", "lead").executeTakeFirstOrThrow();
    const reader = [w.users.lead, w.users.planner].find((u) => u.id === lead.user_id)!;
    const events = await scoped(listBasinAudit)(db, reader, w.basinId, {});
    const row = events.find((e) => e.action === "member.added" && e.targetId === w.users.admin.id);
    expect(row?.details).toMatchObject({ role: "planner", selfGrantedBySiteAdmin: true });
  });
});
