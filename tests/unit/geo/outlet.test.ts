import { describe, expect, it } from "vitest";
import { buildTopology, validateImport } from "@/geo";
import { WEAK_TURNED_SHARE } from "@/geo/outlet";
import { outletSentence } from "@/lib/format/outlet";
import { lines } from "./helpers";

/**
 * The outlet rule: the free end that turns round the least length of line. Every case is an
 * exact construction (lines along the equator and along one meridian), so which end is right
 * follows from the geometry alone; lengths only weigh the directions, so none is asserted here.
 */
const codes = (ps: Array<{ code: string }>) => ps.map((p) => p.code);
const mapping = { reachId: "id" };
const run = (items: Parameters<typeof lines>[0], options = {}) => validateImport({ reaches: lines(items), reachMapping: mapping }, options);

/**
 * A main stem M1→M2→M3 along the equator, drawn downstream (west to east, mouth at 0.03°E),
 * and a tributary T1..T4 joining at 0.01°E from the north, drawn *upstream* (from the
 * confluence toward its headwater at 0.008°N). Counting lines, the tributary's four outvote
 * the main stem's three and its headwater looks like the mouth; by length (main stem 0.03°,
 * tributary 0.008°) the mouth is at the east end.
 */
const MAIN = [
  { id: "M1", coordinates: [[0, 0], [0.01, 0]] },
  { id: "M2", coordinates: [[0.01, 0], [0.02, 0]] },
  { id: "M3", coordinates: [[0.02, 0], [0.03, 0]] },
];
const TRIBUTARY_DRAWN_UP = [0, 1, 2, 3].map((k) => ({ id: `T${k + 1}`, coordinates: [[0.01, 0.002 * k], [0.01, 0.002 * (k + 1)]] }));

describe("choosing the outlet", () => {
  it("one mis-drawn tributary cannot move the outlet off the main stem's mouth; exactly its reaches are turned", () => {
    const r = run([...MAIN, ...TRIBUTARY_DRAWN_UP]);
    expect(r.errors).toEqual([]);
    const [part] = r.network.parts;
    expect(part.outletReachId).toBe("M3");
    expect(r.network.nodes.find((n) => n.id === part.outletNodeId)?.position).toEqual([0.03, 0]);
    const turned = r.network.reaches.filter((x) => x.flipped).map((x) => x.id).sort();
    expect(turned).toEqual(["T1", "T2", "T3", "T4"]);
    const reversed = r.warnings.find((w) => w.code === "reach_reversed")!;
    expect(reversed.features.sort()).toEqual(["T1", "T2", "T3", "T4"]);
    expect(reversed.message).toContain("the downstream end of M3");
    expect(part.suggestion).toMatchObject({ basis: "directions", weak: false });
    // the mouth turns the tributary's lines; the next-best end (the tributary's head) would turn M2 and M3
    const s = part.suggestion as Extract<typeof part.suggestion, { basis: "directions" }>;
    const km = (...ids: string[]) => ids.reduce((t, id) => t + r.network.reaches.find((x) => x.id === id)!.geometryLengthKm, 0);
    expect(s.turnedKm).toBeCloseTo(km("T1", "T2", "T3", "T4"), 12);
    expect(s.totalKm).toBeCloseTo(km("M1", "M2", "M3", "T1", "T2", "T3", "T4"), 12);
    expect(s.runnerUpReachId).toBe("T4");
    expect(s.runnerUpTurnedKm!).toBeCloseTo(km("M2", "M3"), 12);
    // the report names it
    expect(outletSentence(part)).toMatch(/^Outlet: the downstream end of M3, from the line directions \(\d+\.\d\d km of \d+\.\d\d km of lines turned round; next best, the free end of T4, would turn \d+\.\d\d km\)\.$/);
    // and the main stem flows M1 → M2 → M3 with T1 joining M2's head
    expect(r.network.reaches.find((x) => x.id === "T1")?.downstreamReachId).toBe("M2");
    expect(r.network.reaches.find((x) => x.id === "M1")?.downstreamReachId).toBe("M2");
  });

  it("a multi-part line counts each part with its own direction", () => {
    // Topology sees one line per reach: A is chained from a short first part drawn upstream,
    // so its line runs upstream, but 90 % of it (againstKm) was drawn downstream.
    const t = buildTopology([
      { name: "A", coordinates: [[0.02, 0], [0, 0]], lengthKm: 2, againstKm: 1.8 },
      { name: "B", coordinates: [[0.02, 0], [0.03, 0]], lengthKm: 1 },
    ]);
    // A's line runs east→west, so taken whole it says "flows west"; its parts say "flows east"
    expect(t.components[0].outletReach).toBe(1);
    expect(t.reaches[0].flipped).toBe(true);
    expect(t.problems.map((p) => p.code)).toEqual(["reach_reversed"]);
    // without the parts' evidence the same lines would drain west (the old first-part rule)
    const whole = buildTopology([
      { name: "A", coordinates: [[0.02, 0], [0, 0]], lengthKm: 2 },
      { name: "B", coordinates: [[0.02, 0], [0.03, 0]], lengthKm: 1 },
    ]);
    expect(whole.components[0].outletReach).toBe(0);
  });

  it("a MultiLineString whose first part points the wrong way takes its direction from all its parts", () => {
    // M: a short first part drawn west (0.002°E → 0°), then the long rest drawn east (0.002°E → 0.03°E);
    // B continues east to the mouth at 0.04°E. The first part alone says M flows west.
    const r = run([
      { id: "M", type: "MultiLineString", coordinates: [[[0.002, 0], [0, 0]], [[0.002, 0], [0.03, 0]]] },
      { id: "B", coordinates: [[0.03, 0], [0.04, 0]] },
    ]);
    expect(r.errors).toEqual([]);
    expect(r.network.parts[0].outletReachId).toBe("B");
    const m = r.network.reaches.find((x) => x.id === "M")!;
    expect(m).toMatchObject({ flipped: true, downstreamReachId: "B" });
    expect(m.coordinates[0]).toEqual([0, 0]);
    expect(m.coordinates[m.coordinates.length - 1]).toEqual([0.03, 0]);
    // the report names the reach turned round: M, whose line (from its first part) ran west
    expect(r.warnings.find((w) => w.code === "reach_reversed")?.features).toEqual(["M"]);
  });

  it("lines drawn toward each other give no answer: the planner must choose, and choosing clears it", () => {
    const items = [
      { id: "A", coordinates: [[0, 0], [0.01, 0]] },
      { id: "B", coordinates: [[0.02, 0], [0.01, 0]] },
    ];
    const r = run(items);
    expect(codes(r.errors)).toEqual(["outlet_uncertain"]);
    expect(codes(r.warnings)).toEqual([]); // nothing is called "drawn upstream" before the outlet is known
    expect(r.errors[0].features.sort()).toEqual(["A", "B"]);
    expect(r.errors[0].message).toMatch(/even the best outlet.*turns round .* of the part's .* of lines.*Choose the outlet reach under "Outlet"/);
    expect(r.network.parts[0].suggestion).toMatchObject({ basis: "directions", weak: true });
    const chosen = run(items, { outlets: [{ reachId: "B" }] });
    expect(chosen.errors).toEqual([]);
    expect(chosen.warnings.find((w) => w.code === "reach_reversed")?.features).toEqual(["B"]);
    expect(chosen.network.parts[0]).toMatchObject({ outletReachId: "B", chosen: true });
    expect(outletSentence(chosen.network.parts[0])).toBe("Outlet: the downstream end of B, as you chose.");
    expect(outletSentence(r.network.parts[0])).toContain("This is uncertain");
    expect(chosen.network.reaches.find((x) => x.id === "A")?.downstreamReachId).toBe("B");
  });

  it("two short mouths at the end of a long stem: both fit almost equally, so the planner must say which", () => {
    // M runs 0.1° east to X (0.1°E); S1 and S2, 0.003° each, both drawn from X outwards.
    const items = [
      { id: "M", coordinates: [[0, 0], [0.1, 0]] },
      { id: "S1", coordinates: [[0.1, 0], [0.103, 0]] },
      { id: "S2", coordinates: [[0.1, 0], [0.1, 0.003]] },
    ];
    const r = run(items);
    expect(codes(r.errors)).toEqual(["outlet_uncertain"]);
    expect(r.errors[0].features.sort()).toEqual(["S1", "S2"]);
    expect(r.errors[0].message).toMatch(/the downstream end of S[12] \(turning round 0.33 km of lines\) and the free end of S[12] \(turning 0.33 km\) fit the line directions almost equally well/);
    const chosen = run(items, { outlets: [{ reachId: "S2" }] });
    expect(chosen.errors).toEqual([]);
    expect(chosen.network.parts[0].outletReachId).toBe("S2");
    expect(chosen.network.reaches.find((x) => x.id === "S1")).toMatchObject({ flipped: true, downstreamReachId: "S2" });
  });

  it("a part whose best outlet still turns much of it round needs the planner too", () => {
    // A Y: C is drawn downstream to the foot at 0.02°S, but both A and B are drawn away from the confluence
    const items = [
      { id: "A", coordinates: [[0, 0], [-0.01, 0.01]] },
      { id: "B", coordinates: [[0, 0], [0.01, 0.01]] },
      { id: "C", coordinates: [[0, 0], [0, -0.01]] },
    ];
    const r = run(items);
    expect(codes(r.errors)).toEqual(["outlet_uncertain"]);
    expect(r.errors[0].message).toContain("even the best outlet");
    const s = r.network.parts[0].suggestion as { turnedKm: number; totalKm: number };
    expect(s.turnedKm).toBeGreaterThan(WEAK_TURNED_SHARE * s.totalKm);
  });

  it("a mapped downstream-id field decides, without asking", () => {
    const r = validateImport(
      {
        reaches: lines([
          { id: "A", down: "B", coordinates: [[0, 0], [0.01, 0]] },
          { id: "B", coordinates: [[0.02, 0], [0.01, 0]] },
        ]),
        reachMapping: { reachId: "id", downstreamId: "down" },
      },
      {},
    );
    expect(r.errors).toEqual([]);
    expect(r.network.parts[0]).toMatchObject({ outletReachId: "B", suggestion: { basis: "field" } });
  });

  it("a single straight reach is certain either way it is drawn", () => {
    const r = run([{ id: "R", coordinates: [[0, 0], [0, 0.01]] }]);
    expect(r.errors).toEqual([]);
    expect(r.network.parts[0].suggestion).toMatchObject({ basis: "directions", weak: false, turnedKm: 0 });
    expect(r.network.nodes.find((n) => n.id === r.network.parts[0].outletNodeId)?.position).toEqual([0, 0.01]);
  });
});

describe("a large network drawn mostly downstream", () => {
  it("finds the mouth of a 2,000-reach network with every 7th line drawn upstream, and asks only where lines near it disagree", async () => {
    const { syntheticNetwork } = await import("../../../scripts/bench/geo-import");
    const { crsFromEpsg } = await import("@/geo/crs");
    const toWgs84 = crsFromEpsg(32615).toWgs84;
    const net = syntheticNetwork(2000);
    const drawnUp = new Set(net.filter((_, k) => k % 7 === 3).map((x) => x.id));
    const asLines = (items: typeof net) => items.map((x) => ({ id: x.id, coordinates: x.coords.map(([e, n]) => toWgs84(e, n)) }));
    // C1, the collector's second reach, is one of the lines drawn upstream: between the mouth (end of C0)
    // and the free end of the side branch S1_0 only 64 % of the line is drawn toward the mouth
    expect(drawnUp.has("C1")).toBe(true);
    const r = run(asLines(net));
    expect(r.network.parts[0].outletReachId).toBe("C0");
    expect(r.errors.map((e) => e.code)).toEqual(["outlet_uncertain"]);
    expect(r.network.parts[0].suggestion).toMatchObject({ basis: "directions", weak: true, runnerUpReachId: "S1_0" });
    // confirmed by the planner: exactly the lines the generator drew upstream are turned round
    const confirmed = run(asLines(net), { outlets: [{ reachId: "C0" }] });
    expect(confirmed.errors).toEqual([]);
    expect(confirmed.network.reaches.filter((x) => x.flipped).map((x) => x.id).sort()).toEqual([...drawnUp].sort());
    // with C1 drawn the right way, the other lines drawn upstream do not put the mouth in doubt
    const fixed = net.map((x) => (x.id === "C1" ? { ...x, coords: [...x.coords].reverse() } : x));
    const sure = run(asLines(fixed));
    expect(sure.errors).toEqual([]);
    expect(sure.network.parts[0]).toMatchObject({ outletReachId: "C0", suggestion: { basis: "directions", weak: false } });
    expect(sure.network.reaches.filter((x) => x.flipped)).toHaveLength(drawnUp.size - 1);
  });
});
