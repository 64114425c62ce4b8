import type { Feature, LineString, Point, Position } from "geojson";
import { describe, expect, it } from "vitest";
import { runModel } from "@/lib/model";
import { exportPreface, PLANNING_CAUTION } from "@/lib/results/caution";
import { doBand } from "@/lib/results/do-scale";
import { MeasuredLine } from "@/lib/results/line-cut";
import { reachResultsExport, resultsGeoJson, type PieceProperties } from "@/lib/results/results-geojson";
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

  it("exports whole reaches with their minimum DO and the caution", () => {
    const out = reachResultsExport({ run, model, network, caution: exportPreface("Tamsel demo") });
    expect(out.caution.slice(0, PLANNING_CAUTION.length)).toEqual([...PLANNING_CAUTION]);
    const reaches = out.features.filter((f) => f.properties?.kind === "reach");
    expect(reaches).toHaveLength(run.reaches.length);
    for (const f of reaches) {
      const r = run.reaches.find((x) => x.id === f.properties?.id)!;
      expect(f.properties?.min_do_mg_l).toBe(r.critical.do_mg_l);
      expect(f.properties?.anoxic).toBe(r.anoxic);
    }
    expect(out.features.length).toBe(reaches.length + fc.features.length);
    expect("condition" in out).toBe(false);
  });

  it("names the design condition it holds on the collection and on every reach", () => {
    const out = reachResultsExport({ run, model, network, caution: [], condition: "Hot, dry 7Q10" });
    expect(out.condition).toBe("Hot, dry 7Q10");
    const reaches = out.features.filter((f) => f.properties?.kind === "reach");
    expect(reaches.length).toBeGreaterThan(0);
    for (const f of reaches) expect(f.properties?.condition).toBe("Hot, dry 7Q10");
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
