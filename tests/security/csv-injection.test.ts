import { beforeAll, describe, expect, it } from "vitest";
import { planAllocationsCsv } from "@/lib/services/plan-reports";
import { publishPlan } from "@/lib/services/plans";
import { fileDb } from "../support/file-db";
import { planAt } from "../support/plan-fixture";
import { buildWorld, type World } from "../support/world";

// A published plan's CSV is downloaded by anyone: a facility name chosen to be a
// formula must arrive as text.
const db = fileDb();
let w: World;
let planId: string;
const HOSTILE = '=HYPERLINK("http://evil.example","Open")';
beforeAll(async () => {
  w = await buildWorld(db);
  planId = (await planAt(db, w, "closed")).planId;
  await db.updateTable("plan_allocations").set({ facility_name: HOSTILE }).where("plan_id", "=", planId).execute();
  await publishPlan(db, w.users.lead, w.basinId, planId);
});

describe("CSV formula injection", () => {
  it("a published plan's allocation CSV, downloaded signed out, carries formula-leading names as quoted text", async () => {
    const csv = String((await planAllocationsCsv(db, null, w.basinId, planId)).body);
    const lines = csv.split("\r\n").filter((l) => l && !l.startsWith("#"));
    const rows = lines.slice(1);
    expect(rows.length).toBeGreaterThan(0);
    for (const row of rows) {
      expect(row).toContain(`"'=HYPERLINK(""http://evil.example"",""Open"")"`);
      // no cell of the row starts with a bare formula character
      expect(row.split(",").some((cell) => /^[=@]/.test(cell))).toBe(false);
    }
  });
});
