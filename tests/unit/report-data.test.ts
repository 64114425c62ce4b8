import { describe, expect, it } from "vitest";
import { formatIn } from "@/lib/format/quantities";
import { allocate, runModel } from "@/lib/model";
import { planReport, type ReportPlanInput } from "@/lib/reports/plan-report-data";
import { PLANNING_CAUTION } from "@/lib/results/caution";
import { scenarioInputsSchema } from "@/lib/validation/scenario";
import { demoNetwork, example } from "./results/fixtures";

// The invented Tamsel basin's allocation example: its allocation and a model run of the file.
const allocated = example("tamsel-river-allocate");
const allocation = allocate(allocated);
const run = runModel(allocated);
const names: Record<string, string> = { "DP-1001": "Quillford Works", "DP-1002": "Marrowby Creamery", "DP-1003": "East Penhallow", "DP-1004": "Dunmere Mill", "DP-1005": "Harrowgate" };

function plan(status: string, threads: ReportPlanInput["threads"] = []): ReportPlanInput {
  return {
    title: "Tamsel DO plan",
    version: 3,
    status,
    createdAt: "2026-11-01T10:00:00.000Z",
    createdBy: "Planner",
    publishedAt: status === "published" ? "2026-11-20T15:30:00.000Z" : null,
    snapshot: {
      run: {
        id: "run-1",
        modelVersion: "sagline-model-1",
        inputsHash: "ab".repeat(32),
        methods: { reaeration: { A: ["owens-gibbs"], B: ["owens-gibbs", "oconnor-dobbins"] }, saturation: "sat method" },
        finishedAt: "2026-11-01T09:00:00.000Z",
        result: { warnings: [], conditions: [{ name: "Late summer low flow", run }], allocation },
        modelFiles: [{ name: "base", file: allocated }],
      },
      scenario: {
        id: "s1",
        name: "Basis",
        version: 2,
        inputs: scenarioInputsSchema.parse({ conditions: [{ name: "Late summer low flow", temperatureC: 25 }], allocation: { objective: "max-total", reserveFraction: 0.05 } }),
      },
    },
    allocations: allocation.allocations.map((a) => ({
      facilityName: names[a.id],
      permitId: a.id,
      cboduKgDay: a.cbodu_kg_day,
      bod5KgDay: a.bod5_kg_day,
      bod5MgL: a.bod5_mg_l,
      todayCboduKgDay: a.today_cbodu_kg_day,
      reductionPct: a.reduction_pct,
    })),
    review: null,
    threads,
  };
}

describe("planReport", () => {
  it("formats allocations, totals and TMDL in the basin's unit (US: lb/d, cfs)", () => {
    const r = planReport(plan("published"), { name: "Tamsel", unitSystem: "US" }, null);
    expect(r.allocations.columns).toContain("Allocated CBODu (lb/d)");
    expect(r.allocations.columns).toContain("Design flow (cfs)");
    const first = allocation.allocations.find((a) => a.id === "DP-1004")!;
    const row = r.allocations.rows.find((x) => x[1] === "DP-1004")!;
    expect(row[0]).toBe("Dunmere Mill");
    expect(row[3]).toBe(formatIn("load", first.cbodu_kg_day, "US"));
    // lb/d is 2.2046… × kg/d
    expect(Number(row[3])).toBeCloseTo(first.cbodu_kg_day * 2.20462262185, 1);
    // rows sorted by facility name
    expect(r.allocations.rows.map((x) => x[0])).toEqual(Object.values(names).sort((a, b) => a.localeCompare(b)));
    const total = allocation.allocations.reduce((s, a) => s + a.cbodu_kg_day, 0);
    expect(r.summary.find((x) => x.label === "Total allocated CBODu")!.value).toBe(`${formatIn("load", total, "US")} lb/d`);
    expect(r.tmdl!.rows.at(-1)).toEqual(["TMDL", "loading capacity at the design condition", formatIn("load", allocation.tmdl!.tmdl_kg_day, "US")]);
  });

  it("says published with its date, or DRAFT with the state", () => {
    const pub = planReport(plan("published"), { name: "Tamsel", unitSystem: "SI" }, null);
    expect(pub.published).toBe(true);
    expect(pub.statusLine).toBe("Published 20 Nov 2026");
    const review = planReport(plan("review"), { name: "Tamsel", unitSystem: "SI" }, null);
    expect(review.published).toBe(false);
    expect(review.statusLine).toBe("DRAFT — not published (in review)");
    expect(review.caution).toEqual(PLANNING_CAUTION);
  });

  it("lists the methods and parameters from the snapshot, in plain words", () => {
    const r = planReport(plan("published"), { name: "Tamsel", unitSystem: "US" }, null);
    const items = Object.fromEntries(r.methods.flatMap((m) => m.items.map((i) => [i.label, i.value])));
    // what the LP solved (the run's result), named in plain words
    expect(items["Objective"]).toBe("Most total load");
    expect(items["Reaeration method"]).toBe("Chosen per reach by depth and velocity");
    expect(items["Reaeration formulas used"]).toBe("Owens–Edwards–Gibbs (2 reaches); O'Connor–Dobbins (1 reach)");
    expect(items["Reserve capacity"]).toBe("5.0 %");
    expect(items["Late summer low flow"]).toBe("network design low flow × 1; temperature 77.0 °F");
    expect(items["Model version"]).toBe("sagline-model-1");
    expect(items["Scenario"]).toBe("Basis, version 2");
  });

  it("draws the profile from the farthest headwater and the map from the network lines", () => {
    const r = planReport(plan("published"), { name: "Tamsel", unitSystem: "SI" }, demoNetwork(allocated));
    expect(r.profile!.path.at(-1)).toBe(allocated.reaches.find((x) => x.downstream === null)!.id);
    expect(r.profile!.caption).toContain(r.profile!.path.join(" › "));
    expect(r.map!.lines.length).toBeGreaterThan(allocated.reaches.length);
    expect(planReport(plan("published"), { name: "Tamsel", unitSystem: "SI" }, null).map).toBeNull();
  });

  it("summarises the responses: the plan as a whole first, comments oldest first, silent threads left out", () => {
    const t = (facilityName: string | null, comments: { body: string; at: string }[], response: string | null) => ({
      facilityName,
      permitId: facilityName ? "DP-1" : null,
      status: response ? "addressed" : "open",
      response,
      responder: response ? "Ada Planner" : null,
      respondedAt: response ? "2026-11-10T12:00:00.000Z" : null,
      comments: comments.map((c) => ({ ...c, author: "Sam", role: "stakeholder" })),
    });
    const r = planReport(
      plan("closed", [
        t("Marrowby Creamery", [{ body: "later", at: "2026-11-05T10:00:00.000Z" }, { body: "earlier", at: "2026-11-04T10:00:00.000Z" }], "We agree."),
        t("Dunmere Mill", [], null),
        t(null, [{ body: "whole plan", at: "2026-11-06T08:15:00.000Z" }], null),
      ]),
      { name: "Tamsel", unitSystem: "SI" },
      null,
    );
    expect(r.responsiveness.map((x) => x.topic)).toEqual(["The plan as a whole", "Marrowby Creamery (DP-1)"]);
    expect(r.responsiveness[0].comments[0]).toEqual({ author: "Sam", role: "stakeholder", at: "6 Nov 2026, 08:15 UTC", body: "whole plan" });
    expect(r.responsiveness[1].comments.map((c) => c.body)).toEqual(["earlier", "later"]);
    expect(r.responsiveness[1]).toMatchObject({ response: "We agree.", responder: "Ada Planner", respondedAt: "10 Nov 2026, 12:00 UTC", acknowledged: null });
    expect(r.acknowledgement).toBeNull();
    // in the basin's zone, named (America/Chicago is UTC−6 in November: IANA rules)
    const chicago = planReport(plan("closed", [t(null, [{ body: "whole plan", at: "2026-11-06T08:15:00.000Z" }], null)]), { name: "Tamsel", unitSystem: "SI", timeZone: "America/Chicago" }, null);
    expect(chicago.responsiveness[0].comments[0].at).toBe("6 Nov 2026, 02:15 CST");
    expect(chicago.reviewLine).toBe("Dates and times in this report are in America/Chicago.");
  });

  it("prints the lead's acknowledgement of threads published without a response", () => {
    const thread = { id: "th-1", facilityName: null, permitId: null, status: "open", response: null, responder: null, respondedAt: null, comments: [{ body: "No answer came", at: "2026-11-06T08:15:00.000Z", author: "Sam", role: "stakeholder" }] };
    const ack = { by: "Maren Lead", at: "2026-11-20T15:00:00.000Z", statement: "Taken up in the next revision.", threads: [{ id: "th-1", topic: "The plan as a whole", comments: 1 }] };
    const r = planReport({ ...plan("published", [thread]), publicationAcknowledgement: ack }, { name: "Tamsel", unitSystem: "SI", timeZone: "America/Chicago" }, null);
    expect(r.acknowledgement).toBe('1 thread was published without a response (The plan as a whole). Maren Lead acknowledged this on 20 Nov 2026: "Taken up in the next revision."');
    expect(r.responsiveness[0].acknowledged).toBe('No response when the plan was published on 20 Nov 2026; acknowledged by Maren Lead: "Taken up in the next revision."');
  });

  it("refuses a snapshot without an allocation", () => {
    const p = plan("published");
    expect(() => planReport({ ...p, snapshot: { run: { result: { conditions: [] } } } }, { name: "T", unitSystem: "SI" }, null)).toThrow(/no allocation/);
  });
});

describe("planReport with several design conditions", () => {
  it("names the governing condition in the summary, the figures and a row per condition", async () => {
    const { runsAfterAllocation } = await import("@/lib/model");
    const file = example("tamsel-river-allocate");
    file.allocation!.reserve_fraction = 0;
    file.allocation!.conditions = [{ name: "Hot, dry 7Q10", temperature_c: 28 }];
    const al = allocate(file, { own_condition_name: "Design low flow" });
    const conditions = runsAfterAllocation(file, al, "Design low flow");
    const p = plan("published");
    const snap = p.snapshot as { run: { result: Record<string, unknown> } };
    snap.run.result = { warnings: [], conditions, allocation: al };
    const r = planReport(p, { name: "Tamsel", unitSystem: "SI" }, null);
    const hot = conditions[1].run.minimum;
    // the hot condition sits at the criterion and binds: it governs
    expect(hot.do_mg_l).toBeLessThan(conditions[0].run.minimum.do_mg_l);
    expect(r.summary.find((x) => x.label === "Lowest DO (governing condition)")!.value).toBe(`${hot.do_mg_l.toFixed(2)} mg/L in ${hot.reach} under “Hot, dry 7Q10”`);
    expect(r.conditions.rows.map((row) => [row[0], row[4]])).toEqual([
      ["Design low flow", "yes"],
      ["Hot, dry 7Q10 (governing)", "yes"],
    ]);
    expect(r.profile!.caption).toContain("under “Hot, dry 7Q10” (the governing condition)");
  });
});
