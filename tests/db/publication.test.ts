import { beforeEach, describe, expect, it } from "vitest";
import * as publishRoute from "@/app/api/basins/[basinId]/plans/[planId]/publish/route";
import * as plansRoute from "@/app/api/basins/[basinId]/plans/route";
import * as reviewRoute from "@/app/api/basins/[basinId]/plans/[planId]/review/route";
import { findFacilityByPermit, linkFacilityUser } from "@/db/queries/facilities";
import { insertUser } from "@/db/queries/users";
import { responsivenessRows } from "@/lib/results/responsiveness";
import { followBasin } from "@/lib/services/follows";
import { addComment, closeDueReviews, getPlan, proposePlan, respondToThread } from "@/lib/services/plans";
import { createRun, processRun } from "@/lib/services/runs";
import { createScenario } from "@/lib/services/scenarios";
import { scenarioCreateSchema } from "@/lib/validation/scenario";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { fileDb } from "../support/file-db";
import { planAt } from "../support/plan-fixture";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

/** Publishing a plan: unanswered threads acknowledged and audited, who hears of it, and versions per lineage. */
const db = fileDb();
const DAY = 86_400_000;

let w: World;
beforeEach(async () => {
  w = await buildWorld(db);
});

const publish = (planId: string, body: Record<string, unknown>) =>
  callRoute(publishRoute.POST, "POST", { userId: w.users.lead.id, params: { basinId: w.basinId, planId }, body });

/** A plan whose review had comments on the plan as a whole and on one facility, now closed. */
async function closedWithComments() {
  const p = await planAt(db, w, "review");
  const facility = await findFacilityByPermit(db, w.basinId, "DP-1001");
  const facilityThread = p.threads.find((t) => t.facility_id === facility!.id)!.id;
  await scoped(addComment)(db, w.users.stakeholder, w.basinId, p.planThreadId, "Keep the August flow for the herons.");
  await scoped(addComment)(db, w.users.discharger, w.basinId, facilityThread, "We need until 2028 to upgrade.");
  await closeDueReviews(db, new Date(Date.now() + 32 * DAY));
  return { ...p, facilityThread, facilityName: facility!.name };
}

const planRow = (planId: string) => db.selectFrom("plans").select(["status", "publication_acknowledgement"]).where("id", "=", planId).executeTakeFirstOrThrow();
const published = (planId: string) => db.selectFrom("email_outbox").select(["to_address", "text_body"]).where("basin_id", "=", w.basinId).where("kind", "=", "plan_published").where("dedupe_key", "like", `plan_published:${planId}:%`).execute();

describe("publishing with threads unanswered", () => {
  it("refuses until every unanswered thread is acknowledged, naming them; nothing is written or sent", async () => {
    const p = await closedWithComments();
    const none = await publish(p.planId, {});
    expect(none.status).toBe(422);
    const detail = err(none.json).details![0];
    expect(detail.path).toBe("acknowledgedThreadIds");
    expect(detail.message).toContain('"The plan as a whole"');
    expect(detail.message).toContain(`"${p.facilityName}"`);
    // one of the two acknowledged: the other is named
    const one = await publish(p.planId, { acknowledgedThreadIds: [p.planThreadId], statement: "Answered in the permit notices." });
    expect(one.status).toBe(422);
    expect(err(one.json).details![0].message).toBe(`Not acknowledged: "${p.facilityName}"`);
    expect(await planRow(p.planId)).toEqual({ status: "closed", publication_acknowledgement: null });
    expect(await published(p.planId)).toEqual([]);
  });

  it("asks for the lead's statement when threads go out unanswered", async () => {
    const p = await closedWithComments();
    const res = await publish(p.planId, { acknowledgedThreadIds: [p.planThreadId, p.facilityThread], statement: "ok" });
    expect(res.status).toBe(422);
    expect(err(res.json).details![0].path).toBe("statement");
    expect((await planRow(p.planId)).status).toBe("closed");
  });

  it("publishes once acknowledged: kept with the plan, in the audit trail and in the responsiveness summary", async () => {
    const p = await closedWithComments();
    // the facility's thread is answered; only the plan as a whole waits
    await scoped(respondToThread)(db, w.users.planner, w.basinId, p.facilityThread, "A compliance schedule to 2028 is proposed.");
    const statement = "The heron question is taken up in the next revision of the plan.";
    const res = await publish(p.planId, { acknowledgedThreadIds: [p.planThreadId], statement });
    expect(res.status).toBe(204);
    const row = await planRow(p.planId);
    expect(row.status).toBe("published");
    expect(row.publication_acknowledgement).toMatchObject({
      by: w.users.lead.name,
      byId: w.users.lead.id,
      statement,
      threads: [{ id: p.planThreadId, topic: "The plan as a whole", comments: 1 }],
    });
    const audit = await db.selectFrom("audit_events").select("details").where("target_id", "=", p.planId).where("action", "=", "plan.published").executeTakeFirstOrThrow();
    expect(audit.details).toMatchObject({ statement, unansweredThreads: [{ id: p.planThreadId, topic: "The plan as a whole", comments: 1 }] });
    const plan = await getPlan(db, null, w.basinId, p.planId);
    expect(plan.publicationAcknowledgement?.threads.map((t) => t.id)).toEqual([p.planThreadId]);
    const rows = responsivenessRows(plan.threads, plan.publicationAcknowledgement);
    expect(rows.find((r) => r.topic === "The plan as a whole")!.response).toMatch(new RegExp(`^No response when the plan was published on .*; acknowledged by ${w.users.lead.name}: "${statement}"$`));
    expect(rows.find((r) => r.topic === p.facilityName)!.response).toBe("A compliance schedule to 2028 is proposed.");
  });

  it("counts a thread with comments after its response as unanswered", async () => {
    const p = await planAt(db, w, "review");
    await scoped(addComment)(db, w.users.stakeholder, w.basinId, p.planThreadId, "First question.");
    await scoped(respondToThread)(db, w.users.planner, w.basinId, p.planThreadId, "First answer.");
    await new Promise((r) => setTimeout(r, 5));
    await scoped(addComment)(db, w.users.stakeholder, w.basinId, p.planThreadId, "A follow-up that nobody answered.");
    await closeDueReviews(db, new Date(Date.now() + 32 * DAY));
    expect((await publish(p.planId, {})).status).toBe(422);
    expect((await publish(p.planId, { acknowledgedThreadIds: [p.planThreadId], statement: "The follow-up repeats the first question." })).status).toBe(204);
  });

  it("needs no acknowledgement when every comment has its response", async () => {
    const p = await planAt(db, w, "review");
    await scoped(addComment)(db, w.users.stakeholder, w.basinId, p.planThreadId, "A question.");
    await scoped(respondToThread)(db, w.users.planner, w.basinId, p.planThreadId, "An answer.");
    await closeDueReviews(db, new Date(Date.now() + 32 * DAY));
    expect((await publish(p.planId, {})).status).toBe(204);
    expect((await planRow(p.planId)).publication_acknowledgement).toBeNull();
  });

  it("a response racing the publication either lands first or is refused: never on a frozen plan", async () => {
    const p = await closedWithComments();
    const [pub, resp] = await Promise.allSettled([
      publish(p.planId, { acknowledgedThreadIds: [p.planThreadId, p.facilityThread], statement: "Published as reviewed; see the permit notices." }),
      scoped(respondToThread)(db, w.users.planner, w.basinId, p.planThreadId, "A late answer."),
    ]);
    expect(pub.status === "fulfilled" && pub.value.status).toBe(204);
    const thread = await db.selectFrom("threads").select(["response", "responded_at"]).where("id", "=", p.planThreadId).executeTakeFirstOrThrow();
    const publishedAt = (await db.selectFrom("plans").select("published_at").where("id", "=", p.planId).executeTakeFirstOrThrow()).published_at!;
    if (resp.status === "fulfilled") expect(thread.responded_at!.getTime()).toBeLessThanOrEqual(publishedAt.getTime());
    else expect(String(resp.reason)).toMatch(/published/);
  });
});

describe("a review whose end has passed", () => {
  it("is closed by the publication itself when the closing job has not run yet, and is not extended", async () => {
    const p = await planAt(db, w, "review");
    // the end passes; the scheduled job has not run
    await db.updateTable("review_periods").set({ starts_at: new Date(Date.now() - 40 * DAY), ends_at: new Date(Date.now() - 1000) }).where("plan_id", "=", p.planId).execute();
    expect((await getPlan(db, w.users.lead, w.basinId, p.planId)).stage).toBe("closed");
    const extend = await callRoute(reviewRoute.PATCH, "PATCH", {
      userId: w.users.lead.id,
      params: { basinId: w.basinId, planId: p.planId },
      body: { endsAt: new Date(Date.now() + 10 * DAY).toISOString(), reason: "Asked for after the end" },
    });
    expect(extend.status).toBe(409);
    expect(err(extend.json).message).toMatch(/closed at .*; a closed review is not extended/);
    expect((await publish(p.planId, {})).status).toBe(204);
    expect((await planRow(p.planId)).status).toBe("published");
    const audit = await db.selectFrom("audit_events").select(["action", "details"]).where("target_id", "=", p.planId).orderBy("id").execute();
    expect(audit.map((a) => a.action).slice(-2)).toEqual(["review.closed", "plan.published"]);
    expect(audit.at(-2)!.details).toEqual({ by: "publication" });
    const period = await db.selectFrom("review_periods").select("closed_at").where("plan_id", "=", p.planId).executeTakeFirstOrThrow();
    expect(period.closed_at).not.toBeNull();
  });

  it("a plan whose review is still open is not published", async () => {
    const p = await planAt(db, w, "review");
    const res = await publish(p.planId, {});
    expect(res.status).toBe(409);
    expect(err(res.json).message).toMatch(/this one is in review/);
  });
});

describe("who hears of a publication", () => {
  it("every member, follower and commenter, each once, with a link that opens without signing in", async () => {
    const p = await planAt(db, w, "review");
    const facility = await findFacilityByPermit(db, w.basinId, "DP-1001");
    await linkFacilityUser(db, facility!.id, w.users.discharger.id);
    // a member of the public who comments, and one who follows and also comments
    const commenter = await insertUser(db, { email: `commenter-${w.basinId.slice(0, 8)}@world.test`, name: "A commenter", password_hash: "x", is_admin: false });
    const follower = await insertUser(db, { email: `follower-${w.basinId.slice(0, 8)}@world.test`, name: "A follower", password_hash: "x", is_admin: false });
    await followBasin(db, { id: follower.id, email: follower.email, name: follower.name, isAdmin: false }, w.basinId);
    await scoped(addComment)(db, { id: commenter.id, email: commenter.email, name: commenter.name, isAdmin: false }, w.basinId, p.planThreadId, "From outside the basin.");
    await scoped(addComment)(db, { id: follower.id, email: follower.email, name: follower.name, isAdmin: false }, w.basinId, p.planThreadId, "From a follower.");
    await scoped(addComment)(db, w.users.stakeholder, w.basinId, p.planThreadId, "From a member.");
    await scoped(respondToThread)(db, w.users.planner, w.basinId, p.planThreadId, "Answered together.");
    await closeDueReviews(db, new Date(Date.now() + 32 * DAY));
    expect((await publish(p.planId, {})).status).toBe(204);

    const mails = await published(p.planId);
    const members = ["lead", "planner", "discharger", "stakeholder", "spareDischarger", "target"] as const;
    const expected = [...members.map((k) => w.users[k].email), commenter.email, follower.email].sort();
    expect(mails.map((m) => m.to_address).sort()).toEqual(expected);
    for (const m of mails) {
      expect(m.text_body).toContain(`/published/${w.basinId}/${p.planId}`);
      expect(m.text_body).not.toContain("/reviews/");
      // the governing condition's figure, named (the fixture's scenario has one condition, "7Q10")
      expect(m.text_body).toMatch(/lowest dissolved oxygen is \d+\.\d\d mg\/L \(in reach \S+\) under "7Q10", against a criterion of \d+\.\d mg\/L/);
    }
    // the linked discharger also gets its own final allocation
    const own = mails.find((m) => m.to_address === w.users.discharger.email)!;
    expect(own.text_body).toContain(facility!.name);
    expect(own.text_body).toMatch(/Final allocation \(CBODu\): /);
    expect(mails.find((m) => m.to_address === commenter.email)!.text_body).not.toMatch(/Final allocation/);
    // the outsider of the world (a lead elsewhere, not following) hears nothing
    expect(mails.map((m) => m.to_address)).not.toContain(w.users.outsider.email);
  });
});

describe("plan versions count within a lineage", () => {
  it("a plan from the same scenario revises the newest plan of that scenario; another scenario starts at version 1", async () => {
    const first = await planAt(db, w, "draft");
    const scenarioOf = async (runId: string) => (await db.selectFrom("runs").select("scenario_id").where("id", "=", runId).executeTakeFirstOrThrow()).scenario_id;
    const rerun = await scoped(createRun)(db, w.users.planner, w.basinId, await scenarioOf(first.runId), "allocation");
    await processRun(db, rerun.id);
    const revision = await scoped(proposePlan)(db, w.users.planner, w.basinId, { runId: rerun.id, title: "Revised" });
    expect(revision).toMatchObject({ version: 2, revises: first.planId });
    // another scenario (other inputs: a run of its own) starts a plan of its own
    const scenario = await scoped(createScenario)(db, w.users.planner, w.basinId, scenarioCreateSchema.parse({ name: "Warmer", inputs: { conditions: [{ name: "Warm 7Q10", temperatureC: 24 }] } }));
    const warm = await scoped(createRun)(db, w.users.planner, w.basinId, scenario.id, "allocation");
    await processRun(db, warm.id);
    const other = await scoped(proposePlan)(db, w.users.planner, w.basinId, { runId: warm.id, title: "Warm plan" });
    expect(other).toMatchObject({ version: 1, revises: null });
    expect((await getPlan(db, w.users.planner, w.basinId, other.id)).lineageId).toBe(other.id);
    expect((await getPlan(db, w.users.planner, w.basinId, revision.id)).lineageId).toBe(first.planId);
    // explicitly a revision of the first, or explicitly a plan of its own
    const third = await scoped(proposePlan)(db, w.users.planner, w.basinId, { runId: rerun.id, title: "Third", revises: first.planId });
    expect(third.version).toBe(3);
    const fresh = await scoped(proposePlan)(db, w.users.planner, w.basinId, { runId: rerun.id, title: "Fresh", revises: null });
    expect(fresh).toMatchObject({ version: 1, revises: null });
  });

  it("refuses to revise a plan of another basin, naming revises", async () => {
    const elsewhere = await buildWorld(db);
    const foreign = await planAt(db, elsewhere, "draft");
    const own = await planAt(db, w, "draft");
    const res = await callRoute(plansRoute.POST, "POST", {
      userId: w.users.planner.id,
      params: { basinId: w.basinId },
      body: { runId: own.runId, title: "Sneaky", revises: foreign.planId },
    });
    expect(res.status).toBe(422);
    expect(err(res.json).details![0].path).toBe("revises");
  });

  it("two proposals at once in one lineage take different versions", async () => {
    const first = await planAt(db, w, "draft");
    const rs = await Promise.all([1, 2].map((i) => scoped(proposePlan)(db, w.users.planner, w.basinId, { runId: first.runId, title: `Parallel ${i}`, revises: first.planId })));
    expect(rs.map((r) => r.version).sort()).toEqual([2, 3]);
  });
});
