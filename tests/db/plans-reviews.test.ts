import { sql } from "kysely";
import { beforeAll, describe, expect, it } from "vitest";
import { awaitsResponse } from "@/lib/results/responsiveness";
import * as planRoute from "@/app/api/basins/[basinId]/plans/[planId]/route";
import * as plansRoute from "@/app/api/basins/[basinId]/plans/route";
import * as reviewRoute from "@/app/api/basins/[basinId]/plans/[planId]/review/route";
import * as commentsRoute from "@/app/api/basins/[basinId]/threads/[threadId]/comments/route";
import * as responseRoute from "@/app/api/basins/[basinId]/threads/[threadId]/response/route";
import { addComment, closeDueReviews, getPlan, publishPlan, respondToThread, withdrawPlan } from "@/lib/services/plans";
import { fileDb } from "../support/file-db";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { planAt } from "../support/plan-fixture";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
});

const as = (key: keyof World["users"]) => w.users[key].id;
type PlanJson = Awaited<ReturnType<typeof getPlan>>;

describe("a plan from proposal to publication", () => {
  let planId: string;
  let planThread: string;
  let facilityThread: string;

  it("is proposed from a feasible allocation run as a frozen snapshot, visible to planners and leads only", async () => {
    const p = await planAt(db, w, "draft");
    planId = p.planId;
    planThread = p.planThreadId;
    facilityThread = p.threads.find((t) => t.facility_id !== null)!.id;
    const read = (userId?: string) => callRoute(planRoute.GET, "GET", { userId, params: { basinId: w.basinId, planId } });
    const asPlanner = await read(as("planner"));
    expect(asPlanner.status).toBe(200);
    const plan = asPlanner.json as PlanJson;
    expect(plan.status).toBe("draft");
    expect(plan.allocations).toHaveLength(5);
    expect(plan.threads).toHaveLength(6);
    expect((await read(as("stakeholder"))).status).toBe(403);
    expect((await read(as("discharger"))).status).toBe(403);
    expect((await read()).status).toBe(401);
    const list = await callRoute(plansRoute.GET, "GET", { userId: as("stakeholder"), params: { basinId: w.basinId } });
    expect(list.json).toEqual([]);
  });

  it("refuses comments before a review period opens", async () => {
    const res = await callRoute(commentsRoute.POST, "POST", { userId: as("stakeholder"), params: { basinId: w.basinId, threadId: planThread }, body: { body: "Too early?" } });
    expect(res.status).toBe(409);
    expect(err(res.json).message).toMatch(/only while the plan's review period is open/);
  });

  it("opens a review (lead only, explicit time zone), then members and the signed-in public comment", async () => {
    const now = Date.now();
    const body = { startsAt: new Date(now - 60_000).toISOString(), endsAt: new Date(now + 31 * 86_400_000).toISOString(), timeZone: "America/Chicago" };
    expect((await callRoute(reviewRoute.POST, "POST", { userId: as("planner"), params: { basinId: w.basinId, planId }, body })).status).toBe(403);
    const badZone = await callRoute(reviewRoute.POST, "POST", { userId: as("lead"), params: { basinId: w.basinId, planId }, body: { ...body, timeZone: "Mars/Olympus" } });
    expect(err(badZone.json).details![0].path).toBe("timeZone");
    const noOffset = await callRoute(reviewRoute.POST, "POST", { userId: as("lead"), params: { basinId: w.basinId, planId }, body: { ...body, startsAt: "2026-12-01T09:00:00" } });
    expect(err(noOffset.json).details![0].path).toBe("startsAt");
    expect((await callRoute(reviewRoute.POST, "POST", { userId: as("lead"), params: { basinId: w.basinId, planId }, body })).status).toBe(204);
    // every member is told, once, through the outbox written in the same transaction
    const opened = await db.selectFrom("email_outbox").select(["to_address", "text_body"]).where("basin_id", "=", w.basinId).where("kind", "=", "review_opened").execute();
    const members = await db.selectFrom("memberships").select("user_id").where("basin_id", "=", w.basinId).execute();
    expect(opened).toHaveLength(members.length);
    expect(opened.map((o) => o.to_address)).toContain(w.users.discharger.email);
    expect(opened[0].text_body).toMatch(/qualified/);

    const comment = (userId: string, threadId: string, text: string) =>
      callRoute(commentsRoute.POST, "POST", { userId, params: { basinId: w.basinId, threadId }, body: { body: text } });
    const byDischarger = await comment(as("discharger"), facilityThread, "Our plant cannot reach this by 2027.\nPlease phase it.");
    expect(byDischarger.status).toBe(201);
    expect((byDischarger.json as { role: string }).role).toBe("discharger");
    const byPublic = await comment(as("outsider"), planThread, "<script>alert(1)</script> keep the river fishable");
    expect(byPublic.status).toBe(201);
    expect((byPublic.json as { role: string }).role).toBe("stakeholder (public)");
    const empty = await comment(as("stakeholder"), planThread, "   ");
    expect(empty.status).toBe(422);

    const plan = (await callRoute(planRoute.GET, "GET", { userId: as("stakeholder"), params: { basinId: w.basinId, planId } })).json as PlanJson;
    expect(plan.status).toBe("review");
    expect(plan.review).toMatchObject({ timeZone: "America/Chicago", open: true });
    const whole = plan.threads.find((t) => t.id === planThread)!;
    // stored as the text that was written: shown as text, never as HTML
    expect(whole.comments[0].body).toBe("<script>alert(1)</script> keep the river fishable");
    expect(plan.threads.find((t) => t.id === facilityThread)!.comments[0].body).toContain("\n");
  });

  it("planners answer and mark threads addressed; others cannot", async () => {
    const answer = (userId: string) =>
      callRoute(responseRoute.POST, "POST", { userId, params: { basinId: w.basinId, threadId: facilityThread }, body: { response: "A compliance schedule is proposed." } });
    expect((await answer(as("discharger"))).status).toBe(403);
    expect((await answer(as("planner"))).status).toBe(204);
    const plan = await getPlan(db, w.users.planner, w.basinId, planId);
    expect(plan.threads.find((t) => t.id === facilityThread)).toMatchObject({ status: "addressed", response: "A compliance schedule is proposed." });
    // a later reply reaches the earlier participants (the discharger and the planner who answered), not its author
    await scoped(addComment)(db, w.users.stakeholder, w.basinId, facilityThread, "We support the schedule.");
    const replies = await db
      .selectFrom("email_outbox")
      .select("to_address")
      .where("basin_id", "=", w.basinId)
      .where("kind", "=", "thread_reply")
      .where("text_body", "like", "%We support the schedule%")
      .execute();
    expect(replies.map((r) => r.to_address).sort()).toEqual([w.users.discharger.email, w.users.planner.email].sort());
  });

  it("extending needs a reason; the review closes itself at its end and comments stop", async () => {
    // the review was opened for 31 days; the extension moves its end to day 33
    const later = new Date(Date.now() + 33 * 86_400_000).toISOString();
    const noReason = await callRoute(reviewRoute.PATCH, "PATCH", { userId: as("lead"), params: { basinId: w.basinId, planId }, body: { endsAt: later } });
    expect(err(noReason.json).details![0].path).toBe("reason");
    const ok = await callRoute(reviewRoute.PATCH, "PATCH", {
      userId: as("lead"),
      params: { basinId: w.basinId, planId },
      body: { endsAt: later, reason: "Requests from two dischargers for more time" },
    });
    expect(ok.status).toBe(204);
    // (the closing job is basin-wide: other files' plans may close too, so this plan's state is what is checked)
    await closeDueReviews(db, new Date(Date.now() + 32 * 86_400_000));
    expect((await getPlan(db, w.users.lead, w.basinId, planId)).status).toBe("review");
    expect(await closeDueReviews(db, new Date(Date.now() + 34 * 86_400_000))).toBeGreaterThanOrEqual(1);
    expect((await getPlan(db, w.users.lead, w.basinId, planId)).status).toBe("closed");
    await expect(scoped(addComment)(db, w.users.stakeholder, w.basinId, planThread, "late")).rejects.toThrow(/review period is open/);
  });

  it("is published by a lead, then frozen: readable signed out, no edit path, and direct SQL refused by the trigger", async () => {
    await expect(scoped(publishPlan)(db, w.users.planner, w.basinId, planId)).rejects.toThrow("Only the basin's lead can publish plans; you are a planner here.");
    const dp1001 = await db.selectFrom("plan_allocations").select("facility_id").where("plan_id", "=", planId).where("permit_id", "=", "DP-1001").executeTakeFirstOrThrow();
    await db.insertInto("facility_users").values({ facility_id: dp1001.facility_id, user_id: w.users.discharger.id }).execute();
    // threads with comments after their last response: the lead acknowledges them (tests/db/publication.test.ts has the rules)
    const waiting = (await getPlan(db, w.users.lead, w.basinId, planId)).threads.filter(awaitsResponse).map((t) => t.id);
    expect(waiting.length).toBeGreaterThan(0);
    await scoped(publishPlan)(db, w.users.lead, w.basinId, planId, { acknowledgedThreadIds: waiting, statement: "Answered in the permit notices that follow." });
    const published = await db.selectFrom("email_outbox").select(["to_address", "text_body"]).where("basin_id", "=", w.basinId).where("kind", "=", "plan_published").execute();
    // every member hears of it; the linked discharger with its final allocation
    expect(published.map((p) => p.to_address)).toContain(w.users.stakeholder.email);
    expect(published.find((p) => p.to_address === w.users.discharger.email)!.text_body).toMatch(/Quillford Water Reclamation Plant/);
    const signedOut = await callRoute(planRoute.GET, "GET", { params: { basinId: w.basinId, planId } });
    expect(signedOut.status).toBe(200);
    expect((signedOut.json as PlanJson).status).toBe("published");
    expect(((await callRoute(plansRoute.GET, "GET", { params: { basinId: w.basinId } })).json as { id: string }[]).map((p) => p.id)).toContain(planId);

    await expect(scoped(respondToThread)(db, w.users.planner, w.basinId, planThread, "after the fact")).rejects.toThrow(/published/);
    await expect(scoped(withdrawPlan)(db, w.users.lead, w.basinId, planId)).rejects.toThrow(/published/);
    await expect(sql`update plans set title = 'changed' where id = ${planId}`.execute(db)).rejects.toThrow(/published and frozen/);
    await expect(sql`update plan_allocations set cbodu_kg_day = 1 where plan_id = ${planId}`.execute(db)).rejects.toThrow(/published and frozen/);
    await expect(sql`delete from comments where thread_id = ${planThread}`.execute(db)).rejects.toThrow(/published and frozen/);
    await expect(sql`delete from plans where id = ${planId}`.execute(db)).rejects.toThrow(/published and frozen/);
    await expect(
      sql`insert into comments (thread_id, author_name, author_role, body) values (${planThread}, 'x', 'x', 'sneaky')`.execute(db),
    ).rejects.toThrow(/published and frozen/);
  });

  it("is proposed only from a finished, feasible allocation run", async () => {
    const other = await buildWorld(db);
    const { runId } = await planAt(db, other, "draft");
    const model = await db.selectFrom("runs").select("id").where("basin_id", "=", other.basinId).where("kind", "=", "allocation").executeTakeFirstOrThrow();
    expect(model.id).toBe(runId);
    const res = await callRoute(plansRoute.POST, "POST", { userId: other.users.planner.id, params: { basinId: other.basinId }, body: { runId: "00000000-0000-4000-8000-000000000000", title: "Nothing" } });
    expect(res.status).toBe(404);
  });
});
