import { describe, expect, it } from "vitest";
import { readGeoJson, readPointCsv, validateImport } from "@/geo";
import { geodesicKm, network, reachMapping } from "./helpers";

const dischargerMapping = { name: "name", permitId: "permit" };
const csvLayer = (rows: string) => readPointCsv(`name,permit,lat,lon\n${rows}`, { kind: "latlon", latitude: "lat", longitude: "lon" });
const run = (dischargers: ReturnType<typeof csvLayer>, options = {}) =>
  validateImport({ reaches: network("y-confluence"), reachMapping, dischargers, dischargerMapping }, options);
const codes = (ps: Array<{ code: string }>) => ps.map((p) => p.code);

describe("dischargers in the validation report", () => {
  it("places a discharger on its reach with distance and chainage", () => {
    // 0.0001° east of the middle of C (which runs 0.02° south from 0,0): chainage 0.01° along C.
    const r = run(csvLayer("Mill,P-1,-0.01,0.0001\n"));
    expect(r.errors).toEqual([]);
    const [d] = r.network.dischargers;
    expect(d).toMatchObject({ id: "P-1", reachId: "C", assignment: "nearest", position: [0.0001, -0.01] });
    // 0.01° of meridian south from the equator, by GeographicLib's inverse.
    expect(d.chainageKm).toBeCloseTo(geodesicKm([[0, 0], [0, -0.01]]), 6);
    // A meridian is a geodesic, and the foot of the perpendicular from a point 11 m east of it
    // lies on its parallel to within 1e-9° here; GeographicLib gives that distance.
    expect(d.snapDistanceM).toBeCloseTo(geodesicKm([[0.0001, -0.01], [0, -0.01]]) * 1000, 6);
  });

  it("measures chainage along a reach that was turned round, from its new head", () => {
    // C2 is drawn from (0,-0.02) up to (0,-0.01); after orientation its head is (0,-0.01).
    const r = validateImport({
      reaches: network("reversed-line"),
      reachMapping,
      dischargers: csvLayer("Mill,P-1,-0.0125,0.00001\n"),
      dischargerMapping,
    });
    expect(r.network.dischargers[0].reachId).toBe("C2");
    expect(r.network.dischargers[0].chainageKm).toBeCloseTo(geodesicKm([[0, -0.01], [0, -0.0125]]), 6);
  });

  it("reports rows with bad coordinates by permit id", () => {
    const r = run(csvLayer("Mill,P-1,abc,0\nPlant,P-2,0,200\nWorks,P-3,0.001,0\n"));
    expect(codes(r.errors)).toEqual(["coordinates_invalid", "coordinates_out_of_range"]);
    expect(r.errors[0].message).toBe("discharger P-1 has a coordinate that is missing or not a number");
    expect(r.errors[1].features).toEqual(["P-2"]);
    expect(r.network.dischargers.map((d) => d.id)).toEqual(["P-3"]);
  });

  it("reports duplicate permit ids, far points and reassignments", () => {
    const r = run(csvLayer("Mill,P-1,0.005,0\nMill again,P-1,0.005,0\nFar,P-9,0.5,0.5\n"));
    expect(codes(r.errors)).toEqual(["duplicate_id", "discharger_too_far"]);
    expect(r.errors[0].message).toBe("Permit id P-1 is used by 2 features (row 1, row 2); ids must be unique");
    const moved = run(csvLayer("Far,P-9,0.5,0.5\n"), { reassign: { "P-9": "B" } });
    expect(codes(moved.errors)).toEqual([]);
    expect(moved.network.dischargers[0]).toMatchObject({ reachId: "B", assignment: "reassigned" });
  });

  it("refuses lines as dischargers and an empty discharger layer", () => {
    const asLines = readGeoJson(JSON.stringify({ type: "FeatureCollection", features: [{ type: "Feature", properties: { name: "X", permit: "P-1" }, geometry: { type: "LineString", coordinates: [[0, 0], [0, 1]] } }] }));
    const wrong = run(asLines).errors;
    expect(codes(wrong)).toEqual(["wrong_geometry_type"]);
    expect(wrong[0].geometry).toEqual({ type: "LineString", coordinates: [[0, 0], [0, 1]] });
    expect(codes(run(csvLayer("")).errors)).toEqual(["empty_layer"]);
  });
});
