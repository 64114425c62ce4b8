import { describe, expect, it } from "vitest";
import { runModel } from "@/lib/model";
import { MI_TO_KM } from "@/lib/model/units";
import { anoxicStretches, downstreamOf, profileOverlay, profileSeries } from "@/lib/results/profile-series";
import { chainFile, example } from "./fixtures";

describe("DO-versus-distance series", () => {
  const f = chainFile();
  const run = runModel(f);

  it("places reaches, dischargers and points on one distance axis from the path head (km)", () => {
    const s = profileSeries(run, f, "R1", "SI");
    expect(s.unit).toBe("km");
    expect(s.path).toEqual(["R1", "R2", "R3"]);
    // R1 3 km, R2 4 km, R3 5 km: heads at 0, 3, 7; path length 12
    expect(s.reaches).toEqual([
      { id: "R1", from: 0, to: 3 },
      { id: "R2", from: 3, to: 7 },
      { id: "R3", from: 7, to: 12 },
    ]);
    expect(s.length).toBe(12);
    expect(s.dischargers).toEqual([{ id: "F1", reach: "R2", km: 1.5, distance: 4.5 }]);
    // distance from the head + distance to the outlet = the whole path, at every point
    for (const p of s.points) expect(p.distance + p.to_outlet).toBeCloseTo(12, 9);
    expect(s.points[0].distance).toBe(0);
    expect(s.points[s.points.length - 1].distance).toBe(12);
    for (const p of s.points) expect(p.criterion_mg_l).toBe(5);
  });

  it("gives the same axis in miles (1 mi = 1.609344 km)", () => {
    const km = profileSeries(run, f, "R1", "SI");
    const mi = profileSeries(run, f, "R1", "US");
    expect(mi.unit).toBe("mi");
    expect(mi.length).toBeCloseTo(12 / MI_TO_KM, 12);
    mi.points.forEach((p, i) => expect(p.distance * MI_TO_KM).toBeCloseTo(km.points[i].distance, 9));
    expect(mi.dischargers[0].distance).toBeCloseTo(4.5 / MI_TO_KM, 12);
  });

  it("starts a side path at its own head", () => {
    const s = profileSeries(run, f, "S1");
    expect(s.path).toEqual(["S1", "R3"]);
    expect(s.reaches[1]).toEqual({ id: "R3", from: 2, to: 7 });
    expect(s.dischargers).toEqual([]);
  });

  it("carries each reach's exact critical point, inside its reach and no higher than its profile points", () => {
    const s = profileSeries(run, f, "R1");
    for (const c of s.criticals) {
      const span = s.reaches.find((r) => r.id === c.reach)!;
      expect(c.distance).toBeGreaterThanOrEqual(span.from);
      expect(c.distance).toBeLessThanOrEqual(span.to);
      const pts = s.points.filter((p) => p.reach === c.reach);
      expect(c.do_mg_l).toBeLessThanOrEqual(Math.min(...pts.map((p) => p.do_mg_l)) + 1e-12);
    }
  });

  it("is monotone in distance along every path of the demo basin, with saturation ≥ DO shown ≥ 0", () => {
    const demo = example("tamsel-river");
    const demoRun = runModel(demo);
    for (const r of demo.reaches) {
      const s = profileSeries(demoRun, demo, r.id, "US");
      for (let i = 1; i < s.points.length; i++) expect(s.points[i].distance).toBeGreaterThanOrEqual(s.points[i - 1].distance);
      for (let i = 1; i < s.points.length; i++) expect(s.points[i].to_outlet).toBeLessThanOrEqual(s.points[i - 1].to_outlet + 1e-12);
      for (const p of s.points) {
        expect(p.do_shown_mg_l).toBeGreaterThanOrEqual(0);
        expect(p.do_sat_mg_l).toBeGreaterThanOrEqual(p.do_shown_mg_l);
      }
      expect(s.points[s.points.length - 1].to_outlet).toBeCloseTo(0, 9);
      // the outlet reach's critical point is on this path's axis too
      expect(s.criticals.map((c) => c.reach)).toEqual(s.path);
    }
  });

  it("shows anoxic water at zero and flags it", () => {
    const f2 = chainFile();
    f2.dischargers[0].cbodu_mg_l = 4000; // far more than the river can carry
    const s = profileSeries(runModel(f2), f2, "R1");
    const anoxic = s.points.filter((p) => p.anoxic);
    expect(anoxic.length).toBeGreaterThan(0);
    for (const p of anoxic) {
      expect(p.do_mg_l).toBeLessThan(0);
      expect(p.do_shown_mg_l).toBe(0);
    }
    expect(s.criticals.some((c) => c.anoxic && c.do_shown_mg_l === 0)).toBe(true);
  });

  it("throws for a reach the run does not hold", () => {
    const partial = { ...run, reaches: run.reaches.filter((r) => r.id !== "R3") };
    expect(() => profileSeries(partial, f, "R1")).toThrow(/R3/);
  });
});

describe("anoxic stretches", () => {
  const pt = (distance: number, anoxic: boolean) => ({ distance, anoxic });
  it("groups consecutive anoxic points", () => {
    const points = [pt(0, false), pt(1, true), pt(2, true), pt(3, false), pt(4, true)];
    expect(anoxicStretches({ points } as never)).toEqual([
      { from: 1, to: 2 },
      { from: 4, to: 4 },
    ]);
    expect(anoxicStretches({ points: [pt(0, false)] } as never)).toEqual([]);
  });
});

describe("the stretch below an outfall", () => {
  const f = chainFile();
  const run = runModel(f);
  const full = profileSeries(run, f, "R1", "SI");

  it("starts at the outfall (distance 0) and keeps every point below it, shifted", () => {
    const { series, lowest } = downstreamOf(full, "F1");
    // F1 is 1.5 km into R2, which starts 3 km down the path: the outfall sits at 4.5
    const below = full.points.filter((p) => p.distance >= 4.5);
    expect(series.points).toHaveLength(below.length);
    series.points.forEach((p, i) => {
      expect(p.distance).toBeCloseTo(below[i].distance - 4.5, 12);
      expect(p.do_mg_l).toBe(below[i].do_mg_l);
    });
    expect(series.points[0].distance).toBeCloseTo(0, 12);
    expect(series.length).toBeCloseTo(12 - 4.5, 12);
    expect(series.origin).toBe("outfall F1");
    expect(series.reaches.map((r) => r.id)).toEqual(["R2", "R3"]);
    expect(series.reaches[0]).toEqual({ id: "R2", from: 0, to: 2.5 });
    expect(series.dischargers).toEqual([{ id: "F1", reach: "R2", km: 1.5, distance: 0 }]);
    // the lowest DO below the outfall is the minimum over exactly those points
    expect(lowest!.do_mg_l).toBe(Math.min(...below.map((p) => p.do_mg_l)));
    // R1's critical point lies above the outfall and is dropped
    expect(series.criticals.every((c) => c.reach !== "R1")).toBe(true);
  });

  it("refuses a discharger that is not on the path", () => {
    expect(() => downstreamOf(full, "NOPE")).toThrow(/not on the path/);
  });
});

describe("profiles of several runs overlaid", () => {
  it("puts each run on the same path and axis, with its lowest DO, and skips a run without the start reach", () => {
    const run = runModel;
    const chain = chainFile;
    const series = profileSeries;
        const a = chain();
    const b = chain();
    b.dischargers[0].cbodu_mg_l = 120;
    // another network where the first reach is called Q1
    const other = chain();
    other.reaches[0].id = "Q1";
    other.headwaters[0].reach = "Q1";
    const o = profileOverlay(
      [
        { label: "today", condition: "c", run: run(a), model: a },
        { label: "double load", condition: "c", run: run(b), model: b },
        { label: "no R1", condition: "c", run: run(other), model: other },
      ],
      "R1",
    );
    expect(o.path).toEqual(["R1", "R2", "R3"]);
    expect(o.lines.map((l) => l.label)).toEqual(["today", "double load"]);
    expect(o.skipped).toEqual(["no R1"]);
    expect(o.criteria_mg_l).toEqual([5]);
    const sa = series(run(a), a, "R1");
    // every profile point is on the line, and the lowest is the run's exact minimum on the path
    expect(o.lines[0].points.length).toBeGreaterThanOrEqual(sa.points.length);
    const exactMin = Math.min(...sa.criticals.map((c) => c.do_mg_l));
    expect(o.lines[0].lowest.do_mg_l).toBeCloseTo(exactMin, 12);
    // more load never raises DO (monotonicity, MODEL.md §7)
    expect(o.lines[1].lowest.do_mg_l).toBeLessThan(o.lines[0].lowest.do_mg_l);
    for (let i = 1; i < o.lines[0].points.length; i++) expect(o.lines[0].points[i].distance).toBeGreaterThanOrEqual(o.lines[0].points[i - 1].distance);
  });
});
