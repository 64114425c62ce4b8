import { spawnSync } from "node:child_process";
import { beforeAll, describe, expect, it } from "vitest";
import * as gaugeRoute from "@/app/api/basins/[basinId]/gauges/[gaugeId]/route";
import * as gaugesRoute from "@/app/api/basins/[basinId]/gauges/route";
import { buildConditionFiles } from "@/lib/scenarios/build-model-file";
import { conditionFlowText } from "@/lib/results/condition-flow";
import type { GaugeDto, GaugeSummaryDto } from "@/lib/services/gauges";
import { getNetwork } from "@/lib/services/networks";
import type { ScenarioDto } from "@/lib/services/scenarios";
import { callRoute } from "../support/call-route";
import { commitDemo } from "../support/demo-network";
import { err } from "../support/errors";
import { fileDb } from "../support/file-db";
import { scoped } from "../support/scoped";
import { DEMO_GAUGE_FILE, demoGaugeBytes, gaugeForm } from "../support/gauge-record";
import { buildWorld, type World } from "../support/world";

/**
 * A gauge's daily flow record uploaded into a basin: read, its low-flow statistics computed
 * and kept with the file. The statistics are the design-flow command's (same reader, same
 * computation, same numbers); their science is tested against published tables in
 * tests/reference and tests/unit/hydrology.
 */
const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
  await commitDemo(db, w.users.planner, w.basinId);
});

const upload = (form: FormData, userId = w.users.planner.id) => callRoute(gaugesRoute.POST, "POST", { userId, params: { basinId: w.basinId }, body: form });
const count = async () => Number((await db.selectFrom("gauge_records").select((e) => e.fn.countAll<string>().as("n")).where("basin_id", "=", w.basinId).executeTakeFirstOrThrow()).n);

describe("a gauge's daily flow record", () => {
  let first: GaugeDto;

  it("is read, its design flows computed as the design-flow command computes them, and kept with the file's checksum and who uploaded it", async () => {
    const res = await upload(gaugeForm({ stationCode: "TQ-01", reachId: "TR-04" }));
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    first = res.json as GaugeDto;
    expect(first).toMatchObject({ name: "Quillford gauge", stationCode: "TQ-01", reachId: "TR-04", unit: "m3/s", climaticYearStart: "04-01", uploadedBy: w.users.planner.name });
    expect(first.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(first.firstDay).toBe("1994-04-01");
    expect(first.dayCount).toBeGreaterThan(365 * 29);
    const cli = spawnSync(process.execPath, ["--import", "tsx", "scripts/design-flow-cli.ts", DEMO_GAUGE_FILE], { encoding: "utf8" });
    expect(cli.status, cli.stderr).toBe(0);
    const printed = JSON.parse(cli.stdout) as { years_used: number; statistics: { name: string; value: number | null; empirical: number | null }[] };
    expect(first.statistics.years_used).toBe(printed.years_used);
    for (const s of printed.statistics) {
      const mine = first.designFlows.find((d) => d.name === s.name)!;
      expect(mine.value).toBe(s.value);
      expect(mine.empirical).toBe(s.empirical);
    }
    expect(first.statistics.annual_minima["7"].length).toBe(first.statistics.years_used);
    const audit = await db.selectFrom("audit_events").select(["action", "details"]).where("target_id", "=", first.id).executeTakeFirstOrThrow();
    expect(audit.action).toBe("gauge.uploaded");
    // the original bytes are kept
    const kept = await db.selectFrom("gauge_records").select("content").where("id", "=", first.id).executeTakeFirstOrThrow();
    expect(Buffer.compare(kept.content, demoGaugeBytes())).toBe(0);
  });

  it("read in cfs, every design flow is the same multiple of the m³/s one (log-Pearson III quantiles scale with the data: exact)", async () => {
    const res = await upload(gaugeForm({ name: "Quillford gauge, read as cfs", unit: "cfs" }));
    expect(res.status).toBe(201);
    const cfs = res.json as GaugeDto;
    const CFS = 0.028316846592; // m³/s per ft³/s (exact: 0.3048³)
    for (const d of cfs.designFlows) {
      const m3 = first.designFlows.find((x) => x.name === d.name)!;
      expect(d.value! / m3.value!).toBeCloseTo(CFS, 12);
    }
  });

  it("is listed newest first with its design flows, and read back whole", async () => {
    const list = (await callRoute(gaugesRoute.GET, "GET", { userId: w.users.lead.id, params: { basinId: w.basinId } })).json as GaugeSummaryDto[];
    expect(list.map((g) => g.name)).toEqual(["Quillford gauge, read as cfs", "Quillford gauge"]);
    expect(list[1].designFlows.map((d) => d.name)).toEqual(first.designFlows.map((d) => d.name));
    const one = await callRoute(gaugeRoute.GET, "GET", { userId: w.users.lead.id, params: { basinId: w.basinId, gaugeId: first.id } });
    expect(one.status).toBe(200);
    expect(one.json).toEqual(first);
    const other = await callRoute(gaugeRoute.GET, "GET", { userId: w.users.lead.id, params: { basinId: w.basinId, gaugeId: "00000000-0000-4000-8000-000000000000" } });
    expect(other.status).toBe(404);
  });

  it("a file it cannot read is refused naming the line, and nothing is saved", async () => {
    const before = await count();
    const bad = await upload(gaugeForm({}, Buffer.from("date,flow\n2020-04-01,1.5\n2020-04-02,lots\n"), "bad.csv"));
    expect(bad.status).toBe(422);
    expect(err(bad.json).message).toMatch(/bad\.csv: line 3: flow "lots" is not a number/);
    expect(err(bad.json).details?.[0]?.path).toBe("file");
    const binary = await upload(gaugeForm({}, Buffer.from([0xff, 0xfe, 0x00, 0x41]), "record.bin"));
    expect(binary.status).toBe(422);
    expect(err(binary.json).message).toMatch(/not UTF-8 text/);
    const empty = await upload(gaugeForm({}, Buffer.alloc(0), "empty.csv"));
    expect(empty.status).toBe(422);
    expect(await count()).toBe(before);
  });

  it("bad form fields are refused naming the field: an unknown reach, a unit, a climatic year start, a missing name", async () => {
    const before = await count();
    const reach = await upload(gaugeForm({ reachId: "XX-99" }));
    expect(reach.status).toBe(422);
    expect(err(reach.json).details?.[0]?.path).toBe("reachId");
    const unit = await upload(gaugeForm({ unit: "gallons" }));
    expect(unit.status).toBe(422);
    expect(JSON.stringify(unit.json)).toMatch(/unit/);
    const start = await upload(gaugeForm({ climaticYearStart: "02-29" }));
    expect(start.status).toBe(422);
    expect(JSON.stringify(start.json)).toMatch(/climaticYearStart/);
    const form = gaugeForm();
    form.delete("name");
    const nameless = await upload(form);
    expect(nameless.status).toBe(422);
    expect(JSON.stringify(nameless.json)).toMatch(/name/);
    expect(await count()).toBe(before);
  });

  it("a short record is kept with the warning that says so", async () => {
    const lines = ["date,flow"];
    for (let d = Date.UTC(2019, 3, 1); d < Date.UTC(2022, 3, 1); d += 86_400_000) lines.push(`${new Date(d).toISOString().slice(0, 10)},${(2 + Math.sin(d / 3e9)).toFixed(3)}`);
    const res = await upload(gaugeForm({ name: "Short record" }, Buffer.from(lines.join("\n")), "short.csv"));
    expect(res.status).toBe(201);
    const g = res.json as GaugeDto;
    expect(g.statistics.years_used).toBe(3);
    expect(g.statistics.warnings.join("\n")).toMatch(/Only 3 complete climatic years/);
  });
});

describe("a condition's design flow from a gauge's statistic", () => {
  const scenarios = () => import("@/app/api/basins/[basinId]/scenarios/route");
  const create = async (name: string, condition: Record<string, unknown>) =>
    callRoute((await scenarios()).POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: { name, inputs: { conditions: [{ name: "Gauged 7Q10", ...condition }] } } });
  let placed: GaugeDto;
  beforeAll(async () => {
    placed = (await upload(gaugeForm({ name: "Quillford, placed", reachId: "TR-04" }))).json as GaugeDto;
  });

  it("is read from the record when the scenario is saved (anything sent as its source is replaced) and scales every reach so the gauge's reach carries it", async () => {
    const res = await create("From the Quillford 7Q10", { gaugeFlow: { gaugeId: placed.id, statistic: "7Q10", source: { valueM3s: 99, gaugeName: "forged", stationCode: null, reachId: "TR-01", sha256: "x", firstDay: "", lastDay: "", yearsUsed: 1 } } });
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    const scenario = res.json as ScenarioDto;
    const q7 = placed.designFlows.find((d) => d.name === "7Q10")!.value!;
    expect(scenario.inputs.conditions[0].gaugeFlow!.source).toEqual({
      valueM3s: q7,
      gaugeName: "Quillford, placed",
      stationCode: null,
      reachId: "TR-04",
      sha256: placed.sha256,
      firstDay: "1994-04-01",
      lastDay: "2024-03-31",
      yearsUsed: placed.statistics.years_used,
    });
    // the model files equal those of the same scenario scaled by hand by 7Q10 / TR-04's network design flow
    const net = await scoped(getNetwork)(db, w.users.planner, w.basinId, scenario.networkId);
    const forModel = { reaches: net.reaches.map((r) => ({ id: r.id, downstreamId: r.downstreamId, lengthKm: r.lengthKm, attributes: r.attributes })), outfalls: net.outfalls.map((o) => ({ permitId: o.permitId, reachId: o.reachId, chainageKm: o.chainageKm, attributes: o.attributes })) };
    const own = net.reaches.find((r) => r.id === "TR-04")!.attributes.designFlowM3s as number;
    const byGauge = buildConditionFiles(forModel, scenario.inputs, 5)[0].file;
    const byHand = buildConditionFiles(forModel, { ...scenario.inputs, conditions: [{ ...scenario.inputs.conditions[0], gaugeFlow: null, flowScale: q7 / own }] }, 5)[0].file;
    expect(byGauge).toEqual(byHand);
    // and the words a plan prints say where it came from
    expect(conditionFlowText(scenario.inputs.conditions[0], "SI")).toMatch(/^7Q10 of Quillford, placed: 0\.\d+ m³\/s at TR-04, 30 years of daily record 1994-04-01 to 2024-03-31/);
  });

  it("carries the statistic to headwaters by drainage-area ratio when asked, scaling those without an area, each value recorded with its rule", async () => {
    const networkId = (await db.selectFrom("networks").select("id").where("basin_id", "=", w.basinId).orderBy("version", "desc").executeTakeFirstOrThrow()).id;
    // drainage areas (km²) on the gauge's reach and four of the five headwaters; HC-01 has none
    const areas: Record<string, number> = { "TR-04": 120, "TR-01": 30, "OC-01": 12, "BB-01": 18, "SR-01": 9 };
    for (const [id, a] of Object.entries(areas)) {
      const r = await db.selectFrom("reaches").select("attributes").where("network_id", "=", networkId).where("reach_key", "=", id).executeTakeFirstOrThrow();
      await db.updateTable("reaches").set({ attributes: JSON.stringify({ ...(r.attributes as object), drainageAreaKm2: a }) }).where("network_id", "=", networkId).where("reach_key", "=", id).execute();
    }
    const q7 = placed.designFlows.find((d) => d.name === "7Q10")!.value!;
    for (const exponent of [1, 0.8]) {
      const res = await create(`By drainage area ^${exponent}`, { gaugeFlow: { gaugeId: placed.id, statistic: "7Q10", headwaters: "drainage-area", areaExponent: exponent } });
      expect(res.status, JSON.stringify(res.json)).toBe(201);
      const scenario = res.json as ScenarioDto;
      const t = scenario.inputs.conditions[0].gaugeFlow!.source!.transfers!;
      expect(t.gaugeAreaKm2).toBe(120);
      expect(t.scaled).toEqual(["HC-01"]);
      const net = await scoped(getNetwork)(db, w.users.planner, w.basinId, scenario.networkId);
      const forModel = { reaches: net.reaches.map((r) => ({ id: r.id, downstreamId: r.downstreamId, lengthKm: r.lengthKm, attributes: r.attributes })), outfalls: net.outfalls.map((o) => ({ permitId: o.permitId, reachId: o.reachId, chainageKm: o.chainageKm, attributes: o.attributes })) };
      const file = buildConditionFiles(forModel, scenario.inputs, 5)[0].file;
      const scaledByHand = buildConditionFiles(forModel, { ...scenario.inputs, conditions: [{ ...scenario.inputs.conditions[0], gaugeFlow: null, flowScale: q7 / (net.reaches.find((r) => r.id === "TR-04")!.attributes.designFlowM3s as number) }] }, 5)[0].file;
      const flowAt = (f: typeof file, id: string) => f.headwaters.find((h) => h.reach === id)!.flow_m3_s;
      // exact arithmetic: Q = 7Q10 × (A / 120 km²)^exponent
      for (const id of ["TR-01", "OC-01", "BB-01", "SR-01"]) expect(flowAt(file, id)).toBeCloseTo(q7 * Math.pow(areas[id] / 120, exponent), 12);
      // HC-01 (no area) and every lateral inflow are scaled as before
      expect(flowAt(file, "HC-01")).toBeCloseTo(flowAt(scaledByHand, "HC-01"), 12);
      for (const h of file.headwaters.filter((x) => !(x.reach in areas))) expect(h.flow_m3_s).toBeCloseTo(flowAt(scaledByHand, h.reach), 12);
      expect(conditionFlowText(scenario.inputs.conditions[0], "SI")).toMatch(
        new RegExp(`carried to headwaters by drainage-area ratio, Q × \\(A / 120\\.00 km²\\)${exponent === 1 ? "" : "\\^0\\.8"}: BB-01 .*, TR-01 .*; scaled with every reach \\(no drainage area\\): HC-01$`),
      );
    }
    // the gauge's reach without an area is refused, naming the field
    const r4 = await db.selectFrom("reaches").select("attributes").where("network_id", "=", networkId).where("reach_key", "=", "TR-04").executeTakeFirstOrThrow();
    const { drainageAreaKm2: _gone, ...rest } = r4.attributes as Record<string, unknown>;
    await db.updateTable("reaches").set({ attributes: JSON.stringify(rest) }).where("network_id", "=", networkId).where("reach_key", "=", "TR-04").execute();
    const refused = await create("No gauge area", { gaugeFlow: { gaugeId: placed.id, statistic: "7Q10", headwaters: "drainage-area" } });
    expect(refused.status).toBe(422);
    expect(err(refused.json).details?.[0]?.path).toBe("inputs.conditions.0.gaugeFlow.headwaters");
    expect(err(refused.json).message).toMatch(/TR-04 has no drainage area/);
  });

  it("is refused naming the field: a record of another basin or none, a record on no reach, or a gauge beside an outlet flow", async () => {
    const unknown = await create("No such gauge", { gaugeFlow: { gaugeId: "00000000-0000-4000-8000-000000000000", statistic: "7Q10" } });
    expect(unknown.status).toBe(422);
    expect(err(unknown.json).details?.[0]?.path).toBe("inputs.conditions.0.gaugeFlow.gaugeId");
    const unplaced = (await upload(gaugeForm({ name: "Nowhere" }))).json as GaugeDto;
    const nowhere = await create("Gauge on no reach", { gaugeFlow: { gaugeId: unplaced.id, statistic: "7Q10" } });
    expect(nowhere.status).toBe(422);
    expect(err(nowhere.json).message).toMatch(/not placed on a reach/);
    const both = await create("Both", { gaugeFlow: { gaugeId: placed.id, statistic: "7Q10" }, outletFlowM3s: 2 });
    expect(both.status).toBe(422);
    expect(JSON.stringify(both.json)).toMatch(/gaugeFlow/);
  });
});
