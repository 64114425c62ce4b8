import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { allocate, runModel } from "@/lib/model";
import { LB_TO_KG, MI_TO_KM } from "@/lib/model/units";
import { csvText, NOTES_HEADER } from "@/lib/reports/csv-text";
import { PLANNING_CAUTION } from "@/lib/results/caution";
import { allocationCsv, allocationRows, profileCsv } from "@/lib/results/csv-rows";
import { profileSeries } from "@/lib/results/profile-series";
import { chainFile, example } from "./fixtures";

/** The file downloadCsv and the plan's CSV route write, read back by papaparse with one header row. */
const read = (text: string) => Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true });

describe("allocation CSV", () => {
  const model = example("tamsel-river-allocate");
  const allocation = allocate(model);

  it("one header row, a row per facility, the planning caution then the context in the Notes column", () => {
    const t = allocationCsv(allocation, model, "SI", ["Basin Tamsel (demo)"], { "DP-1001": "Quillford Water Reclamation Plant" });
    const p = read(csvText(t));
    expect(p.errors).toEqual([]);
    expect(p.meta.fields).toEqual([...t.columns.map((c) => c.header), NOTES_HEADER]);
    expect(p.meta.fields!.slice(0, 2)).toEqual(["Permit id", "Facility name"]);
    // as many data rows as facilities (the notes fit beside them), or one more line of notes at most
    expect(p.data.length).toBe(Math.max(allocation.allocations.length, 1));
    const notes = p.data.map((r) => r[NOTES_HEADER]).filter(Boolean).join(" ");
    for (const c of PLANNING_CAUTION) expect(notes).toContain(c);
    expect(p.data[0][NOTES_HEADER]).toBe(PLANNING_CAUTION[0]);
    expect(notes).toContain("Basin Tamsel (demo)");
    expect(notes).toContain("Objective: Most total load");
    expect(notes).not.toMatch(/max-total/);
  });

  it("joins each facility's design flow and gives loads in kg/d or lb/d", () => {
    const rows = allocationRows(allocation, model);
    for (const r of rows) expect(r.design_flow_m3_s).toBe(model.dischargers.find((d) => d.id === r.id)!.flow_m3_s);
    const si = allocationCsv(allocation, model, "SI");
    const us = allocationCsv(allocation, model, "US");
    const cbodu = si.columns.findIndex((c) => c.header === "Allocated CBODu (kg/d)");
    expect(us.columns[cbodu].header).toBe("Allocated CBODu (lb/d)");
    const reduction = si.columns.findIndex((c) => c.header === "Reduction from today (%)");
    for (const r of si.rows) {
      const kg = si.columns[cbodu].value(r) as number;
      const lb = us.columns[cbodu].value(r) as number;
      expect(kg).toBeCloseTo(r.cbodu_kg_day, 2);
      // 1 lb = 0.45359237 kg (exact by definition)
      expect(lb * LB_TO_KG).toBeCloseTo(r.cbodu_kg_day, 1);
      // exports keep loads to 0.01 and percentages to 0.01 (EXPORT_PRECISION), never -0
      expect(kg).toBe(Number(r.cbodu_kg_day.toFixed(2)));
      const pct = si.columns[reduction].value(r);
      expect(pct).toBe(r.reduction_pct === null ? "" : Number(r.reduction_pct.toFixed(2)) || 0);
      expect(Object.is(pct, -0)).toBe(false);
    }
  });
});

describe("profile CSV", () => {
  it("lists every point of the path in the basin's distance unit, anoxic as a word", () => {
    const f = chainFile();
    f.dischargers[0].cbodu_mg_l = 4000;
    const s = profileSeries(runModel(f), f, "R1", "US");
    const t = profileCsv(s);
    expect(t.notes[t.notes.length - 1]).toBe("Path: R1 → R2 → R3; criterion 5 mg/L");
    expect(t.columns[1].header).toBe("Distance along path (mi)");
    const p = read(csvText(t));
    expect(p.errors).toEqual([]);
    expect(p.data).toHaveLength(s.points.length);
    const body = p.data;
    expect(body.some((r) => r["DO (mg/L)"] === "anoxic")).toBe(true);
    for (const r of body) expect(r["DO (mg/L)"].startsWith("-")).toBe(false);
    // DO to 0.001 mg/L in exports: no float noise
    for (const r of body) if (r["DO (mg/L)"] !== "anoxic") expect(r["DO (mg/L)"]).toMatch(/^\d+(\.\d{1,3})?$/);
    // R2's head is 3 km down the path: "from reach head" restarts at 0 there
    const r2 = body.filter((r) => r.Reach === "R2");
    expect(Number(r2[0]["From reach head (mi)"])).toBe(0);
    expect(Number(r2[0]["Distance along path (mi)"])).toBeCloseTo(3 / MI_TO_KM, 3);
  });

  it("says which condition it holds, in a column and in the preface", () => {
    const f = chainFile();
    const s = profileSeries(runModel(f), f, "R1");
    const t = profileCsv(s, ["Tamsel"], "Hot, dry 7Q10");
    expect(t.notes).toContain("Condition: Hot, dry 7Q10");
    const p = read(csvText(t));
    expect(p.meta.fields![0]).toBe("Condition");
    for (const r of p.data) expect(r.Condition).toBe("Hot, dry 7Q10");
    expect(profileCsv(s).columns[0].header).toBe("Reach");
  });
});
