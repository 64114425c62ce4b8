import { describe, expect, it } from "vitest";
import { buildTopology, validateImport, type TopologyLine } from "@/geo";
import { geodesicKm, lines, network, reachMapping } from "./helpers";

const validate = (name: string, options = {}) => validateImport({ reaches: network(name), reachMapping }, options);
const reach = (r: ReturnType<typeof validate>, id: string) => r.network.reaches.find((x) => x.id === id);
const codes = (ps: Array<{ code: string }>) => ps.map((p) => p.code);

describe("topology of hand-built networks", () => {
  it("Y confluence: one node joins A, B and C; outlet at the foot of C; lengths on the WGS84 ellipsoid", () => {
    const r = validate("y-confluence");
    expect(r.errors).toEqual([]);
    expect(r.warnings).toEqual([]);
    expect(r.network.nodes).toHaveLength(4);
    const confluence = r.network.nodes.find((n) => n.kind === "confluence");
    expect(confluence?.reachIds.sort()).toEqual(["A", "B", "C"]);
    expect(confluence?.position).toEqual([0, 0]);
    const [part] = r.network.parts;
    expect(r.network.nodes.find((n) => n.id === part.outletNodeId)?.position).toEqual([0, -0.02]);
    expect(reach(r, "A")).toMatchObject({ downstreamReachId: "C", flipped: false });
    expect(reach(r, "C")?.upstreamReachIds.sort()).toEqual(["A", "B"]);
    expect(reach(r, "C")?.downstreamReachId).toBeUndefined();
    // 0.01° along a meridian, 0.01° along the equator (exactly a·Δλ, a = 6 378 137 m), 0.02°
    // along a meridian: geodesics, measured by GeographicLib's inverse.
    const [a, c] = [geodesicKm([[0, 0.01], [0, 0]]), geodesicKm([[0, 0], [0, -0.02]])];
    const b = (6378137 * 0.01 * Math.PI) / 180 / 1000;
    expect(reach(r, "A")?.lengthKm).toBeCloseTo(a, 9);
    expect(reach(r, "B")?.lengthKm).toBeCloseTo(b, 9);
    expect(reach(r, "C")?.lengthKm).toBeCloseTo(c, 9);
    expect(r.network.totalLengthKm).toBeCloseTo(a + b + c, 9);
  });

  it("reversed line: C2 is turned round, head first, and reported", () => {
    const r = validate("reversed-line");
    expect(r.errors).toEqual([]);
    expect(codes(r.warnings)).toEqual(["reach_reversed"]);
    expect(r.warnings[0].features).toEqual(["C2"]);
    expect(reach(r, "C2")).toMatchObject({ flipped: true, coordinates: [[0, -0.01], [0, -0.02]] });
    expect(reach(r, "C1")?.downstreamReachId).toBe("C2");
  });

  it("the planner's outlet choice wins over the suggestion", () => {
    const r = validate("y-confluence", { outlets: [{ reachId: "A" }] });
    expect(r.errors).toEqual([]);
    expect(r.network.parts[0]).toMatchObject({ chosen: true });
    expect(reach(r, "C")).toMatchObject({ flipped: true, downstreamReachId: "A" });
    expect(codes(r.warnings)).toContain("downstream_id_mismatch");
    const bad = validate("y-confluence", { outlets: [{ nodeId: "N2" }] });
    expect(codes(bad.errors)).toEqual(["outlet_invalid"]);
    expect(codes(validate("y-confluence", { outlets: [{ reachId: "Z" }] }).errors)).toEqual(["outlet_invalid"]);
  });

  it("gap of 6.0 m: reported as just over a 5 m tolerance, joined with 10 m", () => {
    const r = validate("gap");
    expect(codes(r.errors)).toEqual(["disconnected_parts"]);
    expect(r.errors[0].message).toMatch(/2 separate parts/);
    expect(codes(r.warnings)).toContain("gap");
    const gap = r.warnings.find((w) => w.code === "gap");
    expect(gap?.features).toEqual(["A", "C"]);
    expect(gap?.message).toContain("6.0 m apart");
    expect(gap?.geometry).toEqual({ type: "LineString", coordinates: [[0, 0], [0, -0.0000539592]] });
    const joined = validate("gap", { toleranceM: 10 });
    expect(joined.errors).toEqual([]);
    expect(reach(joined, "A")?.downstreamReachId).toBe("C");
    const allowed = validate("gap", { allowMultipleOutlets: true });
    expect(codes(allowed.errors)).toEqual([]);
    expect(codes(allowed.warnings)).toContain("disconnected_parts");
  });

  it("a tributary ending on the middle of another reach is reported, with the split point", () => {
    const r = validate("mid-reach-junction");
    expect(codes(r.errors)).toEqual(["disconnected_parts"]);
    const w = r.warnings.find((p) => p.code === "ends_mid_reach");
    expect(w?.features).toEqual(["TRIB", "MAIN"]);
    expect(w?.message).toMatch(/^TRIB ends 2\.0 m from the middle of MAIN/);
    const [, q] = (w?.geometry as { coordinates: number[][] }).coordinates;
    expect(q[0]).toBeCloseTo(0, 9);
    expect(q[1]).toBeCloseTo(0, 9);
    expect(codes(validate("y-confluence").warnings)).not.toContain("ends_mid_reach");
  });

  it("loop: the four reaches of the ring are named", () => {
    const r = validate("loop");
    expect(codes(r.errors)).toEqual(["loop"]);
    expect([...r.errors[0].features].sort()).toEqual(["L1", "L2", "L3", "L4"]);
    expect(r.errors[0].geometry?.type).toBe("MultiLineString");
  });

  it("braid: two channels between the same nodes", () => {
    const r = validate("braid");
    expect(codes(r.errors)).toEqual(["braid"]);
    expect(r.errors[0].features).toEqual(["B1", "B2"]);
  });

  it("duplicate id is an error naming the id and both features", () => {
    const r = validate("duplicate-id");
    expect(codes(r.errors)).toEqual(["duplicate_id"]);
    expect(r.errors[0].message).toBe("Reach id A is used by 2 features (feature 1, feature 2); ids must be unique");
  });

  it("a line that comes back to its start is a closed loop", () => {
    const r = validateImport({ reaches: lines([{ id: "R", coordinates: [[0, 0], [0.01, 0], [0.01, 0.01], [0, 0]] }]), reachMapping });
    expect(codes(r.errors)).toEqual(["closed_loop"]);
  });

  it("separate trees each get their own suggested outlet", () => {
    const t = buildTopology([
      { name: "P", coordinates: [[0, 0.01], [0, 0]] },
      { name: "Q", coordinates: [[1, 0.01], [1, 0]] },
    ]);
    expect(t.components).toHaveLength(2);
    expect(t.components.map((c) => c.outletNodeId)).toEqual(["N2", "N4"]);
    expect(t.problems.map((p) => p.code)).toEqual(["disconnected_parts"]);
  });

  it("suggests the outlet from a mapped downstream-id field before geometry", () => {
    // Every line is drawn upstream, so geometry alone would pick the wrong end of T.
    const input: TopologyLine[] = [
      { name: "S", coordinates: [[0, 0], [0, 0.01]], downstreamName: "T" },
      { name: "T", coordinates: [[0, -0.01], [0, 0]] },
    ];
    const byField = buildTopology(input);
    expect(byField.nodes.find((n) => n.kind === "outlet")?.position).toEqual([0, -0.01]);
    const byGeometry = buildTopology(input.map((l) => ({ name: l.name, coordinates: l.coordinates })));
    expect(byGeometry.nodes.find((n) => n.kind === "outlet")?.position).toEqual([0, 0.01]);
  });

  it("reach lengths agree with the WGS84 geodesic for a meandering line", () => {
    const coords = [[10, 45], [10.01, 45.004], [10.02, 44.998], [10.03, 45.001]];
    const r = validateImport({ reaches: lines([{ id: "M", coordinates: coords }]), reachMapping });
    expect(reach(r, "M")?.geometryLengthKm).toBeCloseTo(geodesicKm(coords), 6); // within a millimetre
  });
});

describe("geometry and attribute problems", () => {
  const one = (coordinates: number[][] | number[][][], type = "LineString") =>
    validateImport({ reaches: lines([{ id: "R1", coordinates, type }, { id: "R2", coordinates: [[5, 5], [5, 5.01]] }]), reachMapping }, { allowMultipleOutlets: true });

  it("zero-length line", () => {
    const r = one([[1, 1], [1, 1]]);
    expect(codes(r.errors)).toEqual(["zero_length"]);
    expect(r.errors[0].features).toEqual(["R1"]);
  });

  it("self-crossing line is a warning with the crossing point", () => {
    const r = one([[0, 0], [0.02, 0.02], [0.02, 0], [0, 0.02]]);
    expect(r.errors).toEqual([]);
    const w = r.warnings.find((p) => p.code === "self_crossing");
    expect(w?.geometry).toEqual({ type: "MultiPoint", coordinates: [[0.01, 0.01]] });
  });

  it("coordinates out of range or not numbers", () => {
    expect(codes(one([[500000, 4000000], [500100, 4000000]]).errors)).toEqual(["coordinates_out_of_range"]);
    expect(one([[500000, 4000000], [500100, 4000000]]).errors[0].message).toMatch(/coordinate system/);
    const nan = validateImport({
      reaches: { ...lines([{ id: "R1", coordinates: [[0, 0], [0, 1]] }]), features: [{ index: 0, label: "feature 1", properties: { id: "R1" }, geometry: { type: "LineString", coordinates: [[0, Number.NaN], [0, 1]] } }] },
      reachMapping,
    });
    expect(codes(nan.errors)).toEqual(["coordinates_invalid"]);
  });

  it("wrong geometry type per feature, and for a whole layer of points", () => {
    expect(codes(one([0, 0] as unknown as number[][], "Point").errors)).toEqual(["wrong_geometry_type"]);
    const points = validateImport({ reaches: lines([{ id: "P", coordinates: [0, 0] as unknown as number[][], type: "Point" }]), reachMapping });
    expect(points.errors).toHaveLength(1);
    expect(points.errors[0].message).toMatch(/holds Point features, not lines/);
  });

  it("multi-part lines are joined when their parts meet, refused when they don't", () => {
    // listed out of order, both drawn north: joined head to tail
    const joined = one([[[0, 0.01], [0, 0.02]], [[0, 0], [0, 0.01]]], "MultiLineString");
    expect(joined.errors).toEqual([]);
    // halves drawn toward each other: joined, but which end is the outlet cannot be told (geo/outlet.ts)
    expect(codes(one([[[0, 0], [0, 0.01]], [[0, 0.02], [0, 0.01]]], "MultiLineString").errors)).toEqual(["outlet_uncertain"]);
    expect(joined.network.reaches.find((r) => r.id === "R1")?.geometryLengthKm).toBeCloseTo(geodesicKm([[0, 0], [0, 0.02]]), 9);
    expect(codes(one([[[0, 0], [0, 0.01]], [[1, 0], [1, 0.01]]], "MultiLineString").errors)).toEqual(["multipart_disconnected"]);
  });

  it("empty layer", () => {
    const r = validateImport({ reaches: lines([]), reachMapping });
    expect(codes(r.errors)).toEqual(["empty_layer"]);
    expect(r.network.reaches).toEqual([]);
  });

  it("missing reach id, unknown downstream id and long reaches", () => {
    const r = validateImport(
      { reaches: lines([{ coordinates: [[0, 0.01], [0, 0]] }, { id: "C", down: "Q", coordinates: [[0, 0], [0, -0.2]] }]), reachMapping },
      { maxReachLengthKm: 20 },
    );
    expect(codes(r.errors)).toEqual(["missing_value"]);
    expect(r.errors[0].message).toBe("feature 1 has no reach id (field id)");
    expect(codes(r.warnings).sort()).toEqual(["downstream_id_mismatch", "downstream_id_unknown", "reach_too_long"]);
    expect(r.warnings.find((w) => w.code === "reach_too_long")?.message).toContain("C (22.1 km)"); // 0.2° of meridian: 22.11 km by GeographicLib
  });
});
