import { describe, expect, it } from "vitest";
import { readPointCsv, readShapefileZip, validateImport } from "@/geo";
import { DEMO_DISCHARGER_MAPPING, DEMO_REACH_MAPPING } from "@/db/seed/demo-gis";
import { allocate, runModel, runsAfterAllocation, withAllocatedLoads, type RunResult } from "@/lib/model";
import { nameOwnCondition } from "@/lib/model/allocation/own-condition";
import { buildConditionFiles, buildModelFile, type NetworkForModel } from "@/lib/scenarios/build-model-file";
import { scenarioInputsSchema } from "@/lib/validation/scenario";
import { fixtureBytes, fixtureText } from "../geo/helpers";
import { example } from "../results/fixtures";

async function demoNetwork(): Promise<NetworkForModel> {
  const reaches = await readShapefileZip(fixtureBytes("demo/tamsel-reaches.zip"));
  const dischargers = readPointCsv(fixtureText("demo/tamsel-dischargers.csv"), { kind: "latlon", latitude: "latitude", longitude: "longitude" });
  const { network } = validateImport({ reaches, reachMapping: DEMO_REACH_MAPPING, dischargers, dischargerMapping: DEMO_DISCHARGER_MAPPING });
  return {
    reaches: network.reaches.map((r) => ({ id: r.id, downstreamId: r.downstreamReachId ?? null, lengthKm: r.lengthKm, attributes: { ...r.attributes } })),
    outfalls: network.dischargers.map((d) => ({ permitId: d.id, reachId: d.reachId!, chainageKm: d.modelChainageKm ?? d.chainageKm!, attributes: { ...d.attributes } })),
  };
}

/** Every profile point's DO of two runs agrees to `tol` mg/L (and the runs have the same shape). */
function expectSameDo(a: RunResult, b: RunResult, tol: number) {
  expect(a.reaches.map((r) => r.id)).toEqual(b.reaches.map((r) => r.id));
  a.reaches.forEach((r, i) => {
    expect(r.points.length).toBe(b.reaches[i].points.length);
    r.points.forEach((p, k) => expect(Math.abs(p.do_mg_l - b.reaches[i].points[k].do_mg_l)).toBeLessThan(tol));
    expect(Math.abs(r.critical.do_mg_l - b.reaches[i].critical.do_mg_l)).toBeLessThan(tol);
  });
  expect(a.minimum.reach).toBe(b.minimum.reach);
}

const TWO = [
  { name: "Design low flow", flowScale: 1, temperatureC: 24 },
  { name: "Hot, dry 7Q10", flowScale: 0.6, temperatureC: 29 },
];

describe("DO after an allocation, under every condition", () => {
  it("equals the model run of each condition's own file (built on its own from the scenario) with the allocated loads", async () => {
    const net = await demoNetwork();
    const inputs = scenarioInputsSchema.parse({ conditions: TWO });
    const { file } = buildModelFile(net, inputs, 5, true);
    const allocation = allocate(file, { own_condition_name: TWO[0].name });
    expect(allocation.feasible).toBe(true);
    const after = runsAfterAllocation(file, allocation, TWO[0].name);
    expect(after.map((c) => c.name)).toEqual(TWO.map((c) => c.name));
    // the independent route: the scenario's single-condition files, as a model run builds them
    const own = buildConditionFiles(net, inputs, 5);
    after.forEach((c, i) => expectSameDo(c.run, runModel(withAllocatedLoads(own[i].file, allocation)), 1e-9));
  });

  it("holds DO at or above the criterion under every condition; the hotter, lower one binds (example file, second condition written out by hand)", () => {
    const file = example("tamsel-river-allocate");
    const hot = { name: "Hot, dry 7Q10", temperature_c: 28, scale: 1 };
    // no reserve: the river is then checked with exactly the allocated loads, so the binding condition sits at the criterion
    file.allocation!.reserve_fraction = 0;
    file.allocation!.conditions = [
      { name: hot.name, temperature_c: hot.temperature_c, headwaters: file.headwaters.map((h) => ({ reach: h.reach, flow_m3_s: h.flow_m3_s * hot.scale })) },
    ];
    const allocation = allocate(file, { own_condition_name: "Design low flow" });
    expect(allocation.feasible).toBe(true);
    const after = runsAfterAllocation(file, allocation, "Design low flow");
    // the same condition written into a plain model file without applyCondition
    const { allocation: _a, ...plain } = structuredClone(file);
    const byHand = {
      ...plain,
      reaches: plain.reaches.map((r) => ({ ...r, temperature_c: hot.temperature_c })),
      headwaters: plain.headwaters.map((h) => ({ ...h, flow_m3_s: h.flow_m3_s * hot.scale })),
    };
    expectSameDo(after[1].run, runModel(withAllocatedLoads(byHand, allocation)), 1e-9);
    expectSameDo(after[0].run, runModel(withAllocatedLoads(plain, allocation)), 1e-9);
    for (const c of after) expect(c.run.minimum.do_mg_l).toBeGreaterThanOrEqual(file.criterion_do_mg_l - 1e-6);
    // the hot condition is the critical one: it sits at the criterion and carries the binding checkpoints
    expect(after[1].run.minimum.do_mg_l).toBeCloseTo(file.criterion_do_mg_l, 5);
    expect(after[0].run.minimum.do_mg_l).toBeGreaterThan(after[1].run.minimum.do_mg_l);
    expect(allocation.binding.length).toBeGreaterThan(0);
    for (const b of allocation.binding) expect(b.condition).toBe(hot.name);
    expect(allocation.conditions).toEqual(["Design low flow", hot.name]);
  });

  it("keeps today's loads when the allocation is infeasible, so the run shows what fails", async () => {
    const net = await demoNetwork();
    // a criterion no allocation can meet: background alone keeps DO under it
    const { file } = buildModelFile(net, scenarioInputsSchema.parse({ conditions: TWO, criterionDoMgL: 8.5 }), 5, true);
    const allocation = allocate(file, { own_condition_name: TWO[0].name });
    expect(allocation.feasible).toBe(false);
    const after = runsAfterAllocation(file, allocation, TWO[0].name);
    const own = buildConditionFiles(net, scenarioInputsSchema.parse({ conditions: TWO, criterionDoMgL: 8.5 }), 5);
    after.forEach((c, i) => expectSameDo(c.run, runModel(own[i].file), 1e-9));
    for (const d of allocation.diagnosis ?? []) expect(TWO.map((c) => c.name)).toContain(d.condition);
  });

  it("leaves the CLI's names alone: without own_condition_name the file's condition is \"base\" (MODEL.md output)", async () => {
    const net = await demoNetwork();
    const { file } = buildModelFile(net, scenarioInputsSchema.parse({ conditions: TWO }), 5, true);
    const plain = allocate(file);
    expect(plain.conditions).toEqual(["base", TWO[1].name]);
    const named = nameOwnCondition(plain, TWO[0].name);
    expect(named.conditions).toEqual(TWO.map((c) => c.name));
    expect(named.binding.map((b) => b.condition)).toEqual(plain.binding.map((b) => (b.condition === "base" ? TWO[0].name : b.condition)));
    expect(named.allocations).toEqual(plain.allocations);
    // the option changes names only, never a number
    const withName = allocate(file, { own_condition_name: TWO[0].name });
    expect(withName.allocations).toEqual(plain.allocations);
    expect(withName.binding).toEqual(named.binding);
  });
});
