import { describe, expect, it } from "vitest";
import { readPointCsv, readShapefileZip, validateImport } from "@/geo";
import { DEMO_DISCHARGER_MAPPING, DEMO_REACH_MAPPING } from "@/db/seed/demo-gis";
import { buildModelFile, ScenarioInputError, type NetworkForModel } from "@/lib/scenarios/build-model-file";
import { DEFAULT_HEADWATER_DO_SHARE, defaultHeadwaterDoMgL, networkOutletFlowM3s } from "@/lib/scenarios/design-defaults";
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

describe("default headwater DO: a share of saturation", () => {
  it("is 90 % of the Standard Methods saturation value at the water's temperature", () => {
    expect(DEFAULT_HEADWATER_DO_SHARE).toBe(0.9);
    // Standard Methods 4500-O table, fresh water at 1 atm: 7.559 mg/L at 30 °C, 9.092 at 20 °C (MODEL.md §2); ±0.001 for the table's rounding
    expect(defaultHeadwaterDoMgL(30)).toBeCloseTo(0.9 * 7.559, 3);
    expect(defaultHeadwaterDoMgL(20)).toBeCloseTo(0.9 * 9.092, 3);
    // above sea level the air holds less oxygen: lower than at 0 m
    expect(defaultHeadwaterDoMgL(30, 1500)).toBeLessThan(defaultHeadwaterDoMgL(30));
  });

  it("enters each headwater at its own temperature when the scenario gives no DO, never above saturation", async () => {
    const net = await demoNetwork();
    const { file, warnings } = buildModelFile(net, inputs({ conditions: [{ name: "hot", temperatureC: 30 }] }), 5, false);
    // the run page lists what was assumed
    expect(warnings.some((w) => w.startsWith("No DO given for headwater and tributary water: 90 % of saturation"))).toBe(true);
    for (const h of file.headwaters) {
      const reach = net.reaches.find((r) => r.id === h.reach)!;
      const z = typeof reach.attributes.elevationM === "number" ? reach.attributes.elevationM : 0;
      expect(h.temperature_c).toBe(30);
      expect(h.do_mg_l).toBeCloseTo(defaultHeadwaterDoMgL(30, z), 12);
      expect(h.do_mg_l).toBeLessThan(7.559);
    }
  });

  it("keeps a DO a stored scenario gives (7.5 mg/L before the default changed), so its model file and hash stay the same", async () => {
    const net = await demoNetwork();
    // a scenario as stored before: headwater DO written out, no outlet flow field in its conditions
    const stored = { conditions: [{ name: "7Q10", flowScale: 1, reachFlowsM3s: {}, temperatureC: null }, { name: "Hot", flowScale: 0.8, reachFlowsM3s: {}, temperatureC: 28 }], headwater: { cbodUMgL: 2, nbodUMgL: 0, doMgL: 7.5, temperatureC: 20 } };
    const parsed = scenarioInputsSchema.parse(stored);
    expect(parsed.headwater.doMgL).toBe(7.5);
    expect(parsed.conditions[0].outletFlowM3s).toBeNull();
    const { file, warnings } = buildModelFile(net, parsed, 5, true);
    expect(new Set(file.headwaters.map((h) => h.do_mg_l))).toEqual(new Set([7.5]));
    expect(warnings.some((w) => w.startsWith("No DO given"))).toBe(false);
    // further conditions carry only flow and temperature, as they did: the file (and so the inputs hash) is unchanged
    for (const h of file.allocation!.conditions![0].headwaters!) expect(Object.keys(h).sort()).toEqual(["flow_m3_s", "reach", "temperature_c"]);
  });

  it("in an allocation, moves the saturation DO with each further condition's temperature", async () => {
    const net = await demoNetwork();
    const { file } = buildModelFile(net, inputs({ conditions: [{ name: "mild", temperatureC: 20 }, { name: "hot", temperatureC: 30 }] }), 5, true);
    const hot = file.allocation!.conditions![0];
    for (const h of hot.headwaters!) {
      const main = file.headwaters.find((m) => m.reach === h.reach)!;
      expect(h.do_mg_l).toBeLessThan(main.do_mg_l);
      const reach = net.reaches.find((r) => r.id === h.reach)!;
      const z = typeof reach.attributes.elevationM === "number" ? reach.attributes.elevationM : 0;
      expect(h.do_mg_l).toBeCloseTo(defaultHeadwaterDoMgL(30, z), 12);
    }
  });
});

describe("design flow entered at the outlet", () => {
  it("scales every reach's network flow by the outlet flow over the network's own", async () => {
    const net = await demoNetwork();
    const own = networkOutletFlowM3s(net.reaches)!;
    const outlet = net.reaches.find((r) => r.downstreamId === null)!;
    expect(own).toBe(outlet.attributes.designFlowM3s);
    const base = buildModelFile(net, inputs(), 5, false).file;
    const given = buildModelFile(net, inputs({ conditions: [{ name: "at outlet", outletFlowM3s: own * 0.6, flowScale: 3 }] }), 5, false).file;
    // the outlet flow wins over the scale factor
    for (const h of given.headwaters) expect(h.flow_m3_s).toBeCloseTo(base.headwaters.find((b) => b.reach === h.reach)!.flow_m3_s * 0.6, 12);
  });

  it("names the field when the network has no outlet flow to scale from, and refuses a flow of zero", async () => {
    const net = await demoNetwork();
    const bare = { ...net, reaches: net.reaches.map((r) => (r.downstreamId === null ? { ...r, attributes: { ...r.attributes, designFlowM3s: undefined } } : r)) };
    expect(networkOutletFlowM3s(bare.reaches)).toBeUndefined();
    try {
      buildModelFile(bare, inputs({ conditions: [{ name: "x", outletFlowM3s: 1 }] }), 5, false);
      expect.unreachable();
    } catch (e) {
      expect(e).toBeInstanceOf(ScenarioInputError);
      expect((e as ScenarioInputError).path).toBe("inputs.conditions.0.outletFlowM3s");
    }
    const r = scenarioInputsSchema.safeParse({ conditions: [{ name: "x", outletFlowM3s: 0 }] });
    expect(r.success).toBe(false);
    expect(r.error?.issues[0].path).toEqual(["conditions", 0, "outletFlowM3s"]);
  });
});
