import { beforeAll, describe, expect, it } from "vitest";
import * as auditRoute from "@/app/api/basins/[basinId]/audit/route";
import { findFacilityByPermit, linkFacilityUser } from "@/db/queries/facilities";
import { auditTargetHref } from "@/components/tables/audit-table";
import { listBasinAudit } from "@/lib/services/audit";
import { updateBasin } from "@/lib/services/basins";
import { followBasin } from "@/lib/services/follows";
import { getMyFacilities } from "@/lib/services/my-facilities";
import {
  CLOSING_SOON_MS,
  addComment,
  closeDueReviews,
  extendReview,
  getPlan,
  getPlanForReader,
  getPublishedPlan,
  listPlans,
  listPublishedPlans,
  listReviews,
  openReview,
  proposePlan,
  publishPlan,
  respondToThread,
  sendClosingSoonNotices,
  withdrawPlan,
} from "@/lib/services/plans";
import { fileDb } from "../support/file-db";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { planAt } from "../support/plan-fixture";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

const db = fileDb();

const HOUR = 3_600_000;
const DAY = 24 * HOUR;

const closingMail = (basinId: string) =>
  db.selectFrom("email_outbox").select(["to_address", "dedupe_key", "text_body"]).where("basin_id", "=", basinId).where("kind", "=", "review_closing").execute();

describe("review closing soon", () => {
  let w: World;
  let plan: Awaited<ReturnType<typeof planAt>>;
  let opened: number;
  beforeAll(async () => {
    w = await buildWorld(db);
    opened = Date.now();
    // the fixture's review runs from a minute ago for 31 days
    plan = await planAt(db, w, "review");
    await scoped(addComment)(db, w.users.outsider, w.basinId, plan.planThreadId, "A comment from outside the basin");
  });

  it("says nothing while the end is more than two days away", async () => {
    await sendClosingSoonNotices(db, new Date(opened + 4 * DAY));
    expect(await closingMail(w.basinId)).toHaveLength(0);
  });

  it("tells every member and everyone who commented once the end is within two days, once", async () => {
    const at = new Date(opened + 31 * DAY - CLOSING_SOON_MS + 10 * 60_000);
    const members = ["lead", "planner", "discharger", "stakeholder", "spareDischarger", "target"] as const;
    const expected = [...members.map((k) => w.users[k].email), w.users.outsider.email].sort();
    // (the job is site-wide: other files' reviews may be due too, so this basin's mail is what is counted)
    await sendClosingSoonNotices(db, at);
    const mail = await closingMail(w.basinId);
    expect(mail.map((m) => m.to_address).sort()).toEqual(expected);
    expect(mail[0].text_body).toMatch(/closes at/);
    expect(mail[0].text_body).toContain(`/reviews/${w.basinId}/${plan.planId}`);
    // the job runs every 30 s: running again queues nothing more
    await sendClosingSoonNotices(db, new Date(at.getTime() + 60_000));
    expect(await closingMail(w.basinId)).toHaveLength(expected.length);
  });

  it("announces the new end again after an extension, when that end draws near", async () => {
    const before = (await closingMail(w.basinId)).length;
    const newEnd = new Date(opened + 45 * DAY);
    await scoped(extendReview)(db, w.users.lead, w.basinId, plan.planId, { endsAt: newEnd.toISOString(), reason: "Dischargers asked for two more weeks" });
    await sendClosingSoonNotices(db, new Date(opened + 35 * DAY));
    expect(await closingMail(w.basinId)).toHaveLength(before);
    await sendClosingSoonNotices(db, new Date(newEnd.getTime() - DAY));
    expect(await closingMail(w.basinId)).toHaveLength(2 * before);
    expect((await closingMail(w.basinId)).filter((m) => m.dedupe_key.includes(newEnd.toISOString()))).toHaveLength(before);
  });

  it("waits until the second half of a short review", async () => {
    const w2 = await buildWorld(db);
    const draft = await planAt(db, w2, "draft");
    // the basin allows short reviews (its lead's setting; 0: no minimum)
    await scoped(updateBasin)(db, w2.users.lead, w2.basinId, { minReviewDays: 0 });
    const start = Date.now();
    // a 6-hour review: the notice is due in its last 3 hours, not the moment it opens
    const other = await scoped(proposePlan)(db, w2.users.planner, w2.basinId, { runId: draft.runId, title: "Short review" });
    await scoped(openReview)(db, w2.users.lead, w2.basinId, other.id, {
      startsAt: new Date(start).toISOString(),
      endsAt: new Date(start + 6 * HOUR).toISOString(),
      timeZone: "UTC",
    });
    await sendClosingSoonNotices(db, new Date(start + 2 * HOUR));
    expect(await closingMail(w2.basinId)).toHaveLength(0);
    await sendClosingSoonNotices(db, new Date(start + 3 * HOUR + 60_000));
    expect((await closingMail(w2.basinId)).length).toBeGreaterThan(0);
  });
});

describe("followers", () => {
  it("hear that a review opened, that it closes soon and that the plan was published; only dischargers get allocations", async () => {
    const w = await buildWorld(db);
    await followBasin(db, w.users.outsider, w.basinId);
    await followBasin(db, w.users.lead, w.basinId); // a member who also follows: still one message each
    const plan = await planAt(db, w, "review");
    const mail = (kind: string) =>
      db.selectFrom("email_outbox").select(["to_address", "text_body"]).where("basin_id", "=", w.basinId).where("kind", "=", kind as "review_opened").execute();
    const opened = await mail("review_opened");
    expect(opened.filter((m) => m.to_address === w.users.outsider.email)).toHaveLength(1);
    expect(opened.filter((m) => m.to_address === w.users.lead.email)).toHaveLength(1);
    await sendClosingSoonNotices(db, new Date(Date.now() + 30 * DAY));
    expect((await mail("review_closing")).filter((m) => m.to_address === w.users.outsider.email)).toHaveLength(1);
    await closeDueReviews(db, new Date(Date.now() + 32 * DAY));
    await scoped(publishPlan)(db, w.users.lead, w.basinId, plan.planId);
    const published = await mail("plan_published");
    const outsider = published.filter((m) => m.to_address === w.users.outsider.email);
    expect(outsider).toHaveLength(1);
    expect(outsider[0].text_body).toMatch(/was published/);
    expect(outsider[0].text_body).not.toMatch(/Final allocation/);
  });
});

describe("a planner's response", () => {
  it("is e-mailed to everyone who wrote in the thread, not to the responder", async () => {
    const w = await buildWorld(db);
    const plan = await planAt(db, w, "review");
    await scoped(addComment)(db, w.users.discharger, w.basinId, plan.planThreadId, "Our load is already low");
    await scoped(addComment)(db, w.users.outsider, w.basinId, plan.planThreadId, "So is ours");
    await scoped(respondToThread)(db, w.users.planner, w.basinId, plan.planThreadId, "Noted: the allocation keeps today's load");
    const replies = await db
      .selectFrom("email_outbox")
      .select(["to_address", "text_body"])
      .where("basin_id", "=", w.basinId)
      .where("kind", "=", "thread_reply")
      .where("text_body", "like", "%the allocation keeps today%")
      .execute();
    expect(replies.map((m) => m.to_address).sort()).toEqual([w.users.discharger.email, w.users.outsider.email].sort());
    expect(replies[0].text_body).toMatch(/\(planner, responding\)/);
  });
});

describe("readers outside the basin", () => {
  let w: World;
  let review: Awaited<ReturnType<typeof planAt>>;
  beforeAll(async () => {
    w = await buildWorld(db);
    review = await planAt(db, w, "review");
  });

  it("lists plans under review to anyone signed in, and no drafts", async () => {
    const draft = await planAt(db, w, "draft");
    const listed = await listReviews(db, w.users.outsider);
    const ours = listed.filter((r) => r.basinId === w.basinId);
    expect(ours.map((r) => r.id)).toEqual([review.planId]);
    expect(ours[0]).toMatchObject({ status: "review", open: true, timeZone: "America/Chicago" });
    expect(listed.some((r) => r.id === draft.planId)).toBe(false);
    await expect(listReviews(db, null)).rejects.toMatchObject({ status: 401 });
  });

  it("lets a signed-in non-member read a plan in review, but not a draft", async () => {
    const found = await getPlanForReader(db, w.users.outsider, w.basinId, review.planId);
    expect(found.basin.id).toBe(w.basinId);
    expect(found.plan.threads.length).toBeGreaterThan(1);
    const draft = await planAt(db, w, "draft");
    await expect(getPlanForReader(db, w.users.outsider, w.basinId, draft.planId)).rejects.toMatchObject({ status: 403 });
    await expect(getPlanForReader(db, null, w.basinId, review.planId)).rejects.toMatchObject({ status: 401 });
  });
});

describe("versions", () => {
  it("a plan withdrawn after its review stays readable with its comments; a withdrawn draft does not", async () => {
    const w = await buildWorld(db);
    const reviewed = await planAt(db, w, "review");
    await scoped(addComment)(db, w.users.stakeholder, w.basinId, reviewed.planThreadId, "Kept on the record");
    await scoped(withdrawPlan)(db, w.users.lead, w.basinId, reviewed.planId);
    const read = await getPlan(db, w.users.outsider, w.basinId, reviewed.planId);
    expect(read.status).toBe("withdrawn");
    expect(read.threads.flatMap((t) => t.comments.map((c) => c.body))).toContain("Kept on the record");
    const draft = await planAt(db, w, "draft");
    await scoped(withdrawPlan)(db, w.users.lead, w.basinId, draft.planId);
    await expect(getPlan(db, w.users.stakeholder, w.basinId, draft.planId)).rejects.toMatchObject({ status: 403 });
    const listed = (await listPlans(db, w.users.stakeholder, w.basinId)).map((p) => p.id);
    expect(listed).toContain(reviewed.planId);
    expect(listed).not.toContain(draft.planId);
    // signed out: published plans only
    expect(await listPlans(db, null, w.basinId)).toEqual([]);
  });

  it("a published plan says when a later version of it has been published", async () => {
    const w = await buildWorld(db);
    const first = await planAt(db, w, "published");
    expect((await getPublishedPlan(db, null, w.basinId, first.planId))!.supersededBy).toBeNull();
    // a plan of its own (another scenario, not a revision) supersedes nothing
    const separate = await planAt(db, w, "published", { revises: null });
    expect((await getPublishedPlan(db, null, w.basinId, first.planId))!.supersededBy).toBeNull();
    const second = await planAt(db, w, "published", { revises: first.planId });
    const old = (await getPublishedPlan(db, null, w.basinId, first.planId))!;
    expect(old.supersededBy?.id).toBe(second.planId);
    expect((await getPublishedPlan(db, null, w.basinId, second.planId))!.supersededBy).toBeNull();
    const front = (await listPublishedPlans(db)).filter((p) => p.basinId === w.basinId);
    expect(front.map((p) => [p.id, p.version, p.superseded])).toEqual([
      [second.planId, 2, false],
      [separate.planId, 1, false],
      [first.planId, 1, true],
    ]);
  });
});

describe("a discharger's own facilities", () => {
  let w: World;
  let facilityId: string;
  beforeAll(async () => {
    w = await buildWorld(db);
  });

  it("is empty for a member who represents no facility", async () => {
    const v = await scoped(getMyFacilities)(db, w.users.stakeholder, w.basinId);
    expect(v).toMatchObject({ facilities: [], plans: [], plan: null });
  });

  it("offers no plan while the only plan is a draft", async () => {
    await planAt(db, w, "draft");
    const f = await findFacilityByPermit(db, w.basinId, "DP-1001");
    facilityId = f!.id;
    await linkFacilityUser(db, facilityId, w.users.discharger.id);
    const v = await scoped(getMyFacilities)(db, w.users.discharger, w.basinId);
    // the world's own facility and the demo network's DP-1001
    expect(v.facilities.map((x) => x.id).sort()).toEqual([w.facilityId, facilityId].sort());
    expect(v.plans).toEqual([]);
    expect(v.plan).toBeNull();
  });

  it("shows the newest plan in review with the facility's allocation and its thread", async () => {
    const review = await planAt(db, w, "review");
    const v = await scoped(getMyFacilities)(db, w.users.discharger, w.basinId);
    expect(v.plans.map((p) => p.id)).toEqual([review.planId]);
    expect(v.plan!.id).toBe(review.planId);
    const mine = v.plan!.allocations.find((a) => a.facilityId === facilityId)!;
    expect(mine.permitId).toBe("DP-1001");
    expect(v.plan!.threads.some((t) => t.facilityId === facilityId)).toBe(true);
    // the snapshot carries what the page draws: the allocation entry and the outfall's reach
    const snapshot = v.plan!.snapshot as { run: { result: { allocation: { allocations: { id: string }[] } }; modelFiles: { file: { dischargers: { id: string; reach: string }[] } }[] } };
    expect(snapshot.run.result.allocation.allocations.some((a) => a.id === "DP-1001")).toBe(true);
    expect(snapshot.run.modelFiles[0].file.dischargers.find((d) => d.id === "DP-1001")?.reach).toBeTruthy();
  });

  it("refuses a plan version it does not offer", async () => {
    const draft = await planAt(db, w, "draft");
    await expect(scoped(getMyFacilities)(db, w.users.discharger, w.basinId, draft.planId)).rejects.toMatchObject({ status: 404 });
  });

  it("is for members only", async () => {
    await expect(scoped(getMyFacilities)(db, w.users.outsider, w.basinId)).rejects.toMatchObject({ status: 403 });
  });
});

describe("the audit trail", () => {
  let w: World;
  beforeAll(async () => {
    w = await buildWorld(db);
    await planAt(db, w, "published");
  });

  it("records the plan's life and filters by area", async () => {
    const plans = await scoped(listBasinAudit)(db, w.users.lead, w.basinId, { area: "plans" });
    const actions = plans.map((e) => e.action);
    expect(actions).toEqual(expect.arrayContaining(["plan.proposed", "review.opened", "review.closed", "plan.published"]));
    expect(actions.every((a) => /^(plan|review|comment|thread)\./.test(a))).toBe(true);
    const network = await scoped(listBasinAudit)(db, w.users.lead, w.basinId, { area: "network" });
    expect(network.length).toBeGreaterThan(0);
    expect(network.every((e) => /^(import|network)\./.test(e.action))).toBe(true);
    // the scheduled close has no person behind it
    expect(plans.find((e) => e.action === "review.closed")!.actor).toBeNull();
  });

  it("a comment's and a response's events name the thread's plan, so the trail links to the thread on its page", async () => {
    const v = await buildWorld(db);
    const plan = await planAt(db, v, "review");
    await scoped(addComment)(db, v.users.stakeholder, v.basinId, plan.planThreadId, "When is the next survey?");
    await scoped(respondToThread)(db, v.users.planner, v.basinId, plan.planThreadId, "In August");
    const events = await scoped(listBasinAudit)(db, v.users.lead, v.basinId, { area: "plans" });
    const threadEvents = events.filter((e) => e.targetType === "thread");
    expect(threadEvents.map((e) => e.action).sort()).toEqual(["comment.added", "thread.addressed"]);
    for (const e of threadEvents) expect(e).toMatchObject({ targetId: plan.planThreadId, planId: plan.planId });
    expect(auditTargetHref(v.basinId, threadEvents[0])).toBe(`/basins/${v.basinId}/plans/${plan.planId}#thread-${plan.planThreadId}`);
    // every other event has no thread plan
    expect(events.filter((e) => e.targetType !== "thread").every((e) => e.planId === null)).toBe(true);
  });

  it("pages backwards by event id without gaps or repeats", async () => {
    const all = await scoped(listBasinAudit)(db, w.users.lead, w.basinId);
    const first = await scoped(listBasinAudit)(db, w.users.lead, w.basinId, { limit: 3 });
    const rest = await scoped(listBasinAudit)(db, w.users.lead, w.basinId, { before: first[2].id });
    expect([...first, ...rest].map((e) => e.id)).toEqual(all.map((e) => e.id));
  });

  it("refuses an unknown area or cursor, naming the parameter", async () => {
    const area = await callRoute(auditRoute.GET, "GET", { userId: w.users.lead.id, params: { basinId: w.basinId }, query: { area: "everything" } });
    expect(area.status).toBe(422);
    expect(err(area.json).details?.[0].path).toBe("area");
    const before = await callRoute(auditRoute.GET, "GET", { userId: w.users.lead.id, params: { basinId: w.basinId }, query: { before: "yesterday" } });
    expect(before.status).toBe(422);
    expect(err(before.json).details?.[0].path).toBe("before");
    const ok = await callRoute(auditRoute.GET, "GET", { userId: w.users.lead.id, params: { basinId: w.basinId }, query: { area: "plans" } });
    expect(ok.status).toBe(200);
  });
});
