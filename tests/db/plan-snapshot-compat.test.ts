import { readFileSync } from "node:fs";
import { sql } from "kysely";
import { beforeAll, describe, expect, it } from "vitest";
import { findFacilityByPermit, linkFacilityUser } from "@/db/queries/facilities";
import { PLAN_SNAPSHOT_VERSION, PlanSnapshotError, readPlanSnapshot } from "@/lib/plans/snapshot";
import { planReport } from "@/lib/reports/plan-report-data";
import { governingCondition } from "@/lib/results/governing";
import { runConditions } from "@/lib/results/run-conditions";
import { getMyFacilities } from "@/lib/services/my-facilities";
import { planAllocationsCsv, planReachesGeoJson, planReportPdf } from "@/lib/services/plan-reports";
import { getPlanForReaderWithMap } from "@/lib/services/plan-readers";
import { getPlan } from "@/lib/services/plans";
import { fileDb } from "../support/file-db";
import { planAt } from "../support/plan-fixture";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

/**
 * Every stored shape of a plan's snapshot (tests/fixtures/plans/) goes through every reader:
 * the plan API, the PDF, the CSV and GeoJSON downloads, the review page's map data and a
 * discharger's own view. A change to what runs store that cannot read an earlier snapshot
 * fails here — and a published plan with that snapshot could no longer be shown.
 */
const db = fileDb();
const FIXTURES = ["snapshot-v1-2026-12-03.json", "snapshot-v1-one-condition.json"] as const;
const fixture = (name: string) => JSON.parse(readFileSync(`tests/fixtures/plans/${name}`, "utf8")) as Record<string, unknown>;

let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
});

/** A plan of the world's basin (demo network, in review) whose snapshot is the stored fixture. */
async function planWith(name: string) {
  const { planId } = await planAt(db, w, "review", { revises: null });
  // the plan is not published: its row may still be written
  await sql`update plans set snapshot = ${JSON.stringify(fixture(name))}::jsonb where id = ${planId}`.execute(db);
  return planId;
}

describe.each(FIXTURES)("a plan whose snapshot was stored as %s", (name) => {
  let planId: string;
  beforeAll(async () => {
    planId = await planWith(name);
    const facility = await findFacilityByPermit(db, w.basinId, "DP-1003");
    await linkFacilityUser(db, facility!.id, w.users.discharger.id).catch(() => undefined);
  });

  it("is read as stored, checked against its schema", async () => {
    const plan = await getPlan(db, w.users.planner, w.basinId, planId);
    expect(plan.snapshot).toEqual(fixture(name));
  });

  it("names its governing condition and reads its allocation's condition names as the scenario's", async () => {
    const s = (await getPlan(db, w.users.planner, w.basinId, planId)).snapshot;
    const read = runConditions({ conditions: s.run.result.conditions, allocation: s.run.result.allocation });
    const names = s.run.result.conditions.map((c) => c.name);
    expect(names).toContain(governingCondition({ conditions: s.run.result.conditions, allocation: read.allocation }).name);
    for (const b of read.allocation?.binding ?? []) expect(b.condition).not.toBe("base");
  });

  it("renders the PDF, the CSV and the GeoJSON", async () => {
    const pdf = await planReportPdf(db, w.users.planner, w.basinId, planId);
    expect(Buffer.from(pdf.body as Uint8Array).subarray(0, 5).toString()).toBe("%PDF-");
    const report = planReport(await getPlan(db, w.users.planner, w.basinId, planId), { name: "Basin", unitSystem: "SI" }, null);
    expect(report.allocations.rows.length).toBeGreaterThan(0);
    const csv = await planAllocationsCsv(db, w.users.planner, w.basinId, planId);
    expect(String(csv.body)).toMatch(/DP-1003/);
    const geo = JSON.parse(String((await planReachesGeoJson(db, w.users.planner, w.basinId, planId)).body));
    expect(geo.features.length).toBeGreaterThan(0);
  });

  it("feeds the review page's map and a discharger's own view", async () => {
    const reader = await getPlanForReaderWithMap(db, w.users.outsider, w.basinId, planId);
    expect(reader.plan.id).toBe(planId);
    const mine = await scoped(getMyFacilities)(db, w.users.discharger, w.basinId, planId);
    expect(mine.plan?.id).toBe(planId);
  });
});

describe("the snapshot schema", () => {
  it("refuses a stored snapshot that no version reads, naming the fields", async () => {
    const broken = fixture(FIXTURES[0]) as { run: { result: Record<string, unknown> } };
    delete broken.run.result.allocation;
    expect(() => readPlanSnapshot("p-1", broken)).toThrow(PlanSnapshotError);
    expect(() => readPlanSnapshot("p-1", broken)).toThrow(/run\.result\.allocation/);
    const planId = await planWith(FIXTURES[0]);
    await sql`update plans set snapshot = snapshot #- '{run,result,conditions}' where id = ${planId}`.execute(db);
    await expect(getPlan(db, w.users.planner, w.basinId, planId)).rejects.toThrow(/run\.result\.conditions/);
  });

  it("is written with its version by every new proposal", async () => {
    const { planId } = await planAt(db, w, "draft", { revises: null });
    expect((await getPlan(db, w.users.planner, w.basinId, planId)).snapshot.snapshotVersion).toBe(PLAN_SNAPSHOT_VERSION);
  });
});
