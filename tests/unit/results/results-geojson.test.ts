import type { Feature, LineString, Point, Position } from "geojson";
import { describe, expect, it } from "vitest";
import { runModel } from "@/lib/model";
import { exportPreface, PLANNING_CAUTION } from "@/lib/results/caution";
import { doBand } from "@/lib/results/do-scale";
import { MeasuredLine } from "@/lib/results/line-cut";
import { dischargersLayer, EXPORT_LAYERS, exportLayer, piecesLayer, reachesLayer, resultsGeoJson, type PieceProperties } from "@/lib/results/results-geojson";
import { dischargersFile, piecesFile, reachesFile } from "./export-layouts";
import { demoNetwork, example } from "./fixtures";

/** Planar distance (degrees) from a point to a polyline; enough to tell "on the line" at 1e-9°. */
function offLine(p: Position, line: Position[]): number {
  let best = Infinity;
  for (let i = 0; i + 1 < line.length; i++) {
    const [ax, ay] = line[i];
    const [bx, by] = line[i + 1];
    const dx = bx - ax;
    const dy = by - ay;
    const t = Math.max(0, Math.min(1, ((p[0] - ax) * dx + (p[1] - ay) * dy) / (dx * dx + dy * dy || 1)));
    best = Math.min(best, Math.hypot(p[0] - (ax + t * dx), p[1] - (ay + t * dy)));
  }
  return best;
}

describe("results GeoJSON of the demo basin", () => {
  const model = example("tamsel-river");
  const run = runModel(model);
  const network = demoNetwork(model);
  const fc = resultsGeoJson({ run, model, network });
  const lineOf = (id: string) => (network.features.find((f) => f.properties?.id === id)!.geometry as LineString).coordinates;
  const of = (kind: string) => fc.features.filter((f) => f.properties?.kind === kind);

  it("cuts every reach at its profile points; piece DO equals the points' DO", () => {
    for (const r of run.reaches) {
      const pieces = of("reach-piece").filter((f) => f.properties?.reach === r.id) as Feature<LineString, PieceProperties>[];
      const pairs = r.points.slice(1).map((b, i) => [r.points[i], b]).filter(([a, b]) => b.km > a.km);
      expect(pieces).toHaveLength(pairs.length);
      pieces.forEach((piece, i) => {
        const [a, b] = pairs[i];
        const p = piece.properties;
        expect([p.km_start, p.km_end]).toEqual([a.km, b.km]);
        expect(p.do_start_mg_l).toBe(a.do_mg_l);
        expect(p.do_end_mg_l).toBe(b.do_mg_l);
        expect(p.do_mg_l).toBe(Math.min(a.do_mg_l, b.do_mg_l));
        expect(p.band).toBe(doBand(p.do_mg_l, run.criterion_do_mg_l));
        expect(p.anoxic).toBe(false);
      });
      // the pieces join end to end and cover the whole drawn line
      const line = lineOf(r.id);
      const coords = pieces.map((p) => p.geometry.coordinates);
      expect(coords[0][0]).toEqual(line[0]);
      expect(coords[coords.length - 1][coords[coords.length - 1].length - 1]).toEqual(line[line.length - 1]);
      for (let i = 1; i < coords.length; i++) expect(coords[i][0]).toEqual(coords[i - 1][coords[i - 1].length - 1]);
      for (const c of coords) for (const p of c) expect(offLine(p, line)).toBeLessThan(1e-9);
    }
  });

  it("puts each reach's critical point on its reach line at its share of the length", () => {
    const crit = of("critical") as Feature<Point>[];
    expect(crit.map((f) => f.properties?.reach).sort()).toEqual(run.reaches.map((r) => r.id).sort());
    for (const f of crit) {
      const r = run.reaches.find((x) => x.id === f.properties?.reach)!;
      const line = lineOf(r.id);
      expect(offLine(f.geometry.coordinates, line)).toBeLessThan(1e-9);
      expect(f.properties?.do_mg_l).toBe(r.critical.do_mg_l);
      expect(f.properties?.below).toBe(r.critical.do_mg_l < run.criterion_do_mg_l);
      const m = new MeasuredLine(line);
      const lengthKm = model.reaches.find((x) => x.id === r.id)!.length_km;
      const along = new MeasuredLine([line[0], ...line.slice(1).filter((_, i) => m.cumulative[i + 1] < (r.critical.km / lengthKm) * m.lengthKm), f.geometry.coordinates]);
      expect(along.lengthKm / m.lengthKm).toBeCloseTo(r.critical.km / lengthKm, 6);
    }
  });

  it("places every discharger on its reach", () => {
    const ds = of("discharger") as Feature<Point>[];
    expect(ds.map((d) => d.properties?.id).sort()).toEqual(model.dischargers.map((d) => d.id).sort());
    for (const d of ds) expect(offLine(d.geometry.coordinates, lineOf(String(d.properties?.reach)))).toBeLessThan(1e-9);
  });

  it("leaves out reaches the network has no line for", () => {
    const some = { ...network, features: network.features.filter((f) => f.properties?.id !== "TR-01") };
    const part = resultsGeoJson({ run, model, network: some });
    expect(part.features.some((f) => f.properties?.reach === "TR-01")).toBe(false);
    expect(part.features.some((f) => f.properties?.reach === "TR-02")).toBe(true);
  });

  it("the reaches layer: one LineString per reach with its lowest DO, rounded, and the caution", () => {
    const out = reachesLayer({ run, model, network, caution: exportPreface("Tamsel demo"), system: "SI" });
    expect(reachesFile.parse(out)).toBeTruthy();
    expect(out.caution.slice(0, PLANNING_CAUTION.length)).toEqual([...PLANNING_CAUTION]);
    expect(out.features).toHaveLength(run.reaches.length);
    for (const f of out.features) {
      const r = run.reaches.find((x) => x.id === f.properties?.id)!;
      expect(f.properties?.min_do_mg_l).toBe(Number(r.critical.do_mg_l.toFixed(3)));
      expect(f.properties?.anoxic).toBe(r.anoxic);
      // the lowest point sits on the reach line
      expect(offLine([f.properties?.min_do_lon, f.properties?.min_do_lat], lineOf(r.id))).toBeLessThan(1e-6);
    }
    expect("condition" in out).toBe(false);
  });

  it("names the design condition it holds on the collection and on every reach", () => {
    const out = reachesLayer({ run, model, network, caution: [], condition: "Hot, dry 7Q10", system: "SI" });
    expect(out.condition).toBe("Hot, dry 7Q10");
    expect(out.features.length).toBeGreaterThan(0);
    for (const f of out.features) expect(f.properties?.condition).toBe("Hot, dry 7Q10");
  });

  it("the pieces layer holds only pieces, the dischargers layer only dischargers with name, permit id and allocation", () => {
    const pieces = piecesLayer({ run, model, network, caution: [], system: "SI" });
    expect(piecesFile.parse(pieces)).toBeTruthy();
    expect(pieces.features).toHaveLength(of("reach-piece").length);
    const allocations = model.dischargers.map((d, i) => ({
      permitId: d.id,
      facilityName: `Facility ${i}`,
      cboduKgDay: 100.123456,
      bod5KgDay: 68.5,
      bod5MgL: 29.96,
      todayCboduKgDay: 120,
      reductionPct: -0.0001,
    }));
    const us = dischargersLayer({ run, model, network, caution: [], system: "US" }, allocations);
    expect(dischargersFile.parse(us)).toBeTruthy();
    expect(us.units).toMatchObject({ lb_d: "lb/d", mi: "mi", cfs: "cfs" });
    expect(us.features.map((f) => f.properties?.permit_id).sort()).toEqual(model.dischargers.map((d) => d.id).sort());
    for (const f of us.features) {
      expect(f.properties?.facility_name).toMatch(/^Facility /);
      // 100.123456 kg/d / 0.45359237 = 220.7341… lb/d, to 0.01
      expect(f.properties?.allocated_cbodu_lb_d).toBe(220.73);
      expect(Object.is(f.properties?.reduction_pct, -0)).toBe(false);
      expect(f.properties?.reduction_pct).toBe(0);
      expect(offLine((f.geometry as Point).coordinates, lineOf(String(f.properties?.reach)))).toBeLessThan(1e-6);
    }
  });

  it("no property of any layer carries float noise: every number has at most its stated decimals", () => {
    for (const layer of EXPORT_LAYERS) {
      const out = exportLayer(layer, { run, model, network, caution: [], system: "SI" });
      for (const f of out.features)
        for (const [k, v] of Object.entries(f.properties ?? {})) if (typeof v === "number") expect(String(v), `${layer} ${k}`).toMatch(/^-?\d+(\.\d{1,7})?$/);
    }
  });
});

describe("anoxic reaches on the map", () => {
  it("flags pieces and critical points below zero as anoxic", () => {
    const model = example("tamsel-river");
    model.dischargers[0].bod5_mg_l = 3000; // an overloaded outfall on TR-03
    delete model.dischargers[0].cbodu_mg_l;
    const run = runModel(model);
    const anoxicReach = run.reaches.find((r) => r.anoxic);
    expect(anoxicReach).toBeDefined();
    const fc = resultsGeoJson({ run, model, network: demoNetwork(model) });
    const pieces = fc.features.filter((f) => f.properties?.kind === "reach-piece" && f.properties.anoxic);
    expect(pieces.length).toBeGreaterThan(0);
    for (const p of pieces) {
      expect(p.properties?.band).toBe("anoxic");
      expect(p.properties?.do_mg_l).toBeLessThan(0);
    }
    const c = fc.features.find((f) => f.properties?.kind === "critical" && f.properties.reach === anoxicReach!.id);
    expect(c?.properties?.anoxic).toBe(true);
  });
});
