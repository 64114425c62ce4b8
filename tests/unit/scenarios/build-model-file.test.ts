import { describe, expect, it } from "vitest";
import { readPointCsv, readShapefileZip, validateImport } from "@/geo";
import { DEMO_DISCHARGER_MAPPING, DEMO_REACH_MAPPING } from "@/db/seed/demo-gis";
import { allocate, runModel } from "@/lib/model";
import { buildConditionFiles, buildModelFile, ScenarioInputError, type NetworkForModel } from "@/lib/scenarios/build-model-file";
import { parseModelFile } from "@/lib/validation/model-file";
import { scenarioInputsSchema } from "@/lib/validation/scenario";
import { fixtureBytes, fixtureText } from "../geo/helpers";

async function demoNetwork(): Promise<NetworkForModel> {
  const reaches = await readShapefileZip(fixtureBytes("demo/tamsel-reaches.zip"));
  const dischargers = readPointCsv(fixtureText("demo/tamsel-dischargers.csv"), { kind: "latlon", latitude: "latitude", longitude: "longitude" });
  const { network } = validateImport({ reaches, reachMapping: DEMO_REACH_MAPPING, dischargers, dischargerMapping: DEMO_DISCHARGER_MAPPING });
  return {
    reaches: network.reaches.map((r) => ({ id: r.id, downstreamId: r.downstreamReachId ?? null, lengthKm: r.lengthKm, attributes: { ...r.attributes } })),
    outfalls: network.dischargers.map((d) => ({ permitId: d.id, reachId: d.reachId!, chainageKm: d.modelChainageKm ?? d.chainageKm!, attributes: { ...d.attributes } })),
  };
}
const inputs = (patch: Record<string, unknown> = {}) => scenarioInputsSchema.parse({ conditions: [{ name: "7Q10, August" }], ...patch });

describe("model file from a scenario and a network version", () => {
  it("is a valid MODEL.md file whose outlet flow is the outlet reach's design flow plus every effluent", async () => {
    const net = await demoNetwork();
    const { file } = buildModelFile(net, inputs(), 5, false);
    expect(parseModelFile(file).ok).toBe(true);
    const run = runModel(file);
    const outlet = net.reaches.find((r) => r.downstreamId === null)!;
    const last = run.reaches.find((r) => r.id === outlet.id)!.points.at(-1)!;
    // mass balance: natural design flow at the outlet reach + Σ effluent design flows (independent sum)
    const effluent = net.outfalls.reduce((s, o) => s + (o.attributes.designFlowM3s as number), 0);
    expect(last.flow_m3_s).toBeCloseTo((outlet.attributes.designFlowM3s as number) + effluent, 9);
  });

  it("scales every natural inflow with the condition's flow scale and honours per-reach flows", async () => {
    const net = await demoNetwork();
    const base = buildModelFile(net, inputs(), 5, false).file;
    const half = buildModelFile(net, inputs({ conditions: [{ name: "half", flowScale: 0.5 }] }), 5, false).file;
    for (const h of half.headwaters) {
      expect(h.flow_m3_s).toBeCloseTo(base.headwaters.find((b) => b.reach === h.reach)!.flow_m3_s * 0.5, 12);
    }
    const given = buildModelFile(net, inputs({ conditions: [{ name: "given", reachFlowsM3s: { "TR-01": 0.05 } }] }), 5, false).file;
    expect(given.headwaters.find((h) => h.reach === "TR-01")!.flow_m3_s).toBe(0.05);
  });

  it("uses the condition temperature everywhere and the scenario criterion over the basin's", async () => {
    const net = await demoNetwork();
    const { file } = buildModelFile(net, inputs({ criterionDoMgL: 6, conditions: [{ name: "hot", temperatureC: 28 }] }), 5, false);
    expect(file.criterion_do_mg_l).toBe(6);
    expect(new Set(file.reaches.map((r) => r.temperature_c))).toEqual(new Set([28]));
    expect(new Set(file.headwaters.map((h) => h.temperature_c))).toEqual(new Set([28]));
  });

  it("carries further conditions into one allocation that the LP can solve", async () => {
    const net = await demoNetwork();
    const { file } = buildModelFile(net, inputs({ conditions: [{ name: "7Q10" }, { name: "warmer, lower", flowScale: 0.8, temperatureC: 27 }] }), 5, true);
    expect(file.allocation?.conditions).toHaveLength(1);
    const result = allocate(file);
    expect(result.conditions.length).toBe(2);
    expect(result.allocations).toHaveLength(5);
  });

  it("refuses an allocation whose further condition gives no temperature under a first that sets one (it would take the first's), naming the field", async () => {
    const net = await demoNetwork();
    const mixed = inputs({ conditions: [{ name: "Hot", temperatureC: 28 }, { name: "Reaches' own" }] });
    expect(() => buildModelFile(net, mixed, 5, true)).toThrow(ScenarioInputError);
    try {
      buildModelFile(net, mixed, 5, true);
    } catch (e) {
      expect((e as ScenarioInputError).path).toBe("inputs.conditions.1.temperatureC");
    }
    // a model run builds one file per condition: no such mixing
    expect(buildConditionFiles(net, mixed, 5)).toHaveLength(2);
    // the other way round is one file whose own reaches keep their temperatures and a condition that sets all of them
    expect(buildModelFile(net, inputs({ conditions: [{ name: "Reaches' own" }, { name: "Hot", temperatureC: 28 }] }), 5, true).file.allocation?.conditions?.[0].temperature_c).toBe(28);
  });

  it("applies per-reach kinetics and flows; a null override keeps the network's value", async () => {
    const net = await demoNetwork();
    const { file } = buildModelFile(
      net,
      inputs({
        reachOverrides: { "TR-01": { kd20PerDay: 0.5, sod20GPerM2Day: null, ka20PerDay: 4, kn20PerDay: 0.1 } },
        inflowOverrides: { "OC-01": { cbodUMgL: 6, doMgL: null } },
        // the scenario's headwater DO, which a null inflow override keeps
        headwater: { doMgL: 7.5 },
        conditions: [{ name: "c", reachFlowsM3s: { "TR-01": null, "OC-01": 0.08 } }],
      }),
      5,
      false,
    );
    const tr01 = file.reaches.find((r) => r.id === "TR-01")!;
    expect(tr01).toMatchObject({ kd20_per_day: 0.5, ka20_per_day: 4, ka_method: "given", sod20_g_m2_day: 0 });
    const tr01Network = net.reaches.find((r) => r.id === "TR-01")!;
    expect(file.headwaters.find((h) => h.reach === "TR-01")!.flow_m3_s).toBe(tr01Network.attributes.designFlowM3s);
    expect(file.headwaters.find((h) => h.reach === "OC-01")).toMatchObject({ flow_m3_s: 0.08, cbodu_mg_l: 6, do_mg_l: 7.5 });
    expect(tr01.kn20_per_day).toBe(0.1);
  });

  it("names the field when something the model needs is missing", async () => {
    const net = await demoNetwork();
    net.reaches[2].attributes = { ...net.reaches[2].attributes, velocityMps: undefined };
    expect(() => buildModelFile(net, inputs(), 5, false)).toThrow(ScenarioInputError);
    expect(() => buildModelFile(net, inputs(), 5, false)).toThrow(new RegExp(`Reach ${net.reaches[2].id} needs a velocity`));
    const net2 = await demoNetwork();
    delete net2.reaches[0].attributes.designFlowM3s;
    try {
      buildModelFile(net2, inputs(), 5, false);
      expect.unreachable();
    } catch (e) {
      expect((e as ScenarioInputError).path).toBe(`inputs.conditions.0.reachFlowsM3s.${net2.reaches[0].id}`);
    }
  });

  it("a reach with a Manning channel gets its velocity and depth from each condition's flow; part of one is refused, naming what is missing", async () => {
    const net = await demoNetwork();
    const target = net.reaches.find((r) => r.attributes.slope !== undefined)!;
    target.attributes = { ...target.attributes, manningN: 0.035, bottomWidthM: 6, sideSlope: 1.5 };
    const files = buildConditionFiles(net, inputs({ conditions: [{ name: "design" }, { name: "half", flowScale: 0.5 }] }), 5);
    const reach = files[0].file.reaches.find((r) => r.id === target.id)!;
    expect(reach.manning).toEqual({ n: 0.035, bottom_width_m: 6, side_slope: 1.5 });
    expect(reach.velocity_m_s).toBeUndefined();
    expect(parseModelFile(files[0].file).ok).toBe(true);
    const seg = (i: number) => runModel(files[i].file).reaches.find((r) => r.id === target.id)!.segments[0];
    expect(seg(0).hydraulics).toBe("manning");
    expect(seg(1).velocity_m_s).toBeLessThan(seg(0).velocity_m_s);
    expect(seg(1).depth_m).toBeLessThan(seg(0).depth_m);
    // the other reaches keep the velocity and depth entered at design flow
    const other = net.reaches.find((r) => r.id !== target.id)!;
    expect(runModel(files[1].file).reaches.find((r) => r.id === other.id)!.segments[0].velocity_m_s).toBe(other.attributes.velocityMps);

    const partial = await demoNetwork();
    partial.reaches[1].attributes = { ...partial.reaches[1].attributes, manningN: 0.03, slope: undefined };
    expect(() => buildModelFile(partial, inputs(), 5, false)).toThrow(new RegExp(`Reach ${partial.reaches[1].id} has part of a Manning channel: add a bottom width and a slope`));
  });

  it("gives one single-condition file per condition for model runs", async () => {
    const net = await demoNetwork();
    const files = buildConditionFiles(net, inputs({ conditions: [{ name: "a" }, { name: "b", flowScale: 2 }] }), 5);
    expect(files.map((f) => f.name)).toEqual(["a", "b"]);
    expect(runModel(files[1].file).minimum.do_mg_l).toBeGreaterThan(runModel(files[0].file).minimum.do_mg_l);
  });
});
