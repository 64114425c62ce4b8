import { sql } from "kysely";
import { beforeAll, describe, expect, it } from "vitest";
import { planReachLines } from "@/db/queries/plan-reports";
import { getPlan } from "@/lib/services/plans";
import { fileDb } from "../support/file-db";
import { planAt } from "../support/plan-fixture";
import { buildWorld, type World } from "../support/world";

// A published plan reads the same whatever happens around it: no row can be
// added under it, and the facility names and reach lines it shows are its own copies.
const db = fileDb();
let w: World;
let planId: string;
beforeAll(async () => {
  w = await buildWorld(db);
  planId = (await planAt(db, w, "published")).planId;
});

describe("a published plan is frozen", () => {
  it("refuses new review periods, threads and allocations in the database itself", async () => {
    const facility = await db.selectFrom("plan_allocations").select(["facility_id"]).where("plan_id", "=", planId).executeTakeFirstOrThrow();
    const attempts = [
      sql`insert into review_periods (plan_id, starts_at, ends_at, time_zone) values (${planId}, now(), now() + interval '1 day', 'UTC')`,
      sql`insert into threads (plan_id, facility_id) values (${planId}, gen_random_uuid())`,
      sql`insert into plan_allocations (plan_id, facility_id, permit_id, cbodu_kg_day, bod5_kg_day, bod5_mg_l, today_cbodu_kg_day, terms)
          values (${planId}, ${facility.facility_id}, 'X', 1, 1, 1, 1, '{}')`,
    ];
    for (const q of attempts) await expect(q.execute(db)).rejects.toThrow(/published and frozen/);
  });

  it("shows the facility names and reach lines it was proposed with after the live rows change", async () => {
    const before = await getPlan(db, null, w.basinId, planId);
    const lines = await planReachLines(db, planId);
    const ids = before.allocations.map((a) => a.facilityId);
    await db.updateTable("facilities").set({ name: "RENAMED-AFTER-PUBLICATION" }).where("id", "in", ids).execute();
    await db.updateTable("reaches").set({ name: "RENAMED REACH", length_km: 999 }).where("network_id", "=", lines[0].network_id).execute();
    const after = await getPlan(db, null, w.basinId, planId);
    expect(after.allocations.map((a) => a.facilityName)).toEqual(before.allocations.map((a) => a.facilityName));
    expect(JSON.stringify(after)).not.toContain("RENAMED-AFTER-PUBLICATION");
    const linesAfter = await planReachLines(db, planId);
    expect(linesAfter).toEqual(lines);
    expect(linesAfter.some((l) => l.name === "RENAMED REACH" || l.length_km === 999)).toBe(false);
  });
});
