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

const db = fileDb();
let w: World;
beforeAll(async () => {
  w = await buildWorld(db);
  await commitDemo(db, w.users.planner, w.basinId);
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
});
