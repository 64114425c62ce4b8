import geographiclib from "geographiclib-geodesic";
import { beforeAll, describe, expect, it } from "vitest";
import { getSurvey, listSurveys, uploadSurvey } from "@/lib/services/surveys";
import { surveyUploadSchema } from "@/lib/validation/surveys";
import { commitDemo } from "../support/demo-network";
import { AppError } from "@/lib/errors";
import { fileDb } from "../support/file-db";
import { scoped } from "../support/scoped";
import { demoSurveyBytes, uploadDemoSurvey } from "../support/survey";
import { buildWorld, type World } from "../support/world";
import { callRoute } from "../support/call-route";

const db = fileDb();
let w: World;
let networkId: string;
beforeAll(async () => {
  w = await buildWorld(db);
  networkId = (await commitDemo(db, w.users.planner, w.basinId)).network.id;
});

const upload = (text: string, name = "s.csv", fields: Record<string, unknown> = {}) =>
  scoped(uploadSurvey)(db, w.users.planner, w.basinId, { name, bytes: Buffer.from(text) }, surveyUploadSchema.parse({ name: "Test survey", ...fields }));
async function expectAppError(p: Promise<unknown>, code: string): Promise<AppError> {
  const e = await p.then(
    () => null,
    (x: unknown) => x,
  );
  expect(e).toBeInstanceOf(AppError);
  expect((e as AppError).code).toBe(code);
  return e as AppError;
}
const surveyCount = async () => Number((await db.selectFrom("surveys").select((eb) => eb.fn.countAll().as("n")).where("basin_id", "=", w.basinId).executeTakeFirstOrThrow()).n);

describe("synoptic surveys", () => {
  it("places every demo station on its main-stem reach, within the distance to the line vertex it was drawn beside", async () => {
    const s = await uploadDemoSurvey(db, w.users.planner, w.basinId);
    expect(s).toMatchObject({ stationCount: 16, sampleCount: 16, firstTime: "2026-08-12T08:15", lastTime: "2026-08-12T17:00", uploadedBy: w.users.planner.name });
    expect(s.units).toEqual({ temperatureUnit: "C", flowUnit: "m3/s", bodKind: "bod5", maxSnapDistanceM: 500 });
    // two stations per reach, TR-01 to TR-08, in order down the river
    expect(s.samples.map((x) => x.reach)).toEqual(["TR-01", "TR-01", "TR-02", "TR-02", "TR-03", "TR-03", "TR-04", "TR-04", "TR-05", "TR-05", "TR-06", "TR-06", "TR-07", "TR-07", "TR-08", "TR-08"]);
    // each station sits 0.00018° north and 0.00012° west of a vertex of its reach: its distance to the
    // line is at most its geodesic distance to that vertex (GeographicLib), and above zero
    const bound = geographiclib.Geodesic.WGS84.Inverse(52.5, -86, 52.50018, -86.00012).s12 as number;
    for (const x of s.samples) {
      expect(x.placement).toBe("snapped");
      expect(x.distance_m!).toBeGreaterThan(0);
      expect(x.distance_m!).toBeLessThan(bound * 1.01);
    }
    const [a, b] = [s.samples[0], s.samples[1]];
    expect(b.km).toBeGreaterThan(a.km);
    // the original file is kept byte for byte, with its SHA-256
    const row = await db.selectFrom("surveys").select(["content", "sha256"]).where("id", "=", s.id).executeTakeFirstOrThrow();
    expect(Buffer.compare(row.content, demoSurveyBytes())).toBe(0);
    expect(row.sha256).toMatch(/^[0-9a-f]{64}$/);
    expect((await scoped(getSurvey)(db, w.users.lead, w.basinId, s.id)).samples).toEqual(s.samples);
    const audit = await db.selectFrom("audit_events").select("action").where("target_id", "=", s.id).execute();
    expect(audit.map((x) => x.action)).toEqual(["survey.uploaded"]);
  });

  it("keeps several surveys per basin, newest first; reads reach/km placement and the chosen units", async () => {
    const before = await surveyCount();
    const s = await upload("station,reach,km,datetime,do,temp,flow\nA,TR-03,1.5,2026-09-01T10:00,6.5,75.2,10\n", "second.csv", { temperatureUnit: "F", flowUnit: "cfs" });
    expect(s.samples[0]).toMatchObject({ reach: "TR-03", km: 1.5, placement: "given", distance_m: null });
    // 75.2 °F = 24 °C exactly; 1 cfs = 0.3048³ m³/s (international foot)
    expect(s.samples[0].temperature_c).toBeCloseTo(24, 12);
    expect(s.samples[0].flow_m3s).toBeCloseTo(10 * 0.3048 ** 3, 12);
    const list = await scoped(listSurveys)(db, w.users.planner, w.basinId);
    expect(list.length).toBe(before + 1);
    expect(list[0].id).toBe(s.id);
  });

  it("saves nothing while any row cannot be used, and names each row and column", async () => {
    const before = await surveyCount();
    const e = await expectAppError(upload("station,lat,lon,do\nS1,52.6101,-86.0949,abc\nS2,10,10,5\n"), "invalid");
    // the rows are read first; row 2 (far from every reach) would be refused by the placement after
    expect(e.message).toBe("s.csv: 1 row cannot be used; nothing was saved");
    expect(e.details).toEqual([{ path: "file.row 1.do", message: '"abc" is not a number' }]);
    const far = await expectAppError(upload("station,lat,lon,do\nS2,10,10,5\n"), "invalid");
    expect((far.details as { message: string }[])[0].message).toMatch(/^Station S2 is \d+ m from the nearest reach \(\S+\), beyond the 500 m limit/);
    expect(await surveyCount()).toBe(before);
  });

  it("refuses a survey before the basin has a network, and a file it cannot read", async () => {
    const other = await buildWorld(db);
    await expectAppError(
      scoped(uploadSurvey)(db, other.users.planner, other.basinId, { name: "s.csv", bytes: demoSurveyBytes() }, surveyUploadSchema.parse({ name: "x" })),
      "conflict",
    );
    await expectAppError(upload("not a survey at all", "notes.txt"), "invalid");
  });

  it("fits a reach's hydraulic geometry to measured flow, velocity and depth (an exact power law recovered) and writes it on the reach", async () => {
    // U = 0.3·Q^0.4 and H = 0.5·Q^0.35 exactly at Q = 1, 2 and 4 m³/s (values to 12 digits): the log–log fit must return them
    const rows = [1, 2, 4].map((q, i) => `V${i},TR-05,${0.5 * i},${q},${(0.3 * q ** 0.4).toPrecision(12)},${(0.5 * q ** 0.35).toPrecision(12)}`);
    const measured = await upload(["station,reach,km,flow,velocity,depth", ...rows].join("\n"), "hg.csv");
    expect(measured.samples[0]).toMatchObject({ flow_m3s: 1, velocity_m_s: 0.3, depth_m: 0.5 });
    const { POST } = await import("@/app/api/basins/[basinId]/networks/[networkId]/reaches/[reachId]/hydraulic-geometry/route");
    const res = await callRoute(POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId, networkId, reachId: "TR-05" }, body: { surveyIds: [measured.id] } });
    expect(res.status, JSON.stringify(res.json)).toBe(200);
    const fit = res.json as { geometry: { a: number; b: number; c: number; f: number }; velocity: { r2: number; n: number } };
    expect(fit.geometry.a).toBeCloseTo(0.3, 9);
    expect(fit.geometry.b).toBeCloseTo(0.4, 9);
    expect(fit.geometry.c).toBeCloseTo(0.5, 9);
    expect(fit.geometry.f).toBeCloseTo(0.35, 9);
    expect(fit.velocity).toMatchObject({ n: 3 });
    expect(fit.velocity.r2).toBeCloseTo(1, 12);
    const reach = await db.selectFrom("reaches").select("attributes").where("network_id", "=", networkId).where("reach_key", "=", "TR-05").executeTakeFirstOrThrow();
    expect(reach.attributes).toMatchObject({ hgVelocityCoef: fit.geometry.a, hgDepthExp: fit.geometry.f, hydraulicGeometrySource: { surveys: [{ id: measured.id, name: "Test survey" }], measurements: 3 } });
    // typed over in the network table, the coefficients lose their record of where they came from
    const { PATCH } = await import("@/app/api/basins/[basinId]/networks/[networkId]/reaches/[reachId]/route");
    const patch = (body: unknown) => callRoute(PATCH, "PATCH", { userId: w.users.planner.id, params: { basinId: w.basinId, networkId, reachId: "TR-05" }, body });
    expect((await patch({ hgVelocityCoef: null, hgVelocityExp: null, hgDepthCoef: null, hgDepthExp: null })).status).toBe(204);
    const cleared = await db.selectFrom("reaches").select("attributes").where("network_id", "=", networkId).where("reach_key", "=", "TR-05").executeTakeFirstOrThrow();
    expect(cleared.attributes).not.toHaveProperty("hydraulicGeometrySource");
    expect(cleared.attributes).not.toHaveProperty("hgVelocityCoef");
    // a survey without velocity and depth on the reach cannot fit it, and says so naming the field
    const none = await callRoute(POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId, networkId, reachId: "TR-02" }, body: { surveyIds: [measured.id] } });
    expect(none.status).toBe(422);
    expect((none.json as { error: { details: { path: string }[] } }).error.details[0].path).toBe("surveyIds");
    // a stakeholder may not
    expect((await callRoute(POST, "POST", { userId: w.users.stakeholder.id, params: { basinId: w.basinId, networkId, reachId: "TR-05" }, body: { surveyIds: [measured.id] } })).status).toBe(403);
  });

  it("reads velocity and depth in ft/s and ft when the flow is in cfs (1 ft = 0.3048 m)", async () => {
    const s = await upload("station,reach,km,flow,velocity,depth\nA,TR-03,1,10,1,2\n", "us.csv", { flowUnit: "cfs" });
    expect(s.samples[0].velocity_m_s).toBeCloseTo(0.3048, 12);
    expect(s.samples[0].depth_m).toBeCloseTo(0.6096, 12);
  });

  it("takes a column mapping sent with the upload (JSON in the form), and names a mapping it cannot read", async () => {
    const { POST } = await import("@/app/api/basins/[basinId]/surveys/route");
    const form = (columns: string) => {
      const f = new FormData();
      f.set("name", "Mapped survey");
      f.set("columns", columns);
      f.set("file", new File(["Site,Seg,Chain,O2\nM1,TR-03,1.25,6.6\n"], "mapped.csv"));
      return f;
    };
    const ok = await callRoute(POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: form(JSON.stringify({ station: "Site", reach: "Seg", km: "Chain", do: "O2" })) });
    expect(ok.status, JSON.stringify(ok.json)).toBe(201);
    expect((ok.json as { samples: { station: string; reach: string; km: number; do_mg_l: number }[] }).samples[0]).toMatchObject({ station: "M1", reach: "TR-03", km: 1.25, do_mg_l: 6.6 });
    const bad = await callRoute(POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: form("{not json") });
    expect(bad.status).toBe(422);
    expect(JSON.stringify(bad.json)).toMatch(/columns/);
    const unknownKey = await callRoute(POST, "POST", { userId: w.users.planner.id, params: { basinId: w.basinId }, body: form(JSON.stringify({ oxygen: "O2" })) });
    expect(unknownKey.status).toBe(422);
  });
});
