import { describe, expect, it } from "vitest";
import { DEMO_DISCHARGER_MAPPING as CSV_MAPPING, DEMO_GEOJSON_REACH_MAPPING as GEOJSON_MAPPING, DEMO_REACH_MAPPING as SHP_MAPPING } from "@/db/seed/demo-gis";
import { readGeoJson, readPointCsv, readShapefileZip, validateImport } from "@/geo";
import { buildDemo } from "@/scripts/make-demo-gis";
import { fixtureBytes, fixtureText } from "./helpers";

const dischargers = () => readPointCsv(fixtureText("demo/tamsel-dischargers.csv"), { kind: "latlon", latitude: "latitude", longitude: "longitude" });

describe("the demo basin", () => {
  it("committed files are what the generator makes (deterministic, up to date)", () => {
    const demo = buildDemo();
    expect(Buffer.from(demo.zip).equals(fixtureBytes("demo/tamsel-reaches.zip"))).toBe(true);
    expect(demo.geojson).toBe(fixtureText("demo/tamsel-reaches.geojson"));
    expect(demo.csv).toBe(fixtureText("demo/tamsel-dischargers.csv"));
  });

  it("imports from the shapefile: one tree, 17 reaches, HC-01 turned round, five dischargers snapped", async () => {
    const reaches = await readShapefileZip(fixtureBytes("demo/tamsel-reaches.zip"));
    const r = validateImport({ reaches, reachMapping: SHP_MAPPING, dischargers: dischargers(), dischargerMapping: CSV_MAPPING });
    expect(r.errors).toEqual([]);
    expect(r.warnings.map((w) => [w.code, w.features])).toEqual([["reach_reversed", ["HC-01"]]]);
    expect(r.network.reaches).toHaveLength(17);
    expect(r.network.parts).toHaveLength(1);
    const outlet = r.network.nodes.find((n) => n.id === r.network.parts[0].outletNodeId);
    expect(outlet?.reachIds).toEqual(["TR-08"]);
    expect(r.network.nodes.filter((n) => n.kind === "confluence").map((n) => [...n.reachIds].sort())).toEqual([
      ["OC-03", "TR-02", "TR-03"],
      ["BB-03", "TR-05", "TR-06"],
      ["HC-02", "TR-07", "TR-08"],
      ["BB-01", "BB-02", "SR-01"],
    ]);
    const tr1 = r.network.reaches.find((x) => x.id === "TR-01");
    expect(tr1?.attributes.temperatureC).toBeCloseTo(25, 12); // 77 °F
    expect(tr1?.attributes.designFlowM3s).toBeCloseTo(6 * 0.028316846592, 12);
    expect(r.network.dischargers.map((d) => [d.id, d.reachId, d.assignment])).toEqual([
      ["DP-1001", "TR-03", "nearest"],
      ["DP-1002", "OC-03", "nearest"],
      ["DP-1003", "TR-06", "nearest"],
      ["DP-1004", "BB-03", "nearest"],
      ["DP-1005", "HC-02", "nearest"],
    ]);
    // The generator places each discharger 25–80 m off its line; a bend can bring the line closer.
    for (const d of r.network.dischargers) {
      expect(d.snapDistanceM).toBeGreaterThan(5);
      expect(d.snapDistanceM).toBeLessThanOrEqual(80.5);
      const reach = r.network.reaches.find((x) => x.id === d.reachId);
      expect(d.chainageKm).toBeGreaterThan(0);
      expect(d.chainageKm).toBeLessThan(reach?.geometryLengthKm ?? 0);
    }
  });

  it("imports the same network from the GeoJSON", () => {
    const r = validateImport({ reaches: readGeoJson(fixtureText("demo/tamsel-reaches.geojson")), reachMapping: GEOJSON_MAPPING });
    expect(r.errors).toEqual([]);
    expect(r.network.reaches.map((x) => x.downstreamReachId ?? "outlet")).toEqual(r.network.reaches.map((x) => x.attributes.downstreamId ?? "outlet"));
  });
});
