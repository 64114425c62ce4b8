import Papa from "papaparse";
import { describe, expect, it } from "vitest";
import { allocate, runModel } from "@/lib/model";
import { LB_TO_KG, MI_TO_KM } from "@/lib/model/units";
import { PLANNING_CAUTION } from "@/lib/results/caution";
import { allocationCsv, allocationRows, profileCsv } from "@/lib/results/csv-rows";
import { profileSeries } from "@/lib/results/profile-series";
import { chainFile, example } from "./fixtures";

/** The same text downloadCsv makes: `# ` preface lines, then papaparse's CSV. */
function text<T>(t: { preface: string[]; columns: Array<{ header: string; value: (r: T) => unknown }>; rows: T[] }): string {
  const body = Papa.unparse({ fields: t.columns.map((c) => c.header), data: t.rows.map((r) => t.columns.map((c) => c.value(r) ?? "")) });
  return [...t.preface.map((l) => `# ${l}`), body].join("\r\n");
}

describe("allocation CSV", () => {
  const model = example("tamsel-river-allocate");
  const allocation = allocate(model);

  it("starts with the planning caution as # lines, then the context", () => {
    const t = allocationCsv(allocation, model, "SI", ["Basin Tamsel (demo)"]);
    const lines = text(t).split("\r\n");
    PLANNING_CAUTION.forEach((c, i) => expect(lines[i]).toBe(`# ${c}`));
    expect(lines[PLANNING_CAUTION.length]).toBe("# Basin Tamsel (demo)");
    expect(lines[PLANNING_CAUTION.length + 2].split(",")[0]).toBe("facility");
    expect(lines).toHaveLength(PLANNING_CAUTION.length + 2 + 1 + allocation.allocations.length);
  });

  it("joins each facility's design flow and gives loads in kg/d or lb/d", () => {
    const rows = allocationRows(allocation, model);
    for (const r of rows) expect(r.design_flow_m3_s).toBe(model.dischargers.find((d) => d.id === r.id)!.flow_m3_s);
    const si = allocationCsv(allocation, model, "SI");
    const us = allocationCsv(allocation, model, "US");
    expect(si.columns[1].header).toBe("allocated CBODu (kg/d)");
    expect(us.columns[1].header).toBe("allocated CBODu (lb/d)");
    for (const r of si.rows) {
      const kg = si.columns[1].value(r) as number;
      const lb = us.columns[1].value(r) as number;
      expect(kg).toBeCloseTo(r.cbodu_kg_day, 2);
      // 1 lb = 0.45359237 kg (exact by definition)
      expect(lb * LB_TO_KG).toBeCloseTo(r.cbodu_kg_day, 1);
      expect(si.columns[5].value(r)).toBe(r.reduction_pct === null ? "" : Number(r.reduction_pct.toFixed(1)));
    }
  });
});

describe("profile CSV", () => {
  it("lists every point of the path in the basin's distance unit, anoxic as a word", () => {
    const f = chainFile();
    f.dischargers[0].cbodu_mg_l = 4000;
    const s = profileSeries(runModel(f), f, "R1", "US");
    const t = profileCsv(s);
    expect(t.preface[t.preface.length - 1]).toBe("Path: R1 → R2 → R3; criterion 5 mg/L");
    expect(t.columns[1].header).toBe("distance along path (mi)");
    const parsed = Papa.parse<string[]>(text(t), { comments: "#", skipEmptyLines: true }).data;
    expect(parsed).toHaveLength(1 + s.points.length);
    const doCol = parsed[0].indexOf("DO (mg/L)");
    const body = parsed.slice(1);
    expect(body.some((r) => r[doCol] === "anoxic")).toBe(true);
    for (const r of body) expect(r[doCol].startsWith("-")).toBe(false);
    // R2's head is 3 km down the path: "from reach head" restarts at 0 there
    const r2 = body.filter((r) => r[0] === "R2");
    expect(Number(r2[0][3])).toBe(0);
    expect(Number(r2[0][1])).toBeCloseTo(3 / MI_TO_KM, 3);
  });

  it("says which condition it holds, in a column and in the preface", () => {
    const f = chainFile();
    const s = profileSeries(runModel(f), f, "R1");
    const t = profileCsv(s, ["Tamsel"], "Hot, dry 7Q10");
    expect(t.preface).toContain("Condition: Hot, dry 7Q10");
    const parsed = Papa.parse<string[]>(text(t), { comments: "#", skipEmptyLines: true }).data;
    expect(parsed[0][0]).toBe("condition");
    for (const r of parsed.slice(1)) expect(r[0]).toBe("Hot, dry 7Q10");
    expect(profileCsv(s).columns[0].header).toBe("reach");
  });
});
