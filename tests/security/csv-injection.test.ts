import Papa from "papaparse";
import { beforeAll, describe, expect, it } from "vitest";
import * as csvRoute from "@/app/api/basins/[basinId]/plans/[planId]/csv/route";
import { publishPlan } from "@/lib/services/plans";
import { callRoute } from "../support/call-route";
import { fileDb } from "../support/file-db";
import { planAt } from "../support/plan-fixture";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

// A published plan's CSV is downloaded by anyone: a facility name chosen to be a
// formula must arrive as text a spreadsheet shows, not runs.
const db = fileDb();
let w: World;
let planId: string;
const HOSTILE = '=HYPERLINK("http://evil.example","Open")';
beforeAll(async () => {
  w = await buildWorld(db);
  planId = (await planAt(db, w, "closed")).planId;
  await db.updateTable("plan_allocations").set({ facility_name: HOSTILE }).where("plan_id", "=", planId).execute();
  await scoped(publishPlan)(db, w.users.lead, w.basinId, planId);
});

describe("CSV formula injection", () => {
  it("a published plan's allocation CSV, downloaded signed out through its route, carries a formula-leading name as quoted text", async () => {
    const res = await callRoute(csvRoute.GET, "GET", { params: { basinId: w.basinId, planId } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toMatch(/^text\/csv/);
    const csv = String(res.json);
    const rows = Papa.parse<string[]>(csv, { skipEmptyLines: true }).data;
    const header = rows[0];
    const nameColumn = header.indexOf("Facility name");
    expect(nameColumn).toBeGreaterThanOrEqual(0);
    expect(rows.length).toBeGreaterThan(1);
    for (const row of rows.slice(1)) {
      expect(row[nameColumn]).toBe(`'${HOSTILE}`);
      // no cell of the file starts with a character a spreadsheet runs, unless it is a plain number
      for (const cell of row) expect(/^[=+\-@\t\r]/.test(cell) && !Number.isFinite(Number(cell)), cell).toBe(false);
    }
    // and the raw text quotes the cell, so the quote and the comma inside stay one cell
    expect(csv).toContain(`"'=HYPERLINK(""http://evil.example"",""Open"")"`);
  });
});
