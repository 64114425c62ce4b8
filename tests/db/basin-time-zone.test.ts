import { describe, expect, it } from "vitest";
import * as basinRoute from "@/app/api/basins/[basinId]/route";
import * as reviewRoute from "@/app/api/basins/[basinId]/plans/[planId]/review/route";
import { addComment, getPlan } from "@/lib/services/plans";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { fileDb } from "../support/file-db";
import { planAt } from "../support/plan-fixture";
import { buildWorld } from "../support/world";
import { scoped } from "../support/scoped";

/** A basin's time zone: lead-set, or taken from its first review; what its notices give times in. */
const db = fileDb();
const DAY = 86_400_000;
const zoneOf = async (basinId: string) => (await db.selectFrom("basins").select("time_zone").where("id", "=", basinId).executeTakeFirstOrThrow()).time_zone;

describe("a basin's time zone", () => {
  it("is set by the lead, checked as an IANA name (the field named), and cleared with null", async () => {
    const w = await buildWorld(db);
    const patch = (userId: string, body: unknown) => callRoute(basinRoute.PATCH, "PATCH", { userId, params: { basinId: w.basinId }, body });
    const bad = await patch(w.users.lead.id, { timeZone: "Central Time" });
    expect(bad.status).toBe(422);
    expect(err(bad.json).details![0]).toMatchObject({ path: "timeZone", message: expect.stringContaining("IANA") });
    expect((await patch(w.users.planner.id, { timeZone: "Europe/Dublin" })).status).toBe(403);
    const ok = await patch(w.users.lead.id, { timeZone: "Europe/Dublin" });
    expect(ok.status).toBe(200);
    expect((ok.json as { timeZone: string }).timeZone).toBe("Europe/Dublin");
    // the basin form sends an empty field as ""
    expect(((await patch(w.users.lead.id, { timeZone: "" })).json as { timeZone: string | null }).timeZone).toBeNull();
    expect(await zoneOf(w.basinId)).toBeNull();
  });

  it("is taken from the first review when the lead set none, and kept after", async () => {
    const w = await buildWorld(db);
    const first = await planAt(db, w, "draft");
    const now = Date.now();
    const open = (planId: string, timeZone: string) =>
      callRoute(reviewRoute.POST, "POST", {
        userId: w.users.lead.id,
        params: { basinId: w.basinId, planId },
        body: { startsAt: new Date(now + 60_000).toISOString(), endsAt: new Date(now + 40 * DAY).toISOString(), timeZone },
      });
    expect((await open(first.planId, "America/Denver")).status).toBe(204);
    expect(await zoneOf(w.basinId)).toBe("America/Denver");
    expect((await getPlan(db, w.users.lead, w.basinId, first.planId)).basinTimeZone).toBe("America/Denver");
    const second = await planAt(db, w, "draft", { revises: null });
    expect((await open(second.planId, "Asia/Kolkata")).status).toBe(204);
    expect(await zoneOf(w.basinId)).toBe("America/Denver");
  });

  it("gives the times in a busy thread's summary e-mail in the basin's zone, named", async () => {
    const w = await buildWorld(db);
    await db.updateTable("basins").set({ time_zone: "America/Chicago" }).where("id", "=", w.basinId).execute();
    const p = await planAt(db, w, "review");
    // three comments in one window: the third is summarised (lib/services/plan-notices noticeThreadReply)
    for (const [who, body] of [
      [w.users.stakeholder, "First."],
      [w.users.discharger, "Second."],
      [w.users.stakeholder, "Third."],
      [w.users.discharger, "Fourth."],
    ] as const)
      await scoped(addComment)(db, who, w.basinId, p.planThreadId, body);
    const digests = await db.selectFrom("email_outbox").select("text_body").where("basin_id", "=", w.basinId).where("dedupe_key", "like", "thread_digest:%").execute();
    expect(digests.length).toBeGreaterThan(0);
    for (const d of digests) {
      expect(d.text_body).toMatch(/, \d{1,2} \w{3} \d{4}, \d{2}:\d{2} C[SD]T \(America\/Chicago\):/);
      expect(d.text_body).not.toMatch(/\d{2}:\d{2} UTC/);
    }
  });
});
