import { beforeAll, describe, expect, it } from "vitest";
import { getMyFacilities, governingPlan, versionLabel } from "@/lib/services/my-facilities";
import { fileDb } from "../support/file-db";
import { readerBasin, readerPlan } from "../support/reader-plans";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

const db = fileDb();

describe("governingPlan (the choice, on its own)", () => {
  const p = (id: string, stage: "open" | "closed" | "published" | "scheduled", createdAt: string, publishedAt: string | null = null) => ({ id, stage, createdAt, publishedAt });

  it("takes the newest published plan over a later one under review or closed", () => {
    const plans = [p("v3", "open", "2026-12-03"), p("v2", "published", "2026-11-01", "2026-11-20"), p("v1", "published", "2026-10-01", "2026-10-20")];
    expect(governingPlan(plans)?.id).toBe("v2");
    expect(governingPlan([p("v2", "closed", "2026-12-01"), p("v1", "published", "2026-10-01", "2026-10-20")])?.id).toBe("v1");
  });

  it("without a published plan takes the one whose review is open, else the newest offered", () => {
    expect(governingPlan([p("new", "closed", "2026-12-02"), p("old", "open", "2026-11-01")])?.id).toBe("old");
    expect(governingPlan([p("old", "closed", "2026-11-01"), p("new", "scheduled", "2026-12-02")])?.id).toBe("new");
    expect(governingPlan([])).toBeNull();
  });

  it("names a version by its state and date in the review's time zone", () => {
    const review = { startsAt: "2026-12-01T15:00:00.000Z", endsAt: "2027-01-05T23:00:00.000Z", closedAt: null, timeZone: "America/Chicago" };
    // 3 Dec 2026 03:00 UTC is still 2 Dec in Chicago (UTC−6)
    expect(versionLabel({ version: 1, stage: "published", publishedAt: "2026-12-03T03:00:00.000Z", review }, "final")).toBe("Published 2 Dec 2026 — version 1 (final)");
    expect(versionLabel({ version: 2, stage: "open", publishedAt: null, review }, null)).toBe("In review until 5 Jan 2027 — version 2");
    expect(versionLabel({ version: 2, stage: "closed", publishedAt: null, review: { ...review, closedAt: "2027-01-04T12:00:00.000Z" } }, null)).toBe("Review closed 4 Jan 2027 — version 2");
  });
});

describe("My facilities opens on the plan that governs", () => {
  let w: World;
  let published: string;
  let closedLater: string;
  let openLatest: string;
  beforeAll(async () => {
    w = await buildWorld(db);
    await readerBasin(db, w);
  });

  it("with one plan under review, that plan", async () => {
    ({ planId: closedLater } = await readerPlan(db, w, { stage: "closed", title: "First proposal" }));
    const view = await scoped(getMyFacilities)(db, w.users.discharger, w.basinId);
    expect(view.plan?.id).toBe(closedLater);
    expect(view.plans.map((p) => p.label)).toEqual([expect.stringMatching(/^Review closed \d{1,2} \w{3} \d{4} — version \d+$/)]);
  });

  it("once a plan is published, the published one — also after a later version is proposed and its review closed", async () => {
    ({ planId: published } = await readerPlan(db, w, { stage: "published", title: "Adopted plan" }));
    ({ planId: openLatest } = await readerPlan(db, w, { stage: "open", title: "Revision under review" }));
    const view = await scoped(getMyFacilities)(db, w.users.discharger, w.basinId);
    expect(view.governingId).toBe(published);
    expect(view.plan?.id).toBe(published);
    expect(view.plan?.status).toBe("published");
    // newest first, each named by its state
    expect(view.plans.map((p) => p.id)).toEqual([openLatest, published, closedLater]);
    const byId = Object.fromEntries(view.plans.map((p) => [p.id, p]));
    expect(byId[published].label).toMatch(/^Published \d{1,2} \w{3} \d{4} — version \d+ \(final\)$/);
    expect(byId[published].governing).toBe(true);
    expect(byId[openLatest].label).toMatch(/^In review until \d{1,2} \w{3} \d{4} — version \d+$/);
    expect(byId[closedLater].governing).toBe(false);
  });

  it("shows another version when asked, and refuses a plan that is not offered", async () => {
    expect((await scoped(getMyFacilities)(db, w.users.discharger, w.basinId, openLatest)).plan?.id).toBe(openLatest);
    const { planId: draft } = await readerPlan(db, w, { stage: "draft" });
    expect((await scoped(getMyFacilities)(db, w.users.discharger, w.basinId)).plans.map((p) => p.id)).not.toContain(draft);
    await expect(scoped(getMyFacilities)(db, w.users.discharger, w.basinId, draft)).rejects.toMatchObject({ status: 404 });
  });

  it("a later published plan governs over the earlier one, which is then marked superseded", async () => {
    const { planId: second } = await readerPlan(db, w, { stage: "published", title: "Adopted revision" });
    const view = await scoped(getMyFacilities)(db, w.users.discharger, w.basinId);
    expect(view.plan?.id).toBe(second);
    expect(view.plans.find((p) => p.id === published)?.label).toMatch(/\(superseded\)$/);
  });

  it("is empty for a member who represents no facility", async () => {
    const view = await scoped(getMyFacilities)(db, w.users.stakeholder, w.basinId);
    expect(view).toMatchObject({ facilities: [], plans: [], plan: null, governingId: null });
  });
});
