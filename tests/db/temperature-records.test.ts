import { beforeAll, describe, expect, it } from "vitest";
import * as recordsRoute from "@/app/api/basins/[basinId]/temperature-records/route";
import { buildConditionFiles } from "@/lib/scenarios/build-model-file";
import { getNetwork } from "@/lib/services/networks";
import type { ScenarioDto } from "@/lib/services/scenarios";
import type { TemperatureRecordDto } from "@/lib/services/temperature-records";
import { callRoute } from "../support/call-route";
import { commitDemo } from "../support/demo-network";
import { err } from "../support/errors";
import { fileDb } from "../support/file-db";
import { scoped } from "../support/scoped";
import { buildWorld, type World } from "../support/world";

const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
  await commitDemo(db, w.users.planner, w.basinId);
});

const form = (text: string, fields: Record<string, string> = {}, name = "temps.csv") => {
  const f = new FormData();
  f.set("name", "Tamsel at Quillford, water temperature");
  for (const [k, v] of Object.entries(fields)) f.set(k, v);
  f.set("file", new File([text], name));
  return f;
};
const upload = (body: FormData, userId = w.users.planner.id) => callRoute(recordsRoute.POST, "POST", { userId, params: { basinId: w.basinId }, body });

/**
 * A record built so its percentiles are exact: 1 June – 30 September 2025 (122 days) with
 * day i (0-based) at 10 + i/10 °C, and a May day at 40 °C that the summer rule must leave out.
 * The type-7 percentile p of n sorted values is x[h] with h = (n − 1)·p/100, interpolated:
 * p = 90: h = 121 × 0.9 = 108.9 → 10 + 108.9/10 = 20.89 °C (the values are linear in i, so interpolation is exact);
 * p = 50: h = 60.5 → 10 + 6.05 = 16.05 °C.
 */
function summerRecord(): string {
  const rows = ["date,temperature", "2025-05-31,40"];
  const start = Date.UTC(2025, 5, 1);
  for (let i = 0; i < 122; i++) rows.push(`${new Date(start + i * 86_400_000).toISOString().slice(0, 10)},${(10 + i / 10).toFixed(1)}`);
  return rows.join("\n");
}

describe("daily water-temperature records", () => {
  let record: TemperatureRecordDto;
  it("are read in the import worker and kept with the file's SHA-256, listed with the summer 90th percentile", async () => {
    const res = await upload(form(summerRecord(), { reachId: "TR-04" }));
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    record = res.json as TemperatureRecordDto;
    expect(record).toMatchObject({ dayCount: 123, missingDays: 0, firstDay: "2025-05-31", lastDay: "2025-09-30", unit: "C", reachId: "TR-04" });
    expect(record.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect(record.summer!.value_c).toBeCloseTo(20.89, 10);
    expect(record.summer!.days_used).toBe(122);
    const list = await callRoute(recordsRoute.GET, "GET", { userId: w.users.lead.id, params: { basinId: w.basinId } });
    expect((list.json as TemperatureRecordDto[]).map((r) => r.id)).toContain(record.id);
  });

  it("refuses a file it cannot read, naming the line, and saves nothing; a stakeholder may not upload", async () => {
    const before = Number((await db.selectFrom("temperature_records").select((e) => e.fn.countAll<string>().as("n")).where("basin_id", "=", w.basinId).executeTakeFirstOrThrow()).n);
    const bad = await upload(form("date,temperature\n2025-07-01,warm\n"));
    expect(bad.status).toBe(422);
    expect(err(bad.json).details?.[0]).toMatchObject({ path: "file", message: 'temps.csv: line 2: temperature "warm" is not a number' });
    expect((await upload(form(summerRecord()), w.users.stakeholder.id)).status).toBe(403);
    const after = Number((await db.selectFrom("temperature_records").select((e) => e.fn.countAll<string>().as("n")).where("basin_id", "=", w.basinId).executeTakeFirstOrThrow()).n);
    expect(after).toBe(before);
  });

  it("give a condition its design temperature by the stated rule when the scenario is saved, with where it came from", async () => {
    const scenarios = await import("@/app/api/basins/[basinId]/scenarios/route");
    const create = (name: string, condition: Record<string, unknown>) =>
      callRoute(scenarios.POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: { name, inputs: { conditions: [{ name: "Summer", ...condition }] } } });
    // a value and a source sent by the client are replaced by the record's
    const res = await create("From the record", { temperatureC: 5, temperatureFrom: { recordId: record.id, percentile: 50 } });
    expect(res.status, JSON.stringify(res.json)).toBe(201);
    const c = (res.json as ScenarioDto).inputs.conditions[0];
    expect(c.temperatureC).toBe(16.05);
    expect(c.temperatureFrom!.source).toMatchObject({ valueC: 16.05, recordName: "Tamsel at Quillford, water temperature", sha256: record.sha256, daysUsed: 122, daysMissing: 0 });
    expect(c.temperatureFrom!.source!.rule).toBe("50th percentile of June–September daily means, 122 days (2025-06-01 to 2025-09-30)");
    // the model file carries it on every reach
    const scenario = res.json as ScenarioDto;
    const net = await scoped(getNetwork)(db, w.users.planner, w.basinId, scenario.networkId);
    const forModel = { reaches: net.reaches.map((r) => ({ id: r.id, downstreamId: r.downstreamId, lengthKm: r.lengthKm, attributes: r.attributes })), outfalls: net.outfalls.map((o) => ({ permitId: o.permitId, reachId: o.reachId, chainageKm: o.chainageKm, attributes: o.attributes })) };
    const file = buildConditionFiles(forModel, scenario.inputs, 5)[0].file;
    expect(new Set(file.reaches.map((r) => r.temperature_c))).toEqual(new Set([16.05]));
    // months with no values, and a record of no such id, are refused naming the field
    const winter = await create("Winter", { temperatureFrom: { recordId: record.id, months: [1, 2] } });
    expect(winter.status).toBe(422);
    expect(err(winter.json).details?.[0]?.path).toBe("inputs.conditions.0.temperatureFrom.months");
    const unknown = await create("Unknown", { temperatureFrom: { recordId: "00000000-0000-4000-8000-000000000000" } });
    expect(err(unknown.json).details?.[0]?.path).toBe("inputs.conditions.0.temperatureFrom.recordId");
  });
});
