import { spawnSync } from "node:child_process";
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { applyCondition } from "@/lib/model/allocation/conditions";
import { runModel } from "@/lib/model/network/run";
import type { ModelFile, ReachInput } from "@/lib/model/types";
import { parseModelFile } from "@/lib/validation/model-file";

/**
 * A reach's velocity and depth following its flow inside the model (MODEL.md §3, §8): a
 * Manning channel or hydraulic geometry in the model file gives U and H at the flow each
 * segment carries, and the run records the rule. Expected values: Manning's equation and
 * continuity themselves (exact identities), and a published worked example.
 */
const FT = 0.3048; // m per international foot (exact by definition)
const CFS = FT ** 3;

const reach = (over: Partial<ReachInput>): ReachInput => ({ id: "R1", downstream: null, length_km: 8, kd20_per_day: 0.3, ka_method: "oconnor-dobbins", temperature_c: 20, ...over });
const file = (r: ReachInput, flow: number): ModelFile => ({
  reaches: [r],
  headwaters: [{ reach: "R1", flow_m3_s: flow, cbodu_mg_l: 12, do_mg_l: 7, temperature_c: 20 }],
  dischargers: [{ id: "F1", reach: "R1", km: 1, flow_m3_s: 0.2, cbodu_mg_l: 60, do_mg_l: 2, temperature_c: 20 }],
  criterion_do_mg_l: 5,
});

describe("Manning's equation inside a run", () => {
  const channel = { n: 0.035, bottom_width_m: 12 };
  const slope = 0.0005;

  it("gives each segment the normal depth and velocity of a rectangular channel at its flow (exact: continuity and Manning's equation)", () => {
    const out = runModel(file(reach({ manning: channel, slope_m_m: slope }), 1.8));
    for (const seg of out.reaches[0].segments) {
      expect(seg.hydraulics).toBe("manning");
      const { velocity_m_s: u, depth_m: y, flow_m3_s: q } = seg;
      // continuity: Q = U·b·y (a rectangle's mean depth is its flow depth)
      expect(u * channel.bottom_width_m * y).toBeCloseTo(q, 10);
      // Manning (SI): Q = (1/n)·A·R^(2/3)·S^(1/2)
      const area = channel.bottom_width_m * y;
      const radius = area / (channel.bottom_width_m + 2 * y);
      expect((area * Math.pow(radius, 2 / 3) * Math.sqrt(slope)) / channel.n).toBeCloseTo(q, 9);
    }
    // below the outfall the flow is larger, so the water is deeper and faster
    const [above, below] = out.reaches[0].segments;
    expect(below.flow_m3_s).toBeGreaterThan(above.flow_m3_s);
    expect(below.depth_m).toBeGreaterThan(above.depth_m);
    expect(below.velocity_m_s).toBeGreaterThan(above.velocity_m_s);
  });

  it("matches the published trapezoidal worked example's normal depth (Chow 1959, Open-Channel Hydraulics, Example 6.2 — from memory)", () => {
    // b = 20 ft, side slopes 2:1, n = 0.025, S = 0.0016, Q = 400 cfs → normal depth 3.36 ft (from memory);
    // the run reports the velocity Q/A, so the depth is read back from the trapezoid's area.
    const r = reach({ manning: { n: 0.025, bottom_width_m: 20 * FT, side_slope: 2 }, slope_m_m: 0.0016 });
    const f: ModelFile = { ...file(r, 400 * CFS), dischargers: [] };
    const seg = runModel(f).reaches[0].segments[0];
    const area = seg.flow_m3_s / seg.velocity_m_s;
    const b = 20 * FT;
    const y = (-b + Math.sqrt(b * b + 4 * 2 * area)) / (2 * 2); // (b + 2y)·y = A
    expect(Math.abs(y / FT - 3.36)).toBeLessThan(0.02);
    // the mean depth the DO model uses is A over the top width
    expect(seg.depth_m).toBeCloseTo(area / (b + 2 * 2 * y), 10);
  });

  it("a run with Manning equals a run given the same velocity and depth (the rule only changes where U and H come from)", () => {
    const withManning = runModel({ ...file(reach({ manning: channel, slope_m_m: slope }), 1.8), dischargers: [] });
    const seg = withManning.reaches[0].segments[0];
    const given = runModel({ ...file(reach({ velocity_m_s: seg.velocity_m_s, depth_m: seg.depth_m, slope_m_m: slope }), 1.8), dischargers: [] });
    expect(given.reaches[0].segments[0].hydraulics).toBe("given");
    expect(given.minimum.do_mg_l).toBeCloseTo(withManning.minimum.do_mg_l, 12);
    expect(given.reaches[0].critical.km).toBeCloseTo(withManning.reaches[0].critical.km, 10);
  });

  it("at a lower design flow the water slows and the travel time to the sag grows; fixed velocity and depth do not move", () => {
    const lowFlow = { name: "half flow", headwaters: [{ reach: "R1", flow_m3_s: 0.9 }] };
    const manning = file(reach({ manning: channel, slope_m_m: slope }), 1.8);
    const high = runModel(manning).reaches[0];
    const low = runModel(applyCondition(manning, lowFlow, ["condition"])).reaches[0];
    expect(low.segments[0].velocity_m_s).toBeLessThan(high.segments[0].velocity_m_s);
    expect(low.points.at(-1)!.t_day).toBeGreaterThan(high.points.at(-1)!.t_day);
    const fixed = file(reach({ velocity_m_s: 0.3, depth_m: 1 }), 1.8);
    const fixedLow = runModel(applyCondition(fixed, lowFlow, ["condition"])).reaches[0];
    expect(fixedLow.segments[0].velocity_m_s).toBe(0.3);
  });

  it("hydraulic geometry gives U = a·Q^b and H = c·Q^f at each segment's flow (exact)", () => {
    const g = { a: 0.25, b: 0.4, c: 0.4, f: 0.45 };
    const out = runModel(file(reach({ hydraulic_geometry: g }), 1.8));
    for (const seg of out.reaches[0].segments) {
      expect(seg.hydraulics).toBe("hydraulic-geometry");
      expect(seg.velocity_m_s).toBeCloseTo(g.a * Math.pow(seg.flow_m3_s, g.b), 12);
      expect(seg.depth_m).toBeCloseTo(g.c * Math.pow(seg.flow_m3_s, g.f), 12);
    }
  });
});

describe("the model file's hydraulics and condition fields", () => {
  const base = () => JSON.parse(JSON.stringify(file(reach({ manning: { n: 0.03, bottom_width_m: 10 }, slope_m_m: 0.001 }), 2))) as Record<string, unknown> & ModelFile;
  const issues = (data: unknown) => {
    const r = parseModelFile(data);
    return r.ok ? [] : r.issues.map((i) => `${i.path}: ${i.message}`);
  };

  it("accepts a Manning reach and names each field at fault otherwise", () => {
    expect(issues(base())).toEqual([]);
    const noSlope = base();
    delete noSlope.reaches[0].slope_m_m;
    expect(issues(noSlope).join("\n")).toMatch(/reaches\[0\]\.slope_m_m: .*required with manning/);
    const both = base();
    both.reaches[0].velocity_m_s = 0.3;
    expect(issues(both).join("\n")).toMatch(/reaches\[0\]\.manning: give velocity_m_s and depth_m, or manning, not both/);
    const twoRules = base();
    twoRules.reaches[0].hydraulic_geometry = { a: 0.2, b: 0.4, c: 0.4, f: 0.4 };
    expect(issues(twoRules).join("\n")).toMatch(/reaches\[0\]\.manning: give hydraulic_geometry or manning, not both/);
    const badN = base();
    badN.reaches[0].manning!.n = 0;
    expect(issues(badN).join("\n")).toMatch(/reaches\[0\]\.manning\.n: n must be greater than zero/);
  });

  it("a condition sets inflows' and dischargers' flows by id, and names an id that does not exist", () => {
    const f = { ...file(reach({ velocity_m_s: 0.3, depth_m: 1 }), 2), inflows: [{ id: "T1", reach: "R1", km: 4, flow_m3_s: 0.5, cbodu_mg_l: 3, do_mg_l: 7, temperature_c: 20 }] };
    const c = applyCondition(f, { name: "dry", inflows: [{ id: "T1", flow_m3_s: 0.1 }], dischargers: [{ id: "F1", flow_m3_s: 0.35 }] }, ["allocation", "conditions", 0]);
    expect(c.inflows![0].flow_m3_s).toBe(0.1);
    expect(c.dischargers[0].flow_m3_s).toBe(0.35);
    // the original is untouched
    expect(f.inflows[0].flow_m3_s).toBe(0.5);
    expect(() => applyCondition(f, { name: "dry", inflows: [{ id: "T9", flow_m3_s: 0.1 }] }, ["allocation", "conditions", 0])).toThrow(
      /allocation\.conditions\[0\]\.inflows\[0\]\.id: no inflow has id "T9"/,
    );
    expect(() => applyCondition(f, { name: "dry", dischargers: [{ id: "F9", flow_m3_s: 0.1 }] }, ["allocation", "conditions", 0])).toThrow(/dischargers\[0\]\.id/);
  });
});

describe("npm run model -- FILE --condition NAME", () => {
  const cli = (...args: string[]) => spawnSync(process.execPath, ["--import", "tsx", "scripts/model-cli.ts", ...args], { encoding: "utf8" });
  const dir = mkdtempSync(join(tmpdir(), "sagline-condition-"));
  const f: ModelFile = {
    ...file(reach({ manning: { n: 0.035, bottom_width_m: 12 }, slope_m_m: 0.0005 }), 1.8),
    allocation: { objective: "max-total", conditions: [{ name: "7Q10", headwaters: [{ reach: "R1", flow_m3_s: 0.6 }] }] },
  };
  const path = join(dir, "file.json");
  writeFileSync(path, JSON.stringify(f));

  it("runs the file under the named condition: the same JSON as the library's run of that condition", () => {
    const r = cli("run", path, "--condition", "7Q10");
    expect(r.status, r.stderr).toBe(0);
    const out = JSON.parse(r.stdout);
    const expected = runModel(applyCondition(f, f.allocation!.conditions![0], ["allocation", "conditions", 0]));
    expect(out.reaches[0].segments[0].flow_m3_s).toBeCloseTo(0.6, 12);
    expect(out.minimum.do_mg_l).toBeCloseTo(expected.minimum.do_mg_l, 12);
    expect(out.reaches[0].segments[0].hydraulics).toBe("manning");
  }, 30_000);

  it("an unknown condition exits 1 naming --condition and the file's conditions; a bare flag is a usage error", () => {
    const r = cli("run", path, "--condition", "30Q5");
    expect(r.status).toBe(1);
    expect(r.stderr).toMatch(/--condition: no condition named "30Q5"; the file's conditions: "7Q10"/);
    expect(r.stderr).not.toMatch(/\n\s+at /);
    expect(cli("run", path, "--condition").status).toBe(2);
  }, 30_000);
});
