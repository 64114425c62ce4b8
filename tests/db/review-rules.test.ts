import { beforeEach, describe, expect, it } from "vitest";
import * as basinRoute from "@/app/api/basins/[basinId]/route";
import * as planRoute from "@/app/api/basins/[basinId]/plans/[planId]/route";
import * as plansRoute from "@/app/api/basins/[basinId]/plans/route";
import * as reviewRoute from "@/app/api/basins/[basinId]/plans/[planId]/review/route";
import * as commentsRoute from "@/app/api/basins/[basinId]/threads/[threadId]/comments/route";
import { listReviews } from "@/lib/services/plans";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { fileDb } from "../support/file-db";
import { planAt } from "../support/plan-fixture";
import { buildWorld, type World } from "../support/world";

/** The rules of a review period, as the server keeps them (lib/plans/review-rules.ts). */
const db = fileDb();
const DAY = 86_400_000;
const iso = (ms: number) => new Date(ms).toISOString();

async function draftIn(w: World) {
  return planAt(db, w, "draft");
}
const open = (w: World, planId: string, body: Record<string, unknown>) =>
  callRoute(reviewRoute.POST, "POST", { userId: w.users.lead.id, params: { basinId: w.basinId, planId }, body: { timeZone: "America/Chicago", ...body } });
const nothingWritten = async (w: World, planId: string) => {
  const plan = await db.selectFrom("plans").select("status").where("id", "=", planId).executeTakeFirstOrThrow();
  expect(plan.status).toBe("draft");
  expect(await db.selectFrom("review_periods").select("id").where("plan_id", "=", planId).execute()).toEqual([]);
  expect(await db.selectFrom("email_outbox").select("id").where("basin_id", "=", w.basinId).where("kind", "=", "review_opened").execute()).toEqual([]);
};

// each case in a basin of its own: what one case sends must not be counted by the next
let w: World;
beforeEach(async () => {
  w = await buildWorld(db);
});

describe("opening a review", () => {
  it("refuses a review that lies in the past (1–5 Nov when today is 2 Dec), naming startsAt; nothing is written or sent", async () => {
    const { planId } = await draftIn(w);
    const now = Date.now();
    const res = await open(w, planId, { startsAt: iso(now - 31 * DAY), endsAt: iso(now - 27 * DAY) });
    expect(res.status).toBe(422);
    expect(err(res.json).details![0]).toMatchObject({ path: "startsAt", message: expect.stringContaining("cannot open in the past") });
    await nothingWritten(w, planId);
  });

  it("takes a start a minute back (the time to click) but not ten minutes back", async () => {
    const { planId } = await draftIn(w);
    const now = Date.now();
    const late = await open(w, planId, { startsAt: iso(now - 10 * 60_000), endsAt: iso(now + 40 * DAY) });
    expect(late.status).toBe(422);
    expect(err(late.json).details![0].path).toBe("startsAt");
    expect((await open(w, planId, { startsAt: iso(now - 60_000), endsAt: iso(now + 40 * DAY) })).status).toBe(204);
  });

  it("refuses an end before the start, naming endsAt", async () => {
    const { planId } = await draftIn(w);
    const now = Date.now();
    const res = await open(w, planId, { startsAt: iso(now + DAY), endsAt: iso(now + 12 * 3_600_000) });
    expect(res.status).toBe(422);
    expect(err(res.json).details!.map((d) => d.path)).toContain("endsAt");
    await nothingWritten(w, planId);
  });

  it("holds a review to the basin's shortest period (30 days unless the lead sets another), naming the earliest end", async () => {
    const w2 = await buildWorld(db);
    const { planId } = await draftIn(w2);
    const basin = await callRoute(basinRoute.GET, "GET", { userId: w2.users.lead.id, params: { basinId: w2.basinId } });
    expect((basin.json as { minReviewDays: number }).minReviewDays).toBe(30);
    const now = Date.now();
    const short = await open(w2, planId, { startsAt: iso(now), endsAt: iso(now + 12 * DAY) });
    expect(short.status).toBe(422);
    expect(err(short.json).details![0]).toMatchObject({ path: "endsAt", message: expect.stringContaining("shortest review is 30 days: close it on or after") });
    await nothingWritten(w2, planId);

    // the lead sets ten days; a planner may not
    const patch = (userId: string, body: unknown) => callRoute(basinRoute.PATCH, "PATCH", { userId, params: { basinId: w2.basinId }, body });
    expect((await patch(w2.users.planner.id, { minReviewDays: 10 })).status).toBe(403);
    for (const bad of [-1, 366, 2.5]) {
      const r = await patch(w2.users.lead.id, { minReviewDays: bad });
      expect(r.status, String(bad)).toBe(422);
      expect(err(r.json).details![0].path).toBe("minReviewDays");
    }
    expect((await patch(w2.users.lead.id, { minReviewDays: 10 })).status).toBe(200);
    // another setting changed later leaves it as it is
    const other = await patch(w2.users.lead.id, { doCriterionMgL: 4.5 });
    expect((other.json as { minReviewDays: number }).minReviewDays).toBe(10);
    expect((await open(w2, planId, { startsAt: iso(now), endsAt: iso(now + 12 * DAY) })).status).toBe(204);
  });

  it("a review opened for a later start is 'scheduled' everywhere — the plan, the basin's list, the review list — and takes no comments yet", async () => {
    const w3 = await buildWorld(db);
    const { planId, planThreadId } = await draftIn(w3);
    const now = Date.now();
    expect((await open(w3, planId, { startsAt: iso(now + 2 * DAY), endsAt: iso(now + 40 * DAY) })).status).toBe(204);
    const plan = await callRoute(planRoute.GET, "GET", { userId: w3.users.stakeholder.id, params: { basinId: w3.basinId, planId } });
    expect(plan.json).toMatchObject({ status: "review", stage: "scheduled", review: { open: false } });
    const list = await callRoute(plansRoute.GET, "GET", { userId: w3.users.stakeholder.id, params: { basinId: w3.basinId } });
    expect((list.json as Array<{ id: string; stage: string }>).find((p) => p.id === planId)?.stage).toBe("scheduled");
    expect((await listReviews(db, w3.users.outsider)).find((r) => r.id === planId)?.stage).toBe("scheduled");
    const comment = await callRoute(commentsRoute.POST, "POST", { userId: w3.users.stakeholder.id, params: { basinId: w3.basinId, threadId: planThreadId }, body: { body: "Too early" } });
    expect(comment.status).toBe(409);
  });

  it("an extension only moves the end later, the current end named in the period's zone; a later end is kept with its reason", async () => {
    const { planId } = await draftIn(w);
    const now = Date.now();
    const end = now + 31 * DAY;
    expect((await open(w, planId, { startsAt: iso(now), endsAt: iso(end) })).status).toBe(204);
    const extend = (endsAt: string) =>
      callRoute(reviewRoute.PATCH, "PATCH", { userId: w.users.lead.id, params: { basinId: w.basinId, planId }, body: { endsAt, reason: "Two dischargers asked for more time" } });
    for (const earlier of [iso(end), iso(end - DAY)]) {
      const res = await extend(earlier);
      expect(res.status).toBe(422);
      expect(err(res.json).details![0]).toMatchObject({ path: "endsAt", message: expect.stringMatching(/after the current end, .* C[SD]T \(America\/Chicago\)$/) });
    }
    expect((await extend(iso(end + 7 * DAY))).status).toBe(204);
    const period = await db.selectFrom("review_periods").select(["ends_at", "extensions"]).where("plan_id", "=", planId).executeTakeFirstOrThrow();
    expect(period.ends_at.toISOString()).toBe(iso(end + 7 * DAY));
    expect(period.extensions).toMatchObject([{ from: iso(end), to: iso(end + 7 * DAY), reason: "Two dischargers asked for more time" }]);
  });
});
