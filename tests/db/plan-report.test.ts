import { execFileSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import * as csvRoute from "@/app/api/basins/[basinId]/plans/[planId]/csv/route";
import * as geojsonRoute from "@/app/api/basins/[basinId]/plans/[planId]/geojson/route";
import * as reportRoute from "@/app/api/basins/[basinId]/plans/[planId]/report/route";
import { findBasinById, updateBasin } from "@/db/queries/basins";
import { AppError } from "@/lib/errors";
import Papa from "papaparse";
import { formatIn } from "@/lib/format/quantities";
import { NOTES_HEADER } from "@/lib/reports/csv-text";
import { dischargersFile, piecesFile, reachesFile } from "../unit/results/export-layouts";
import { formatDay } from "@/lib/format/zoned-time";
import { PLANNING_CAUTION } from "@/lib/results/caution";
import { planReachesGeoJson, planReportPdf } from "@/lib/services/plan-reports";
import { resetPublishedCache } from "@/lib/services/published-cache";
import { addComment, closeDueReviews, getPlan, publishPlan, respondToThread } from "@/lib/services/plans";
import { callRoute } from "../support/call-route";
import { err } from "../support/errors";
import { planAt } from "../support/plan-fixture";
import { fileDb } from "../support/file-db";
import { buildWorld, type World } from "../support/world";
import { scoped } from "../support/scoped";

const db = fileDb();
let dir: string;
beforeAll(async () => {
  dir = mkdtempSync(join(tmpdir(), "sagline-report-"));
});
afterAll(async () => {
  rmSync(dir, { recursive: true, force: true });
});

/** The text of a PDF as poppler's pdftotext reads it, white space collapsed. */
function pdfText(bytes: Uint8Array, name: string): string {
  const file = join(dir, `${name}.pdf`);
  writeFileSync(file, bytes);
  return execFileSync("pdftotext", ["-enc", "UTF-8", file, "-"], { encoding: "utf8" }).replace(/\s+/g, " ");
}

const exportEvents = (planId: string) =>
  db.selectFrom("audit_events").select(["actor_id", "details"]).where("action", "=", "plan.exported").where("target_id", "=", planId).execute();

describe("the report of a published plan (US units) with a comment and its response", () => {
  let w: World;
  let planId: string;
  const COMMENT = "Please phase the Lower Brack reduction over two permit cycles.";
  const RESPONSE = "Agreed in part: the permit schedule allows two steps; the final load is unchanged.";

  beforeAll(async () => {
    w = await buildWorld(db);
    await updateBasin(db, w.basinId, { unit_system: "US" });
    const p = await planAt(db, w, "review");
    planId = p.planId;
    const facilityThread = p.threads.find((t) => t.facility_id !== null)!.id;
    await scoped(addComment)(db, w.users.stakeholder, w.basinId, facilityThread, COMMENT);
    await scoped(respondToThread)(db, w.users.planner, w.basinId, facilityThread, RESPONSE);
    await closeDueReviews(db, new Date(Date.now() + 32 * 86_400_000));
    await scoped(publishPlan)(db, w.users.lead, w.basinId, planId);
  }, 120_000);

  it("downloads signed out as an attachment named after the basin and version", async () => {
    const res = await callRoute(reportRoute.GET, "GET", { params: { basinId: w.basinId, planId } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/pdf");
    const basin = (await findBasinById(db, w.basinId))!;
    const plan = await getPlan(db, null, w.basinId, planId);
    expect(res.headers.get("content-disposition")).toBe(`attachment; filename="${basin.slug}-plan-v${plan.version}.pdf"`);
  });

  it("prints title, status, cautions, allocations in the basin's unit, TMDL, methods and the responsiveness summary", async () => {
    const plan = await getPlan(db, null, w.basinId, planId);
    const pdf = await planReportPdf(db, null, w.basinId, planId);
    expect(Buffer.from(pdf.body as Uint8Array).subarray(0, 5).toString()).toBe("%PDF-");
    const text = pdfText(pdf.body as Uint8Array, "published");
    expect(text).toContain(plan.title);
    // the date as it falls in the basin's zone (its first review's, America/Chicago)
    expect(text).toContain(`Published ${formatDay(new Date(plan.publishedAt!), "America/Chicago")}`);
    expect(text).toContain("Dates and times in this report are in America/Chicago.");
    expect(text).not.toContain("DRAFT");
    for (const line of PLANNING_CAUTION) expect(text).toContain(line);
    // loads in lb/d, never kg/d; each facility's row: name, permit, (the rest of a wrapped name,) design flow, then its allocated CBODu as formatted
    expect(text).toContain("CBODu (lb/d)");
    expect(text).not.toContain("kg/d");
    for (const a of plan.allocations) {
      const load = formatIn("load", a.cboduKgDay, "US");
      expect(text).toContain(a.facilityName.split(" ").slice(0, 2).join(" "));
      expect(text, a.facilityName).toMatch(new RegExp(`${a.permitId}(?: [A-Za-z]+)* \\d+\\.\\d+ ${load.replace(".", "\\.")} `));
    }
    expect(text).toContain("TMDL = ΣWLA + ΣLA + MOS + reserve");
    expect(text).toContain("Methods and parameters");
    expect(text).toContain("Chosen per reach by depth and velocity");
    expect(text).toMatch(/Reaeration formulas used (O'Connor–Dobbins|Churchill–Elmore–Buckingham|Owens–Edwards–Gibbs|Tsivoglou–Neal|Given rate coefficient) \(\d+ reach/);
    expect(text).toContain((plan.snapshot as { run: { modelVersion: string } }).run.modelVersion);
    expect(text).toContain("Most total load");
    expect(text).toContain(COMMENT);
    expect(text).toContain(RESPONSE);
    expect(text).toMatch(new RegExp(`${w.users.stakeholder.name} \\(stakeholder\\), \\d{1,2} \\w{3} \\d{4}, \\d{2}:\\d{2} C[SD]T`));
    expect(text).toContain(`Response by ${w.users.planner.name}`);
    // the caution on the first page and in every page's footer
    const pages = Number(/Page 1 of (\d+)/.exec(text)![1]);
    expect(text.split(PLANNING_CAUTION[1]).length - 1).toBe(pages + 1);
  });

  it("never leaves the Methods and parameters heading at the foot of a page: its first group is on the same page", async () => {
    const pdf = await planReportPdf(db, null, w.basinId, planId);
    const file = join(dir, "methods.pdf");
    writeFileSync(file, pdf.body as Uint8Array);
    // pdftotext separates pages with a form feed
    const pages = execFileSync("pdftotext", ["-enc", "UTF-8", file, "-"], { encoding: "utf8" }).split("\f");
    const page = pages.find((p) => p.includes("Methods and parameters"))!;
    expect(page).toBeDefined();
    const after = page.slice(page.indexOf("Methods and parameters"));
    expect(after).toContain("Model and scenario");
    expect(after).toContain("Model version");
  });

  it("is rendered once for a published plan and served from storage after that, also to requests arriving together", async () => {
    await db.deleteFrom("plan_report_files").where("plan_id", "=", planId).execute();
    // and the copy this process keeps in memory (lib/services/published-cache.ts), so that storage is what is tested
    resetPublishedCache();
    const together = await Promise.all([1, 2, 3, 4].map(() => planReportPdf(db, null, w.basinId, planId)));
    const stored = await db.selectFrom("plan_report_files").select(["pdf", "created_at"]).where("plan_id", "=", planId).execute();
    expect(stored).toHaveLength(1);
    for (const p of together) expect(Buffer.from(p.body as Uint8Array).equals(stored[0].pdf)).toBe(true);
    // a later request is the stored file byte for byte (a fresh rendering would differ in its creation date)
    const later = await planReportPdf(db, null, w.basinId, planId, new Date(Date.now() + 86_400_000));
    expect(Buffer.from(later.body as Uint8Array).equals(stored[0].pdf)).toBe(true);
  });

  it("is a public copy: exporting a published plan records no audit event", async () => {
    await planReportPdf(db, w.users.stakeholder, w.basinId, planId);
    expect(await exportEvents(planId)).toEqual([]);
  });

  it("GeoJSON: each layer is one kind of feature in its documented layout; reaches carry their DO, dischargers their facility and allocation", async () => {
    const res = await callRoute(geojsonRoute.GET, "GET", { params: { basinId: w.basinId, planId } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("application/geo+json");
    expect(res.headers.get("content-disposition")).toMatch(/-plan-v1-reaches\.geojson"/);
    const json = reachesFile.parse(res.json);
    expect((json.plan as { status: string }).status).toBe("published");
    expect(json.caution.slice(0, 2)).toEqual([...PLANNING_CAUTION]);
    const plan = await getPlan(db, null, w.basinId, planId);
    const runReaches = (plan.snapshot as { run: { result: { conditions: { run: { reaches: { id: string; critical: { do_mg_l: number } }[] } }[] } } }).run.result.conditions[0].run.reaches;
    expect(json.features.map((f) => f.properties.id).sort()).toEqual(runReaches.map((r) => r.id).sort());
    for (const f of json.features) {
      const r = runReaches.find((x) => x.id === f.properties.id)!;
      expect(f.properties.min_do_mg_l).toBe(Number(r.critical.do_mg_l.toFixed(3)));
      // a US basin: lengths in miles
      expect(f.properties).toHaveProperty("length_mi");
    }

    const d = await callRoute(geojsonRoute.GET, "GET", { params: { basinId: w.basinId, planId }, query: { layer: "dischargers" } });
    expect(d.status).toBe(200);
    expect(d.headers.get("content-disposition")).toMatch(/-plan-v1-dischargers\.geojson"/);
    const dischargers = dischargersFile.parse(d.json);
    expect(dischargers.features.map((f) => f.properties.permit_id).sort()).toEqual(plan.allocations.map((a) => a.permitId).sort());
    for (const a of plan.allocations) {
      const f = dischargers.features.find((x) => x.properties.permit_id === a.permitId)!;
      expect(f.properties.facility_name).toBe(a.facilityName);
      // lb/d to 0.01 (1 lb = 0.45359237 kg)
      expect(f.properties.allocated_cbodu_lb_d).toBe(Number((a.cboduKgDay / 0.45359237).toFixed(2)));
    }

    const p = await callRoute(geojsonRoute.GET, "GET", { params: { basinId: w.basinId, planId }, query: { layer: "pieces" } });
    const pieces = piecesFile.parse(p.json);
    expect(pieces.features.length).toBeGreaterThan(json.features.length);
    const bad = await callRoute(geojsonRoute.GET, "GET", { params: { basinId: w.basinId, planId }, query: { layer: "everything" } });
    expect(bad.status).toBe(422);
    expect(err(bad.json).details![0].path).toBe("layer");
  });

  it("GeoJSON names the condition it holds (the governing one by default) and lists every condition; an unknown one is refused naming the field", async () => {
    const plan = await getPlan(db, null, w.basinId, planId);
    const names = (plan.snapshot as { run: { result: { conditions: { name: string }[] } } }).run.result.conditions.map((c) => c.name);
    const byDefault = JSON.parse((await planReachesGeoJson(db, null, w.basinId, planId)).body as string);
    expect(names).toContain(byDefault.plan.condition);
    expect(byDefault.plan.conditions.map((c: { name: string }) => c.name)).toEqual(names);
    for (const f of byDefault.features) expect(f.properties.condition).toBe(byDefault.plan.condition);
    const named = JSON.parse((await planReachesGeoJson(db, null, w.basinId, planId, names[0])).body as string);
    expect(named.plan.condition).toBe(names[0]);
    const e = await planReachesGeoJson(db, null, w.basinId, planId, "No such condition").catch((x: unknown) => x);
    expect(e).toBeInstanceOf(AppError);
    expect((e as AppError).status).toBe(422);
    expect(((e as AppError).details as { path: string }[])[0].path).toBe("condition");
    // through the route: ?condition= picks one, an unknown one is a 422 naming it
    const viaRoute = await callRoute(geojsonRoute.GET, "GET", { params: { basinId: w.basinId, planId }, query: { condition: names[0] } });
    expect(viaRoute.status).toBe(200);
    expect((viaRoute.json as { plan: { condition: string } }).plan.condition).toBe(names[0]);
    const unknown = await callRoute(geojsonRoute.GET, "GET", { params: { basinId: w.basinId, planId }, query: { condition: "No such condition" } });
    expect(unknown.status).toBe(422);
    expect(err(unknown.json).details![0].path).toBe("condition");
  });

  it("CSV: one header row a spreadsheet and papaparse read alike, a row per facility in lb/d, the caution in the Notes column", async () => {
    const res = await callRoute(csvRoute.GET, "GET", { params: { basinId: w.basinId, planId } });
    expect(res.status).toBe(200);
    const text = res.json as string;
    expect(res.headers.get("content-disposition")).toMatch(/-plan-v1-allocations\.csv"/);
    // no comment lines: the first line is the header a spreadsheet shows as its first row
    for (const line of text.split("\r\n")) expect(line.startsWith("#")).toBe(false);
    const p = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });
    expect(p.errors).toEqual([]);
    expect(p.meta.fields).toEqual([
      "Permit id",
      "Facility name",
      "Design flow (cfs)",
      "Allocated CBODu (lb/d)",
      "Allocated BOD5 (lb/d)",
      "Effluent BOD5 at design flow (mg/L)",
      "Today's CBODu (lb/d)",
      "Reduction from today (%)",
      "CBODu/BOD5 ratio",
      "Floor (lb/d)",
      "Ceiling (lb/d)",
      NOTES_HEADER,
    ]);
    const plan = await getPlan(db, null, w.basinId, planId);
    expect(p.data).toHaveLength(plan.allocations.length);
    for (const a of plan.allocations) {
      const row = p.data.find((r) => r["Permit id"] === a.permitId)!;
      expect(row["Facility name"]).toBe(a.facilityName);
      // loads in lb/d to 0.01 (1 lb = 0.45359237 kg)
      expect(Number(row["Allocated CBODu (lb/d)"])).toBe(Number((a.cboduKgDay / 0.45359237).toFixed(2)));
    }
    const notes = p.data.map((r) => r[NOTES_HEADER]).filter(Boolean);
    expect(notes.slice(0, 2)).toEqual([...PLANNING_CAUTION]);
    const all = notes.join(" ");
    expect(all).toMatch(/Published /);
    expect(all).toMatch(/Design condition/);
    // the basin is named once, also when the plan's title starts with it
    expect(all).not.toMatch(/(.+): \1:/);
  });

});

describe("the report of a draft", () => {
  let w: World;
  let planId: string;
  beforeAll(async () => {
    w = await buildWorld(db);
    planId = (await planAt(db, w, "draft")).planId;
  }, 120_000);

  it("is refused to anyone who may not read the draft", async () => {
    for (const route of [reportRoute, geojsonRoute, csvRoute]) {
      const anon = await callRoute(route.GET, "GET", { params: { basinId: w.basinId, planId } });
      expect(anon.status).toBe(401);
      for (const who of ["stakeholder", "discharger", "outsider"] as const) {
        const res = await callRoute(route.GET, "GET", { userId: w.users[who].id, params: { basinId: w.basinId, planId } });
        expect(res.status, who).toBe(403);
        expect(err(res.json).code).toBe("forbidden");
      }
    }
    expect(await exportEvents(planId)).toEqual([]);
  });

  it("is marked DRAFT and its export by a planner is recorded", async () => {
    const res = await callRoute(reportRoute.GET, "GET", { userId: w.users.planner.id, params: { basinId: w.basinId, planId } });
    expect(res.status).toBe(200);
    expect(res.headers.get("content-disposition")).toMatch(/-plan-v\d+-draft\.pdf"$/);
    const events = await exportEvents(planId);
    expect(events).toHaveLength(1);
    expect(events[0]).toMatchObject({ actor_id: w.users.planner.id, details: { format: "pdf", status: "draft" } });

    const pdf = await planReportPdf(db, w.users.lead, w.basinId, planId);
    const text = pdfText(pdf.body as Uint8Array, "draft");
    expect(text).toContain("DRAFT — not published (draft)");
    expect(text).toContain("No comments were received on this plan.");
    expect(text).toContain("CBODu (kg/d)");
    expect(await exportEvents(planId)).toHaveLength(2);

    await callRoute(geojsonRoute.GET, "GET", { userId: w.users.lead.id, params: { basinId: w.basinId, planId } });
    await callRoute(csvRoute.GET, "GET", { userId: w.users.planner.id, params: { basinId: w.basinId, planId } });
    expect((await exportEvents(planId)).map((e) => (e.details as { format: string }).format).sort()).toEqual(["csv", "geojson", "pdf", "pdf"]);
  });
});
